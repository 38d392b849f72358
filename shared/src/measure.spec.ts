import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { MeasureError } from './errors';
import { isLengthJSON, Length, LengthUnit, requireNonNegative, requirePositive, reviveLengths } from './measure';
import { mathjsConvert, mathjsToMillimetres } from './testing/mathjs-units';

describe('Length conversions', () => {
  // published: NIST SP 811 appendix B and NIST Handbook 44 appendix C —
  // 1 in = 25.4 mm exactly, 1 yd = 0.9144 m exactly (1959 agreement).
  it('holds 1 in as exactly 25.4 mm (published: NIST SP 811 appendix B)', () => {
    expect(Length.inches(1).mm.toString()).toBe('25.4');
  });

  it('holds 1 yd as exactly 0.9144 m (published: NIST Handbook 44 appendix C)', () => {
    expect(Length.yards(1).to('m').toString()).toBe('0.9144');
  });

  it('gives 1 sq yd = 0.83612736 m^2 (published: NIST SP 811 appendix B)', () => {
    const yd = Length.yards(1).to('m');
    expect(yd.times(yd).toString()).toBe('0.83612736');
  });

  // derived: each conversion computed a second way with mathjs units.
  it.each<[string, LengthUnit]>([
    ['7.5', 'in'],
    ['0.125', 'in'],
    ['2.25', 'yd'],
    ['190', 'cm'],
    ['1.5', 'm'],
    ['6', 'mm'],
  ])('converts %s %s to millimetres as mathjs does (derived)', (value, unit) => {
    const mm = Length.of(value, unit).mm;
    expect(mm.eq(new Decimal(mathjsToMillimetres(value, unit)))).toBe(true);
  });

  it('converts inches to yards exactly: 45.5 in = 1.2638... yd (derived, mathjs cross-check)', () => {
    const yd = Length.inches('45.5').to('yd');
    expect(yd.toDecimalPlaces(12).eq(new Decimal(mathjsConvert('45.5', 'in', 'yd')).toDecimalPlaces(12))).toBe(true);
  });

  it('round-trips any eighth of an inch through millimetres without loss (derived)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 8 * 3900 }), (eighths) => {
        const length = Length.inches(new Decimal(eighths).dividedBy(8));
        return length.to('in').times(8).eq(eighths);
      }),
    );
  });
});

describe('Length arithmetic', () => {
  it('adds, subtracts, scales and compares exactly (published: 2.54 cm = 1 in, NIST SP 811 appendix B)', () => {
    const a = Length.inches('6.5');
    const b = Length.centimetres('2.54');
    expect(a.plus(b).to('in').toString()).toBe('7.5');
    expect(a.minus(b).to('in').toString()).toBe('5.5');
    expect(a.times(2).to('in').toString()).toBe('13');
    expect(a.dividedBy(2).to('in').toString()).toBe('3.25');
    expect(a.ratio(b).toString()).toBe('6.5');
    expect(a.gt(b)).toBe(true);
    expect(Length.max(a, b)).toBe(a);
    expect(Length.min(a, b)).toBe(b);
    expect(Length.sum([a, b, b]).to('in').toString()).toBe('8.5');
  });

  it('refuses NaN, Infinity, unknown units and lengths over 100 m', () => {
    expect(() => Length.inches(Number.NaN)).toThrow(MeasureError);
    expect(() => Length.inches(Number.POSITIVE_INFINITY)).toThrow(expect.objectContaining({ code: 'not-finite' }));
    expect(() => Length.of(1, 'ft' as LengthUnit)).toThrow(expect.objectContaining({ code: 'unknown-unit' }));
    expect(() => Length.metres('100.001')).toThrow(expect.objectContaining({ code: 'too-large' }));
    expect(() => Length.inches(1e300)).toThrow(expect.objectContaining({ code: 'too-large' }));
    expect(() => Length.inches(1).dividedBy(0)).toThrow(MeasureError);
  });

  it('checks sizes are positive or not negative', () => {
    expect(() => requirePositive(Length.zero, 'width')).toThrow(expect.objectContaining({ code: 'not-positive' }));
    expect(() => requirePositive(Length.inches(-1), 'width')).toThrow(/greater than zero/);
    expect(() => requireNonNegative(Length.inches(-1), 'drop')).toThrow(expect.objectContaining({ code: 'negative' }));
    expect(requireNonNegative(Length.zero, 'drop').isZero()).toBe(true);
  });
});

describe('Length JSON', () => {
  it('serialises to exact millimetres and revives', () => {
    const design = { cut: Length.inches('6.5'), nested: [{ side: Length.inches('0.125') }] };
    const text = JSON.stringify(design);
    expect(text).toBe('{"cut":{"mm":"165.1"},"nested":[{"side":{"mm":"3.175"}}]}');
    const back = JSON.parse(text, reviveLengths) as typeof design;
    expect(back.cut).toBeInstanceOf(Length);
    expect(back.cut.eq(design.cut)).toBe(true);
    expect(back.nested[0].side.to('in').toString()).toBe('0.125');
  });

  it('recognises only the { mm } form', () => {
    expect(isLengthJSON({ mm: '1' })).toBe(true);
    expect(isLengthJSON({ mm: 1 })).toBe(false);
    expect(isLengthJSON({ mm: '1', other: 2 })).toBe(false);
    expect(() => Length.fromJSON({ mm: 'abc' })).toThrow(MeasureError);
  });
});
