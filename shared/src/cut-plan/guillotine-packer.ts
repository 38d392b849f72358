// The guillotine packer: fills a free rectangle of a panel the way a maker
// cuts with a rotary cutter. It cuts a strip the depth (or width) of one
// piece from edge to edge, sub-cuts that strip into copies of the piece, fills
// what is left of the strip the same way with smaller pieces, and carries on
// with the rest of the rectangle. Every cut therefore runs edge to edge of the
// region it is made in, and the result is a cut tree.
//
// All sizes are whole steps (see scaled-units.ts). A region of unlimited
// height (fabric bought by length) is cut in horizontal strips only.

import type { Orientation } from './plan-model';

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** A placed piece: a piece type (type >= 0) or a pinned piece (pinned >= 0). */
export interface PieceNode extends Box {
  kind: 'piece';
  type: number;
  pinned: number;
  rotated: boolean;
}

/** A region with nothing in it (yet); h may be Infinity for unlimited fabric. */
export interface EmptyNode extends Box {
  kind: 'empty';
}

/**
 * A region cut into parts along one direction: 'h' by horizontal cuts (parts
 * stacked top to bottom), 'v' by vertical cuts (parts left to right).
 */
export interface SplitNode extends Box {
  kind: 'split';
  dir: 'h' | 'v';
  children: CutNode[];
}

export type CutNode = PieceNode | EmptyNode | SplitNode;

/**
 * How the packer chooses the next strip. Among the strips whose fill (area of
 * the copies over the area the strip uses up, counting slivers no piece fits)
 * reaches `threshold`, it takes the one of the highest-ranked piece (then the
 * largest); if none does, the best-filled one. `dirs` limits the strip
 * direction. On fabric of unlimited length a way of laying a piece is judged
 * instead by the length all its copies would take.
 */
export interface Variant {
  name: string;
  threshold: number;
  dirs: 'h' | 'v' | 'both';
}

export const VARIANTS: readonly Variant[] = [
  { name: 'largest first', threshold: 0, dirs: 'both' },
  { name: 'largest first, horizontal strips', threshold: 0, dirs: 'h' },
  { name: 'largest first, vertical strips', threshold: 0, dirs: 'v' },
  { name: 'fill 80%', threshold: 0.8, dirs: 'both' },
  { name: 'fill 90%', threshold: 0.9, dirs: 'both' },
  { name: 'fill 97%', threshold: 0.97, dirs: 'both' },
  { name: 'best fill', threshold: 1.01, dirs: 'both' },
];

export interface FillContext {
  /** Orientations allowed in the bin being filled. */
  options: readonly Orientation[];
  /** Copies left of each type; decremented as pieces are placed. */
  counts: Int32Array;
  /** Types that may be used now (1) or not (0). */
  mask: Uint8Array;
  /** Priority of each type: among strips that fill well enough, the highest rank goes first. */
  rank: Float64Array;
  /** Worth of a square step of each type, for comparing trial fills. */
  weight: Float64Array;
  /** Pieces that may still be placed (Infinity for no limit). */
  budget: number;
  /** No option's shorter side is below this: a thinner region takes nothing (0 if unknown). */
  minSide: number;
  variant: Variant;
  /** Build the cut tree, or only count (a trial run). */
  build: boolean;
  /** Options looked at so far: a measure of the effort spent, the same on every machine. */
  work: number;
  /** Length of unlimited fabric used so far, in steps. */
  length: number;
  /** Square steps placed so far. */
  placedArea: number;
  /** Square steps placed, each times its type's weight. */
  placedValue: number;
  placedCount: number;
}

export function emptyNode(x: number, y: number, w: number, h: number): EmptyNode {
  return { kind: 'empty', x, y, w, h };
}

interface Pick {
  option: Orientation;
  dir: 'h' | 'v';
  n: number;
}

/** choose() writes its answer here (read it before choosing again) to spare the garbage collector. */
const picked: Pick = { option: { type: -1, w: 0, h: 0, rotated: false, area: 0 }, dir: 'h', n: 0 };

// The hot loop below creates no closures or objects per candidate: it runs
// for every strip of every trial fill.

/** The next strip for region w x h, in `picked`; null when no piece fits. */
function choose(ctx: FillContext, w: number, h: number, unbounded: boolean): Pick | null {
  const { options, counts, mask, variant, rank } = ctx;
  if (w < ctx.minSide || h < ctx.minSide) return null;
  ctx.work += options.length;
  // Smallest short and long side of any piece that still fits: a leftover
  // thinner or shorter than these cannot take a piece and counts as used up.
  let minShort = Infinity;
  let minLong = Infinity;
  for (let i = 0; i < options.length; i++) {
    const o = options[i];
    if (counts[o.type] <= 0 || mask[o.type] === 0 || o.w > w || o.h > h) continue;
    const s = o.w < o.h ? o.w : o.h;
    const l = o.w < o.h ? o.h : o.w;
    if (s < minShort) minShort = s;
    if (l < minLong) minLong = l;
  }
  if (minShort === Infinity) return null;

  const threshold = variant.threshold - 1e-12;
  const across = variant.dirs !== 'v' || unbounded;
  const down = variant.dirs !== 'h' && !unbounded;
  let best: Orientation | null = null;
  let bestDir: 'h' | 'v' = 'h';
  let bestN = 0;
  let bestOk = false;
  let bestRank = 0;
  let bestArea = 0;
  let bestUtil = 0;
  for (let i = 0; i < options.length; i++) {
    const o = options[i];
    const left = counts[o.type];
    if (left <= 0 || mask[o.type] === 0 || o.w > w || o.h > h) continue;
    const cap = left < ctx.budget ? left : ctx.budget;
    const r = rank[o.type];
    for (let k = 0; k < 2; k++) {
      let n: number;
      let used: number;
      if (k === 0) {
        if (!across) continue;
        n = Math.min(cap, Math.floor(w / o.w));
        const rest = w - n * o.w;
        const below = h - o.h;
        used = n * o.area;
        // A leftover is usable when some piece could fit it: both sides long enough.
        if (rest > 0 && !(Math.min(rest, o.h) >= minShort && Math.max(rest, o.h) >= minLong)) used += rest * o.h;
        if (!unbounded && below > 0 && !(Math.min(w, below) >= minShort && Math.max(w, below) >= minLong)) used += w * below;
      } else {
        if (!down) continue;
        n = Math.min(cap, Math.floor(h / o.h));
        const rest = h - n * o.h;
        const beside = w - o.w;
        used = n * o.area;
        if (rest > 0 && !(Math.min(rest, o.w) >= minShort && Math.max(rest, o.w) >= minLong)) used += rest * o.w;
        if (beside > 0 && !(Math.min(beside, h) >= minShort && Math.max(beside, h) >= minLong)) used += beside * h;
      }
      let util = (n * o.area) / used;
      if (unbounded) {
        // Fabric bought by length: judge a way of laying a piece by the length
        // all its copies would take in such strips, last partial strip included.
        const perStrip = Math.floor(w / o.w);
        const strips = Math.ceil(Math.min(left, ctx.budget) / perStrip);
        util = (Math.min(left, ctx.budget) * o.area) / (w * strips * o.h);
      }
      const ok = util >= threshold;
      let better: boolean;
      if (best === null) better = true;
      else if (ok !== bestOk) better = ok;
      else if (ok) {
        better =
          r > bestRank ||
          (r === bestRank && (o.area > bestArea || (o.area === bestArea && util > bestUtil)));
      } else {
        better = util > bestUtil || (util === bestUtil && (r > bestRank || (r === bestRank && o.area > bestArea)));
      }
      if (better) {
        best = o;
        bestDir = k === 0 ? 'h' : 'v';
        bestN = n;
        bestOk = ok;
        bestRank = r;
        bestArea = o.area;
        bestUtil = util;
      }
    }
  }
  if (best === null) return null;
  picked.option = best;
  picked.dir = bestDir;
  picked.n = bestN;
  return picked;
}

function place(ctx: FillContext, pick: Pick): void {
  ctx.counts[pick.option.type] -= pick.n;
  ctx.budget -= pick.n;
  ctx.placedArea += pick.n * pick.option.area;
  ctx.placedValue += pick.n * pick.option.area * ctx.weight[pick.option.type];
  ctx.placedCount += pick.n;
}

function pieceNode(o: Orientation, x: number, y: number): PieceNode {
  return { kind: 'piece', x, y, w: o.w, h: o.h, type: o.type, pinned: -1, rotated: o.rotated };
}

/** Cuts one strip of `pick` at the region's top-left and fills the strip's leftover. */
function cutStrip(ctx: FillContext, pick: Pick, x: number, y: number, w: number, h: number): CutNode | null {
  const { option: o, n } = pick;
  if (pick.dir === 'h') {
    const used = n * o.w;
    const leftover = fillRegion(ctx, x + used, y, w - used, o.h);
    if (!ctx.build) return null;
    if (n === 1 && used === w) return pieceNode(o, x, y);
    const children: CutNode[] = [];
    for (let i = 0; i < n; i++) children.push(pieceNode(o, x + i * o.w, y));
    if (leftover) children.push(leftover);
    return { kind: 'split', dir: 'v', x, y, w, h: o.h, children };
  }
  const used = n * o.h;
  const leftover = fillRegion(ctx, x, y + used, o.w, h - used);
  if (!ctx.build) return null;
  if (n === 1 && used === h) return pieceNode(o, x, y);
  const children: CutNode[] = [];
  for (let i = 0; i < n; i++) children.push(pieceNode(o, x, y + i * o.h));
  if (leftover) children.push(leftover);
  return { kind: 'split', dir: 'h', x, y, w: o.w, h, children };
}

/**
 * Fills the region with strips until no piece fits or the budget is spent.
 * Returns the region's cut tree (null for a zero-size region or a trial run).
 * A trial run and a real run with the same counts place exactly the same pieces.
 */
export function fillRegion(ctx: FillContext, x: number, y: number, w: number, h: number): CutNode | null {
  if (w <= 0 || h <= 0) return null;
  const unbounded = h === Infinity;
  let root: CutNode | null = null;
  // The open chain of strips: the split whose last part is the region being filled.
  let chain: SplitNode | null = null;
  for (;;) {
    const chosen = ctx.budget > 0 ? choose(ctx, w, h, unbounded) : null;
    if (!chosen) {
      if (ctx.build) {
        const rest = emptyNode(x, y, w, h);
        if (chain) chain.children.push(rest);
        else root = rest;
      }
      return root;
    }
    const pick: Pick = { option: chosen.option, dir: chosen.dir, n: chosen.n };
    place(ctx, pick);
    const o = pick.option;
    if (unbounded) ctx.length += o.h;
    const stripW = pick.dir === 'h' ? w : o.w;
    const stripH = pick.dir === 'h' ? o.h : h;
    const strip = cutStrip(ctx, pick, x, y, stripW, stripH);
    const restW = pick.dir === 'h' ? w : w - o.w;
    const restH = pick.dir === 'h' ? h - o.h : h;
    if (ctx.build) {
      const done = restW <= 0 || restH <= 0;
      if (chain && chain.dir === pick.dir) {
        chain.children.push(strip as CutNode);
      } else {
        const split: SplitNode = { kind: 'split', dir: pick.dir, x, y, w, h, children: [strip as CutNode] };
        if (chain) chain.children.push(split);
        else root = split;
        chain = split;
      }
      if (done) {
        if (chain.children.length === 1) {
          // The strip is the whole region.
          if (root === chain) root = strip;
          else replaceLast(root as SplitNode, chain, strip as CutNode);
        }
        return root;
      }
    } else if (restW <= 0 || restH <= 0) {
      return null;
    }
    if (pick.dir === 'h') y += o.h;
    else x += o.w;
    w = restW;
    h = restH;
  }
}

/** Replaces `target` (the last part of some split under `root`) by `node`. */
function replaceLast(root: SplitNode, target: SplitNode, node: CutNode): void {
  let parent: SplitNode = root;
  for (;;) {
    const last = parent.children[parent.children.length - 1];
    if (last === target) {
      parent.children[parent.children.length - 1] = node;
      return;
    }
    parent = last as SplitNode;
  }
}

/** Empty regions of a cut tree, in tree order (top-left first). */
export function emptyLeaves(node: CutNode, out: EmptyNode[] = []): EmptyNode[] {
  if (node.kind === 'empty') out.push(node);
  else if (node.kind === 'split') for (const child of node.children) emptyLeaves(child, out);
  return out;
}

/**
 * Fills every empty region of a tree in place (a real run) or only counts
 * what would be placed (a trial run). Returns the weighted area placed.
 */
export function fillTree(root: CutNode, ctx: FillContext): number {
  const before = ctx.placedValue;
  for (const leaf of emptyLeaves(root)) {
    if (ctx.budget <= 0) break;
    const filled = fillRegion(ctx, leaf.x, leaf.y, leaf.w, leaf.h);
    if (ctx.build && filled && filled !== leaf) Object.assign(leaf, filled);
  }
  return ctx.placedValue - before;
}
