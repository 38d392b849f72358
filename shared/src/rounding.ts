// Rounding to ruler marks, kept apart from the exact values. Cut sizes round
// UP (a piece is never short); finished sizes round to the NEAREST mark.

import Decimal from 'decimal.js';
import { MeasureError } from './errors';
import { Length } from './measure';

export type RoundingMode = 'up' | 'down' | 'nearest';

/** The ruler steps the product rounds to. */
export type RulerStep = 'eighth-inch' | 'millimetre';

export const EIGHTH_INCH: Length = Length.inches('0.125');
export const MILLIMETRE: Length = Length.millimetres(1);

/**
 * Values within a millionth of a millimetre of a mark count as on it, so that an exact value
 * such as 6.5 in carried through sqrt 2 and back is not pushed up a mark by the
 * last digit of a 20-digit calculation.
 */
const MARK_TOLERANCE_MM = new Decimal('1e-6');

/** The tolerance above: a rounded-up value is never more than this below the exact value. */
export const MARK_TOLERANCE: Length = Length.millimetres(MARK_TOLERANCE_MM);

/** Rounds `length` to a multiple of `step` (up, down or half-up nearest). */
export function roundToStep(length: Length, step: Length, mode: RoundingMode): Length {
  if (!step.isPositive()) {
    throw new MeasureError('not-positive', 'Expected a rounding step greater than zero.', 'step');
  }
  const steps = length.mm.dividedBy(step.mm);
  const tolerance = MARK_TOLERANCE_MM.dividedBy(step.mm);
  let whole: Decimal;
  switch (mode) {
    case 'up':
      whole = steps.minus(tolerance).ceil();
      break;
    case 'down':
      whole = steps.plus(tolerance).floor();
      break;
    case 'nearest':
      whole = steps.toDecimalPlaces(0, Decimal.ROUND_HALF_UP);
      break;
  }
  return step.times(whole);
}

/** Cut sizes: the next 1/8 in mark at or above the exact value. */
export function roundUpToEighth(length: Length): Length {
  return roundToStep(length, EIGHTH_INCH, 'up');
}

/** Finished sizes: the nearest 1/8 in mark (halves round up). */
export function roundToNearestEighth(length: Length): Length {
  return roundToStep(length, EIGHTH_INCH, 'nearest');
}

/** The 1/8 in mark at or below the exact value. */
export function roundDownToEighth(length: Length): Length {
  return roundToStep(length, EIGHTH_INCH, 'down');
}

/** Metric cut sizes: the next whole millimetre. */
export function roundUpToMillimetre(length: Length): Length {
  return roundToStep(length, MILLIMETRE, 'up');
}

/** Metric finished sizes: the nearest millimetre (0.1 cm). */
export function roundToNearestMillimetre(length: Length): Length {
  return roundToStep(length, MILLIMETRE, 'nearest');
}

/** Rounds to the ruler step in the given mode. */
export function roundToRuler(length: Length, ruler: RulerStep, mode: RoundingMode): Length {
  return roundToStep(length, ruler === 'eighth-inch' ? EIGHTH_INCH : MILLIMETRE, mode);
}

/** A cut dimension: the exact geometric value and the ruler value to cut at. */
export interface CutSize {
  exact: Length;
  rounded: Length;
}

/** Pairs an exact cut dimension with its value rounded UP to the ruler step. */
export function cutSize(exact: Length, ruler: RulerStep = 'eighth-inch'): CutSize {
  return { exact, rounded: roundToRuler(exact, ruler, 'up') };
}
