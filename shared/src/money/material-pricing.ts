import Decimal from 'decimal.js';
import { Length } from '../measure';
import { QUARTER_YARD, roundUpToIncrement, TEN_CENTIMETRES, type CutIncrement } from '../shop-increment';

/**
 * A studio fabric the plan uses, priced at its stock cost. Shops sell fabric
 * off the bolt in whole steps (common practice: 10 cm where it is priced by
 * the metre, 1/4 yd where by the yard; a fat quarter is a quarter yard cut the
 * other way, so it prices as one step), so the length is rounded UP to the
 * step before it is priced: the client pays for what is cut, never for less.
 */
export interface StockCost {
  costPence: number | null;
  costUnit: 'metre' | 'yard';
}

export interface PricedLength {
  /** In the stock's own unit, exact (e.g. "1.3" m or "1.75" yd). */
  quantity: string;
  unit: 'm' | 'yd';
  /** The step it was rounded to, e.g. "10 cm". */
  increment: string;
  /** The stock's cost per unit; null when Studio fabric holds none. */
  unitPricePence: number | null;
}

/** The step a length of fabric is priced in, by the unit its cost is kept in (common practice). */
export const PRICING_INCREMENTS: Readonly<Record<StockCost['costUnit'], CutIncrement>> = { metre: TEN_CENTIMETRES, yard: QUARTER_YARD };

const MM_PER: Record<StockCost['costUnit'], Decimal> = { metre: new Decimal(1000), yard: new Decimal('914.4') };

/** The length used, rounded up to the shop step of the stock's unit, at the stock's cost per unit; null for no length. */
export function priceLength(used: Length, stock: StockCost): PricedLength | null {
  if (!used.isPositive()) return null;
  const increment = PRICING_INCREMENTS[stock.costUnit];
  const cut = roundUpToIncrement(used, increment).length;
  return {
    quantity: cut.mm.dividedBy(MM_PER[stock.costUnit]).toDecimalPlaces(4, Decimal.ROUND_UP).toString(),
    unit: stock.costUnit === 'metre' ? 'm' : 'yd',
    increment: increment.name,
    unitPricePence: stock.costPence,
  };
}
