// How shops sell fabric: cut off the bolt in steps (1/8 yd, 10 cm, 25 cm...)
// or as precut pieces (a fat quarter is 18 x 22 in: a half yard cut in half
// across the width; a metric fat quarter is 50 x 55 cm).

import { DomainError } from './errors';
import { Length, requirePositive } from './measure';
import { roundToStep } from './rounding';

/** Fabric cut off the bolt, sold in whole steps of length. */
export interface CutIncrement {
  kind: 'cut';
  id: string;
  name: string;
  step: Length;
  /** Smallest length the shop cuts; default one step. */
  minimum?: Length;
}

/** A precut piece: `width` across the fabric, `length` along the selvedge. */
export interface PrecutIncrement {
  kind: 'precut';
  id: string;
  name: string;
  width: Length;
  length: Length;
}

export type ShopIncrement = CutIncrement | PrecutIncrement;

export const EIGHTH_YARD: CutIncrement = Object.freeze({ kind: 'cut', id: 'eighth-yard', name: '1/8 yd', step: Length.yards('0.125') });
export const QUARTER_YARD: CutIncrement = Object.freeze({ kind: 'cut', id: 'quarter-yard', name: '1/4 yd', step: Length.yards('0.25') });
export const TEN_CENTIMETRES: CutIncrement = Object.freeze({ kind: 'cut', id: 'ten-cm', name: '10 cm', step: Length.centimetres(10) });
export const QUARTER_METRE: CutIncrement = Object.freeze({ kind: 'cut', id: 'quarter-metre', name: '25 cm', step: Length.centimetres(25) });
export const FAT_QUARTER: PrecutIncrement = Object.freeze({
  kind: 'precut',
  id: 'fat-quarter',
  name: 'fat quarter (18 x 22 in)',
  width: Length.inches(22),
  length: Length.inches(18),
});
export const METRIC_FAT_QUARTER: PrecutIncrement = Object.freeze({
  kind: 'precut',
  id: 'metric-fat-quarter',
  name: 'metric fat quarter (50 x 55 cm)',
  width: Length.centimetres(55),
  length: Length.centimetres(50),
});

/** The standard increments, by id. */
export const SHOP_INCREMENTS: readonly ShopIncrement[] = Object.freeze([
  EIGHTH_YARD,
  QUARTER_YARD,
  TEN_CENTIMETRES,
  QUARTER_METRE,
  FAT_QUARTER,
  METRIC_FAT_QUARTER,
]);

/** A shop's own step, e.g. `cutIncrement('half-metre', '50 cm', Length.centimetres(50))`. */
export function cutIncrement(id: string, name: string, step: Length, minimum?: Length): CutIncrement {
  requirePositive(step, 'increment');
  if (minimum !== undefined) requirePositive(minimum, 'minimum cut');
  return { kind: 'cut', id, name, step, minimum };
}

/** The increment with this id; throws DomainError "unknown-preset" otherwise. */
export function shopIncrement(id: string): ShopIncrement {
  const found = SHOP_INCREMENTS.find((i) => i.id === id);
  if (!found) {
    throw new DomainError('unknown-preset', `Expected a shop increment such as eighth-yard, ten-cm or fat-quarter; got "${id}".`, 'increment');
  }
  return found;
}

export interface CutPurchase {
  increment: string;
  /** Number of steps to ask for (e.g. 11 eighths of a yard). */
  steps: number;
  /** Length to buy: steps x step, at least the minimum. */
  length: Length;
}

/** The length to buy for `needed`: rounded UP to whole steps, never below the shop's minimum. */
export function roundUpToIncrement(needed: Length, increment: CutIncrement): CutPurchase {
  const step = requirePositive(increment.step, 'increment');
  let length = roundToStep(Length.max(needed, Length.zero), step, 'up');
  const minimum = increment.minimum ?? step;
  if (length.lt(minimum)) length = roundToStep(minimum, step, 'up');
  return { increment: increment.id, steps: length.ratio(step).round().toNumber(), length };
}
