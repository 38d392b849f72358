// The search: a few packing orders (strategies), each run through the same
// phases, and the best plan kept. Deterministic: no randomness, effort
// counted in work rather than time, and ties go to the earlier order.
//
// Phases of one run:
//  1. pieces kept around features are fixed in their panels, framed by
//     horizontal or vertical cuts first, whichever a trial fill prefers;
//  2. pieces that must come from particular garments (or a studio fabric)
//     are packed before pieces that may come from any garment;
//  3. each garment with a minimum gets that many pieces, the garments with
//     the least fabric first;
//  4. every panel is filled with what is left, with the strategy's packer
//     variant, or the best of its variants on that panel.

import { VARIANTS, fillTree, type CutNode, type FillContext, type Variant } from './guillotine-packer';
import { placePinnedPieces, skeletonTree, type PinnedFailure, type PinnedPlacement } from './kept-features';
import type { Orientation, PlanModel } from './plan-model';

export interface PlanState {
  strategy: string;
  /** Copies left unplaced per piece type. */
  counts: Int32Array;
  /** Cut tree per bin. */
  trees: CutNode[];
  pinnedPlacements: PinnedPlacement[];
  pinnedFailures: PinnedFailure[];
  /** Pieces placed per bin, pinned ones included. */
  binPieces: Int32Array;
  placedArea: number;
  placedCount: number;
  /** Sum over garments of the pieces missing from their minimums. */
  minimumDeficit: number;
  /** Effort spent (see FillContext.work). */
  work: number;
}

interface Strategy {
  name: string;
  /** Orders bins for phases 2 and 4 (a negative result puts a first). */
  order: (a: number, b: number) => number;
  /** Which pieces go first (see Variant). */
  rank: Float64Array;
  /** Worth of each type's area when choosing between trial fills of a panel. */
  weight: Float64Array;
  variants: readonly Variant[];
}

function strategies(model: PlanModel): { core: Strategy[]; extra: Strategy[] } {
  const area = (i: number) => {
    const bin = model.bins[i];
    return bin.unbounded ? Number.MAX_VALUE : bin.w * bin.h;
  };
  const byArea = (a: number, b: number) => area(b) - area(a) || a - b;
  const longSide = (i: number) => Math.max(model.bins[i].w, model.bins[i].h);
  const byLongSide = (a: number, b: number) => longSide(b) - longSide(a) || byArea(a, b);
  const byPieceArea = Float64Array.from(model.types, (t) => t.w * t.h);
  const byPieceLength = Float64Array.from(model.types, (t) => Math.max(t.w, t.h));
  // Scarcity: a piece that fits only a little of the fabric is worth more
  // where it does fit, so trial fills prefer it to pieces that fit anywhere.
  const binArea = model.bins.map((b) => (b.unbounded ? 0 : b.w * b.h));
  const total = binArea.reduce((s, a) => s + a, 0);
  const fitArea = new Float64Array(model.types.length);
  model.binOptions.forEach((options, b) => {
    const seen = new Set<number>();
    for (const o of options) if (!seen.has(o.type)) seen.add(o.type), (fitArea[o.type] += binArea[b]);
  });
  const scarcity = Float64Array.from(fitArea, (a) => (a > 0 ? Math.min(8, Math.sqrt(total / a)) : 1));
  const flat = new Float64Array(model.types.length).fill(1);
  const scarceArea = Float64Array.from(byPieceArea, (a, t) => a * scarcity[t]);
  const [largestFirst, horizontal, vertical, , fill90] = VARIANTS;
  // The variants tried on each panel: more cost more time and gained nothing on the seeded set.
  const perPanel = [largestFirst, horizontal, vertical, fill90];
  // Cheap single-variant runs first, then two that try every variant on each
  // panel. The set was chosen on seeded memory-quilt instances (see
  // scripts/bench-cut-plan.ts); each order wins on some of them.
  const core: Strategy[] = [
    { name: 'longest panels first, scarcest pieces first', order: byLongSide, rank: scarceArea, weight: flat, variants: [largestFirst] },
    { name: 'largest panels first, largest pieces first', order: byArea, rank: byPieceArea, weight: flat, variants: [largestFirst] },
    { name: 'largest panels first, longest pieces first, vertical strips', order: byArea, rank: byPieceLength, weight: flat, variants: [vertical] },
    { name: 'largest panels first, scarcest pieces first', order: byArea, rank: scarceArea, weight: flat, variants: [largestFirst] },
    { name: 'longest panels first, largest pieces first, best variant per panel', order: byLongSide, rank: byPieceArea, weight: scarcity, variants: perPanel },
    { name: 'largest panels first, largest pieces first, best variant per panel', order: byArea, rank: byPieceArea, weight: scarcity, variants: perPanel },
  ];
  // More orders, tried while the effort budget lasts (small plans get them all).
  const byHeight = Float64Array.from(model.types, (t) => t.h * 1e9 + t.w * t.h);
  const byWidth = Float64Array.from(model.types, (t) => t.w * 1e9 + t.w * t.h);
  const orders: [string, (a: number, b: number) => number][] = [['largest panels', byArea], ['longest panels', byLongSide]];
  const ranks: [string, Float64Array][] = [
    ['largest pieces', byPieceArea],
    ['longest pieces', byPieceLength],
    ['scarcest pieces', scarceArea],
    ['tallest pieces', byHeight],
    ['widest pieces', byWidth],
  ];
  const extra: Strategy[] = [];
  for (const variant of VARIANTS) {
    for (const [rankName, rank] of ranks) {
      for (const [orderName, order] of orders) {
        extra.push({ name: `${orderName} first, ${rankName} first, ${variant.name}`, order, rank, weight: flat, variants: [variant] });
      }
    }
  }
  for (const [rankName, rank] of ranks) {
    for (const [orderName, order] of orders) {
      extra.push({ name: `${orderName} first, ${rankName} first, every variant per panel`, order, rank, weight: scarcity, variants: VARIANTS });
    }
  }
  return { core, extra };
}

function run(model: PlanModel, strategy: Strategy, pinned: ReturnType<typeof placePinnedPieces>): PlanState {
  const { bins, types, binOptions } = model;
  const counts = Int32Array.from(types, (t) => t.count);
  let work = 0;
  const all = new Uint8Array(types.length).fill(1);
  const trees = bins.map((bin) => skeletonTree(bin, pinned.placements));
  // A panel with kept pieces: frame them with horizontal or vertical cuts
  // first, whichever a trial fill of the panel finds holds more.
  for (const bin of new Set(pinned.placements.map((p) => p.bin))) {
    let best = -1;
    for (const first of ['h', 'v'] as const) {
      const tree = skeletonTree(bins[bin], pinned.placements, first);
      const trial: FillContext = {
        options: binOptions[bin],
        minSide: 0,
        counts: counts.slice(),
        mask: all,
        rank: strategy.rank,
        weight: strategy.weight,
        budget: Infinity,
        variant: strategy.variants[0],
        build: false,
        work: 0,
        length: 0,
        placedArea: 0,
        placedValue: 0,
        placedCount: 0,
      };
      const value = fillTree(tree, trial);
      work += trial.work;
      if (value > best) {
        best = value;
        trees[bin] = tree;
      }
    }
  }
  const binPieces = new Int32Array(bins.length);
  for (const p of pinned.placements) binPieces[p.bin]++;
  const restricted = Uint8Array.from(types, (t) => (t.restricted ? 1 : 0));
  const order = bins.map((b) => b.index).sort(strategy.order);
  let placedArea = 0;
  let placedCount = pinned.placements.length;
  for (const p of pinned.placements) placedArea += p.w * p.h;

  const context = (
    options: Orientation[],
    minSide: number,
    mask: Uint8Array,
    variant: Variant,
    build: boolean,
    budget: number,
    c: Int32Array,
  ): FillContext => ({
    options,
    minSide,
    counts: c,
    mask,
    rank: strategy.rank,
    weight: strategy.weight,
    budget,
    variant,
    build,
    work: 0,
    length: 0,
    placedArea: 0,
    placedValue: 0,
    placedCount: 0,
  });

  /** Fills a bin with the best of the variants; returns pieces placed. */
  const fillBest = (bin: number, mask: Uint8Array, variants: readonly Variant[], budget = Infinity): number => {
    work += BIN_OVERHEAD * (variants.length === 1 ? 1 : variants.length + 1);
    // Only the orientations of types that may and can still be placed.
    const options: Orientation[] = [];
    let minSide = Infinity;
    for (const o of binOptions[bin]) {
      if (mask[o.type] === 0 || counts[o.type] <= 0) continue;
      options.push(o);
      minSide = Math.min(minSide, o.w, o.h);
    }
    if (options.length === 0) return 0;
    // Fabric bought by length tries every variant: the shortest length that
    // holds the most is what to buy.
    const tried = bins[bin].unbounded ? VARIANTS : variants;
    let best = tried[0];
    if (tried.length > 1) {
      let bestArea = -1;
      let bestLength = Infinity;
      for (const variant of tried) {
        const trial = context(options, minSide, mask, variant, false, budget, counts.slice());
        const area = fillTree(trees[bin], trial);
        work += trial.work;
        if (area > bestArea || (area === bestArea && trial.length < bestLength)) {
          bestArea = area;
          bestLength = trial.length;
          best = variant;
        }
      }
    }
    const ctx = context(options, minSide, mask, best, true, budget, counts);
    fillTree(trees[bin], ctx);
    work += ctx.work;
    binPieces[bin] += ctx.placedCount;
    placedArea += ctx.placedArea;
    placedCount += ctx.placedCount;
    return ctx.placedCount;
  };

  if (types.some((t) => t.restricted)) {
    for (const bin of order) fillBest(bin, restricted, strategy.variants);
  }

  const withMinimum = model.garments
    .filter((g) => g.minimum > 0)
    .map((g) => ({ g, largest: Math.max(...g.bins.map((b) => bins[b].w * bins[b].h)) }))
    .sort((a, b) => a.largest - b.largest)
    .map(({ g }) => g);
  for (const garment of withMinimum) {
    const garmentBins = [...garment.bins].sort((a, b) => bins[b].w * bins[b].h - bins[a].w * bins[a].h || a - b);
    let have = garmentBins.reduce((sum, b) => sum + binPieces[b], 0);
    for (const bin of garmentBins) {
      if (have >= garment.minimum) break;
      have += fillBest(bin, all, [VARIANTS[0]], garment.minimum - have);
    }
  }

  for (const bin of order) fillBest(bin, all, strategy.variants);

  let minimumDeficit = 0;
  for (const garment of model.garments) {
    const have = garment.bins.reduce((sum, b) => sum + binPieces[b], 0);
    minimumDeficit += Math.max(0, garment.minimum - have);
  }
  return {
    strategy: strategy.name,
    counts,
    trees,
    pinnedPlacements: pinned.placements,
    pinnedFailures: pinned.failures,
    binPieces,
    placedArea,
    placedCount,
    minimumDeficit,
    work,
  };
}

/** True when plan a is better than plan b: fewer pieces missing from minimums, then more area, then more pieces. */
export function betterPlan(a: PlanState, b: PlanState): boolean {
  if (a.minimumDeficit !== b.minimumDeficit) return a.minimumDeficit < b.minimumDeficit;
  if (a.placedArea !== b.placedArea) return a.placedArea > b.placedArea;
  return a.placedCount > b.placedCount;
}

/**
 * Runs the strategies in turn, stopping early once one places everything
 * and meets every minimum; returns every plan made, in order.
 */
export function runStrategies(model: PlanModel): PlanState[] {
  const pinned = placePinnedPieces(model);
  const { core, extra } = strategies(model);
  const states: PlanState[] = [];
  let spent = 0;
  let runs = 0;
  const done = (state: PlanState) => state.minimumDeficit === 0 && state.counts.every((c) => c === 0);
  for (const strategy of core) {
    const state = run(model, strategy, pinned);
    states.push(state);
    spent += state.work;
    runs += fillRuns(strategy);
    if (done(state)) return states;
  }
  // Further orders while the effort budget lasts, judged by the effort of a run so far.
  for (const strategy of extra) {
    if (spent + (spent / runs) * fillRuns(strategy) > WORK_BUDGET) continue;
    const state = run(model, strategy, pinned);
    states.push(state);
    spent += state.work;
    runs += fillRuns(strategy);
    if (done(state)) break;
  }
  return states;
}

/** Fill runs one bin takes under a strategy: one per variant tried, and the real one. */
function fillRuns(strategy: Strategy): number {
  return strategy.variants.length === 1 ? 1 : strategy.variants.length + 1;
}

/**
 * Effort (options looked at) the search may spend on further orders. It
 * counts work, not time, so the plan is the same on every machine.
 */
export const WORK_BUDGET = 100_000;

/** Effort counted for each fill of a bin besides the options looked at (setting it up, walking its tree). */
const BIN_OVERHEAD = 50;

/** The best plan of every strategy (the earliest among equals). */
export function searchPlan(model: PlanModel): PlanState {
  let best: PlanState | null = null;
  for (const state of runStrategies(model)) if (!best || betterPlan(state, best)) best = state;
  return best as PlanState;
}
