import { MeasureError } from './errors';
import { LengthUnit } from './measure';
import { parseLength, tryParseLength, VULGAR_FRACTIONS } from './parse-length';

const mm = (text: string, unit: LengthUnit = 'in') => parseLength(text, unit).mm.toString();

describe('parseLength', () => {
  // published: 1 in = 25.4 mm and 1 yd = 914.4 mm exactly (NIST SP 811 appendix B).
  it.each([
    ['7 1/2', '190.5'],
    ['7.5', '190.5'],
    ['7½', '190.5'],
    ['7 ½', '190.5'],
    ['7 1/2 in', '190.5'],
    ['7 1/2in', '190.5'],
    ['7.5"', '190.5'],
    ['7.5″', '190.5'],
    ['7.5 inches', '190.5'],
    ['  7  1/2   IN ', '190.5'],
    ['7 1⁄2', '190.5'],
    ['1/8', '3.175'],
    ['⅞', '22.225'],
    ['.5', '12.7'],
    ['190 cm', '1900'],
    ['190mm', '190'],
    ['1.5 m', '1500'],
    ['1.5 metres', '1500'],
    ['2 1/4 yd', '2057.4'],
    ['2¼ yds', '2057.4'],
  ])('reads %p as %s mm (published: NIST SP 811 appendix B)', (text, expected) => {
    expect(mm(text)).toBe(expected);
  });

  it('reads a bare number in the default unit (published: NIST SP 811 appendix B)', () => {
    expect(mm('190', 'cm')).toBe('1900');
    expect(mm('7.5', 'mm')).toBe('7.5');
  });

  it('knows every unicode vulgar fraction it lists (published: the Unicode Standard, Number Forms and Latin-1 charts)', () => {
    for (const [glyph, [num, den]] of Object.entries(VULGAR_FRACTIONS)) {
      const value = parseLength(`1${glyph}`, 'in').to('in');
      expect(value.minus(1).times(den).toDecimalPlaces(10).toNumber()).toBe(num);
    }
  });

  it.each([
    ['', /Nothing was typed/],
    ['   ', /Nothing was typed/],
    ['-3', /cannot be negative/],
    ['-3 in', /cannot be negative/],
    ['1/0', /cannot be 0/],
    ['abc', /not a length/],
    ['7 1/2 3/4', /not a length/],
    ['7 3/2', /less than 1/],
    ['7,5', /point for decimals/],
    ['0', /greater than 0/],
    ['7.5 ft', /not a length/],
    ['7..5', /not a length/],
    ['in', /not a length/],
    ['1e3', /not a length/],
    ['Infinity', /not a length/],
    ['NaN', /not a length/],
  ])('refuses %p with a message saying what is expected', (text, reason) => {
    expect(() => parseLength(text)).toThrow(MeasureError);
    expect(() => parseLength(text)).toThrow(reason);
    expect(() => parseLength(text)).toThrow(/Expected a length such as 7 1\/2/);
  });

  it('refuses huge values', () => {
    expect(() => parseLength('200 m')).toThrow(expect.objectContaining({ code: 'too-large' }));
    expect(() => parseLength('9'.repeat(80))).toThrow(MeasureError);
  });

  it('accepts zero when allowed, and names the field', () => {
    expect(parseLength('0', 'in', { allowZero: true }).isZero()).toBe(true);
    expect(() => parseLength('x', 'in', { field: 'drop' })).toThrow(expect.objectContaining({ field: 'drop' }));
  });

  it('offers a non-throwing form for form validation', () => {
    const ok = tryParseLength('6 1/2');
    expect(ok.ok && ok.length.to('in').toString()).toBe('6.5');
    const bad = tryParseLength('abc');
    expect(bad.ok).toBe(false);
    expect(!bad.ok && bad.error.code).toBe('unparseable');
  });
});
