// The cut planner's input for a derived design: the garments' panels with
// their kept features, the studio fabrics the design uses, every piece with
// where it may come from, and for each kept feature one copy of a block
// piece pinned centred on it. Also reads the plan back in the design's pieces.

import Decimal from 'decimal.js';
import { Length } from '../measure';
import type { CutPlan, CutPlanInput, KeptFeatureInput, PieceInput, PieceSource } from '../cut-plan/cut-plan';
import { formatLength } from '../format-length';
import { DomainError } from '../errors';
import type { DesignBody, FabricRef } from './design-body';
import type { DerivedPiece, DesignDerivation } from './derive-design';
import { groupOf } from './garment-groups';
import { blockKind } from './kinds';
import type { DesignSources, KeptFeaturePiece, SourceGarment } from './plan-types';

export const panelId = (id: number) => `panel-${id}`;
/** The cut plan's id of a studio fabric, as panelId is of a garment panel. */
export const stockFabricId = (id: number) => `stock-${id}`;

/** The group a reference names; the design must have it. */
function groupFor(body: DesignBody, fabric: FabricRef & { kind: 'group' }) {
  const group = groupOf(body, fabric);
  if (!group) throw new DomainError('out-of-range', `The design gives a place to a group it does not have ("${fabric.groupId}").`, 'assignments');
  return group;
}

function sourceOf(fabric: FabricRef | null, body: DesignBody): PieceSource {
  if (!fabric) return { kind: 'any-garment' };
  switch (fabric.kind) {
    case 'garment':
      return { kind: 'garment', garmentId: String(fabric.garmentId) };
    case 'group': {
      const group = groupFor(body, fabric);
      return { kind: 'garment-group', name: group.name, garmentIds: group.garmentIds.map(String) };
    }
    case 'stock':
      return { kind: 'studio-fabric', fabricId: stockFabricId(fabric.stockId) };
  }
}

/** The planner's id of the i-th kept feature (0-based) of a panel. */
export const keptFeatureId = (panel: number, index: number) => `${panelId(panel)}-feature-${index + 1}`;

export interface FeaturePin {
  /** The derived piece one copy is taken from. */
  from: DerivedPiece;
  piece: PieceInput;
  /** The feature, for the maker: its name, garment and panel. */
  feature: Pick<KeptFeaturePiece, 'featureId' | 'feature' | 'garmentId' | 'garment' | 'panel'>;
}

export interface UnheldFeature {
  featureId: string;
  label: string;
  detail: string;
}

/** How near a piece's fabric is to the garment: its own (0), a group holding it (1), any garment (2); null when it may not come from it. */
function nearness(fabric: FabricRef | null, garmentId: number, body: DesignBody): number | null {
  if (!fabric) return 2;
  if (fabric.kind === 'garment') return fabric.garmentId === garmentId ? 0 : null;
  if (fabric.kind === 'group') return groupFor(body, fabric).garmentIds.includes(garmentId) ? 1 : null;
  return null;
}

/**
 * For each kept feature of the panels, one copy of a block piece to cut
 * centred on it: a whole block piece (a plain square at the block's cut size
 * first, then a rail) that may come from the feature's garment and holds the
 * feature inside its seam allowances, nearest fabric first, then the smallest.
 * A feature no such piece can hold is listed with why.
 */
function keptFeaturePins(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): { pins: FeaturePin[]; unheld: UnheldFeature[] } {
  const kinds = new Map(body.blocks.map((b) => [b.id, b.kind]));
  const allowance = new Decimal(derivation.allowanceMm).times(2);
  const system = body.units;
  const show = (mm: Decimal.Value) => formatLength(Length.millimetres(new Decimal(mm)), system);
  // Only a piece that shows whole in the finished top (its kind's wholePiece) can hold a kept feature.
  const whole = derivation.pieces.filter((d) => d.group === 'block' && d.diagonalCuts === 0 && d.blockId !== undefined && blockKind(kinds.get(d.blockId)!).wholePiece?.role === d.role);
  const left = new Map(whole.map((d) => [d.id, d.count]));
  const pins: FeaturePin[] = [];
  const unheld: UnheldFeature[] = [];
  for (const g of sources.garments) {
    for (const p of g.panels) {
      (p.features ?? []).forEach((f, i) => {
        const featureId = keptFeatureId(p.id, i);
        const where = `${g.description}, ${p.name}`;
        const fw = new Decimal(f.widthMm);
        const fh = new Decimal(f.heightMm);
        const inside = (d: DerivedPiece) => ({ w: new Decimal(d.widthMm).minus(allowance), h: new Decimal(d.heightMm).minus(allowance) });
        const holds = (d: DerivedPiece) => {
          const { w, h } = inside(d);
          return (fw.lte(w) && fh.lte(h)) || (fw.lte(h) && fh.lte(w));
        };
        const near = (d: DerivedPiece) => nearness(d.fabric, g.id, body);
        const mayCome = whole.filter((d) => near(d) !== null);
        const fitting = mayCome.filter(holds);
        const candidates = fitting
          .filter((d) => left.get(d.id)! > 0)
          .sort(
            (a, b) =>
              near(a)! - near(b)! ||
              Number(a.role !== 'square') - Number(b.role !== 'square') ||
              new Decimal(a.widthMm).times(a.heightMm).comparedTo(new Decimal(b.widthMm).times(b.heightMm)),
          );
        const from = candidates[0];
        if (!from) {
          const size = `${show(fw)} x ${show(fh)}`;
          let detail: string;
          if (mayCome.length === 0) {
            detail = `the ${f.name} (${size}) needs a block piece shown whole, and the design has no plain-square or rail block that may be cut from this garment`;
          } else if (fitting.length === 0) {
            const largest = [...mayCome].sort((a, b) => new Decimal(b.widthMm).times(b.heightMm).comparedTo(new Decimal(a.widthMm).times(a.heightMm)))[0]!;
            const { w, h } = inside(largest);
            detail = `the ${f.name} is ${size}, larger than every block piece that may come from this garment: the largest, ${largest.label}, is ${show(w)} x ${show(h)} inside its seam allowances`;
          } else {
            detail = `every block piece that could hold the ${f.name} is already kept around another feature`;
          }
          unheld.push({ featureId, label: `Kept feature: the ${f.name} (${where})`, detail });
          return;
        }
        left.set(from.id, left.get(from.id)! - 1);
        pins.push({
          from,
          piece: {
            id: `${from.id}@${featureId}`,
            width: Number(from.widthMm),
            height: Number(from.heightMm),
            count: 1,
            source: sourceOf(from.fabric, body),
            keptFeature: { featureId, placement: 'centred' },
            label: `${from.label}, kept around the ${f.name} (${where})`,
          },
          feature: { featureId, feature: f.name, garmentId: g.id, garment: g.description, panel: p.name },
        });
      });
    }
  }
  return { pins, unheld };
}

/** A kept feature in the planner's numbers (mm), held inside its panel against float rounding. */
function featureInput(panel: SourceGarment['panels'][number], index: number): KeptFeatureInput {
  const f = panel.features![index]!;
  const x = Number(f.xMm);
  const y = Number(f.yMm);
  // The server keeps x + width within the panel exactly; a float sum may land a hair over.
  const within = (start: number, size: number, limit: number) => (start + size > limit ? limit - start : size);
  return {
    id: keptFeatureId(panel.id, index),
    x,
    y,
    width: within(x, Number(f.widthMm), Number(panel.widthMm)),
    height: within(y, Number(f.heightMm), Number(panel.heightMm)),
    label: f.name,
  };
}

/** Each garment used gives at least this many pieces, whatever the rule says: a memory piece holds something of every garment. */
export const AT_LEAST_PER_GARMENT = 1;

export function planInput(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): { input: CutPlanInput; pins: FeaturePin[]; unheld: UnheldFeature[] } {
  const { pins, unheld } = keptFeaturePins(body, derivation, sources);
  const panels = sources.garments.flatMap((g) =>
    g.panels.map((p) => ({
      garmentId: String(g.id),
      panelId: panelId(p.id),
      width: Number(p.widthMm),
      height: Number(p.heightMm),
      grain: p.grain === 'horizontal' ? ('along-width' as const) : ('along-height' as const),
      directional: g.print === 'directional',
      features: (p.features ?? []).map((_, i) => featureInput(p, i)),
      label: `${g.description}, ${p.name}`,
    })),
  );
  const usedStock = new Set(derivation.pieces.flatMap((p) => (p.fabric?.kind === 'stock' ? [p.fabric.stockId] : [])));
  const studioFabrics = sources.stock
    .filter((s) => usedStock.has(s.id))
    .map((s) => ({ fabricId: stockFabricId(s.id), width: Number(s.widthMm), length: 'unlimited' as const, label: s.name }));
  const pinnedFrom = (id: string) => pins.filter((pin) => pin.from.id === id).length;
  const pieces: PieceInput[] = derivation.pieces.map((p: DerivedPiece) => ({
    id: p.id,
    width: Number(p.widthMm),
    height: Number(p.heightMm),
    count: p.count - pinnedFrom(p.id),
    source: sourceOf(p.fabric, body),
    label: p.label,
  }));
  pieces.push(...pins.map((pin) => pin.piece));
  const unused = new Set(body.rules.unusedGarmentIds ?? []);
  const withPanels = sources.garments.filter((g) => g.panels.length > 0 && !unused.has(g.id));
  const minimum = Math.max(body.rules.minimumPerGarment, AT_LEAST_PER_GARMENT);
  return {
    input: {
      unit: 'mm',
      panels,
      studioFabrics,
      pieces,
      rules: minimum > 0 ? { garmentMinimums: withPanels.map((g) => ({ garmentId: String(g.id), count: minimum })) } : {},
    },
    pins,
    unheld,
  };
}

/**
 * The plan in the design's own pieces: a copy cut around a kept feature is
 * the last copy of the piece it was taken from (its placement keeps the featureId).
 */
export function inDesignPieces(plan: CutPlan, pins: FeaturePin[]): CutPlan {
  if (pins.length === 0) return plan;
  const taken = new Map<string, number>();
  for (const pin of pins) taken.set(pin.from.id, (taken.get(pin.from.id) ?? 0) + 1);
  const seen = new Map<string, number>();
  const as = new Map<string, { id: string; copy: number }>();
  for (const pin of pins) {
    const n = (seen.get(pin.from.id) ?? 0) + 1;
    seen.set(pin.from.id, n);
    as.set(pin.piece.id, { id: pin.from.id, copy: pin.from.count - taken.get(pin.from.id)! + n });
  }
  const region = <T extends { pieceId?: string; copy?: number }>(r: T): T => {
    const to = r.pieceId !== undefined ? as.get(r.pieceId) : undefined;
    return to ? { ...r, pieceId: to.id, copy: to.copy } : r;
  };
  return {
    ...plan,
    placements: plan.placements.map(region),
    panels: plan.panels.map((pp) => ({ ...pp, cuts: pp.cuts.map((c) => ({ ...c, cutsOff: region(c.cutsOff), remaining: region(c.remaining) })) })),
    shortfall: { ...plan.shortfall, pieces: plan.shortfall.pieces.map((s) => ({ ...s, pieceId: as.get(s.pieceId)?.id ?? s.pieceId })) },
  };
}
