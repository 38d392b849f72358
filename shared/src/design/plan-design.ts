// Runs the cut planner for a derived design against the commission's garment
// panels and the studio stock (each kept feature measured on a panel held
// whole, centred in one block piece), and turns the plan into what the maker reads:
// each garment's yield and use, what is short and what to do about it, and
// the studio fabric to buy (shop increments, shrinkage) with the wadding size.

import Decimal from 'decimal.js';
import { Length } from '../measure';
import { planCuts } from '../cut-plan/cut-plan';
import type { CutPlan, CutPlanInput, KeptFeatureInput, PieceInput, PieceSource } from '../cut-plan/cut-plan';
import { formatLength } from '../format-length';
import { straightBinding } from '../binding';
import { backing } from '../backing';
import { wadding } from '../wadding';
import { lengthBeforeShrinking } from '../shrinkage';
import { EIGHTH_YARD, roundUpToIncrement, TEN_CENTIMETRES } from '../shop-increment';
import { DEFAULT_USABLE_WIDTH } from '../fabric-width';
import { DomainError } from '../errors';
import type { BlockKind, DesignBody, FabricRef } from './design-body';
import type { DerivedPiece, DesignDerivation } from './derive-design';
import { groupOf } from './garment-groups';

/**
 * A kept feature measured on a panel (a pocket, a label, embroidery): its top-left
 * corner from the panel's top-left corner and its size, exact millimetres.
 */
export interface PanelFeature {
  name: string;
  xMm: string;
  yMm: string;
  widthMm: string;
  heightMm: string;
}

export interface SourceGarment {
  id: number;
  description: string;
  colour: string | null;
  fibre: string;
  construction: string;
  print: string;
  panels: { id: number; name: string; widthMm: string; heightMm: string; grain: 'vertical' | 'horizontal'; features?: PanelFeature[] }[];
}

export interface SourceStock {
  id: number;
  name: string;
  colour: string | null;
  fibre: string;
  widthMm: string;
  lengthMm: string;
  costUnit?: 'metre' | 'yard';
}

export interface DesignSources {
  garments: SourceGarment[];
  stock: SourceStock[];
}

export interface GarmentUse {
  garmentId: number;
  description: string;
  piecesCut: number;
  areaMm2: number;
  areaUsedMm2: number;
  yield: number;
  uses: { pieceId: string; label: string; count: number }[];
}

export interface ShortLine {
  /**
   * The derived piece's id; for the block piece kept around a feature, that id,
   * "@" and the feature's id; for a feature no block piece can hold, "@" and its id.
   */
  pieceId: string;
  label: string;
  count: number;
  reason: string;
  detail: string;
  /** What the maker can do about it, most direct first. */
  remedies: string[];
}

export interface ShoppingLine {
  stockId: number;
  name: string;
  widthMm: string;
  /** What the pieces, binding and backing need of this fabric. */
  needMm: string;
  onHandMm: string;
  /** Need beyond what is on hand, before shrinkage and rounding. */
  shortMm: string;
  /** Short length grown for shrinkage in the pre-wash (equals shortMm without it). */
  grossMm: string;
  /** Rounded up to the shop increment; "0" when nothing is to buy. */
  buyMm: string;
  increment: string;
  uses: string[];
}

export interface DesignPlanSummary {
  plan: CutPlan;
  garments: GarmentUse[];
  shortfall: ShortLine[];
  minimumsShort: { garmentId: number; description: string; required: number; achieved: number; detail: string }[];
  shopping: ShoppingLine[];
  /** Each kept feature the plan holds whole, and the copy of the block piece cut around it. Absent on plans stored before this was listed. */
  keptFeatures?: KeptFeaturePiece[];
  binding: { stockId: number | null; strips: number; stripWidthMm: string; lengthMm: string; fabricLengthMm: string };
  backing: { stockId: number | null; widthMm: string; lengthMm: string; panels: number; fabricLengthMm: string; method: string };
  wadding: { stockId: number | null; widthMm: string; lengthMm: string; fromRollMm: string | null; pieces: number | null };
  totals: { piecesRequested: number; piecesPlaced: number; piecesShort: number; garmentYield: number };
}

const panelId = (id: number) => `panel-${id}`;
const stockFabricId = (id: number) => `stock-${id}`;

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

/** A kept feature the plan holds whole, and the copy of the block piece cut centred on it. */
export interface KeptFeaturePiece {
  /** The planner's id of the feature (keptFeatureId). */
  featureId: string;
  /** The feature's name as measured, e.g. "breast pocket". */
  feature: string;
  garmentId: number;
  /** The garment's description. */
  garment: string;
  /** The panel's name. */
  panel: string;
  /** The derived piece, and which copy of it (from 1). */
  pieceId: string;
  copy: number;
}

/** The planner's id of the i-th kept feature (0-based) of a panel. */
export const keptFeatureId = (panel: number, index: number) => `${panelId(panel)}-feature-${index + 1}`;

/** Block kinds whose piece shows whole in the finished top, with that piece's role: only these can hold a kept feature. */
const WHOLE_PIECE_ROLE: Partial<Record<BlockKind, string>> = { square: 'square', rectangles: 'rail' };

interface FeaturePin {
  /** The derived piece one copy is taken from. */
  from: DerivedPiece;
  piece: PieceInput;
  /** The feature, for the maker: its name, garment and panel. */
  feature: Pick<KeptFeaturePiece, 'featureId' | 'feature' | 'garmentId' | 'garment' | 'panel'>;
}

interface UnheldFeature {
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
  const whole = derivation.pieces.filter((d) => d.group === 'block' && d.diagonalCuts === 0 && d.blockId !== undefined && WHOLE_PIECE_ROLE[kinds.get(d.blockId)!] === d.role);
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

function planInput(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): { input: CutPlanInput; pins: FeaturePin[]; unheld: UnheldFeature[] } {
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
  const withPanels = sources.garments.filter((g) => g.panels.length > 0);
  const minimum = body.rules.minimumPerGarment;
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
 * The planner's input for a derived design (every length in millimetres).
 * Each kept feature takes one copy of a block piece, pinned centred on it
 * (id: the piece's id, "@", the feature's id).
 */
export function cutPlanInput(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): CutPlanInput {
  return planInput(body, derivation, sources).input;
}

/**
 * The plan in the design's own pieces: a copy cut around a kept feature is
 * the last copy of the piece it was taken from (its placement keeps the featureId).
 */
function inDesignPieces(plan: CutPlan, pins: FeaturePin[]): CutPlan {
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

/** Plans a derived design's cuts and reads the plan for the maker. */
export function planDesign(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): DesignPlanSummary {
  const { input, pins, unheld } = planInput(body, derivation, sources);
  const planned = planCuts(input);
  const plan = inDesignPieces(planned, pins);
  const pinByFeature = new Map(pins.map((pin) => [pin.feature.featureId, pin]));
  const keptFeatures: KeptFeaturePiece[] = plan.placements.flatMap((pl) => {
    const pin = pl.featureId !== undefined ? pinByFeature.get(pl.featureId) : undefined;
    return pin ? [{ ...pin.feature, pieceId: pl.pieceId, copy: pl.copy }] : [];
  });
  const pieceById = new Map(derivation.pieces.map((p) => [p.id, p]));
  const pinById = new Map(pins.map((pin) => [pin.piece.id, pin]));
  const garmentById = new Map(sources.garments.map((g) => [String(g.id), g]));
  const panelLabels = new Map(input.panels.map((p) => [p.panelId, p.label ?? p.panelId]));

  const garments: GarmentUse[] = plan.garments.map((s) => {
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
  const minimumsShort = plan.shortfall.garmentMinimums.map((m) => ({
    garmentId: Number(m.garmentId),
    description: garmentById.get(m.garmentId)?.description ?? m.garmentId,
    required: m.required,
    achieved: m.achieved,
    detail: m.detail,
  }));

  // Finishing: binding, backing and wadding sizes from the finished top.
  const quilt = { width: Length.millimetres(derivation.finished.widthMm), height: Length.millimetres(derivation.finished.lengthMm) };
  const stockById = new Map(sources.stock.map((s) => [s.id, s]));
  const f = body.finishing;
  const bindingStock = f.bindingStockId !== null ? stockById.get(f.bindingStockId) : undefined;
  const bind = straightBinding({ quilt, stripWidth: Length.millimetres(f.bindingStripMm), usableWidth: bindingStock ? Length.millimetres(bindingStock.widthMm) : DEFAULT_USABLE_WIDTH });
  const backingStock = f.backingStockId !== null ? stockById.get(f.backingStockId) : undefined;
  const backWidth = backingStock ? Length.millimetres(backingStock.widthMm) : DEFAULT_USABLE_WIDTH;
  const back = backing({ quilt, usableWidth: Length.min(backWidth, Length.inches(60)), wideWidth: Length.max(backWidth, Length.inches(60)) });
  const backChoice = back.wide && backWidth.gte(Length.inches(60)) ? back.wide : back.pieced;
  const waddingStock = f.waddingStockId !== null ? stockById.get(f.waddingStockId) : undefined;
  const wad = wadding({ quilt, rollWidth: waddingStock ? Length.millimetres(waddingStock.widthMm) : undefined });

  // Shopping: what each studio fabric must give, against what is on hand.
  const needs = new Map<number, { need: Length; uses: string[] }>();
  const addNeed = (stockId: number, length: Length, use: string) => {
    const entry = needs.get(stockId) ?? { need: Length.zero, uses: [] };
    entry.need = entry.need.plus(length);
    entry.uses.push(use);
    needs.set(stockId, entry);
  };
  for (const s of plan.studioFabrics) {
    const id = Number(s.fabricId.replace('stock-', ''));
    if (s.lengthUsed > 0) addNeed(id, Length.millimetres(new Decimal(s.lengthUsed)), `${s.piecesCut} pieces`);
  }
  if (bindingStock) addNeed(bindingStock.id, bind.fabricLength, `binding: ${bind.strips} strips`);
  if (backingStock) addNeed(backingStock.id, backChoice.fabricLength, `backing: ${backChoice.panels} ${backChoice.panels === 1 ? 'panel' : 'panels'}`);
  if (waddingStock && wad.fromRoll) addNeed(waddingStock.id, wad.fromRoll.length, 'wadding');
  const shopping: ShoppingLine[] = [...needs].map(([stockId, { need, uses }]) => {
    const stock = stockById.get(stockId)!;
    const onHand = Length.millimetres(stock.lengthMm);
    const short = need.gt(onHand) ? need.minus(onHand) : Length.zero;
    const gross = short.isPositive() && f.prewash && Number(f.shrinkPercent) > 0 ? lengthBeforeShrinking(short, f.shrinkPercent) : short;
    const increment = stock.costUnit === 'yard' ? EIGHTH_YARD : TEN_CENTIMETRES;
    const buy = gross.isPositive() ? roundUpToIncrement(gross, increment).length : Length.zero;
    return {
      stockId,
      name: stock.name,
      widthMm: stock.widthMm,
      needMm: need.mm.toString(),
      onHandMm: onHand.mm.toString(),
      shortMm: short.mm.toString(),
      grossMm: gross.mm.toString(),
      buyMm: buy.mm.toString(),
      increment: increment.name,
      uses,
    };
  });

  return {
    plan,
    garments,
    shortfall,
    minimumsShort,
    shopping,
    keptFeatures,
    binding: { stockId: bindingStock?.id ?? null, strips: bind.strips, stripWidthMm: bind.stripWidth.mm.toString(), lengthMm: bind.length.mm.toString(), fabricLengthMm: bind.fabricLength.mm.toString() },
    backing: { stockId: backingStock?.id ?? null, widthMm: back.required.width.mm.toString(), lengthMm: back.required.height.mm.toString(), panels: backChoice.panels, fabricLengthMm: backChoice.fabricLength.mm.toString(), method: backChoice.method },
    wadding: { stockId: waddingStock?.id ?? null, widthMm: wad.size.width.mm.toString(), lengthMm: wad.size.height.mm.toString(), fromRollMm: wad.fromRoll ? wad.fromRoll.length.mm.toString() : null, pieces: wad.fromRoll?.pieces ?? null },
    totals: { piecesRequested: plan.totals.piecesRequested, piecesPlaced: plan.totals.piecesPlaced, piecesShort: plan.totals.piecesShort, garmentYield: plan.totals.garmentYield },
  };
}
