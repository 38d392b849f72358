// Wadding (batting): oversized like the backing (common practice 4 in each
// side), and the length to buy from a roll of a given width.

import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { DEFAULT_BACKING_OVERSIZE } from './backing';

export interface WaddingInput {
  quilt: Size;
  /** Extra on every side; default 4 in. */
  oversize?: Length;
  /** Width of the roll it is cut from, if it is bought off a roll. */
  rollWidth?: Length;
}

export interface Wadding {
  size: Size;
  /** Off the roll: pieces butted edge to edge (no overlap), and the length to buy. */
  fromRoll: { pieces: number; joins: number; length: Length } | null;
}

/** Wadding size, and the length off a roll (one piece when it fits either way). */
export function wadding(input: WaddingInput): Wadding {
  const oversize = requireNonNegative(input.oversize ?? DEFAULT_BACKING_OVERSIZE, 'oversize');
  const size = {
    width: requirePositive(input.quilt.width, 'quilt width').plus(oversize.times(2)),
    height: requirePositive(input.quilt.height, 'quilt length').plus(oversize.times(2)),
  };
  if (input.rollWidth === undefined) return { size, fromRoll: null };
  const roll = requirePositive(input.rollWidth, 'roll width');
  const short = Length.min(size.width, size.height);
  const long = Length.max(size.width, size.height);
  if (short.lte(roll)) {
    // Cut the long way across the roll if it fits, otherwise the short way.
    const length = long.lte(roll) ? short : long;
    return { size, fromRoll: { pieces: 1, joins: 0, length } };
  }
  // Too wide for the roll: butt pieces side by side, whichever way uses less.
  const acrossShort = short.ratio(roll).ceil().toNumber();
  const acrossLong = long.ratio(roll).ceil().toNumber();
  const [pieces, length] =
    long.times(acrossShort).lte(short.times(acrossLong)) ? [acrossShort, long] : [acrossLong, short];
  return { size, fromRoll: { pieces, joins: pieces - 1, length: length.times(pieces) } };
}
