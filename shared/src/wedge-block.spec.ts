import * as fc from 'fast-check';
import { DomainError } from './errors';
import { Length } from './measure';
import { MARK_TOLERANCE } from './rounding';
import { boundingBox, edgeLengths, offsetPolygon, overlapArea, XY } from './testing/offset-polygon';
import { bladesPerStrip, bladeStrips, wedgeBlock } from './wedge-block';

const inch = (v: number | string) => Length.inches(v);
const num = (l: Length) => l.toNumber('in');
const MM = 25.4;
const toInches = (points: XY[]) => points.map((p) => ({ x: p.x / MM, y: p.y / MM }));

/** Chord of a circle of radius rad subtending angle a, by the law of cosines (a second way to 2 rad sin(a/2)). */
const chord = (rad: number, a: number) => Math.sqrt(2 * rad * rad * (1 - Math.cos(a)));

describe('plate blades (derived: trigonometry; check values at s = 1/4 in)', () => {
  it.each([
    // N, R, r, finished top, finished bottom, cut top, cut bottom, cut height (derived check values)
    [20, 6, 2, 1.8772, 0.6257, 2.4626, 1.0528, 4.4508],
    [12, 5, 1.5, 2.5882, 0.7765, 3.2398, 1.1601, 3.8807],
  ])('N = %i, R = %p, r = %p', (n, R, r, top, bottom, cutTop, cutBottom, cutHeight) => {
    const b = wedgeBlock({ kind: 'plate', blades: n, outerRadius: inch(R), innerRadius: inch(r) });
    expect(num(b.finished.top)).toBeCloseTo(top, 4);
    expect(num(b.finished.bottom)).toBeCloseTo(bottom, 4);
    expect(num(b.cut.top.exact)).toBeCloseTo(cutTop, 4);
    expect(num(b.cut.bottom.exact)).toBeCloseTo(cutBottom, 4);
    expect(num(b.cut.height.exact)).toBeCloseTo(cutHeight, 4);

    // Second way, direct trigonometry written differently: chords by the law of cosines.
    const angle = (2 * Math.PI) / n;
    expect(num(b.finished.top)).toBeCloseTo(chord(R, angle), 10);
    expect(num(b.finished.bottom)).toBeCloseTo(chord(r, angle), 10);

    // Third way: grow the finished blade by 1/4 in with clipper-lib (miter limit 3) and measure it.
    const grown = offsetPolygon(toInches(b.finished.outline), 0.25);
    const box = boundingBox(grown);
    expect(box.height).toBeCloseTo(num(b.cut.height.exact), 5);
    expect(box.width).toBeCloseTo(num(b.cut.top.exact), 5);
    const bottomEdge = Math.min(...edgeLengths(grown));
    expect(bottomEdge).toBeCloseTo(num(b.cut.bottom.exact), 5);
    // and the cut outline given for printing is that same polygon
    const cutOutline = toInches(b.cut.outline);
    expect(areaOf(cutOutline)).toBeCloseTo(areaOf(grown), 4);
    expect(overlapArea(grown, cutOutline)).toBeCloseTo(areaOf(grown), 4);
  });

  it('rounds the strip width up to 1/8 in: 4.4508 -> 4 1/2 in (rounding step)', () => {
    const b = wedgeBlock({ kind: 'plate', blades: 20, outerRadius: inch(6), innerRadius: inch(2) });
    expect(b.stripWidth.rounded.to('in').toString()).toBe('4.5');
    expect(b.cut.top.rounded.to('in').toString()).toBe('2.5');
  });

  it('20 blades are 18 degrees each; 12 blades 30 degrees (common practice)', () => {
    expect(wedgeBlock({ kind: 'plate', blades: 20, outerRadius: inch(6), innerRadius: inch(2) }).bladeAngleDegrees.toString()).toBe('18');
    expect(wedgeBlock({ kind: 'plate', blades: 12, outerRadius: inch(6), innerRadius: inch(2) }).bladeAngleDegrees.toString()).toBe('30');
  });

  it('five blades of the twenty make a quarter-circle fan (common practice): same blade', () => {
    const plate = wedgeBlock({ kind: 'plate', blades: 20, outerRadius: inch(6), innerRadius: inch(2) });
    const fan = wedgeBlock({ kind: 'fan', blades: 5, outerRadius: inch(6), innerRadius: inch(2) });
    expect(fan.bladeAngleDegrees.toString()).toBe('18');
    expect(fan.cut.top.exact.eq(plate.cut.top.exact)).toBe(true);
    expect(fan.sweepDegrees).toBe(90);
  });

  it('takes a finished diameter instead of a radius (derived: 12 / 2)', () => {
    const b = wedgeBlock({ kind: 'plate', blades: 20, finishedDiameter: inch(12), innerRadius: inch(2) });
    expect(b.outerRadius.to('in').toString()).toBe('6');
  });

  it('works in metric with a metric allowance (derived: trigonometry; rounding step 113.08 -> 114 mm)', () => {
    const b = wedgeBlock({
      kind: 'plate',
      blades: 16,
      outerRadius: Length.centimetres(15),
      innerRadius: Length.centimetres(5),
      allowance: Length.millimetres('7.5'),
      ruler: 'millimetre',
    });
    const h = Math.PI / 16;
    expect(b.cut.height.exact.toNumber('mm')).toBeCloseTo(100 * Math.cos(h) + 15, 9);
    expect(b.stripWidth.rounded.toNumber('mm')).toBe(114);
  });
});

function areaOf(points: XY[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p.x * q.y - q.x * p.y;
  }
  return Math.abs(a) / 2;
}

describe('pointed blades (derived: folding geometry)', () => {
  const b = wedgeBlock({ kind: 'plate', blades: 16, outerRadius: inch(7), innerRadius: inch(2), top: 'pointed' });
  const [, , shoulder, tip] = toInches(b.finished.outline);

  it('the tip sits on the blade axis at the outer radius', () => {
    expect(tip.x).toBeCloseTo(0, 6);
    expect(tip.y).toBeCloseTo(7, 6);
  });

  it('the point is a right angle (the fold runs at 45 degrees from the tip)', () => {
    const slope = (tip.y - shoulder.y) / (shoulder.x - tip.x);
    expect(slope).toBeCloseTo(1, 6);
  });

  it('folding the top corner over the 45 degree line lands it on the axis (second way: reflection)', () => {
    // The raw top seam corner before folding: on the side seam line at the top seam line height.
    const h = Math.PI / 16;
    const corner = { x: 7 * Math.tan(h), y: 7 };
    // Reflect across the line through the tip with direction (1, -1) / sqrt 2.
    const d = { x: Math.SQRT1_2, y: -Math.SQRT1_2 };
    const v = { x: corner.x - tip.x, y: corner.y - tip.y };
    const along = v.x * d.x + v.y * d.y;
    const reflected = { x: tip.x + 2 * along * d.x - v.x, y: tip.y + 2 * along * d.y - v.y };
    expect(reflected.x).toBeCloseTo(0, 6);
    expect(7 - reflected.y).toBeCloseTo(7 * Math.tan(h), 6);
    // and the shoulder is on the side seam line
    expect(shoulder.x / shoulder.y).toBeCloseTo(Math.tan(h), 6);
    expect(num(b.finished.pointHeight!)).toBeCloseTo(tip.y - shoulder.y, 6);
  });

  it('is cut as a straight-topped blade whose top seam line is at the tip radius', () => {
    const h = Math.PI / 16;
    expect(num(b.cut.height.exact)).toBeCloseTo(7 - 2 * Math.cos(h) + 0.5, 9);
    expect(num(b.finished.top)).toBeCloseTo(2 * 7 * Math.tan(h), 9);
  });
});

describe('blades from strips', () => {
  const b = wedgeBlock({ kind: 'plate', blades: 20, outerRadius: inch(6), innerRadius: inch(2) });

  it('fits blades alternately up and down along a 42 in strip without overlap (derived; clipper-lib check)', () => {
    const n = bladesPerStrip(b, inch(42));
    expect(n).toBeGreaterThan(20);
    // Lay n trapezoids cut to the rounded strip width and check they fit and do not overlap.
    const w = num(b.stripWidth.rounded);
    const tan = Math.tan(Math.PI / 20);
    const extra = (w - num(b.stripWidth.exact)) * tan;
    const a = num(b.cut.top.exact) + extra;
    const c = num(b.cut.bottom.exact) - extra;
    const shapes: XY[][] = [];
    let top = 0;
    let bottom = (a - c) / 2;
    for (let i = 0; i < n; i++) {
      const [t, u] = i % 2 === 0 ? [a, c] : [c, a];
      shapes.push([{ x: bottom, y: 0 }, { x: bottom + u, y: 0 }, { x: top + t, y: w }, { x: top, y: w }]);
      top += t;
      bottom += u;
    }
    expect(Math.max(...shapes.flat().map((p) => p.x))).toBeLessThanOrEqual(42 + 1e-9);
    for (let i = 1; i < n; i++) expect(overlapArea(shapes[i - 1], shapes[i])).toBeCloseTo(0, 6);
    expect(bladesPerStrip(b, inch(2))).toBe(0);
  });

  it('splits 20 blades among 3 fabrics in turn: 7, 7, 6 and flags the uneven repeat (derived: 20 = 3 x 6 + 2)', () => {
    const plan = bladeStrips(b, 3, inch(20));
    expect(plan.perFabric.map((f) => f.blades)).toEqual([7, 7, 6]);
    expect(plan.evenRepeat).toBe(false);
    expect(plan.perFabric.every((f) => f.strips * plan.bladesPerStrip >= f.blades)).toBe(true);
    expect(bladeStrips(b, 4, inch(42)).evenRepeat).toBe(true);
  });
});

describe('bad input', () => {
  const base = { kind: 'plate' as const, blades: 12, outerRadius: inch(5), innerRadius: inch(1.5) };
  it.each([
    ['2 blades', { blades: 2 }, 'too-few-blades'],
    ['0 blades', { blades: 0 }, 'too-few-blades'],
    ['2.5 blades', { blades: 2.5 }, 'not-integer'],
    ['NaN blades', { blades: Number.NaN }, 'not-a-number'],
    ['1000 blades', { blades: 1000 }, 'too-large'],
    ['inner = outer', { innerRadius: inch(5) }, 'inner-not-less-than-outer'],
    ['inner > outer', { innerRadius: inch(6) }, 'inner-not-less-than-outer'],
    ['zero inner radius', { innerRadius: Length.zero }, 'not-positive'],
    ['negative outer radius', { outerRadius: inch(-5) }, 'negative'],
    ['allowance larger than the blade', { outerRadius: inch(1.7), allowance: inch(0.5) }, 'allowance-too-large'],
  ])('refuses %s', (_label, change, code) => {
    expect(() => wedgeBlock({ ...base, ...change })).toThrow(DomainError);
    expect(() => wedgeBlock({ ...base, ...change })).toThrow(expect.objectContaining({ code }));
  });

  it('needs an outer size', () => {
    expect(() => wedgeBlock({ kind: 'fan', blades: 5, innerRadius: inch(1) })).toThrow(/outer radius or a finished diameter/);
  });
});

describe('cut blade >= finished blade + allowance (property)', () => {
  it('holds for any plate or fan', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<'plate' | 'fan'>('plate', 'fan'),
        fc.integer({ min: 3, max: 40 }),
        fc.integer({ min: 8, max: 96 }),
        fc.integer({ min: 10, max: 90 }),
        fc.constantFrom<'straight' | 'pointed'>('straight', 'pointed'),
        (kind, blades, innerEighths, percent, top) => {
          const inner = inch(innerEighths / 8);
          const outer = inner.times(1 + percent / 10);
          const b = wedgeBlock({ kind, blades, outerRadius: outer, innerRadius: inner, top });
          const s = b.allowance;
          return (
            b.cut.height.exact.gte(b.finished.height.plus(s.times(2))) &&
            b.cut.top.exact.gte(b.finished.top.plus(s.times(2))) &&
            b.cut.bottom.exact.gte(b.finished.bottom) &&
            b.cut.bottom.exact.isPositive() &&
            b.cut.top.rounded.plus(MARK_TOLERANCE).gte(b.cut.top.exact) &&
            b.stripWidth.rounded.plus(MARK_TOLERANCE).gte(b.stripWidth.exact)
          );
        },
      ),
    );
  });
});
