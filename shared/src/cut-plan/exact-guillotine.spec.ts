import fc from 'fast-check';
import { exactGuillotine, type ExactPiece } from './exact-guillotine';
import { perfectInstance } from './perfect-instance';

/**
 * Brute force, written without the solver's ideas: every subset of the
 * pieces, and a subset fits a rectangle when it is one piece that fits, or
 * some straight cut at any whole position splits the rectangle into two
 * parts that the subset can be shared between (a part may take nothing).
 */
function bruteBest(W: number, H: number, pieces: ExactPiece[]): number {
  const memo = new Map<string, boolean>();
  const fits = (w: number, h: number, mask: number): boolean => {
    if (mask === 0) return true;
    const key = `${w},${h},${mask}`;
    const known = memo.get(key);
    if (known !== undefined) return known;
    let ok = false;
    if ((mask & (mask - 1)) === 0) {
      const p = pieces[31 - Math.clz32(mask)];
      ok = (p.w <= w && p.h <= h) || (p.turn && p.h <= w && p.w <= h);
    }
    for (let c = 1; !ok && c < w; c++) {
      for (let sub = mask; ; sub = (sub - 1) & mask) {
        if (fits(c, h, sub) && fits(w - c, h, mask & ~sub)) { ok = true; break; }
        if (sub === 0) break;
      }
    }
    for (let c = 1; !ok && c < h; c++) {
      for (let sub = mask; ; sub = (sub - 1) & mask) {
        if (fits(w, c, sub) && fits(w, h - c, mask & ~sub)) { ok = true; break; }
        if (sub === 0) break;
      }
    }
    memo.set(key, ok);
    return ok;
  };
  let best = 0;
  for (let mask = 1; mask < 1 << pieces.length; mask++) {
    let area = 0;
    pieces.forEach((p, i) => { if (mask & (1 << i)) area += p.w * p.h; });
    if (area > best && area <= W * H && fits(W, H, mask)) best = area;
  }
  return best;
}

/** Checks a layout by itself: inside, no overlaps, each piece once at its size. */
function layoutFaults(W: number, H: number, pieces: ExactPiece[], result: ReturnType<typeof exactGuillotine>): string[] {
  const faults: string[] = [];
  const seen = new Set<number>();
  let area = 0;
  for (const [k, a] of result.layout.entries()) {
    const p = pieces[a.piece];
    if (seen.has(a.piece)) faults.push(`piece ${a.piece} twice`);
    seen.add(a.piece);
    const sizeOk = a.rotated ? p.turn && a.w === p.h && a.h === p.w : a.w === p.w && a.h === p.h;
    if (!sizeOk) faults.push(`piece ${a.piece} at the wrong size`);
    if (a.x < 0 || a.y < 0 || a.x + a.w > W || a.y + a.h > H) faults.push(`piece ${a.piece} outside`);
    for (const b of result.layout.slice(k + 1)) {
      if (a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h) faults.push(`${a.piece} overlaps ${b.piece}`);
    }
    area += p.w * p.h;
  }
  if (area !== result.area) faults.push(`area ${area} is not the ${result.area} reported`);
  return faults;
}

describe('exact guillotine solver for one small panel', () => {
  it('finds the brute-force optimum on random tiny cases and proves it', () => {
    // derived: the optimum is computed a second way, by brute force over subsets and cuts.
    const piece = fc.record({ w: fc.integer({ min: 1, max: 6 }), h: fc.integer({ min: 1, max: 6 }), turn: fc.boolean() });
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 8 }), fc.integer({ min: 2, max: 8 }), fc.array(piece, { minLength: 1, maxLength: 5 }), (W, H, pieces) => {
        const result = exactGuillotine(W, H, pieces);
        expect(result.proven).toBe(true);
        expect(layoutFaults(W, H, pieces, result)).toEqual([]);
        expect(result.area).toBe(bruteBest(W, H, pieces));
      }),
      { numRuns: 60, seed: 20261204 },
    );
  });

  it('fills a generated perfect packing completely', () => {
    // derived: the sheet was cut into these pieces by straight cuts, so 100% is possible.
    const instance = perfectInstance(11, 8, 6, 5);
    const pieces = instance.pieces.map((p) => ({ w: p.width, h: p.height, turn: false }));
    const result = exactGuillotine(8, 6, pieces);
    expect(result.area).toBe(48);
    expect(result.proven).toBe(true);
    expect(layoutFaults(8, 6, pieces, result)).toEqual([]);
  });

  it('says when its node limit stopped it before the proof', () => {
    const instance = perfectInstance(5, 97, 89, 40);
    const pieces = instance.pieces.map((p) => ({ w: p.width, h: p.height, turn: true })).slice(1);
    const result = exactGuillotine(97, 89, pieces, 50);
    expect(result.proven).toBe(false);
    expect(result.nodes).toBeGreaterThan(50);
  });
});
