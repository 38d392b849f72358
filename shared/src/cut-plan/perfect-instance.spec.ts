import { perfectInstance, seededRandom } from './perfect-instance';

describe('perfect-packing instances', () => {
  it('cuts the sheet into pieces whose areas sum exactly to the sheet', () => {
    // derived: straight edge-to-edge cuts of a sheet conserve its area (the
    // project's own recursive-cut construction).
    for (const seed of [1, 2, 3, 42]) {
      const instance = perfectInstance(seed, 60, 40, 25);
      expect(instance.pieces).toHaveLength(25);
      const area = instance.pieces.reduce((s, p) => s + p.width * p.height, 0);
      expect(area).toBe(60 * 40);
      for (const p of instance.pieces) {
        expect(Number.isInteger(p.width) && Number.isInteger(p.height)).toBe(true);
        expect(p.width).toBeGreaterThanOrEqual(1);
        expect(p.height).toBeGreaterThanOrEqual(1);
      }
    }
  });

  it('keeps sides at least the minimum', () => {
    const instance = perfectInstance(7, 40, 40, 30, 3);
    for (const p of instance.pieces) expect(Math.min(p.width, p.height)).toBeGreaterThanOrEqual(3);
  });

  it('is the same for the same seed', () => {
    expect(perfectInstance(9, 50, 50, 20)).toEqual(perfectInstance(9, 50, 50, 20));
    expect(seededRandom(5)()).toBe(seededRandom(5)());
    expect(perfectInstance(9, 50, 50, 20)).not.toEqual(perfectInstance(10, 50, 50, 20));
  });
});
