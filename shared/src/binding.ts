// Binding: double-fold strips cut across the width of fabric, joined end to
// end to go round the quilt (common practice: strips 2 1/4 or 2 1/2 in wide;
// perimeter + 10 to 12 in for the joins and corners), or bias binding cut as a
// continuous strip from one square.

import { DomainError } from './errors';
import { DEFAULT_USABLE_WIDTH } from './fabric-width';
import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { roundToStep } from './rounding';
import { CutIncrement, CutPurchase, EIGHTH_YARD, roundUpToIncrement } from './shop-increment';

export const DEFAULT_BINDING_WIDTH: Length = Length.inches('2.5');
export const DEFAULT_BINDING_EXTRA: Length = Length.inches(12);

export interface StraightBindingInput {
  /** Finished quilt size. */
  quilt: Size;
  /** Cut strip width; default 2 1/2 in. */
  stripWidth?: Length;
  /** Added to the perimeter for joins and mitred corners; default 12 in. */
  extra?: Length;
  /** Usable width of the fabric; default 40 in. */
  usableWidth?: Length;
  /** Default 1/8 yd. */
  increment?: CutIncrement;
}

export interface StraightBinding {
  perimeter: Length;
  /** Perimeter + extra: the binding length to make. */
  length: Length;
  stripWidth: Length;
  /** Width-of-fabric strips to cut: length / usable width, rounded up. */
  strips: number;
  /** strips x strip width. */
  fabricLength: Length;
  purchase: CutPurchase;
}

/** Straight-grain binding from width-of-fabric strips. */
export function straightBinding(input: StraightBindingInput): StraightBinding {
  const width = requirePositive(input.quilt.width, 'quilt width');
  const height = requirePositive(input.quilt.height, 'quilt length');
  const stripWidth = requirePositive(input.stripWidth ?? DEFAULT_BINDING_WIDTH, 'binding strip width');
  const extra = requireNonNegative(input.extra ?? DEFAULT_BINDING_EXTRA, 'extra length');
  const usable = requirePositive(input.usableWidth ?? DEFAULT_USABLE_WIDTH, 'usable width');
  if (stripWidth.gt(Length.inches(6))) {
    throw new DomainError('too-large', 'Expected a binding strip at most 6 in wide (common practice 2 1/4 or 2 1/2 in).', 'binding strip width');
  }
  const perimeter = width.plus(height).times(2);
  const length = perimeter.plus(extra);
  const strips = length.ratio(usable).ceil().toNumber();
  const fabricLength = stripWidth.times(strips);
  return {
    perimeter,
    length,
    stripWidth,
    strips,
    fabricLength,
    purchase: roundUpToIncrement(fabricLength, input.increment ?? EIGHTH_YARD),
  };
}

export interface BiasBindingSquare {
  /** Exact side of a square whose area equals length x strip width. */
  exactSide: Length;
  /** Side rounded up to the step (default 1 in), to allow for the seam that makes the tube. */
  side: Length;
  /** Approximate bias length the rounded square gives: side^2 / strip width. */
  yields: Length;
}

/**
 * The square to cut continuous bias binding of `length` and `stripWidth` from.
 * The bias strip's area equals the square's, so side = sqrt(length x width).
 */
export function biasBindingSquare(length: Length, stripWidth: Length = DEFAULT_BINDING_WIDTH, step: Length = Length.inches(1)): BiasBindingSquare {
  requirePositive(length, 'binding length');
  requirePositive(stripWidth, 'binding strip width');
  requirePositive(step, 'step');
  const areaMm2 = length.mm.times(stripWidth.mm);
  const exactSide = Length.millimetres(areaMm2.sqrt());
  const side = roundToStep(exactSide, step, 'up');
  const yields = Length.millimetres(side.mm.pow(2).dividedBy(stripWidth.mm));
  return { exactSide, side, yields };
}

/** Bias length (approximate) from a square of `side`: side^2 / strip width. */
export function biasLengthFromSquare(side: Length, stripWidth: Length = DEFAULT_BINDING_WIDTH): Length {
  requirePositive(side, 'square side');
  requirePositive(stripWidth, 'binding strip width');
  return Length.millimetres(side.mm.pow(2).dividedBy(stripWidth.mm));
}
