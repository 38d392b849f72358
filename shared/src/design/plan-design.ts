// Runs the cut planner for a derived design against the commission's garment
// panels and the studio stock (each kept feature measured on a panel held
// whole, centred in one block piece), and turns the plan into what the maker reads:
// each garment's yield and use, what is short and what to do about it, and
// the studio fabric to buy (shop increments, shrinkage) with the wadding size.
// The planner's input is built in plan-input.ts, the finishing and shopping in
// plan-finishing.ts.

import { planCuts } from '../cut-plan/cut-plan';
import type { CutPlan, CutPlanInput } from '../cut-plan/cut-plan';
import type { DesignBody } from './design-body';
import type { DerivedPiece, DesignDerivation } from './derive-design';
import { inDesignPieces, planInput, type FeaturePin, type UnheldFeature } from './plan-input';
import { planFinishing } from './plan-finishing';

export { keptFeatureId } from './plan-input';

export type { PanelFeature, SourceGarment, SourceStock, DesignSources, GarmentUse, ShortLine, ShoppingLine, DesignPlanSummary, KeptFeaturePiece } from './plan-types';
import type { DesignSources, GarmentUse, ShortLine, DesignPlanSummary, KeptFeaturePiece } from './plan-types';

/**
 * The planner's input for a derived design (every length in millimetres).
 * Each kept feature takes one copy of a block piece, pinned centred on it
 * (id: the piece's id, "@", the feature's id).
 */
export function cutPlanInput(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): CutPlanInput {
  return planInput(body, derivation, sources).input;
}

/** What the maker can do about a block piece that could not be cut around its kept feature. */
function keptRemedies(reason: string): string[] {
  return [
    reason === 'no-piece-large-enough'
      ? 'Choose a larger block size, or a plain-square block cut from this garment, so one block holds the feature whole.'
      : 'Choose a smaller block size, so a block centred on the feature fits inside its panel.',
    'Or take the kept feature off the panel, and the block is cut like any other.',
  ];
}

function remediesFor(reason: string, piece: DerivedPiece | undefined, count: number): string[] {
  const out: string[] = [];
  if (reason === 'no-panel-large-enough') {
    out.push('Choose a smaller block size, so the piece fits the garment panels.');
    out.push('Or cut this piece kind from a studio fabric (assign it in the table).');
  } else if (reason === 'rule-not-met') {
    out.push('Allow more garments for this piece: assign a group of garments instead of one.');
    out.push('Or cut it from a studio fabric.');
  } else {
    out.push(`Use fewer blocks: ${count} ${count === 1 ? 'piece is' : 'pieces are'} short.`);
    out.push('Or assign these pieces to a studio fabric, or to a group of garments so the planner can use every panel.');
    if (piece?.group === 'block') out.push('Or choose a smaller block: smaller pieces waste less of each panel.');
  }
  return out;
}

/** What each garment gave: pieces cut, area used and which pieces. */
function garmentUses(plan: CutPlan, derivation: DesignDerivation, sources: DesignSources): GarmentUse[] {
  const pieceById = new Map(derivation.pieces.map((p) => [p.id, p]));
  const garmentById = new Map(sources.garments.map((g) => [String(g.id), g]));
  return plan.garments.map((s) => {
    const uses = new Map<string, number>();
    for (const pl of plan.placements) if (pl.garmentId === s.garmentId) uses.set(pl.pieceId, (uses.get(pl.pieceId) ?? 0) + 1);
    return {
      garmentId: Number(s.garmentId),
      description: garmentById.get(s.garmentId)?.description ?? s.garmentId,
      piecesCut: s.piecesCut,
      areaMm2: s.area,
      areaUsedMm2: s.areaUsed,
      yield: s.yield,
      uses: [...uses].map(([pieceId, count]) => ({ pieceId, label: pieceById.get(pieceId)?.label ?? pieceId, count })),
    };
  });
}

/**
 * What could not be cut, with what to do about it: the planner's short pieces
 * (a kept feature's copy named for its feature and panel) and the kept
 * features no block piece could hold.
 */
function shortLines(planned: CutPlan, input: CutPlanInput, pins: readonly FeaturePin[], unheld: readonly UnheldFeature[], derivation: DesignDerivation): ShortLine[] {
  const pieceById = new Map(derivation.pieces.map((p) => [p.id, p]));
  const pinById = new Map(pins.map((pin) => [pin.piece.id, pin]));
  const panelLabels = new Map(input.panels.map((p) => [p.panelId, p.label ?? p.panelId]));
  const shortfall: ShortLine[] = planned.shortfall.pieces.map((s) => {
    const pin = pinById.get(s.pieceId);
    if (!pin) {
      return {
        pieceId: s.pieceId,
        label: pieceById.get(s.pieceId)?.label ?? s.pieceId,
        count: s.count,
        reason: s.reason,
        detail: s.detail,
        remedies: remediesFor(s.reason, pieceById.get(s.pieceId), s.count),
      };
    }
    return {
      pieceId: s.pieceId,
      label: pin.piece.label!,
      count: s.count,
      reason: s.reason,
      detail: s.detail.replace(/panel "([^"]+)"/g, (_, id: string) => `panel "${panelLabels.get(id) ?? id}"`),
      remedies: keptRemedies(s.reason),
    };
  });
  for (const u of unheld) {
    shortfall.push({ pieceId: `@${u.featureId}`, label: u.label, count: 1, reason: 'no-piece-large-enough', detail: u.detail, remedies: keptRemedies('no-piece-large-enough') });
  }
  return shortfall;
}

/** Plans a derived design's cuts and reads the plan for the maker. */
export function planDesign(
  body: DesignBody,
  derivation: DesignDerivation,
  sources: DesignSources,
  options: { budgetMs?: number } = {},
): DesignPlanSummary {
  const { input, pins, unheld } = planInput(body, derivation, sources);
  // The page's interactive budget unless the caller (printing, saving) gives more.
  const planned = planCuts(input, { budgetMs: options.budgetMs });
  const plan = inDesignPieces(planned, pins);
  const pinByFeature = new Map(pins.map((pin) => [pin.feature.featureId, pin]));
  const keptFeatures: KeptFeaturePiece[] = plan.placements.flatMap((pl) => {
    const pin = pl.featureId !== undefined ? pinByFeature.get(pl.featureId) : undefined;
    return pin ? [{ ...pin.feature, pieceId: pl.pieceId, copy: pl.copy }] : [];
  });
  const garments = garmentUses(plan, derivation, sources);
  const shortfall = shortLines(planned, input, pins, unheld, derivation);
  const garmentById = new Map(sources.garments.map((g) => [String(g.id), g]));
  const minimumsShort = plan.shortfall.garmentMinimums.map((m) => ({
    garmentId: Number(m.garmentId),
    description: garmentById.get(m.garmentId)?.description ?? m.garmentId,
    required: m.required,
    achieved: m.achieved,
    detail: m.detail,
  }));

  const unused = new Set(body.rules.unusedGarmentIds ?? []);
  const garmentsGivingNone = sources.garments
    .filter((g) => g.panels.length > 0 && !unused.has(g.id) && (garments.find((u) => u.garmentId === g.id)?.piecesCut ?? 0) === 0)
    .map((g) => ({
      garmentId: g.id,
      description: g.description,
      message: `${g.description} gives no piece to this quilt. Give it a block or a group of garments in the table, choose a smaller block so its panels hold a piece, or mark it not used.`,
    }));

  const { shopping, binding, backing, wadding } = planFinishing(body, derivation, sources.stock, plan);
  return {
    plan,
    garments,
    shortfall,
    minimumsShort,
    garmentsGivingNone,
    shopping,
    keptFeatures,
    binding,
    backing,
    wadding,
    totals: { piecesRequested: plan.totals.piecesRequested, piecesPlaced: plan.totals.piecesPlaced, piecesShort: plan.totals.piecesShort, garmentYield: plan.totals.garmentYield },
  };
}
