// Runs the cut planner for a derived design against the commission's garment
// panels and the studio stock, and turns the plan into what the maker reads:
// each garment's yield and use, what is short and what to do about it, and
// the studio fabric to buy (shop increments, shrinkage) with the wadding size.

import Decimal from 'decimal.js';
import { Length } from '../measure';
import { planCuts } from '../cut-plan/cut-plan';
import type { CutPlan, CutPlanInput, PieceInput, PieceSource } from '../cut-plan/cut-plan';
import { straightBinding } from '../binding';
import { backing } from '../backing';
import { wadding } from '../wadding';
import { lengthBeforeShrinking } from '../shrinkage';
import { EIGHTH_YARD, roundUpToIncrement, TEN_CENTIMETRES } from '../shop-increment';
import { DEFAULT_USABLE_WIDTH } from '../fabric-width';
import type { DesignBody, FabricRef } from './design-body';
import type { DerivedPiece, DesignDerivation } from './derive-design';

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
  binding: { stockId: number | null; strips: number; stripWidthMm: string; lengthMm: string; fabricLengthMm: string };
  backing: { stockId: number | null; widthMm: string; lengthMm: string; panels: number; fabricLengthMm: string; method: string };
  wadding: { stockId: number | null; widthMm: string; lengthMm: string; fromRollMm: string | null; pieces: number | null };
  totals: { piecesRequested: number; piecesPlaced: number; piecesShort: number; garmentYield: number };
}

const panelId = (id: number) => `panel-${id}`;
const stockFabricId = (id: number) => `stock-${id}`;

function sourceOf(fabric: FabricRef | null): PieceSource {
  if (!fabric) return { kind: 'any-garment' };
  switch (fabric.kind) {
    case 'garment':
      return { kind: 'garment', garmentId: String(fabric.garmentId) };
    case 'group':
      return { kind: 'garment-group', name: fabric.name, garmentIds: fabric.garmentIds.map(String) };
    case 'stock':
      return { kind: 'studio-fabric', fabricId: stockFabricId(fabric.stockId) };
  }
}

/** The planner's input for a derived design (every length in millimetres). */
export function cutPlanInput(body: DesignBody, derivation: DesignDerivation, sources: DesignSources): CutPlanInput {
  const panels = sources.garments.flatMap((g) =>
    g.panels.map((p) => ({
      garmentId: String(g.id),
      panelId: panelId(p.id),
      width: Number(p.widthMm),
      height: Number(p.heightMm),
      grain: p.grain === 'horizontal' ? ('along-width' as const) : ('along-height' as const),
      directional: g.print === 'directional',
      label: `${g.description}, ${p.name}`,
    })),
  );
  const usedStock = new Set(derivation.pieces.flatMap((p) => (p.fabric?.kind === 'stock' ? [p.fabric.stockId] : [])));
  const studioFabrics = sources.stock
    .filter((s) => usedStock.has(s.id))
    .map((s) => ({ fabricId: stockFabricId(s.id), width: Number(s.widthMm), length: 'unlimited' as const, label: s.name }));
  const pieces: PieceInput[] = derivation.pieces.map((p: DerivedPiece) => ({
    id: p.id,
    width: Number(p.widthMm),
    height: Number(p.heightMm),
    count: p.count,
    source: sourceOf(p.fabric),
    label: p.label,
  }));
  const withPanels = sources.garments.filter((g) => g.panels.length > 0);
  const minimum = body.rules.minimumPerGarment;
  return {
    unit: 'mm',
    panels,
    studioFabrics,
    pieces,
    rules: minimum > 0 ? { garmentMinimums: withPanels.map((g) => ({ garmentId: String(g.id), count: minimum })) } : {},
  };
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
  const plan = planCuts(cutPlanInput(body, derivation, sources));
  const pieceById = new Map(derivation.pieces.map((p) => [p.id, p]));
  const garmentById = new Map(sources.garments.map((g) => [String(g.id), g]));

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
  const shortfall: ShortLine[] = plan.shortfall.pieces.map((s) => ({
    pieceId: s.pieceId,
    label: pieceById.get(s.pieceId)?.label ?? s.pieceId,
    count: s.count,
    reason: s.reason,
    detail: s.detail,
    remedies: remediesFor(s.reason, pieceById.get(s.pieceId), s.count),
  }));
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
    binding: { stockId: bindingStock?.id ?? null, strips: bind.strips, stripWidthMm: bind.stripWidth.mm.toString(), lengthMm: bind.length.mm.toString(), fabricLengthMm: bind.fabricLength.mm.toString() },
    backing: { stockId: backingStock?.id ?? null, widthMm: back.required.width.mm.toString(), lengthMm: back.required.height.mm.toString(), panels: backChoice.panels, fabricLengthMm: backChoice.fabricLength.mm.toString(), method: backChoice.method },
    wadding: { stockId: waddingStock?.id ?? null, widthMm: wad.size.width.mm.toString(), lengthMm: wad.size.height.mm.toString(), fromRollMm: wad.fromRoll ? wad.fromRoll.length.mm.toString() : null, pieces: wad.fromRoll?.pieces ?? null },
    totals: { piecesRequested: plan.totals.piecesRequested, piecesPlaced: plan.totals.piecesPlaced, piecesShort: plan.totals.piecesShort, garmentYield: plan.totals.garmentYield },
  };
}
