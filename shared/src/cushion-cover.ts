// Cushion covers: a front cut from the pad size plus seams, and an envelope
// back of two hemmed halves that overlap across the middle.

import { DomainError } from './errors';
import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { cutSize, CutSize, RulerStep } from './rounding';
import { addSeamAllowance, resolveAllowance } from './seam-allowance';

export interface CushionCoverInput {
  /** Cushion pad size. */
  pad: Size;
  /** Seam allowance round the edge; default 1/2 in (common practice for cushions). */
  allowance?: Length;
  /** How far the two back halves overlap; default 4 in (common practice 4 to 6 in). */
  overlap?: Length;
  /** Fabric turned under for each back half's hem; default 1 in (a 1/2 in double fold). */
  hem?: Length;
  ruler?: RulerStep;
}

export interface CushionCover {
  /** Finished cover size (equal to the pad, for a plump cushion). */
  finished: Size;
  front: { width: CutSize; height: CutSize };
  /** Two back halves, each cut this size; the overlap runs across the width. */
  back: { count: 2; width: CutSize; height: CutSize; finishedHeight: Length };
  overlap: Length;
}

/** Cut sizes of an envelope-back cushion cover for a pad. */
export function cushionCover(input: CushionCoverInput): CushionCover {
  const width = requirePositive(input.pad.width, 'pad width');
  const height = requirePositive(input.pad.height, 'pad height');
  const { allowance, ruler } = resolveAllowance(
    { allowance: input.allowance ?? Length.inches('0.5'), ruler: input.ruler },
    width,
    height,
  );
  const overlap = requireNonNegative(input.overlap ?? Length.inches(4), 'overlap');
  const hem = requireNonNegative(input.hem ?? Length.inches(1), 'hem');
  if (overlap.gte(height)) {
    throw new DomainError('out-of-range', 'Expected the envelope overlap to be smaller than the pad height.', 'overlap');
  }
  // Each half reaches from the edge seam line past the middle by half the overlap.
  const finishedHeight = height.plus(overlap).dividedBy(2);
  return {
    finished: { width, height },
    front: { width: cutSize(addSeamAllowance(width, allowance), ruler), height: cutSize(addSeamAllowance(height, allowance), ruler) },
    back: {
      count: 2,
      width: cutSize(addSeamAllowance(width, allowance), ruler),
      height: cutSize(finishedHeight.plus(allowance).plus(hem), ruler),
      finishedHeight,
    },
    overlap,
  };
}
