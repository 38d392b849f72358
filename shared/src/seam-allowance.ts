// Seam allowance and the cut sizes of squares, rectangles and strips.
// Cut = finished + 2 x allowance (1/4 in unless the maker changes it).

import Decimal from 'decimal.js';
import { DomainError } from './errors';
import { Length, requirePositive, Size } from './measure';
import { cutSize, CutSize, RulerStep } from './rounding';

/** The quilter's standard seam allowance, 1/4 in. */
export const QUARTER_INCH_ALLOWANCE: Length = Length.inches('0.25');

/** Largest seam allowance accepted: 1 in (25.4 mm). */
export const MAX_ALLOWANCE: Length = Length.inches(1);

export interface AllowanceOptions {
  /** Seam allowance on every sewn edge; default 1/4 in. Metric allowances (e.g. 7.5 mm) are fine. */
  allowance?: Length;
  /** Ruler step cut sizes round UP to; default "eighth-inch", use "millimetre" for metric work. */
  ruler?: RulerStep;
}

export interface ResolvedAllowance {
  allowance: Length;
  ruler: RulerStep;
}

/**
 * Reads the allowance options, checking the allowance is above zero, at most
 * 1 in and not larger than the smallest finished dimension it is sewn onto.
 */
export function resolveAllowance(options: AllowanceOptions = {}, ...finished: Length[]): ResolvedAllowance {
  const allowance = requirePositive(options.allowance ?? QUARTER_INCH_ALLOWANCE, 'allowance');
  if (allowance.gt(MAX_ALLOWANCE)) {
    throw new DomainError(
      'allowance-too-large',
      `Expected a seam allowance of at most 1 in (25.4 mm); got ${allowance.to('in').toDecimalPlaces(4)} in.`,
      'allowance',
    );
  }
  for (const size of finished) {
    if (allowance.gt(size)) {
      throw new DomainError(
        'allowance-too-large',
        `The seam allowance (${allowance.to('in').toDecimalPlaces(4)} in) is larger than the finished piece ` +
          `(${size.to('in').toDecimalPlaces(4)} in); expected an allowance no larger than the piece.`,
        'allowance',
      );
    }
  }
  return { allowance, ruler: options.ruler ?? 'eighth-inch' };
}

/** Exact finished + 2 x allowance. */
export function addSeamAllowance(finished: Length, allowance: Length): Length {
  return finished.plus(allowance.times(2));
}

/** Exact finished + allowance x factor (for the triangle add-ons). */
export function addAllowanceTimes(finished: Length, allowance: Length, factor: Decimal): Length {
  return finished.plus(allowance.times(factor));
}

/** The kinds of pieced unit the cut-size functions describe. */
export type UnitKind =
  | 'square'
  | 'rectangle'
  | 'half-square-triangle'
  | 'quarter-square-triangle'
  | 'flying-geese'
  | 'equilateral-triangle'
  | 'side-setting-triangle'
  | 'corner-setting-triangle';

/** One shape to cut from fabric, before any diagonal cuts. */
export interface CutPiece {
  /** What the piece becomes, e.g. "square", "goose", "sky", "triangle". */
  role: string;
  /** The shape cut with the ruler: a square, rectangle or a strip to sub-cut triangles from. */
  shape: 'square' | 'rectangle' | 'strip';
  width: CutSize;
  height: CutSize;
  /** How many to cut for one batch of units. */
  quantity: number;
  /** 0: used whole; 1: cut once corner to corner; 2: cut twice (an X). */
  diagonalCuts: 0 | 1 | 2;
  /** Pieces each cut shape yields after its diagonal cuts (1, 2 or 4). */
  piecesEach: number;
}

/** How to cut one kind of unit: the shapes, their counts and what a batch makes. */
export interface UnitCut {
  unit: UnitKind;
  method: string;
  finished: Size;
  /** Finished + 2 x allowance each way: the size of the sewn unit, and the size to trim it to (square units only). */
  unfinished?: Size;
  allowance: Length;
  /** Units one batch of the listed pieces makes. */
  unitsPerBatch: number;
  pieces: CutPiece[];
}

/** Number of batches (and so of each piece) for `units` units. */
export function batchesFor(cut: UnitCut, units: number): number {
  return Math.ceil(units / cut.unitsPerBatch);
}

function unfinishedOf(finished: Size, allowance: Length): Size {
  return { width: addSeamAllowance(finished.width, allowance), height: addSeamAllowance(finished.height, allowance) };
}

/** A plain square: cut finished + 2 x allowance. */
export function squareCut(finishedSide: Length, options: AllowanceOptions = {}): UnitCut {
  requirePositive(finishedSide, 'finished side');
  const { allowance, ruler } = resolveAllowance(options, finishedSide);
  const side = cutSize(addSeamAllowance(finishedSide, allowance), ruler);
  const finished = { width: finishedSide, height: finishedSide };
  return {
    unit: 'square',
    method: 'cut square',
    finished,
    unfinished: unfinishedOf(finished, allowance),
    allowance,
    unitsPerBatch: 1,
    pieces: [{ role: 'square', shape: 'square', width: side, height: side, quantity: 1, diagonalCuts: 0, piecesEach: 1 }],
  };
}

/** A rectangle: each side cut finished + 2 x allowance. */
export function rectangleCut(finished: Size, options: AllowanceOptions = {}): UnitCut {
  requirePositive(finished.width, 'finished width');
  requirePositive(finished.height, 'finished height');
  const { allowance, ruler } = resolveAllowance(options, finished.width, finished.height);
  return {
    unit: 'rectangle',
    method: 'cut rectangle',
    finished,
    unfinished: unfinishedOf(finished, allowance),
    allowance,
    unitsPerBatch: 1,
    pieces: [
      {
        role: 'rectangle',
        shape: 'rectangle',
        width: cutSize(addSeamAllowance(finished.width, allowance), ruler),
        height: cutSize(addSeamAllowance(finished.height, allowance), ruler),
        quantity: 1,
        diagonalCuts: 0,
        piecesEach: 1,
      },
    ],
  };
}

/** The width to cut a strip for a finished strip width (sashing, borders, strip piecing). */
export function stripCut(finishedWidth: Length, options: AllowanceOptions = {}): CutSize {
  requirePositive(finishedWidth, 'finished strip width');
  const { allowance, ruler } = resolveAllowance(options, finishedWidth);
  return cutSize(addSeamAllowance(finishedWidth, allowance), ruler);
}
