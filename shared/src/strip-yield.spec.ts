import { Length } from './measure';
import { alternatingLength, alternatingPiecesPerStrip } from './strip-yield';
import { overlapArea, XY } from './testing/offset-polygon';

const inch = (v: number | string) => Length.inches(v);

/** Trapezoids laid alternately up and down, placed independently of the formula. */
function layTrapezoids(a: number, b: number, h: number, n: number): XY[][] {
  const shapes: XY[][] = [];
  let topX = 0;
  let bottomX = (a - b) / 2;
  for (let i = 0; i < n; i++) {
    if (i % 2 === 0) {
      shapes.push([{ x: topX, y: h }, { x: topX + a, y: h }, { x: bottomX + b, y: 0 }, { x: bottomX, y: 0 }].reverse());
      topX += a;
      bottomX += b;
    } else {
      shapes.push([{ x: topX, y: h }, { x: topX + b, y: h }, { x: bottomX + a, y: 0 }, { x: bottomX, y: 0 }].reverse());
      topX += b;
      bottomX += a;
    }
  }
  return shapes;
}

describe('alternating pieces along a strip', () => {
  it('uses n(a + b)/2 + (a - b)/2 of the strip (derived: placed shapes, clipper-lib overlap check)', () => {
    const a = 2.4626;
    const b = 1.0528;
    const h = 4.4508;
    for (const n of [1, 2, 5, 6]) {
      const shapes = layTrapezoids(a, b, h, n);
      const maxX = Math.max(...shapes.flat().map((p) => p.x));
      expect(alternatingLength(inch(a), inch(b), n).toNumber('in')).toBeCloseTo(maxX, 9);
      for (let i = 1; i < shapes.length; i++) expect(overlapArea(shapes[i - 1], shapes[i])).toBeCloseTo(0, 6);
    }
  });

  it('gives the most pieces that fit (derived: checked by plain arithmetic)', () => {
    // Blades of the N = 20, R = 6 in, r = 2 in plate at 1/4 in seams (derived values, see wedge-block.spec.ts): 42 in strip.
    const n = alternatingPiecesPerStrip(inch('2.4626'), inch('1.0528'), inch(42));
    expect(alternatingLength(inch('2.4626'), inch('1.0528'), n).lte(inch(42))).toBe(true);
    expect(alternatingLength(inch('2.4626'), inch('1.0528'), n + 1).gt(inch(42))).toBe(true);
    expect(n).toBe(23);
    expect((23 * (2.4626 + 1.0528) + (2.4626 - 1.0528)) / 2).toBeLessThanOrEqual(42);
    expect((24 * (2.4626 + 1.0528) + (2.4626 - 1.0528)) / 2).toBeGreaterThan(42);
    expect(alternatingPiecesPerStrip(inch(3), inch(1), inch(2))).toBe(0);
  });

  it('refuses a narrow edge wider than the wide edge', () => {
    expect(() => alternatingPiecesPerStrip(inch(1), inch(2), inch(40))).toThrow(/no wider/);
  });
});
