// Cut sizes of triangle units. Each finished triangle is grown outward by the
// seam allowance s on every edge; for a right isosceles triangle that adds
//   s (2 + sqrt 2)       to each leg (half-square triangles, cut once), and
//   s (2 + 2 sqrt 2)     to the long side (quarter-square triangles, cut twice);
// for an equilateral triangle the height grows by 3s and the side by 2 sqrt 3 s.
// The trade rounds the add-ons up to 7/8 in and 1 1/4 in at s = 1/4 in.

import Decimal from 'decimal.js';
import { Length, requirePositive, Size } from './measure';
import { cutSize } from './rounding';
import { addAllowanceTimes, addSeamAllowance, AllowanceOptions, resolveAllowance, UnitCut } from './seam-allowance';
import { alternatingPiecesPerStrip } from './strip-yield';

const SQRT2 = new Decimal(2).sqrt();
const SQRT3 = new Decimal(3).sqrt();

/** Add-on factor for a half-square triangle's square: 2 + sqrt 2 (0.8536 in at s = 1/4 in). */
export const HST_ALLOWANCE_FACTOR: Decimal = SQRT2.plus(2);
/** Add-on factor for a quarter-square triangle's square: 2 + 2 sqrt 2 (1.2071 in at s = 1/4 in). */
export const QST_ALLOWANCE_FACTOR: Decimal = SQRT2.times(2).plus(2);

/** Exact side of the square to cut once on the diagonal for triangles with legs `finishedLeg`. */
export function halfSquareSquareSide(finishedLeg: Length, allowance: Length): Length {
  return addAllowanceTimes(finishedLeg, allowance, HST_ALLOWANCE_FACTOR);
}

/** Exact side of the square to cut twice on the diagonal for triangles with long side `finishedLongSide`. */
export function quarterSquareSquareSide(finishedLongSide: Length, allowance: Length): Length {
  return addAllowanceTimes(finishedLongSide, allowance, QST_ALLOWANCE_FACTOR);
}

export type HalfSquareMethod = 'cut-once' | 'two-at-a-time';

function square(finishedSide: Length): Size {
  return { width: finishedSide, height: finishedSide };
}

/**
 * Half-square triangle units of finished side `finishedSide`.
 * - "cut-once": cut a square of each fabric once on the diagonal, then sew
 *   the triangles in pairs: 2 squares make 2 units.
 * - "two-at-a-time": lay two squares right sides together, sew 1/4 in each side
 *   of the diagonal and cut on it: 2 squares make 2 units. Same square size;
 *   `oversize` (e.g. 1/8 in) cuts the squares larger to trim the units to size.
 */
export function halfSquareTriangleCut(
  finishedSide: Length,
  options: AllowanceOptions & { method?: HalfSquareMethod; oversize?: Length } = {},
): UnitCut {
  requirePositive(finishedSide, 'finished side');
  const { allowance, ruler } = resolveAllowance(options, finishedSide);
  const method = options.method ?? 'cut-once';
  const oversize = options.oversize ?? Length.zero;
  const side = cutSize(halfSquareSquareSide(finishedSide, allowance).plus(oversize), ruler);
  return {
    unit: 'half-square-triangle',
    method: method === 'cut-once' ? 'squares cut once on the diagonal' : 'two at a time: sew each side of the diagonal, then cut',
    finished: square(finishedSide),
    unfinished: square(addSeamAllowance(finishedSide, allowance)),
    allowance,
    unitsPerBatch: 2,
    pieces: [
      {
        role: 'square (one of each fabric)',
        shape: 'square',
        width: side,
        height: side,
        quantity: 2,
        diagonalCuts: method === 'cut-once' ? 1 : 0,
        piecesEach: 2,
      },
    ],
  };
}

/**
 * Quarter-square triangle (hourglass) units of finished side `finishedSide`:
 * a square of each of two fabrics cut twice on the diagonal gives 8 triangles,
 * enough for 2 units. The long side of each triangle is on the straight grain.
 */
export function quarterSquareTriangleCut(finishedSide: Length, options: AllowanceOptions = {}): UnitCut {
  requirePositive(finishedSide, 'finished side');
  const { allowance, ruler } = resolveAllowance(options, finishedSide);
  const side = cutSize(quarterSquareSquareSide(finishedSide, allowance), ruler);
  return {
    unit: 'quarter-square-triangle',
    method: 'squares cut twice on the diagonal',
    finished: square(finishedSide),
    unfinished: square(addSeamAllowance(finishedSide, allowance)),
    allowance,
    unitsPerBatch: 2,
    pieces: [
      { role: 'square (one of each fabric)', shape: 'square', width: side, height: side, quantity: 2, diagonalCuts: 2, piecesEach: 4 },
    ],
  };
}

/** Equilateral triangle cut sizes and the yield of one strip. */
export interface EquilateralTriangleCut extends UnitCut {
  finishedHeight: Length;
  /** Strip width to cut: finished height + 3 x allowance. */
  stripWidth: ReturnType<typeof cutSize>;
  /** Side of the cut triangle (points included): finished side + 2 sqrt 3 x allowance. */
  cutSide: ReturnType<typeof cutSize>;
}

/**
 * Equilateral triangles of finished side `finishedSide`, cut from a strip at
 * 60 degrees, alternately point up and point down.
 */
export function equilateralTriangleCut(finishedSide: Length, options: AllowanceOptions = {}): EquilateralTriangleCut {
  requirePositive(finishedSide, 'finished side');
  const finishedHeight = finishedSide.times(SQRT3).dividedBy(2);
  const { allowance, ruler } = resolveAllowance(options, finishedHeight);
  const stripWidth = cutSize(finishedHeight.plus(allowance.times(3)), ruler);
  // With the strip rounded up, the triangle is cut to the rounded height; its side follows.
  const exactSide = addAllowanceTimes(finishedSide, allowance, SQRT3.times(2));
  const cutSide = { exact: exactSide, rounded: stripWidth.rounded.times(2).dividedBy(SQRT3) };
  return {
    unit: 'equilateral-triangle',
    method: 'triangles cut from a strip at 60 degrees, alternately up and down',
    finished: { width: finishedSide, height: finishedHeight },
    allowance,
    unitsPerBatch: 1,
    pieces: [{ role: 'triangle', shape: 'strip', width: cutSide, height: stripWidth, quantity: 1, diagonalCuts: 0, piecesEach: 1 }],
    finishedHeight,
    stripWidth,
    cutSide,
  };
}

/** Triangles one strip of `stripLength` yields, cut alternately up and down. */
export function equilateralTrianglesPerStrip(cut: EquilateralTriangleCut, stripLength: Length): number {
  return alternatingPiecesPerStrip(cut.cutSide.rounded, Length.zero, stripLength);
}
