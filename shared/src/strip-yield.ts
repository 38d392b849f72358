// How many trapezoids (wedge blades) or triangles fit along one strip when
// they are cut alternately point up and point down, each sharing a slanted
// edge with the next. n pieces with a wide edge a and a narrow edge b use
//   n (a + b) / 2 + (a - b) / 2
// of the strip's length (b = 0 for a triangle).

import { DomainError } from './errors';
import { Length, requireNonNegative, requirePositive } from './measure';

/** Strip length used by `count` alternating pieces with edges `wide` and `narrow`. */
export function alternatingLength(wide: Length, narrow: Length, count: number): Length {
  if (count <= 0) return Length.zero;
  return wide.plus(narrow).times(count).plus(wide.minus(narrow)).dividedBy(2);
}

/** Most alternating pieces with edges `wide` and `narrow` that one strip of `stripLength` yields. */
export function alternatingPiecesPerStrip(wide: Length, narrow: Length, stripLength: Length): number {
  requirePositive(wide, 'wide edge');
  requireNonNegative(narrow, 'narrow edge');
  requirePositive(stripLength, 'strip length');
  if (narrow.gt(wide)) {
    throw new DomainError('out-of-range', 'Expected the narrow edge to be no wider than the wide edge.', 'narrow edge');
  }
  if (stripLength.lt(wide)) return 0;
  // n <= (2L - (a - b)) / (a + b)
  const n = stripLength.times(2).minus(wide.minus(narrow)).ratio(wide.plus(narrow)).floor().toNumber();
  return Math.max(0, n);
}
