import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { flyingGeeseCut } from './flying-geese';
import { Length } from './measure';
import { cornerSettingTriangleCut, sideSettingTriangleCut } from './on-point';
import { MARK_TOLERANCE } from './rounding';
import { rectangleCut, squareCut, UnitCut } from './seam-allowance';
import { boundingBox, edgeLengths, offsetPolygon } from './testing/offset-polygon';
import {
  equilateralTriangleCut,
  equilateralTrianglesPerStrip,
  halfSquareTriangleCut,
  HST_ALLOWANCE_FACTOR,
  QST_ALLOWANCE_FACTOR,
  quarterSquareTriangleCut,
} from './triangle-cut';

const inch = (v: Decimal.Value) => Length.inches(v);
const num = (l: Length) => l.toNumber('in');
const inches = (l: Length) => l.to('in').toString();

describe('half-square triangles', () => {
  it('adds s(2 + sqrt 2) = 0.8536 in at s = 1/4 in (derived; clipper-lib offset cross-check)', () => {
    const cut = halfSquareTriangleCut(inch(3));
    const exact = num(cut.pieces[0].width.exact);
    expect(exact - 3).toBeCloseTo(0.8536, 4);
    // Second way: grow the finished triangle (legs 3 in) by 1/4 in with clipper-lib; its legs are the square side.
    const grown = offsetPolygon([{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 0, y: 3 }], 0.25);
    expect(boundingBox(grown).width).toBeCloseTo(exact, 5);
    expect(boundingBox(grown).height).toBeCloseTo(exact, 5);
  });

  it('rounds the add-on up to the trade rule of 7/8 in (common practice)', () => {
    expect(inches(halfSquareTriangleCut(inch(3)).pieces[0].width.rounded)).toBe('3.875');
    expect(inches(halfSquareTriangleCut(inch(3), { method: 'two-at-a-time' }).pieces[0].width.rounded)).toBe('3.875');
  });

  it('gives 2 triangles per square and 2 units per pair of squares, trimmed to 3 1/2 in (common practice)', () => {
    const cut = halfSquareTriangleCut(inch(3));
    expect(cut.pieces[0]).toMatchObject({ quantity: 2, diagonalCuts: 1, piecesEach: 2 });
    expect(cut.unitsPerBatch).toBe(2);
    expect(inches(cut.unfinished!.width)).toBe('3.5');
    const twoAtATime = halfSquareTriangleCut(inch(3), { method: 'two-at-a-time', oversize: inch('0.125') });
    expect(twoAtATime.pieces[0].diagonalCuts).toBe(0);
    expect(inches(twoAtATime.pieces[0].width.rounded)).toBe('4');
  });

  it('the factor is 2 + sqrt 2 computed directly (derived)', () => {
    expect(HST_ALLOWANCE_FACTOR.toNumber()).toBeCloseTo(2 + Math.SQRT2, 12);
  });
});

describe('quarter-square triangles', () => {
  it('adds s(2 + sqrt 2) sqrt 2 = 1.2071 in at s = 1/4 in (derived; clipper-lib offset cross-check)', () => {
    const cut = quarterSquareTriangleCut(inch(4));
    const exact = num(cut.pieces[0].width.exact);
    expect(exact - 4).toBeCloseTo(1.2071, 4);
    expect(QST_ALLOWANCE_FACTOR.toNumber()).toBeCloseTo((2 + Math.SQRT2) * Math.SQRT2, 12);
    // Second way: the finished quarter triangle has its 4 in long side on the unit edge.
    const grown = offsetPolygon([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 2, y: 2 }], 0.25);
    expect(Math.max(...edgeLengths(grown))).toBeCloseTo(exact, 5);
  });

  it('rounds the add-on up to the trade rule of 1 1/4 in (common practice) and yields 4 per square', () => {
    const cut = quarterSquareTriangleCut(inch(4));
    expect(inches(cut.pieces[0].width.rounded)).toBe('5.25');
    expect(cut.pieces[0]).toMatchObject({ diagonalCuts: 2, piecesEach: 4, quantity: 2 });
  });
});

describe('equilateral triangles', () => {
  it('cuts a strip of height + 3s = + 3/4 in (derived; handbook value; clipper-lib offset cross-check)', () => {
    const cut = equilateralTriangleCut(inch(4));
    const h = 4 * Math.sin(Math.PI / 3);
    expect(num(cut.finishedHeight)).toBeCloseTo(h, 12);
    expect(num(cut.stripWidth.exact)).toBeCloseTo(h + 0.75, 12);
    const grown = offsetPolygon([{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 2, y: h }], 0.25);
    expect(boundingBox(grown).height).toBeCloseTo(num(cut.stripWidth.exact), 5);
    expect(edgeLengths(grown)[0]).toBeCloseTo(num(cut.cutSide.exact), 5);
    expect(num(cut.cutSide.exact)).toBeCloseTo(4 + 0.5 * Math.tan(Math.PI / 3), 12);
  });

  it('rounds the strip up to the next 1/8 in: 3.4641 + 0.75 -> 4 1/4 in (rounding step)', () => {
    expect(inches(equilateralTriangleCut(inch(4)).stripWidth.rounded)).toBe('4.25');
  });

  it('counts triangles cut alternately up and down from a 42 in strip (derived: (n + 1) side / 2 <= 42)', () => {
    const cut = equilateralTriangleCut(inch(4));
    const side = num(cut.cutSide.rounded);
    const n = equilateralTrianglesPerStrip(cut, inch(42));
    expect(((n + 1) * side) / 2).toBeLessThanOrEqual(42);
    expect(((n + 2) * side) / 2).toBeGreaterThan(42);
  });
});

describe('cut size >= finished size + 2 x allowance for every shape (property)', () => {
  const finished = fc.integer({ min: 8, max: 8 * 40 }).map((eighths) => inch(new Decimal(eighths).dividedBy(8)));
  const allowance = fc.constantFrom(inch('0.25'), inch('0.375'), inch('0.5'), Length.millimetres(6), Length.millimetres('7.5'));

  function checkAll(cut: UnitCut, minFinished: Length, s: Length): boolean {
    const need = minFinished.plus(s.times(2));
    return cut.pieces.every(
      (p) =>
        p.width.rounded.plus(MARK_TOLERANCE).gte(p.width.exact) &&
        p.height.rounded.plus(MARK_TOLERANCE).gte(p.height.exact) &&
        p.width.exact.gte(need) &&
        p.height.exact.gte(need) &&
        !p.width.exact.isNegative(),
    );
  }

  it('holds for squares, rectangles, HST, QST, geese, equilateral and setting triangles', () => {
    fc.assert(
      fc.property(finished, allowance, (f, s) => {
        const opts = { allowance: s };
        const square = squareCut(f, opts);
        const rect = rectangleCut({ width: f, height: f.times(2) }, opts);
        const eq = equilateralTriangleCut(f, opts);
        const needEqual = f.times(new Decimal(3).sqrt()).dividedBy(2).plus(s.times(2));
        return (
          checkAll(square, f, s) &&
          checkAll(rect, f, s) &&
          rect.pieces[0].height.exact.gte(f.times(2).plus(s.times(2))) &&
          checkAll(halfSquareTriangleCut(f, opts), f, s) &&
          checkAll(quarterSquareTriangleCut(f, opts), f, s) &&
          checkAll(flyingGeeseCut({ width: f.times(2), height: f }, opts), f, s) &&
          checkAll(flyingGeeseCut({ width: f.times(2), height: f }, { ...opts, method: 'stitch-and-flip' }), f, s) &&
          eq.stripWidth.exact.gte(needEqual) &&
          eq.stripWidth.rounded.plus(MARK_TOLERANCE).gte(eq.stripWidth.exact) &&
          eq.cutSide.exact.gte(f.plus(s.times(2))) &&
          checkAll(sideSettingTriangleCut(f, opts), f.times(new Decimal(2).sqrt()), s) &&
          checkAll(cornerSettingTriangleCut(f, opts), f.dividedBy(new Decimal(2).sqrt()), s)
        );
      }),
    );
  });
});
