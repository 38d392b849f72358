import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { DomainError } from './errors';
import { Length } from './measure';
import { FAT_QUARTER, METRIC_FAT_QUARTER, TEN_CENTIMETRES } from './shop-increment';
import { mathjsConvert } from './testing/mathjs-units';
import { yardage } from './yardage';

const inch = (v: Decimal.Value) => Length.inches(v);
const inches = (l: Length) => l.to('in').toString();

describe('yardage: worked example (common practice)', () => {
  // 40 squares cut 6 1/2 in from 42 in usable WOF: 6 per strip, 7 strips, 45 1/2 in.
  const plan = yardage({ pieces: [{ width: inch('6.5'), height: inch('6.5'), quantity: 40 }], usableWidth: inch(42) });
  const [group] = plan.groups;

  it('6 per strip, 7 strips, 45 1/2 in of fabric (common practice)', () => {
    expect(group.piecesPerStrip).toBe(6);
    expect(group.strips).toBe(7);
    expect(group.lastStripPieces).toBe(4);
    expect(inches(group.leftoverPerStrip)).toBe('3');
    expect(inches(plan.netLength)).toBe('45.5');
  });

  it('45 1/2 in is 1.264 yd and 1.1557 m before rounding (derived; mathjs units)', () => {
    expect(plan.netLength.to('yd').toDecimalPlaces(3).toString()).toBe('1.264');
    expect(plan.netLength.to('m').toString()).toBe('1.1557');
    expect(plan.netLength.to('yd').toDecimalPlaces(15).eq(new Decimal(mathjsConvert('45.5', 'in', 'yd')).toDecimalPlaces(15))).toBe(true);
    expect(mathjsConvert('45.5', 'in', 'm')).toBe('1.1557');
  });

  it('rounds up to the shop increment: 1 3/8 yd, or 1.2 m in 10 cm steps (rounding step)', () => {
    expect(plan.purchase!.length.to('yd').toString()).toBe('1.375');
    const metric = yardage({
      pieces: [{ width: inch('6.5'), height: inch('6.5'), quantity: 40 }],
      usableWidth: inch(42),
      increment: TEN_CENTIMETRES,
    });
    expect(metric.purchase!.length.to('m').toString()).toBe('1.2');
  });

  it('adds pre-wash shrinkage: 3 % narrows the fabric and lengthens the buy (derived: 45.5 / 0.97)', () => {
    const washed = yardage({
      pieces: [{ width: inch('6.5'), height: inch('6.5'), quantity: 40 }],
      usableWidth: inch(42),
      prewashShrinkPercent: 3,
    });
    expect(inches(washed.usableWidth)).toBe('40.74');
    expect(washed.grossLength.toNumber('in')).toBeCloseTo(45.5 / 0.97, 10);
    expect(washed.purchase!.steps).toBe(11);
  });
});

describe('yardage: orientation', () => {
  it('turns pieces when that uses less fabric, unless the print is directional (derived: floor(40 / 3.5) = 11; floor(40 / 12.5) = 3, 4 x 3.5 = 14)', () => {
    const pieces = [{ width: inch('12.5'), height: inch('3.5'), quantity: 10, label: 'sashing' }];
    const free = yardage({ pieces });
    expect(free.groups[0]).toMatchObject({ rotated: true, piecesPerStrip: 11, strips: 1 });
    expect(inches(free.netLength)).toBe('12.5');
    const oneWay = yardage({ pieces, directional: true });
    expect(oneWay.groups[0]).toMatchObject({ rotated: false, piecesPerStrip: 3, strips: 4 });
    expect(inches(oneWay.netLength)).toBe(String(Math.ceil(10 / Math.floor(40 / 12.5)) * 3.5));
    expect(Math.floor(40 / 3.5)).toBe(11);
  });

  it('cuts long pieces along the length when they are narrower than the fabric (derived: floor(40 / 6.5) = 6)', () => {
    const plan = yardage({ pieces: [{ width: inch('6.5'), height: inch('90.5'), quantity: 4, label: 'border' }], directional: true });
    expect(plan.groups[0]).toMatchObject({ piecesPerStrip: 6, strips: 1 });
    expect(inches(plan.netLength)).toBe('90.5');
  });

  it('refuses a piece that fits neither way', () => {
    expect(() => yardage({ pieces: [{ width: inch(41), height: inch(41), quantity: 1 }] })).toThrow(/wider than the usable/);
    expect(() => yardage({ pieces: [{ width: inch(41), height: inch(10), quantity: 1 }], directional: true })).toThrow(DomainError);
    expect(() => yardage({ pieces: [] })).toThrow(DomainError);
    expect(() => yardage({ pieces: [{ width: inch(4), height: inch(4), quantity: 0 }] })).toThrow(DomainError);
    expect(() => yardage({ pieces: [{ width: inch(-4), height: inch(4), quantity: 2 }] })).toThrow(DomainError);
  });
});

describe('yardage: precuts', () => {
  it('20 squares of 5 in from fat quarters: 4 per strip, 5 strips, 3 strips to a quarter -> 2 fat quarters (derived)', () => {
    const plan = yardage({ pieces: [{ width: inch(5), height: inch(5), quantity: 20 }], increment: FAT_QUARTER });
    expect(plan.groups[0]).toMatchObject({ piecesPerStrip: Math.floor(22 / 5), strips: 5 });
    expect(plan.precuts!.count).toBe(2);
    expect(plan.precuts!.strips.map((s) => s.length)).toEqual([3, 2]);
    expect(plan.purchase).toBeNull();
  });

  it('metric fat quarters of 50 x 55 cm (common practice size; derived count)', () => {
    const plan = yardage({ pieces: [{ width: Length.centimetres(12), height: Length.centimetres(12), quantity: 16 }], increment: METRIC_FAT_QUARTER });
    // 4 per 55 cm strip, 4 strips of 12 cm = 48 cm <= 50 cm: one quarter.
    expect(plan.precuts!.count).toBe(1);
    expect([Math.floor(55 / 12), Math.ceil(16 / 4) * 12]).toEqual([4, 48]);
  });
});

describe('yardage never places more pieces than fit (property)', () => {
  const eighths = (min: number, max: number) => fc.integer({ min, max }).map((e) => inch(new Decimal(e).dividedBy(8)));
  const piece = fc.record({ width: eighths(8, 8 * 30), height: eighths(8, 8 * 30), quantity: fc.integer({ min: 1, max: 80 }) });

  it('holds for strips cut from the bolt', () => {
    fc.assert(
      fc.property(fc.array(piece, { minLength: 1, maxLength: 4 }), eighths(8 * 36, 8 * 44), fc.boolean(), (pieces, usable, directional) => {
        const plan = yardage({ pieces, usableWidth: usable, directional });
        const area = pieces.reduce((sum, p) => sum.plus(p.width.mm.times(p.height.mm).times(p.quantity)), new Decimal(0));
        return (
          plan.groups.every(
            (g, i) =>
              g.subCut.times(g.piecesPerStrip).lte(usable) &&
              g.subCut.times(g.piecesPerStrip + 1).gt(usable) &&
              g.strips * g.piecesPerStrip >= pieces[i].quantity &&
              (g.strips - 1) * g.piecesPerStrip < pieces[i].quantity &&
              g.lastStripPieces >= 1 &&
              g.lastStripPieces <= g.piecesPerStrip &&
              g.length.eq(g.stripWidth.times(g.strips)) &&
              (!directional || !g.rotated),
          ) &&
          plan.netLength.mm.times(usable.mm).gte(area) &&
          plan.purchase!.length.gte(plan.grossLength) &&
          plan.purchase!.length.minus(plan.grossLength).lt(Length.yards('0.125'))
        );
      }),
    );
  });

  it('holds for fat quarters', () => {
    const small = fc.record({ width: eighths(8, 8 * 18), height: eighths(8, 8 * 18), quantity: fc.integer({ min: 1, max: 40 }) });
    fc.assert(
      fc.property(fc.array(small, { minLength: 1, maxLength: 4 }), (pieces) => {
        const plan = yardage({ pieces, increment: FAT_QUARTER });
        const placed = plan.precuts!.strips.flat().length;
        return (
          plan.precuts!.strips.every((bin) => Length.sum(bin).lte(FAT_QUARTER.length)) &&
          placed === plan.groups.reduce((n, g) => n + g.strips, 0) &&
          plan.groups.every((g) => g.subCut.times(g.piecesPerStrip).lte(FAT_QUARTER.width))
        );
      }),
    );
  });
});
