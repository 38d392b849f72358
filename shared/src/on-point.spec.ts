import Decimal from 'decimal.js';
import * as fc from 'fast-check';
import { DomainError } from './errors';
import { Length } from './measure';
import { blockDiagonal, cornerSettingTriangleCut, onPointLayout, sideSettingTriangleCut } from './on-point';
import { boundingBox, edgeLengths, offsetPolygon } from './testing/offset-polygon';

const inch = (v: Decimal.Value) => Length.inches(v);
const num = (l: Length) => l.toNumber('in');
const inches = (l: Length) => l.to('in').toString();

describe('setting triangles', () => {
  it('side triangles for 12 in blocks: square = 12 sqrt 2 + 1 1/4 in, rounded up -> 18 1/4 in (common practice)', () => {
    const cut = sideSettingTriangleCut(inch(12));
    const tradeRule = 12 * Math.SQRT2 + 1.25;
    expect(inches(cut.pieces[0].width.rounded)).toBe('18.25');
    expect(Math.ceil(tradeRule * 8) / 8).toBe(18.25);
    expect(cut.pieces[0]).toMatchObject({ diagonalCuts: 2, piecesEach: 4 });
  });

  it('side triangles exact: block diagonal grown by 1/4 in on every edge (derived; clipper-lib offset)', () => {
    const cut = sideSettingTriangleCut(inch(12));
    const d = 12 * Math.SQRT2;
    const grown = offsetPolygon([{ x: 0, y: 0 }, { x: d, y: 0 }, { x: d / 2, y: d / 2 }], 0.25);
    expect(Math.max(...edgeLengths(grown))).toBeCloseTo(num(cut.pieces[0].width.exact), 5);
  });

  it('corner triangles for 12 in blocks: square = diagonal / 2 + 7/8 in, rounded up -> 9 3/8 in (common practice)', () => {
    const cut = cornerSettingTriangleCut(inch(12));
    expect(inches(cut.pieces[0].width.rounded)).toBe('9.375');
    expect(Math.ceil((6 * Math.SQRT2 + 0.875) * 8) / 8).toBe(9.375);
    expect(cut.pieces[0]).toMatchObject({ diagonalCuts: 1, piecesEach: 2 });
  });

  it('corner triangles exact: legs of diagonal / 2 grown by 1/4 in (derived; clipper-lib offset)', () => {
    const cut = cornerSettingTriangleCut(inch(12));
    const leg = 6 * Math.SQRT2;
    const grown = offsetPolygon([{ x: 0, y: 0 }, { x: leg, y: 0 }, { x: 0, y: leg }], 0.25);
    expect(boundingBox(grown).width).toBeCloseTo(num(cut.pieces[0].width.exact), 5);
  });

  it('adds an oversize for trimming (derived: 18 1/4 + 1 in)', () => {
    expect(inches(sideSettingTriangleCut(inch(12), { oversize: inch(1) }).pieces[0].width.rounded)).toBe('19.25');
  });
});

describe('onPointLayout', () => {
  it('3 x 3 on point: 13 blocks, 8 side triangles, 4 corners (common practice)', () => {
    const layout = onPointLayout({ across: 3, down: 3, block: inch(10) });
    expect(layout.blocks.count).toBe(13);
    expect(layout.sideTriangles.count).toBe(8);
    expect(layout.sideTriangles.squares).toBe(2);
    expect(layout.cornerTriangles).toMatchObject({ count: 4, squares: 2 });
    expect(inches(layout.blocks.cut.rounded)).toBe('10.5');
  });

  it('adds borders round the on-point centre (derived: 3 x hypot(10, 10) + 2 x 3)', () => {
    const layout = onPointLayout({ across: 3, down: 4, block: inch(10), borders: [inch(3)] });
    expect(layout.finished.width.toNumber('in')).toBeCloseTo(3 * Math.hypot(10, 10) + 6, 12);
    expect(layout.borders[0].sides.finished.length.eq(layout.centre.height)).toBe(true);
  });

  it('block diagonal is side x sqrt 2 (derived: Math.hypot)', () => {
    expect(num(blockDiagonal(inch(10)))).toBeCloseTo(Math.hypot(10, 10), 12);
  });

  it('finished area equals the sum of its parts (derived property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 8, max: 160 }), (a, d, e) => {
        const b = inch(new Decimal(e).dividedBy(8));
        const layout = onPointLayout({ across: a, down: d, block: b });
        const bb = b.to('in').pow(2);
        const parts = bb
          .times(layout.blocks.count)
          .plus(bb.dividedBy(2).times(layout.sideTriangles.count))
          .plus(bb.dividedBy(4).times(layout.cornerTriangles.count));
        const whole = layout.finished.width.to('in').times(layout.finished.height.to('in'));
        return parts.minus(whole).abs().lt('1e-12') && layout.finished.width.eq(layout.blockDiagonal.times(a));
      }),
    );
  });

  it('refuses zero blocks or a zero block size', () => {
    expect(() => onPointLayout({ across: 0, down: 3, block: inch(10) })).toThrow(DomainError);
    expect(() => onPointLayout({ across: 3, down: 3, block: Length.zero })).toThrow(/greater than zero/);
  });
});
