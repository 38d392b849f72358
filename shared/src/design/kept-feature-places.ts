// Which block piece holds each kept feature (a pocket, a label kept whole):
// named for the cut lists, and placed in the top for the drawing. The plan
// cuts a kept feature's piece as the last copies of its block piece; the
// copies of a block piece are read in the order of the positions that use it.

import { fabricKey, type DesignBody } from './design-body';
import type { DesignDerivation } from './derive-design';
import { blockKind } from './kinds';
import { keptFeatureId, type DesignPlanSummary, type KeptFeaturePiece } from './plan-design';

/** Where a kept feature sits in the top: its block position, and in a block of rails which rail (0 at the top). */
export interface KeptFeaturePlace {
  position: number;
  rail: number | null;
  feature: string;
  garment: string;
}

/** What naming the features of an older plan needs of the garments. */
export interface FeatureNames {
  garments: readonly { id: number; description: string; panels: readonly { id: number; name: string; features?: readonly { name: string }[] }[] }[];
}

/**
 * The kept features a plan holds. Plans list them; for a plan stored before
 * they did, its placements name each feature by id, read against the garments.
 */
export function keptFeaturePieces(summary: Pick<DesignPlanSummary, 'plan' | 'keptFeatures'>, sources?: FeatureNames): KeptFeaturePiece[] {
  if (summary.keptFeatures) return summary.keptFeatures;
  if (!sources) return [];
  const byId = new Map<string, Omit<KeptFeaturePiece, 'pieceId' | 'copy'>>();
  for (const g of sources.garments) {
    for (const p of g.panels) {
      (p.features ?? []).forEach((f, i) => byId.set(keptFeatureId(p.id, i), { featureId: keptFeatureId(p.id, i), feature: f.name, garmentId: g.id, garment: g.description, panel: p.name }));
    }
  }
  return summary.plan.placements.flatMap((pl) => {
    const f = pl.featureId !== undefined ? byId.get(pl.featureId) : undefined;
    return f ? [{ ...f, pieceId: pl.pieceId, copy: pl.copy }] : [];
  });
}

/**
 * Where in the top each kept feature goes: copy n of a block piece is in the
 * n-th position using it (for rails, the rails of each block in turn). A
 * feature whose piece the derivation does not have is left out.
 */
export function keptFeaturePlaces<K extends KeptFeaturePiece>(body: DesignBody, derived: DesignDerivation, kept: readonly K[]): (K & KeptFeaturePlace)[] {
  const out: (K & KeptFeaturePlace)[] = [];
  for (const k of kept) {
    const piece = derived.pieces.find((p) => p.id === k.pieceId);
    const spec = body.blocks.find((b) => b.id === piece?.blockId);
    if (!piece || !spec || piece.group !== 'block') continue;
    const rails = blockKind(spec.kind).wholePiece?.rails?.(spec) ?? null;
    const key = fabricKey(piece.fabric);
    const positions = derived.positions.filter((p) => p.blockId === spec.id && fabricKey(p.fabrics[piece.role] ?? null) === key);
    const at = positions[Math.floor((k.copy - 1) / (rails ?? 1))];
    if (!at) continue;
    out.push({ ...k, position: at.index, rail: rails === null ? null : (k.copy - 1) % rails });
  }
  return out;
}

const what = (k: Pick<KeptFeaturePlace, 'feature' | 'garment'>) => `the ${k.feature} from the ${k.garment}`;

/** "Block 7 keeps the breast pocket from the Green flannel shirt": the drawing's words for a mark. */
export function keptFeatureLabel(place: KeptFeaturePlace): string {
  return `Block ${place.position + 1}${place.rail === null ? '' : `, rail ${place.rail + 1},`} keeps ${what(place)}`;
}

/** The cut lists' note on a piece cut around a kept feature, with the block it is for when known. */
export function keptFeatureNote(k: Pick<KeptFeaturePlace, 'feature' | 'garment'> & { position?: number }): string {
  return `keeps ${what(k)}, centred${k.position === undefined ? '' : `, for block ${k.position + 1}`}; cut with the feature centred`;
}

/**
 * Where the kept features of a design go in its top, worked out once for the
 * design page, the client's review and the printouts: the plan's kept features
 * (read against the garments for a plan stored before it listed them) placed in the derivation.
 */
export function designKeptFeatures(design: { body: DesignBody; derived: DesignDerivation; plan: Pick<DesignPlanSummary, 'plan' | 'keptFeatures'> }, sources?: FeatureNames): (KeptFeaturePiece & KeptFeaturePlace)[] {
  return keptFeaturePlaces(design.body, design.derived, keptFeaturePieces(design.plan, sources));
}
