// The improvement search: after the fast construction (plan-search.ts), each
// panel in turn, the one with the most area still free first, is packed again
// from scratch by a branch and bound over guillotine constructions, with the
// pieces it holds now and every piece still unplaced that may come from it.
// The new packing replaces the old only when it holds more area and keeps
// every restricted piece (named garment, group) the panel gave before, so no
// rule the construction met is lost: sources, grain and turning are in the
// panel's orientations, minimums are rechecked, panels with kept features and
// fabric bought by length are left as they are.
//
// One node of the search puts a piece in the top-left corner of a free
// region and cuts the rest of the region into two with one edge-to-edge cut
// along one of the piece's sides and a second within the strip (the piece's
// row first, or its column first), or closes the region as waste. A region no
// remaining piece fits is waste at once, and a branch whose placed area plus
// the free area (or the area of the pieces left, if less) cannot beat the
// best so far is cut off. Restarts with seeded, slightly shuffled piece
// orders spread the effort; it is all counted in nodes, not time, so the same
// input and budget always give the same plan.

import type { CutNode, EmptyNode, PieceNode, SplitNode } from './guillotine-packer';
import { seededRandom } from './perfect-instance';
import type { Orientation, PlanModel } from './plan-model';
import type { PlanState } from './plan-search';

interface Region {
  x: number;
  y: number;
  w: number;
  h: number;
}

/**
 * What goes in a region's corner: one piece, or two with a side in common
 * laid side by side ('v': b beside a) or one above the other ('h': b under a),
 * a block that leaves no waste between them.
 */
interface Item {
  w: number;
  h: number;
  area: number;
  a: Orientation;
  b: Orientation | null;
  dir: 'h' | 'v';
}

interface Decision {
  region: Region;
  option: Item;
  /** 'row': cut under the piece across the region first; 'column': beside it down the region first. */
  split: 'row' | 'column';
  right: Region | null;
  below: Region | null;
}

export interface BinPacking {
  /** Square steps placed. */
  area: number;
  tree: CutNode;
  used: Int32Array;
  /** True when the search ran to its end: no construction of this kind holds more. */
  complete: boolean;
  nodes: number;
}

/**
 * Packs one W x H region with at most avail[t] copies of each type, by the
 * orientations given. Stops after `nodeLimit` nodes; `floor` is an area the
 * result must beat to be kept (the current packing's).
 */
export function packRegion(
  W: number,
  H: number,
  options: readonly Orientation[],
  avail: Int32Array,
  nodeLimit: number,
  floor = 0,
  restarts = Math.max(8, Math.floor(nodeLimit / RESTART_NODES)),
): BinPacking | null {
  const counts = avail.slice();
  const typeCount = avail.length;
  let left = 0;
  for (let t = 0; t < typeCount; t++) {
    const o = options.find((op) => op.type === t);
    if (o) left += counts[t] * o.area;
  }
  const opts = options.filter((o) => counts[o.type] > 0);
  let best = floor;
  let bestDecisions: Decision[] | null = null;
  let nodes = 0;
  let complete = false;
  const decisions: Decision[] = [];
  const stack: Region[] = [];
  let openArea = 0;
  let placed = 0;
  let limit = 0;
  let order: Orientation[] = opts;
  let items: Item[] = [];
  let aborted = false;
  let root: Region = { x: 0, y: 0, w: W, h: H };
  let bestRoot = root;

  const fits = (r: Region) => {
    for (let i = 0; i < order.length; i++) {
      const o = order[i];
      if (counts[o.type] > 0 && o.w <= r.w && o.h <= r.h) return true;
    }
    return false;
  };

  const dfs = (): void => {
    if (nodes >= limit) {
      aborted = true;
      return;
    }
    nodes++;
    if (placed + Math.min(openArea, left) <= best) return;
    const region = stack.pop();
    if (!region) {
      if (placed > best) {
        best = placed;
        bestDecisions = decisions.slice();
        bestRoot = root;
      }
      return;
    }
    openArea -= region.w * region.h;
    if (!fits(region)) {
      dfs();
    } else {
      // Candidates: pieces filling the region's width or height exactly first, then larger first.
      let tried = 0;
      for (let pass = 0; pass < 3 && !aborted; pass++) {
        for (let i = 0; i < items.length && !aborted; i++) {
          const o = items[i];
          if (o.w > region.w || o.h > region.h || counts[o.a.type] <= 0) continue;
          if (o.b && counts[o.b.type] <= (o.b.type === o.a.type ? 1 : 0)) continue;
          const exact = Number(o.w === region.w) + Number(o.h === region.h);
          if ((pass === 0 && exact < 2) || (pass === 1 && exact !== 1) || (pass === 2 && exact !== 0)) continue;
          if (tried >= BRANCHES) break;
          tried++;
          counts[o.a.type]--;
          if (o.b) counts[o.b.type]--;
          left -= o.area;
          placed += o.area;
          const splits: ('row' | 'column')[] = o.w === region.w || o.h === region.h ? ['row'] : ['row', 'column'];
          for (const split of splits) {
            const rw = region.w - o.w;
            const bh = region.h - o.h;
            const right: Region | null = rw > 0 ? { x: region.x + o.w, y: region.y, w: rw, h: split === 'row' ? o.h : region.h } : null;
            const below: Region | null = bh > 0 ? { x: region.x, y: region.y + o.h, w: split === 'row' ? region.w : o.w, h: bh } : null;
            const pushed: number[] = [];
            let wasted = 0;
            for (const r of [below, right]) {
              if (!r) continue;
              if (fits(r)) {
                stack.push(r);
                openArea += r.w * r.h;
                pushed.push(r.w * r.h);
              } else wasted += r.w * r.h;
            }
            void wasted;
            decisions.push({ region, option: o, split, right, below });
            dfs();
            decisions.pop();
            for (let k = pushed.length - 1; k >= 0; k--) {
              stack.pop();
              openArea -= pushed[k];
            }
            if (aborted) break;
          }
          placed -= o.area;
          left += o.area;
          counts[o.a.type]++;
          if (o.b) counts[o.b.type]++;
        }
      }
      // Or leave the region empty.
      if (!aborted) dfs();
    }
    stack.push(region);
    openArea += region.w * region.h;
  };

  const random = seededRandom(0x5eed ^ (W * 31 + H));
  for (let round = 0; round < restarts && nodes < nodeLimit && !complete; round++) {
    // The first, unshuffled search gets a quarter of the nodes; then many short seeded dives.
    const share = round === 0 ? Math.floor(nodeLimit / 4) : round === restarts - 1 ? nodeLimit - nodes : Math.floor((nodeLimit - nodes) / (restarts - round));
    limit = nodes + share;
    aborted = false;
    if (round > 0) {
      // A seeded shuffle of the piece order: each area counts a random 0.7 to 1.3 of itself.
      const noise = new Map(opts.map((o) => [o, o.area * (1 - NOISE + 2 * NOISE * random())]));
      order = [...opts].sort((a, b) => (noise.get(b) as number) - (noise.get(a) as number));
    } else order = [...opts].sort((a, b) => b.area - a.area || Math.max(b.w, b.h) - Math.max(a.w, a.h));
    items = blocks(order, W, H);
    stack.length = 0;
    root = { x: 0, y: 0, w: W, h: H };
    stack.push(root);
    openArea = W * H;
    dfs();
    // A round that ran to its end with every branch open has searched all of it.
    if (!aborted && round === 0 && BRANCHES >= opts.length) complete = true;
  }
  if (!bestDecisions) return null;
  const chosen = bestDecisions as Decision[];
  const used = new Int32Array(typeCount);
  for (const d of chosen) {
    used[d.option.a.type]++;
    if (d.option.b) used[d.option.b.type]++;
  }
  return { area: best, tree: buildTree(bestRoot, chosen), used, complete, nodes };
}

/**
 * The items of a piece order: each piece, and (up to MAX_BLOCKS) each pair
 * with a side in common that fits the region together, in the order of their
 * first piece; a pair comes just before its first piece alone.
 */
function blocks(order: Orientation[], W: number, H: number): Item[] {
  const items: Item[] = [];
  let pairs = 0;
  for (const a of order) {
    for (const b of order) {
      if (pairs >= MAX_BLOCKS) break;
      if (a.h === b.h && a.w + b.w <= W) {
        items.push({ w: a.w + b.w, h: a.h, area: a.area + b.area, a, b, dir: 'v' });
        pairs++;
      }
      if (a.w === b.w && a.h + b.h <= H) {
        items.push({ w: a.w, h: a.h + b.h, area: a.area + b.area, a, b, dir: 'h' });
        pairs++;
      }
    }
    items.push({ w: a.w, h: a.h, area: a.area, a, b: null, dir: 'h' });
  }
  return items;
}

/** Most two-piece blocks tried. */
const MAX_BLOCKS = 1_500;

/** Each restart shuffles the piece order by up to this fraction of each area. */
const NOISE = 0.3;

/** Nodes a restart is given: many short dives did better than few long ones on generated perfect packings. */
const RESTART_NODES = 100;

/** Candidate pieces tried in each free region (the search's width). */
const BRANCHES = 3;

/** The cut tree of a list of decisions: each region is a piece with its row and column cut off, or empty. */
function buildTree(root: Region, decisions: Decision[]): CutNode {
  const byRegion = new Map<Region, Decision>(decisions.map((d) => [d.region, d]));
  const node = (r: Region): CutNode => {
    const d = byRegion.get(r);
    if (!d) return { kind: 'empty', x: r.x, y: r.y, w: r.w, h: r.h } as EmptyNode;
    const o = d.option;
    const single = (q: Orientation, x: number, y: number): PieceNode => ({ kind: 'piece', x, y, w: q.w, h: q.h, type: q.type, pinned: -1, rotated: q.rotated });
    const piece: CutNode = !o.b
      ? single(o.a, r.x, r.y)
      : ({
          kind: 'split',
          dir: o.dir,
          x: r.x,
          y: r.y,
          w: o.w,
          h: o.h,
          children: [single(o.a, r.x, r.y), o.dir === 'v' ? single(o.b, r.x + o.a.w, r.y) : single(o.b, r.x, r.y + o.a.h)],
        } as SplitNode);
    const sub = (reg: Region | null, x: number, y: number, w: number, h: number): CutNode =>
      reg ? node(reg) : ({ kind: 'empty', x, y, w, h } as EmptyNode);
    if (d.split === 'row') {
      // Across under the piece's row, then the row beside the piece.
      const row: CutNode =
        o.w === r.w
          ? piece
          : ({ kind: 'split', dir: 'v', x: r.x, y: r.y, w: r.w, h: o.h, children: [piece, sub(d.right, r.x + o.w, r.y, r.w - o.w, o.h)] } as SplitNode);
      if (o.h === r.h) return row;
      return { kind: 'split', dir: 'h', x: r.x, y: r.y, w: r.w, h: r.h, children: [row, sub(d.below, r.x, r.y + o.h, r.w, r.h - o.h)] };
    }
    const column: CutNode =
      o.h === r.h
        ? piece
        : ({ kind: 'split', dir: 'h', x: r.x, y: r.y, w: o.w, h: r.h, children: [piece, sub(d.below, r.x, r.y + o.h, o.w, r.h - o.h)] } as SplitNode);
    if (o.w === r.w) return column;
    return { kind: 'split', dir: 'v', x: r.x, y: r.y, w: r.w, h: r.h, children: [column, sub(d.right, r.x + o.w, r.y, r.w - o.w, r.h)] };
  };
  return node(root);
}

function pieceTypesIn(node: CutNode, out: Int32Array): number {
  if (node.kind === 'piece') {
    if (node.pinned >= 0) return 1;
    out[node.type]++;
    return 0;
  }
  let pinned = 0;
  if (node.kind === 'split') for (const child of node.children) pinned += pieceTypesIn(child, out);
  return pinned;
}

function areaOf(node: CutNode): number {
  if (node.kind === 'piece') return node.w * node.h;
  if (node.kind === 'split') return node.children.reduce((s, c) => s + areaOf(c), 0);
  return 0;
}

/**
 * Spends up to `nodeBudget` search nodes improving the plan panel by panel.
 * Returns a new state (the given one is not changed) that is never worse by
 * betterPlan's order.
 */
export function improvePlan(model: PlanModel, state: PlanState, nodeBudget: number): PlanState {
  if (nodeBudget <= 0) return state;
  const { bins, types, binOptions } = model;
  const counts = state.counts.slice();
  const trees = state.trees.slice();
  const binPieces = state.binPieces.slice();
  let placedArea = state.placedArea;
  let placedCount = state.placedCount;
  const garmentOf = new Map<number, { bins: number[]; minimum: number }>();
  for (const g of model.garments) for (const b of g.bins) garmentOf.set(b, g);

  // Panels worth trying, the most free area first.
  const candidates: { bin: number; free: number }[] = [];
  for (const bin of bins) {
    if (bin.unbounded || binOptions[bin.index].length === 0) continue;
    const inTree = new Int32Array(types.length);
    if (pieceTypesIn(trees[bin.index], inTree) > 0) continue;
    const free = bin.w * bin.h - areaOf(trees[bin.index]);
    if (free > 0) candidates.push({ bin: bin.index, free });
  }
  candidates.sort((a, b) => b.free - a.free || a.bin - b.bin);
  let spent = 0;
  for (let i = 0; i < candidates.length && spent < nodeBudget; i++) {
    const b = candidates[i].bin;
    const bin = bins[b];
    const before = new Int32Array(types.length);
    pieceTypesIn(trees[b], before);
    const avail = new Int32Array(types.length);
    for (let t = 0; t < types.length; t++) avail[t] = counts[t] + before[t];
    // Could anything more go in at all?
    let offered = 0;
    const seen = new Set<number>();
    for (const o of binOptions[b]) if (!seen.has(o.type)) seen.add(o.type), (offered += avail[o.type] * o.area);
    const current = areaOf(trees[b]);
    if (Math.min(offered, bin.w * bin.h) <= current) continue;
    // Share what is left among the panels still to try, more to the freer ones.
    const rest = candidates.slice(i).reduce((s, c) => s + c.free, 0);
    const share = Math.max(MIN_NODES, Math.floor(((nodeBudget - spent) * candidates[i].free) / rest));
    const packing = packRegion(bin.w, bin.h, binOptions[b], avail, Math.min(share, nodeBudget - spent), current);
    spent += packing ? packing.nodes : Math.min(share, nodeBudget - spent);
    if (!packing || packing.area <= current) continue;
    // Keep every restricted piece the panel gave, and the garment's minimum.
    if (types.some((t, k) => t.restricted && packing.used[k] < before[k])) continue;
    const countBefore = before.reduce((s, c) => s + c, 0);
    const countAfter = packing.used.reduce((s, c) => s + c, 0);
    const garment = garmentOf.get(b);
    if (garment && countAfter < countBefore) {
      const have = garment.bins.reduce((s, gb) => s + binPieces[gb], 0) - countBefore + countAfter;
      if (have < garment.minimum) continue;
    }
    for (let t = 0; t < types.length; t++) counts[t] = avail[t] - packing.used[t];
    trees[b] = packing.tree;
    binPieces[b] += countAfter - countBefore;
    placedArea += packing.area - current;
    placedCount += countAfter - countBefore;
  }
  if (placedArea === state.placedArea) return state;
  let minimumDeficit = 0;
  for (const g of model.garments) minimumDeficit += Math.max(0, g.minimum - g.bins.reduce((s, gb) => s + binPieces[gb], 0));
  return { ...state, counts, trees, binPieces, placedArea, placedCount, minimumDeficit, strategy: `${state.strategy}, improved`, work: state.work + spent };
}

/** Fewest nodes given to a panel worth trying. */
const MIN_NODES = 2_000;
