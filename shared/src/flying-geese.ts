// Flying geese units: a large "goose" triangle between two small "sky"
// triangles, finished twice as wide as tall. The goose is a quarter-square
// triangle with its long side on the unit's width; each sky is a half-square
// triangle with legs of the unit's height.

import { DomainError } from './errors';
import { Length, requirePositive } from './measure';
import { cutSize } from './rounding';
import { addSeamAllowance, AllowanceOptions, resolveAllowance, UnitCut } from './seam-allowance';
import { halfSquareSquareSide, quarterSquareSquareSide } from './triangle-cut';

export type FlyingGeeseMethod = 'four-at-a-time' | 'stitch-and-flip';

/**
 * Cut sizes for flying geese of finished `width` x `height` (width = 2 x height).
 * - "four-at-a-time": one large square (width + 1 1/4 in at 1/4 in seams) and
 *   four small squares (height + 7/8 in) make four geese with no waste.
 * - "stitch-and-flip": one rectangle (width + 1/2 in by height + 1/2 in) and
 *   two squares (height + 1/2 in) sewn on the diagonal make one goose.
 */
export function flyingGeeseCut(
  finished: { width: Length; height: Length },
  options: AllowanceOptions & { method?: FlyingGeeseMethod } = {},
): UnitCut {
  const width = requirePositive(finished.width, 'finished width');
  const height = requirePositive(finished.height, 'finished height');
  if (!width.eq(height.times(2))) {
    throw new DomainError(
      'shape-mismatch',
      `Expected flying geese twice as wide as tall (a ${height.to('in').toDecimalPlaces(4)} in tall goose is ` +
        `${height.times(2).to('in').toDecimalPlaces(4)} in wide); got ${width.to('in').toDecimalPlaces(4)} in wide.`,
      'finished width',
    );
  }
  const { allowance, ruler } = resolveAllowance(options, height);
  const method = options.method ?? 'four-at-a-time';
  const unfinished = { width: addSeamAllowance(width, allowance), height: addSeamAllowance(height, allowance) };
  if (method === 'four-at-a-time') {
    const large = cutSize(quarterSquareSquareSide(width, allowance), ruler);
    const small = cutSize(halfSquareSquareSide(height, allowance), ruler);
    return {
      unit: 'flying-geese',
      method: 'four at a time: one large and four small squares',
      finished: { width, height },
      unfinished,
      allowance,
      unitsPerBatch: 4,
      pieces: [
        { role: 'goose', shape: 'square', width: large, height: large, quantity: 1, diagonalCuts: 0, piecesEach: 4 },
        { role: 'sky', shape: 'square', width: small, height: small, quantity: 4, diagonalCuts: 0, piecesEach: 2 },
      ],
    };
  }
  const rectangle = { width: cutSize(unfinished.width, ruler), height: cutSize(unfinished.height, ruler) };
  const sky = cutSize(unfinished.height, ruler);
  return {
    unit: 'flying-geese',
    method: 'stitch and flip: a rectangle and two squares sewn on the diagonal',
    finished: { width, height },
    unfinished,
    allowance,
    unitsPerBatch: 1,
    pieces: [
      { role: 'goose', shape: 'rectangle', ...rectangle, quantity: 1, diagonalCuts: 0, piecesEach: 1 },
      { role: 'sky', shape: 'square', width: sky, height: sky, quantity: 2, diagonalCuts: 0, piecesEach: 1 },
    ],
  };
}
