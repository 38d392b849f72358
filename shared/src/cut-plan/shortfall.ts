// Shortfall: what could not be placed, why, and the smallest extra fabric
// that would hold it where that can be computed.

import type { GarmentMinimumShortfall, PieceShortfall, PieceSource, ShortfallReason } from './cut-plan-types';
import { emptyLeaves, fillRegion, VARIANTS, type CutNode, type FillContext } from './guillotine-packer';
import type { PinnedFailure } from './kept-features';
import { orientationsIn, sourceAllows, type BinModel, type Orientation, type PlanModel } from './plan-model';
import { fromSteps } from './scaled-units';

/**
 * The smallest rectangle, in piece-sized rows and columns, that holds n
 * copies of a w x h piece. Its area is exactly n * w * h, the least any
 * fabric holding them can have; among such grids the squarest is returned.
 */
export function smallestCover(w: number, h: number, n: number): { w: number; h: number } {
  let best = { w: n * w, h };
  for (let d = 1; d * d <= n; d++) {
    if (n % d !== 0) continue;
    for (const [cols, rows] of [
      [d, n / d],
      [n / d, d],
    ]) {
      const candidate = { w: cols * w, h: rows * h };
      const worse = Math.max(best.w, best.h);
      const better = Math.max(candidate.w, candidate.h);
      if (better < worse || (better === worse && candidate.w > best.w)) best = candidate;
    }
  }
  return best;
}

/**
 * Length of fabric of the bin's width that holds the given copies, found by
 * packing them in strips across the width (an upper bound on the least);
 * null when some copy is wider than the fabric every allowed way round.
 */
export function extraLength(
  model: PlanModel,
  bin: BinModel,
  copies: { type: number; count: number }[],
): number | null {
  const open: BinModel = { ...bin, h: Infinity, unbounded: true };
  const counts = new Int32Array(model.types.length);
  const mask = new Uint8Array(model.types.length);
  const options: Orientation[] = [];
  for (const { type, count } of copies) {
    const ways = orientationsIn(model.types[type], open, type);
    if (ways.length === 0) return null;
    options.push(...ways);
    counts[type] += count;
    mask[type] = 1;
  }
  const ctx: FillContext = {
    options,
    counts,
    mask,
    rank: Float64Array.from(model.types, (t) => t.w * t.h),
    weight: new Float64Array(model.types.length).fill(1),
    budget: Infinity,
    minSide: 0,
    variant: VARIANTS[0],
    build: true,
    work: 0,
    length: 0,
    placedArea: 0,
    placedValue: 0,
    placedCount: 0,
  };
  const tree = fillRegion(ctx, 0, 0, open.w, Infinity);
  if (!tree || tree.kind !== 'split') return 0;
  const last = tree.children[tree.children.length - 1];
  return last.kind === 'empty' && last.h === Infinity ? last.y : tree.h;
}

function noSourceDetail(source: PieceSource): string {
  switch (source.kind) {
    case 'any-garment':
      return 'no garment panels are listed';
    case 'garment':
      return `no panels are listed for garment "${source.garmentId}"`;
    case 'garment-group':
      return `no panels are listed for any garment of "${source.name}"`;
    case 'studio-fabric':
      return `studio fabric "${source.fabricId}" is not listed`;
  }
}

/** Why copies of a (not pinned) piece type were left over. */
export function shortReason(model: PlanModel, type: number): { reason: ShortfallReason; detail: string } {
  const t = model.types[type];
  const bins = t.sourceBins.map((b) => model.bins[b]);
  if (bins.length === 0) return { reason: 'rule-not-met', detail: noSourceDetail(t.source) };
  const fitsSomeWay = bins.some((b) => (t.w <= b.w && t.h <= b.h) || (t.h <= b.w && t.w <= b.h));
  if (!fitsSomeWay) {
    return { reason: 'no-panel-large-enough', detail: 'it is larger than every panel or fabric it may come from' };
  }
  if (!bins.some((b) => orientationsIn(t, b).length > 0)) {
    return {
      reason: 'rule-not-met',
      detail: 'it fits only turned, and the grain, directional-print or no-turn rules forbid turning it there',
    };
  }
  return { reason: 'not-enough-area', detail: 'the panels it may come from have no room left for it' };
}

/** Shortfall of every piece with copies left over, in input order. */
export function pieceShortfalls(
  model: PlanModel,
  short: Map<number, { count: number; type: number }>,
  pinnedFailures: PinnedFailure[],
): PieceShortfall[] {
  const out: PieceShortfall[] = [];
  const failureByPiece = new Map(pinnedFailures.map((f) => [model.pinned[f.pinned].piece, f]));
  model.pieces.forEach((piece, index) => {
    const failure = failureByPiece.get(index);
    if (failure) {
      out.push({ pieceId: piece.id, count: 1, reason: failure.reason, detail: failure.detail });
      return;
    }
    const entry = short.get(index);
    if (!entry || entry.count === 0) return;
    const t = model.types[entry.type];
    const why = shortReason(model, entry.type);
    const result: PieceShortfall = { pieceId: piece.id, count: entry.count, ...why };
    if (t.source.kind === 'studio-fabric') {
      const bin = model.bins.find((b) => b.kind === 'studio' && b.fabricId === (t.source as { fabricId: string }).fabricId);
      const length = bin ? extraLength(model, bin, [{ type: entry.type, count: entry.count }]) : null;
      if (bin && length !== null) result.extraFabric = { width: bin.width, height: fromSteps(length) };
    } else {
      const cover = smallestCover(t.w, t.h, entry.count);
      result.extraFabric = { width: fromSteps(cover.w), height: fromSteps(cover.h) };
    }
    out.push(result);
  });
  return out;
}

/** Garments that gave fewer pieces than their minimum, and why. */
export function garmentMinimumShortfalls(
  model: PlanModel,
  binPieces: Int32Array,
  counts: Int32Array,
  trees: CutNode[],
): GarmentMinimumShortfall[] {
  const out: GarmentMinimumShortfall[] = [];
  for (const garment of model.garments) {
    const achieved = garment.bins.reduce((sum, b) => sum + binPieces[b], 0);
    if (achieved >= garment.minimum) continue;
    const entry = (reason: GarmentMinimumShortfall['reason'], detail: string) =>
      out.push({ garmentId: garment.id, required: garment.minimum, achieved, reason, detail });
    const bins = garment.bins.map((b) => model.bins[b]);
    const eligible = model.types.filter((t) => bins.some((b) => sourceAllows(t.source, b)));
    if (eligible.length === 0) {
      if (model.types.length === 0) entry('not-enough-pieces', 'there are no pieces to cut');
      else entry('rule-not-met', 'the source rules let no piece come from this garment');
      continue;
    }
    if (!garment.bins.some((b) => model.binOptions[b].length > 0)) {
      const fitsSomeWay = eligible.some((t) => bins.some((b) => (t.w <= b.w && t.h <= b.h) || (t.h <= b.w && t.w <= b.h)));
      if (fitsSomeWay) entry('rule-not-met', 'pieces fit its panels only turned, which the grain or print rules forbid');
      else entry('no-panel-large-enough', 'its panels are smaller than every piece that may come from it');
      continue;
    }
    // Room left for some piece that may come from it, had there been more pieces?
    const room = garment.bins.some((b) =>
      emptyLeaves(trees[b]).some((leaf) => model.binOptions[b].some((o) => o.w <= leaf.w && o.h <= leaf.h)),
    );
    const fitting = new Set(garment.bins.flatMap((b) => model.binOptions[b].map((o) => o.type)));
    if (room && [...fitting].every((t) => counts[t] === 0)) {
      entry('not-enough-pieces', 'every piece that fits it is already placed elsewhere: too few pieces for the minimums');
    } else {
      entry('not-enough-area', 'its panels have no room left for the pieces that may come from it');
    }
  }
  for (const missing of model.minimumsWithoutPanels) {
    out.push({
      garmentId: missing.garmentId,
      required: missing.count,
      achieved: 0,
      reason: 'rule-not-met',
      detail: 'no panels are listed for this garment',
    });
  }
  return out;
}
