// An exact solver for one small panel: the most area of the given pieces
// (each copy at most once) that edge-to-edge cuts can free from a W x H
// rectangle. A branch and bound over every guillotine cut tree: a region is
// either one piece in its top-left corner (the rest waste), or cut straight
// across at a position some pieces' sides add up to (a normal pattern: any
// guillotine layout can be pushed up and left until every cut is at such a
// sum, Herz 1972 / Christofides and Whitlock 1977, from memory), both parts
// then packed in turn. A cut that leaves a part no piece fits is never needed
// (that part is waste either way), so it is not tried. A branch is cut off
// when its area plus the free area (or the area of the pieces left, if less)
// cannot beat the best so far. When the search ends inside its node limit the
// result is proven optimal. Checked against brute force in its spec.

export interface ExactPiece {
  w: number;
  h: number;
  /** May also lie h x w. */
  turn: boolean;
}

export interface ExactLayout {
  /** Index of the piece in the list given. */
  piece: number;
  x: number;
  y: number;
  w: number;
  h: number;
  rotated: boolean;
}

export interface ExactResult {
  area: number;
  layout: ExactLayout[];
  /** True when every branch was searched or cut off by the bound: no guillotine layout holds more. */
  proven: boolean;
  nodes: number;
}

interface Region {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Sums of sides reachable by some of the pieces (either side of a piece that may turn), up to `max`. */
function sideSums(pieces: ExactPiece[], max: number, side: 'w' | 'h'): Uint8Array {
  const sums = new Uint8Array(max + 1);
  sums[0] = 1;
  for (const p of pieces) {
    const sizes = p.turn && p.w !== p.h ? [p.w, p.h] : [side === 'w' ? p.w : p.h];
    for (let s = max; s >= 0; s--) {
      if (!sums[s]) continue;
      for (const d of sizes) if (s + d <= max) sums[s + d] = 1;
    }
  }
  return sums;
}

/** The best guillotine packing of the pieces into W x H (whole steps), within `nodeLimit` nodes. */
export function exactGuillotine(W: number, H: number, pieces: ExactPiece[], nodeLimit = 2_000_000, floor = 0): ExactResult {
  const n = pieces.length;
  const used = new Uint8Array(n);
  const across = sideSums(pieces, W, 'w');
  const down = sideSums(pieces, H, 'h');
  // The most of a side that pieces can use: the largest sum of sides not above it.
  const usableW = new Int32Array(W + 1);
  const usableH = new Int32Array(H + 1);
  for (let s = 1; s <= W; s++) usableW[s] = across[s] ? s : usableW[s - 1];
  for (let s = 1; s <= H; s++) usableH[s] = down[s] ? s : usableH[s - 1];
  const usable = (r: Region) => usableW[r.w] * usableH[r.h];
  let left = pieces.reduce((s, p) => s + p.w * p.h, 0);
  let placed = 0;
  let openArea = 0;
  let best = floor;
  let bestLayout: ExactLayout[] = [];
  let nodes = 0;
  let aborted = false;
  const layout: ExactLayout[] = [];
  const stack: Region[] = [];
  // Pieces of the same size and turning are interchangeable: only the first unused is tried.
  const sameAsEarlier = pieces.map((p, i) => pieces.findIndex((q) => q.w === p.w && q.h === p.h && q.turn === p.turn) !== i);
  const firstOf = pieces.map((p) => pieces.findIndex((q) => q.w === p.w && q.h === p.h && q.turn === p.turn));

  const fitsAny = (w: number, h: number): boolean => {
    for (let i = 0; i < n; i++) {
      if (used[i]) continue;
      const p = pieces[i];
      if ((p.w <= w && p.h <= h) || (p.turn && p.h <= w && p.w <= h)) return true;
    }
    return false;
  };
  /** The first unused copy of piece i's size, or -1. */
  const unusedLike = (i: number): number => {
    for (let j = i; j < n; j++) if (!used[j] && firstOf[j] === i) return j;
    return -1;
  };

  /** One piece in the region's top-left corner: the ones that fill it exactly, or the others. */
  const corner = (region: Region, exactOnly: boolean): void => {
    for (let i = 0; i < n && !aborted; i++) {
      if (sameAsEarlier[i]) continue;
      const j = unusedLike(i);
      if (j < 0) continue;
      const p = pieces[j];
      const ways: [number, number, boolean][] = [[p.w, p.h, false]];
      if (p.turn && p.w !== p.h) ways.push([p.h, p.w, true]);
      for (const [w, h, rotated] of ways) {
        if (w > region.w || h > region.h) continue;
        if ((w === region.w && h === region.h) !== exactOnly) continue;
        used[j] = 1;
        left -= p.w * p.h;
        placed += p.w * p.h;
        layout.push({ piece: j, x: region.x, y: region.y, w, h, rotated });
        search();
        layout.pop();
        placed -= p.w * p.h;
        left += p.w * p.h;
        used[j] = 0;
      }
    }
  };

  /** Cuts across at a sum of sides, leaving two parts that can each take a piece; larger first parts first. */
  const cuts = (region: Region): void => {
    for (const dir of ['h', 'v'] as const) {
      const size = dir === 'h' ? region.h : region.w;
      const sums = dir === 'h' ? down : across;
      for (let c = size - 1; c >= 1 && !aborted; c--) {
        if (!sums[c]) continue;
        const first: Region = dir === 'h' ? { x: region.x, y: region.y, w: region.w, h: c } : { x: region.x, y: region.y, w: c, h: region.h };
        const second: Region =
          dir === 'h'
            ? { x: region.x, y: region.y + c, w: region.w, h: region.h - c }
            : { x: region.x + c, y: region.y, w: region.w - c, h: region.h };
        if (!fitsAny(first.w, first.h) || !fitsAny(second.w, second.h)) continue;
        stack.push(second, first);
        const added = usable(first) + usable(second);
        openArea += added;
        search();
        stack.pop();
        stack.pop();
        openArea -= added;
      }
    }
  };

  const search = (): void => {
    if (aborted) return;
    if (++nodes > nodeLimit) {
      aborted = true;
      return;
    }
    if (placed + Math.min(openArea, left) <= best) return;
    // Only pieces that fit some open region can still be placed.
    let maxW = 0;
    let maxH = 0;
    for (const r of stack) {
      if (r.w > maxW) maxW = r.w;
      if (r.h > maxH) maxH = r.h;
    }
    let canPlace = 0;
    for (let i = 0; i < n; i++) {
      if (used[i]) continue;
      const p = pieces[i];
      if ((p.w <= maxW && p.h <= maxH) || (p.turn && p.h <= maxW && p.w <= maxH)) canPlace += p.w * p.h;
    }
    if (placed + Math.min(openArea, canPlace) <= best) return;
    const region = stack.pop();
    if (!region) {
      best = placed;
      bestLayout = layout.slice();
      return;
    }
    openArea -= usable(region);
    if (!fitsAny(region.w, region.h)) {
      search();
    } else {
      // A piece that is the whole region, then a cut straight across, then one piece with the rest waste.
      corner(region, true);
      cuts(region);
      corner(region, false);
    }
    stack.push(region);
    openArea += usable(region);
  };

  stack.push({ x: 0, y: 0, w: W, h: H });
  openArea = usable(stack[0]);
  search();
  return { area: bestLayout.length > 0 ? best : floor, layout: bestLayout, proven: !aborted, nodes };
}
