// The circle that covers the hole at the centre of a plate (or the quarter
// circle in the corner of a fan), and the background square a plate or fan is
// appliquéd onto.

import { DomainError } from './errors';
import { Length, requireNonNegative, requirePositive } from './measure';
import { cutSize, CutSize, roundToStep } from './rounding';
import { addSeamAllowance, AllowanceOptions, resolveAllowance } from './seam-allowance';
import { WedgeBlock } from './wedge-block';

/** Common practice: the fabric circle is cut 1/4 to 1/2 in larger all round than its card template. */
export const TURN_ALLOWANCE_RANGE = Object.freeze({ min: Length.inches('0.25'), max: Length.inches('0.5') });

export interface CentreCircleOptions {
  /** How far the card template reaches past the blades' inner corners; default 1/4 in. */
  overlap?: Length;
  /** Fabric turned over the card all round; default 1/4 in (common practice 1/4 to 1/2 in). */
  turnAllowance?: Length;
}

export interface CentreCircle {
  kind: 'plate' | 'fan';
  cardRadius: Length;
  cardDiameter: Length;
  fabricRadius: Length;
  fabricDiameter: Length;
  /**
   * Fan only: the quarter circle's straight edges lie in the block's seams, so
   * they get the seam allowance, not a turn allowance; cut it from a square of
   * this side (fabric radius + seam allowance).
   */
  fanSquare: CutSize | null;
}

/** Card template and fabric for the centre circle of a plate, or the corner quarter circle of a fan. */
export function centreCircle(block: WedgeBlock, options: CentreCircleOptions = {}): CentreCircle {
  const overlap = requireNonNegative(options.overlap ?? Length.inches('0.25'), 'overlap');
  const turn = requirePositive(options.turnAllowance ?? TURN_ALLOWANCE_RANGE.min, 'turn allowance');
  if (turn.gt(Length.inches(1))) {
    throw new DomainError('allowance-too-large', 'Expected a turn allowance of at most 1 in (common practice 1/4 to 1/2 in).', 'turn allowance');
  }
  const cardRadius = block.innerRadius.plus(overlap);
  if (cardRadius.gte(block.outerRadius)) {
    throw new DomainError('out-of-range', 'Expected the centre circle to be smaller than the plate.', 'overlap');
  }
  const fabricRadius = cardRadius.plus(turn);
  return {
    kind: block.kind,
    cardRadius,
    cardDiameter: cardRadius.times(2),
    fabricRadius,
    fabricDiameter: fabricRadius.times(2),
    fanSquare: block.kind === 'fan' ? cutSize(fabricRadius.plus(block.allowance)) : null,
  };
}

export interface BackgroundSquareOptions extends AllowanceOptions {
  /** Space between the plate's outer edge and the block's finished edge; default 1 in. */
  margin?: Length;
  /** Finished sizes are rounded up to this step; default 1 in. */
  step?: Length;
}

export interface BackgroundSquare {
  /** Smallest finished side that holds the plate (2 (R + margin)) or fan (R + margin). */
  minimumFinished: Length;
  /** Finished side rounded up to the step. */
  finished: Length;
  /** Cut side: finished + 2 x allowance. */
  cut: CutSize;
}

/** The background square for a plate (centred) or a fan (in a corner). */
export function backgroundSquare(block: WedgeBlock, options: BackgroundSquareOptions = {}): BackgroundSquare {
  const margin = requireNonNegative(options.margin ?? Length.inches(1), 'margin');
  const step = requirePositive(options.step ?? Length.inches(1), 'step');
  const reach = block.outerRadius.plus(margin);
  const minimumFinished = block.kind === 'plate' ? reach.times(2) : reach;
  const finished = roundToStep(minimumFinished, step, 'up');
  const { allowance, ruler } = resolveAllowance({ allowance: options.allowance ?? block.allowance, ruler: options.ruler }, finished);
  return { minimumFinished, finished, cut: cutSize(addSeamAllowance(finished, allowance), ruler) };
}
