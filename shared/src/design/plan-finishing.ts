// The finishing of a planned design: the binding, backing and wadding sizes
// from the finished top, and the studio fabric to buy: what the pieces and
// the finishing need of each fabric against what is on hand, grown for
// shrinkage in the pre-wash and rounded up to the shop increment.

import Decimal from 'decimal.js';
import { Length } from '../measure';
import type { CutPlan } from '../cut-plan/cut-plan';
import { straightBinding } from '../binding';
import { backing } from '../backing';
import { wadding } from '../wadding';
import { lengthBeforeShrinking } from '../shrinkage';
import { EIGHTH_YARD, roundUpToIncrement, TEN_CENTIMETRES } from '../shop-increment';
import { DEFAULT_USABLE_WIDTH } from '../fabric-width';
import type { DesignBody } from './design-body';
import { plural } from './kinds/block-kind';
import type { DesignDerivation } from './derive-design';
import type { DesignPlanSummary, ShoppingLine, SourceStock } from './plan-types';

type Finishing = ReturnType<typeof finishingSizes>;

/** Binding, backing and wadding for the finished top, from the chosen studio fabrics (or the usual widths). */
function finishingSizes(body: DesignBody, derivation: DesignDerivation, stockById: ReadonlyMap<number, SourceStock>) {
  const quilt = { width: Length.millimetres(derivation.finished.widthMm), height: Length.millimetres(derivation.finished.lengthMm) };
  const f = body.finishing;
  const bindingStock = f.bindingStockId !== null ? stockById.get(f.bindingStockId) : undefined;
  const bind = straightBinding({ quilt, stripWidth: Length.millimetres(f.bindingStripMm), usableWidth: bindingStock ? Length.millimetres(bindingStock.widthMm) : DEFAULT_USABLE_WIDTH });
  const backingStock = f.backingStockId !== null ? stockById.get(f.backingStockId) : undefined;
  const backWidth = backingStock ? Length.millimetres(backingStock.widthMm) : DEFAULT_USABLE_WIDTH;
  const back = backing({ quilt, usableWidth: Length.min(backWidth, Length.inches(60)), wideWidth: Length.max(backWidth, Length.inches(60)) });
  const backChoice = back.wide && backWidth.gte(Length.inches(60)) ? back.wide : back.pieced;
  const waddingStock = f.waddingStockId !== null ? stockById.get(f.waddingStockId) : undefined;
  const wad = wadding({ quilt, rollWidth: waddingStock ? Length.millimetres(waddingStock.widthMm) : undefined });

  return { bindingStock, bind, backingStock, back, backChoice, waddingStock, wad };
}

/** What each studio fabric must give the plan's pieces and the finishing, against what is on hand. */
function shoppingList(body: DesignBody, plan: CutPlan, sizes: Finishing, stockById: ReadonlyMap<number, SourceStock>): ShoppingLine[] {
  const f = body.finishing;
  const needs = new Map<number, { need: Length; uses: string[] }>();
  const addNeed = (stockId: number, length: Length, use: string) => {
    const entry = needs.get(stockId) ?? { need: Length.zero, uses: [] };
    entry.need = entry.need.plus(length);
    entry.uses.push(use);
    needs.set(stockId, entry);
  };
  for (const s of plan.studioFabrics) {
    const id = Number(s.fabricId.replace('stock-', ''));
    if (s.lengthUsed > 0) addNeed(id, Length.millimetres(new Decimal(s.lengthUsed)), plural(s.piecesCut, 'piece'));
  }
  const { bindingStock, bind, backingStock, backChoice, waddingStock, wad } = sizes;
  if (bindingStock) addNeed(bindingStock.id, bind.fabricLength, `binding: ${plural(bind.strips, 'strip')}`);
  if (backingStock) addNeed(backingStock.id, backChoice.fabricLength, `backing: ${backChoice.panels} ${backChoice.panels === 1 ? 'panel' : 'panels'}`);
  if (waddingStock && wad.fromRoll) addNeed(waddingStock.id, wad.fromRoll.length, 'wadding');
  return [...needs].map(([stockId, { need, uses }]) => {
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

}

/** The finishing sizes and the shopping list of a planned design. */
export function planFinishing(body: DesignBody, derivation: DesignDerivation, stock: readonly SourceStock[], plan: CutPlan): Pick<DesignPlanSummary, 'binding' | 'backing' | 'wadding' | 'shopping'> {
  const stockById = new Map(stock.map((s) => [s.id, s]));
  const sizes = finishingSizes(body, derivation, stockById);
  const { bindingStock, bind, backingStock, back, backChoice, waddingStock, wad } = sizes;
  return {
    shopping: shoppingList(body, plan, sizes, stockById),
    binding: { stockId: bindingStock?.id ?? null, strips: bind.strips, stripWidthMm: bind.stripWidth.mm.toString(), lengthMm: bind.length.mm.toString(), fabricLengthMm: bind.fabricLength.mm.toString() },
    backing: { stockId: backingStock?.id ?? null, widthMm: back.required.width.mm.toString(), lengthMm: back.required.height.mm.toString(), panels: backChoice.panels, fabricLengthMm: backChoice.fabricLength.mm.toString(), method: backChoice.method },
    wadding: { stockId: waddingStock?.id ?? null, widthMm: wad.size.width.mm.toString(), lengthMm: wad.size.height.mm.toString(), fromRollMm: wad.fromRoll ? wad.fromRoll.length.mm.toString() : null, pieces: wad.fromRoll?.pieces ?? null },
  };
}
