// Foundation (stitch and flip) blocks: strips sewn onto an oversized
// foundation, then trimmed to the block's unfinished size.

import Decimal from 'decimal.js';
import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { cutSize, CutSize } from './rounding';
import { addSeamAllowance, AllowanceOptions, resolveAllowance } from './seam-allowance';

export interface FoundationBlockInput extends AllowanceOptions {
  /** Finished block size (a Length for a square block). */
  finished: Size | Length;
  /** Extra foundation on every side, trimmed away after sewing; default 1/2 in (common practice). */
  oversize?: Length;
  /** Mean finished (showing) width of the strips, for the strips estimate. */
  meanStripWidth?: Length;
  /** Strips laid parallel to an edge or at 45 degrees; default "diagonal". */
  direction?: 'straight' | 'diagonal';
  /** Extra length at each end of a strip so it covers the foundation's edge; default 1/2 in. */
  overhang?: Length;
}

export interface StripsEstimate {
  direction: 'straight' | 'diagonal';
  count: number;
  /** Strip width to cut: mean showing width + 2 x allowance. */
  cutWidth: CutSize;
  /** Total length of strips (an estimate: foundation area / mean width, plus the overhangs). */
  totalLength: Length;
}

export interface FoundationBlock {
  finished: Size;
  /** The unfinished block: trim the sewn foundation to this. */
  trimmed: { width: CutSize; height: CutSize };
  /** Size to cut the foundation. */
  foundation: Size;
  strips: StripsEstimate | null;
}

const SQRT2 = new Decimal(2).sqrt();

/** Foundation and trimmed sizes of a stitch-and-flip block, with an optional strips estimate. */
export function foundationBlock(input: FoundationBlockInput): FoundationBlock {
  const size = input.finished instanceof Length ? { width: input.finished, height: input.finished } : input.finished;
  const finished = { width: requirePositive(size.width, 'finished width'), height: requirePositive(size.height, 'finished height') };
  const { allowance, ruler } = resolveAllowance(input, finished.width, finished.height);
  const oversize = requireNonNegative(input.oversize ?? Length.inches('0.5'), 'oversize');
  const unfinished = { width: addSeamAllowance(finished.width, allowance), height: addSeamAllowance(finished.height, allowance) };
  const foundation = { width: unfinished.width.plus(oversize.times(2)), height: unfinished.height.plus(oversize.times(2)) };

  let strips: StripsEstimate | null = null;
  if (input.meanStripWidth !== undefined) {
    const w = requirePositive(input.meanStripWidth, 'mean strip width');
    resolveAllowance(input, w);
    const overhang = requireNonNegative(input.overhang ?? Length.inches('0.5'), 'overhang');
    const direction = input.direction ?? 'diagonal';
    // Span the strips must cover, measured across them.
    const span = direction === 'straight' ? foundation.height : foundation.width.plus(foundation.height).dividedBy(SQRT2);
    const count = span.ratio(w).ceil().toNumber();
    const area = foundation.width.mm.times(foundation.height.mm);
    const covered = Length.millimetres(area.dividedBy(w.mm));
    const totalLength =
      direction === 'straight' ? foundation.width.plus(overhang.times(2)).times(count) : covered.plus(overhang.times(2 * count));
    strips = { direction, count, cutWidth: cutSize(addSeamAllowance(w, allowance), ruler), totalLength };
  }
  return {
    finished,
    trimmed: { width: cutSize(unfinished.width, ruler), height: cutSize(unfinished.height, ruler) },
    foundation,
    strips,
  };
}
