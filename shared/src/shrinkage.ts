// Dimensional change and the percentages applied to plan sizes.
// Dimensional change % = 100 (after - before) / before, negative for
// shrinkage, as defined by AATCC TM135 (fabric), AATCC TM150 (garments) and
// ISO 5077:2007 (with ISO 6330 washing procedures).
// Quilting take-up and laundering shrinkage are given as positive percentages
// by which a size gets smaller.

import Decimal from 'decimal.js';
import { DomainError } from './errors';
import { Length, requirePositive, Size } from './measure';

function percent(value: Decimal.Value, field: string, min: number, max: number): Decimal {
  let d: Decimal;
  try {
    d = new Decimal(value);
  } catch {
    throw new DomainError('not-a-number', `Expected ${field} to be a percentage; got "${String(value)}".`, field);
  }
  if (d.isNaN() || !d.isFinite()) {
    throw new DomainError('not-a-number', `Expected ${field} to be a percentage; got ${String(value)}.`, field);
  }
  if (d.lt(min) || d.gte(max)) {
    throw new DomainError('out-of-range', `Expected ${field} from ${min}% up to (not including) ${max}%; got ${d.toString()}%.`, field);
  }
  return d;
}

/** Dimensional change in percent, 100 (after - before) / before; negative = shrinkage. */
export function dimensionalChangePercent(before: Length, after: Length): Decimal {
  requirePositive(before, 'length before washing');
  requirePositive(after, 'length after washing');
  return after.minus(before).ratio(before).times(100);
}

/** The length after a dimensional change of `changePercent` (negative shrinks). */
export function applyDimensionalChange(before: Length, changePercent: Decimal.Value): Length {
  requirePositive(before, 'length');
  const p = percent(changePercent, 'dimensional change', -50, 50);
  return before.times(p.dividedBy(100).plus(1));
}

/** The length that becomes `target` after shrinking by `shrinkPercent` (0 to < 50). */
export function lengthBeforeShrinking(target: Length, shrinkPercent: Decimal.Value): Length {
  requirePositive(target, 'length');
  const p = percent(shrinkPercent, 'shrinkage', 0, 50);
  return target.dividedBy(new Decimal(1).minus(p.dividedBy(100)));
}

/** The length after shrinking by `shrinkPercent`. */
export function lengthAfterShrinking(before: Length, shrinkPercent: Decimal.Value): Length {
  requirePositive(before, 'length');
  const p = percent(shrinkPercent, 'shrinkage', 0, 50);
  return before.times(new Decimal(1).minus(p.dividedBy(100)));
}

/** Common practice range of quilting take-up: 3 to 5 %. */
export const TYPICAL_TAKE_UP_PERCENT = Object.freeze({ min: 3, max: 5 });

/** Common practice: "pre-shrunk" means under 3 %; cotton wovens typically shrink 2 to 5 %. */
export const PRESHRUNK_LIMIT_PERCENT = 3;

export interface PlanShrinkage {
  /** Shrink from quilting (take-up), percent; default 0. */
  takeUpPercent?: Decimal.Value;
  /** Shrink from the first laundering of the finished quilt, percent; default 0. */
  launderingPercent?: Decimal.Value;
}

/**
 * The size to piece the top so that after quilting take-up and laundering
 * shrinkage it comes out at `target`.
 */
export function topSizeForTarget(target: Size, shrinkage: PlanShrinkage): Size {
  const grow = (l: Length) =>
    lengthBeforeShrinking(lengthBeforeShrinking(l, shrinkage.launderingPercent ?? 0), shrinkage.takeUpPercent ?? 0);
  return { width: grow(requirePositive(target.width, 'width')), height: grow(requirePositive(target.height, 'height')) };
}

/** The expected size of a pieced top after quilting take-up and laundering. */
export function sizeAfterQuiltingAndWashing(top: Size, shrinkage: PlanShrinkage): Size {
  const shrink = (l: Length) =>
    lengthAfterShrinking(lengthAfterShrinking(l, shrinkage.takeUpPercent ?? 0), shrinkage.launderingPercent ?? 0);
  return { width: shrink(requirePositive(top.width, 'width')), height: shrink(requirePositive(top.height, 'height')) };
}
