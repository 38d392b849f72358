import { DomainError, MeasureError, requireCount } from './errors';

describe('DomainError', () => {
  it('is an Error with a code, a message and the field at fault', () => {
    const error = new DomainError('too-few-blades', 'Expected at least 3 blades; got 2.', 'blades');
    expect(error).toBeInstanceOf(Error);
    expect(error).toBeInstanceOf(DomainError);
    expect(error.code).toBe('too-few-blades');
    expect(error.field).toBe('blades');
    expect(JSON.parse(JSON.stringify(error))).toEqual({
      name: 'DomainError',
      code: 'too-few-blades',
      message: 'Expected at least 3 blades; got 2.',
      field: 'blades',
    });
  });

  it('keeps MeasureError a DomainError', () => {
    const error = new MeasureError('unparseable', 'Expected a length.');
    expect(error).toBeInstanceOf(DomainError);
    expect(error).toBeInstanceOf(MeasureError);
    expect(error.name).toBe('MeasureError');
  });
});

describe('requireCount', () => {
  it('accepts whole numbers in range', () => {
    expect(requireCount(3, 'rows')).toBe(3);
  });

  it.each([
    [0, 'not-positive'],
    [-2, 'not-positive'],
    [2.5, 'not-integer'],
    [Number.NaN, 'not-a-number'],
    [Number.POSITIVE_INFINITY, 'not-finite'],
    [1e9, 'too-large'],
  ])('refuses %p with code %s', (value, code) => {
    expect(() => requireCount(value, 'rows')).toThrow(expect.objectContaining({ code, field: 'rows' }));
  });
});
