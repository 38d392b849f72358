import Decimal from 'decimal.js';
import { bladeJoins, deriveDesign } from './derive-design';
import { designDrawing } from './design-drawing';
import { planDesign, type DesignSources } from './plan-design';
import type { DesignBody } from './design-body';
import { DomainError } from '../errors';

const inch = (n: number) => new Decimal(n).times('25.4').toString();
const inches = (mm: string) => new Decimal(mm).dividedBy('25.4').toNumber();

function design(over: Partial<DesignBody> = {}, layout: Partial<DesignBody['layout']> = {}): DesignBody {
  return {
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(72), lengthMm: inch(88) },
    layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(12), sashing: { widthMm: inch(2), cornerstones: true }, borders: [inch(2), inch(7)], ...layout },
    blocks: [
      { id: 'A', name: 'Plate', kind: 'plate', blades: 20, outerRadiusMm: inch(5), innerRadiusMm: inch(1.5) },
      { id: 'B', name: 'Square', kind: 'square' },
      { id: 'C', name: 'Triangles', kind: 'hst', units: 2 },
    ],
    pattern: ['A', 'B', 'A', 'C'],
    assignments: [],
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
    rules: { minimumPerGarment: 0 },
    ...over,
  };
}

const countOf = (d: ReturnType<typeof deriveDesign>, key: string) => d.pieces.filter((p) => p.key === key).reduce((n, p) => n + p.count, 0);

describe('deriveDesign: pieces of a straight-set design (hand-worked counts)', () => {
  const d = deriveDesign(design());

  it('gives the finished size and its difference from the target', () => {
    // Hand-worked: across 4 x 12 + 3 x 2 + 2 x (2 + 7) = 72 in; down 5 x 12 + 4 x 2 + 18 = 86 in.
    expect(inches(d.finished.widthMm)).toBe(72);
    expect(inches(d.finished.lengthMm)).toBe(86);
    expect(inches(d.difference.widthMm)).toBe(0);
    expect(inches(d.difference.lengthMm)).toBe(-2);
  });

  it('places 20 blocks repeating the pattern row by row', () => {
    expect(d.positions).toHaveLength(20);
    expect(d.positions.map((p) => p.blockId).slice(0, 6)).toEqual(['A', 'B', 'A', 'C', 'A', 'B']);
    // Hand-worked: the 2nd block of row 2 starts at border 9 + block 12 + sashing 2 = 23 in across, 9 + 14 = 23 in down.
    expect(inches(String(d.positions[5]!.x))).toBeCloseTo(23, 6);
    expect(inches(String(d.positions[5]!.y))).toBeCloseTo(23, 6);
  });

  it('counts the plate pieces: 10 plates of 20 blades are 100 blade pairs, 10 centres, 10 backgrounds', () => {
    // Pattern A B A C over 20 positions: 10 plates. Hand-worked: 10 x 20 / 2 = 100 pairs.
    expect(countOf(d, 'block:A:blades')).toBe(100);
    expect(countOf(d, 'block:A:centre')).toBe(10);
    const bg = d.pieces.find((p) => p.key === 'block:A:background')!;
    expect(bg.count).toBe(10);
    // Published/common practice: a 12 in finished background square is cut 12 1/2 in.
    expect(inches(bg.widthMm)).toBe(12.5);
    // Pair width = cut top 2.4626... + cut bottom ... for N = 20, R = 5, r = 1.5 (wedge maths), rounded up to 1/8.
    const pair = d.pieces.find((p) => p.key === 'block:A:blades')!;
    expect(pair.piecesEach).toBe(2);
    expect(inches(pair.heightMm) * 8).toBe(Math.ceil(inches(pair.heightMm) * 8));
  });

  it('counts the half-square triangles: 5 blocks of 2 x 2 units make 10 dark and 10 light squares cut 6 7/8 in', () => {
    // Hand-worked: 5 blocks x 4 units = 20 units; 2 units per pair of squares -> 10 of each fabric.
    // Common practice: HST squares are cut finished + 7/8 in (6 in units -> 6 7/8 in).
    expect(countOf(d, 'block:C:dark')).toBe(10);
    expect(countOf(d, 'block:C:light')).toBe(10);
    expect(inches(d.pieces.find((p) => p.key === 'block:C:dark')!.widthMm)).toBe(6.875);
  });

  it('counts sashing, cornerstones and border strips', () => {
    // Hand-worked: 3 strips between 4 blocks x 5 rows = 15; 4 rows of sashing between 5 rows x 4 = 16; 3 x 4 = 12 cornerstones.
    expect(d.pieces.filter((p) => p.key === 'sashing').map((p) => p.count)).toEqual([15, 16]);
    expect(countOf(d, 'cornerstones')).toBe(12);
    const border1 = d.pieces.find((p) => p.key === 'border:1')!;
    // Hand-worked: sides 68 1/2 in, top/bottom 58 1/2 in from 40 in strips joined: 2 x 2 + 2 x 2 = 7 strips end to end
    // (137 in and 117 in with joins at 1/4 in each side: ceil(136.5 / 39.5) = 4, ceil(116.5 / 39.5) = 3).
    expect(border1.count).toBe(7);
    expect(inches(border1.heightMm)).toBe(2.5);
  });

  it('sews a 20-blade plate as 10 pairs, 5 sets of four, then one ring', () => {
    const plate = d.sewing.find((s) => s.title.startsWith('Block A'))!;
    expect(plate.steps.map((s) => s.count).slice(0, 3)).toEqual([10, 5, 10]);
    expect(plate.steps[2]!.text).toBe('Join the sets into one ring');
    expect(bladeJoins(12).map((s) => s.count)).toEqual([6, 3]);
  });

  it('gives a blade and a centre circle template for the plate', () => {
    expect(d.templates.map((t) => t.kind)).toEqual(['blade', 'circle']);
  });

  it('assigns a fabric to a position, and a piece kind over it', () => {
    const body = design({
      assignments: [
        { target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: 7 } },
        { target: { kind: 'piece', key: 'block:A:background' }, fabric: { kind: 'stock', stockId: 1 } },
      ],
    });
    const e = deriveDesign(body);
    expect(e.positions[0]!.fabrics).toEqual({ blades: { kind: 'garment', garmentId: 7 }, centre: { kind: 'garment', garmentId: 7 }, background: { kind: 'stock', stockId: 1 } });
    expect(e.pieces.filter((p) => p.key === 'block:A:blades').map((p) => [p.count, p.fabric])).toEqual([
      [10, { kind: 'garment', garmentId: 7 }],
      [90, null],
    ]);
  });

  it('refuses a plate that does not fit its block', () => {
    const body = design({ blocks: [{ id: 'A', name: 'Big plate', kind: 'plate', blades: 20, outerRadiusMm: inch(6), innerRadiusMm: inch(2) }], pattern: ['A'] });
    expect(() => deriveDesign(body)).toThrow(DomainError);
  });
});

describe('deriveDesign: other settings and blocks (hand-worked counts)', () => {
  it('sets 3 x 3 on point: 13 blocks, 2 squares for 8 side triangles, 2 for the 4 corners', () => {
    // Common practice (shared README): 3 x 3 on point holds 9 + 4 blocks; side triangles 4 from a square cut twice.
    const d = deriveDesign(design({ blocks: [{ id: 'B', name: 'Square', kind: 'square' }], pattern: ['B'] }, { setting: 'on-point', rows: 3, columns: 3, sashing: null, borders: [] }));
    expect(d.positions).toHaveLength(13);
    expect(d.pieces.filter((p) => p.key === 'setting-triangles').map((p) => [p.count, p.diagonalCuts])).toEqual([
      [2, 2],
      [2, 1],
    ]);
    // Derived: 3 x 12 sqrt 2 = 50.9117 in square.
    expect(inches(d.finished.widthMm)).toBeCloseTo(36 * Math.SQRT2, 6);
  });

  it('makes flying geese four at a time: 4 blocks of 2 geese need 2 large and 8 small squares', () => {
    // Hand-worked: 8 geese / 4 per batch = 2 batches; each 1 square 13 1/4 in + 4 squares 6 7/8 in (12 x 6 in geese).
    const d = deriveDesign(design({ blocks: [{ id: 'G', name: 'Geese', kind: 'flying-geese', units: 2 }], pattern: ['G'] }, { rows: 2, columns: 2, sashing: null, borders: [] }));
    const goose = d.pieces.find((p) => p.role === 'goose')!;
    const sky = d.pieces.find((p) => p.role === 'sky')!;
    expect([goose.count, inches(goose.widthMm)]).toEqual([2, 13.25]);
    expect([sky.count, inches(sky.widthMm)]).toEqual([8, 6.875]);
  });

  it('cuts rails, QSTs, foundation and fan blocks', () => {
    const d = deriveDesign(
      design(
        {
          blocks: [
            { id: 'R', name: 'Rails', kind: 'rectangles', units: 3 },
            { id: 'Q', name: 'Hourglass', kind: 'qst', units: 1 },
            { id: 'F', name: 'Strings', kind: 'foundation', meanStripWidthMm: inch(1.5) },
            { id: 'N', name: 'Fan', kind: 'fan', blades: 5, outerRadiusMm: inch(9), innerRadiusMm: inch(3) },
          ],
          pattern: ['R', 'Q', 'F', 'N'],
        },
        { rows: 1, columns: 4, sashing: null, borders: [] },
      ),
    );
    // Common practice: 12 x 4 in rails cut 12 1/2 x 4 1/2 in; QST squares finished + 1 1/4 in; foundation 1/2 in oversize each side.
    const rail = d.pieces.find((p) => p.role === 'rail')!;
    expect([rail.count, inches(rail.widthMm), inches(rail.heightMm)]).toEqual([3, 12.5, 4.5]);
    const qst = d.pieces.find((p) => p.key === 'block:Q:dark')!;
    expect([qst.count, inches(qst.widthMm), qst.diagonalCuts]).toEqual([1, 13.25, 2]);
    expect(inches(d.pieces.find((p) => p.role === 'foundation')!.widthMm)).toBe(13.5);
    // Hand-worked: 5 fan blades -> 3 pairs (one blade spare).
    expect(d.pieces.find((p) => p.key === 'block:N:blades')!.count).toBe(3);
    expect(d.templates.map((t) => t.kind)).toEqual(['blade', 'quarter-circle']);
  });
});

describe('designDrawing', () => {
  it('draws every blade of every plate, the sashing, the cornerstones and both borders', () => {
    const body = design();
    const drawing = designDrawing(body, deriveDesign(body));
    // Hand-worked: 10 plates x (background + 20 blades + centre) = 220.
    expect(drawing.shapes.filter((s) => s.part.startsWith('block') && s.position !== undefined && [0, 2].includes(s.position % 4)).length).toBe(220);
    expect(drawing.shapes.filter((s) => s.part === 'cornerstone')).toHaveLength(12);
    expect(drawing.shapes.filter((s) => s.part.startsWith('border')).map((s) => s.part)).toEqual(['border 2', 'border 1']);
    expect(drawing.width).toBeCloseTo(72 * 25.4, 6);
  });
});

describe('planDesign', () => {
  const sources: DesignSources = {
    garments: [
      { id: 1, description: 'Blue shirt', colour: 'Blue', fibre: 'cotton', construction: 'woven', print: 'plain', panels: [{ id: 11, name: 'back', widthMm: inch(22), heightMm: inch(27), grain: 'vertical' }] },
      { id: 2, description: 'Green shirt', colour: 'Green', fibre: 'cotton', construction: 'woven', print: 'plain', panels: [{ id: 21, name: 'back', widthMm: inch(13), heightMm: inch(13), grain: 'vertical' }] },
    ],
    stock: [{ id: 5, name: 'Navy', colour: 'Navy', fibre: 'cotton', widthMm: inch(42), lengthMm: inch(36), costUnit: 'yard' }],
  };
  const squares = (n: number, over: Partial<DesignBody> = {}) =>
    design({ blocks: [{ id: 'B', name: 'Square', kind: 'square' }], pattern: ['B'], ...over }, { rows: 1, columns: n, sashing: null, borders: [] });

  it('places every square the garments can give and says what to do about the rest', () => {
    // Hand-worked: a 22 x 27 in back holds 1 x 2 squares of 12 1/2 in; a 13 x 13 in back holds 1. Five asked: 2 short.
    const body = squares(5);
    const r = planDesign(body, deriveDesign(body), sources);
    expect(r.totals.piecesPlaced).toBe(3);
    expect(r.shortfall).toHaveLength(1);
    expect(r.shortfall[0]!.count).toBe(2);
    expect(r.shortfall[0]!.remedies.join(' ')).toMatch(/fewer blocks/);
    expect(r.shortfall[0]!.remedies.join(' ')).toMatch(/studio fabric/);
    expect(r.garments.map((g) => [g.description, g.piecesCut])).toEqual([
      ['Blue shirt', 2],
      ['Green shirt', 1],
    ]);
  });

  it('buys the studio fabric beyond what is on hand, grown for shrinkage and rounded to the shop step', () => {
    // Hand-worked: 12 navy squares of 12 1/2 in, 3 across 42 in -> 4 strips = 50 in; 36 in on hand -> 14 in short;
    // 3% pre-wash shrinkage: 14 / 0.97 = 14.433 in -> next 1/8 yd (4.5 in) = 18 in.
    const body = squares(12, {
      assignments: [{ target: { kind: 'piece', key: 'block:B:square' }, fabric: { kind: 'stock', stockId: 5 } }],
      finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: true, shrinkPercent: '3' },
    });
    const r = planDesign(body, deriveDesign(body), sources);
    const navy = r.shopping.find((s) => s.stockId === 5)!;
    expect(inches(navy.needMm)).toBeCloseTo(50, 6);
    expect(inches(navy.shortMm)).toBeCloseTo(14, 6);
    expect(inches(navy.grossMm)).toBeCloseTo(14 / 0.97, 6);
    expect(inches(navy.buyMm)).toBeCloseTo(18, 6);
  });

  it('reports a garment minimum that cannot be met', () => {
    const body = squares(2, { rules: { minimumPerGarment: 2 } });
    const r = planDesign(body, deriveDesign(body), sources);
    expect(r.minimumsShort.map((m) => [m.description, m.required])).toContainEqual(['Green shirt', 2]);
  });
});
