import { biasBindingSquare, biasLengthFromSquare, straightBinding } from './binding';
import { DomainError } from './errors';
import { Length } from './measure';
import { TEN_CENTIMETRES } from './shop-increment';
import { mathjsConvert } from './testing/mathjs-units';

const inch = (v: number | string) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('straightBinding', () => {
  it('60 x 80 in, +12 in, 2 1/2 in strips, 40 in usable: 292 in -> 8 strips -> 20 in (common practice worked example)', () => {
    const b = straightBinding({ quilt: { width: inch(60), height: inch(80) } });
    expect(inches(b.perimeter)).toBe('280');
    expect(inches(b.length)).toBe('292');
    expect(b.strips).toBe(8);
    expect(inches(b.fabricLength)).toBe('20');
    // 20 in rounds up to 5/8 yd (22 1/2 in) in 1/8 yd steps (rounding step)
    expect(b.purchase.length.to('yd').toString()).toBe('0.625');
  });

  it('2 1/4 in strips and a metric increment (derived; mathjs converts 700 cm and 15.75 in)', () => {
    const b = straightBinding({
      quilt: { width: Length.centimetres(150), height: Length.centimetres(200) },
      stripWidth: inch('2.25'),
      extra: inch(10),
      usableWidth: inch(42),
      increment: TEN_CENTIMETRES,
    });
    // 700 cm = 275.59 in + 10 = 285.59 in -> 7 strips (derived: ceil(285.59 / 42)) -> 15.75 in = 40.005 cm -> 50 cm
    expect(b.strips).toBe(Math.ceil((700 / 2.54 + 10) / 42));
    expect(inches(b.fabricLength)).toBe('15.75');
    expect(b.purchase.length.to('cm').toString()).toBe('50');
    expect(b.perimeter.to('in').toDecimalPlaces(10).toString()).toBe(Number(mathjsConvert('700', 'cm', 'in')).toFixed(10).replace(/0+$/, ''));
    expect(mathjsConvert('15.75', 'in', 'cm')).toBe('40.005');
  });

  it('refuses bad input', () => {
    expect(() => straightBinding({ quilt: { width: Length.zero, height: inch(80) } })).toThrow(DomainError);
    expect(() => straightBinding({ quilt: { width: inch(60), height: inch(80) }, stripWidth: inch(10) })).toThrow(/at most 6 in/);
    expect(() => straightBinding({ quilt: { width: inch(60), height: inch(80) }, extra: inch(-1) })).toThrow(DomainError);
  });
});

describe('biasBindingSquare', () => {
  it('292 in of 2 1/2 in bias needs a square of sqrt(730) = 27.02 in, cut 28 in (derived: area)', () => {
    const sq = biasBindingSquare(inch(292));
    expect(sq.exactSide.toNumber('in')).toBeCloseTo(Math.sqrt(292 * 2.5), 10);
    expect(inches(sq.side)).toBe('28');
    expect(sq.yields.gte(inch(292))).toBe(true);
  });

  it('a 36 in square gives about 518 in of 2 1/2 in bias (derived: summing 45-degree chords)', () => {
    const side = 36;
    const d = side * Math.SQRT2;
    const w = 2.5;
    // Second way: the bias strips are chords at 45 degrees; chord at distance t from the centre is d - 2|t|.
    const steps = 200000;
    let area = 0;
    for (let i = 0; i < steps; i++) {
      const t = -d / 2 + ((i + 0.5) * d) / steps;
      area += (d - 2 * Math.abs(t)) * (d / steps);
    }
    expect(biasLengthFromSquare(inch(side), inch(w)).toNumber('in')).toBeCloseTo(area / w, 3);
    expect(biasLengthFromSquare(inch(side), inch(w)).toNumber('in')).toBeCloseTo(518.4, 6);
  });
});
