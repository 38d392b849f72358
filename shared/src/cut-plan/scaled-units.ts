// Scaled integer units: the planner works in whole thousandths of the caller's
// unit, so sums and comparisons are exact (a float sum such as 6.5 + 6.5 + 6.5
// is exact, but 0.1 + 0.2 is not, and metric-derived inch values such as
// 7.874015748 in = 200 mm never are).
//
// Rounding is always on the safe side: a piece's size is rounded UP and a
// panel's size DOWN, so a piece the plan says fits is never short of fabric.
// The most a piece is enlarged by is one step (0.001 of the unit), which is far
// below what a rotary cutter and ruler can show (1/8 in).

/** Steps per unit: the planner's resolution is 1/SCALE of the caller's unit. */
export const SCALE = 1000;

/**
 * A value within this many steps of a whole step is taken as that step, so
 * float noise (6.499999999999999 from an upstream division) does not round a
 * 6 1/2 in square up to 6.501 in.
 */
const SNAP = 1e-6;

/** Size of a piece in steps, rounded up (the piece never comes out small). */
export function stepsUp(value: number): number {
  const scaled = value * SCALE;
  const nearest = Math.round(scaled);
  return Math.abs(scaled - nearest) <= SNAP ? nearest : Math.ceil(scaled);
}

/** Size of a panel (or a position inside it) in steps, rounded down. */
export function stepsDown(value: number): number {
  const scaled = value * SCALE;
  const nearest = Math.round(scaled);
  return Math.abs(scaled - nearest) <= SNAP ? nearest : Math.floor(scaled);
}

/** A step count back in the caller's unit. */
export function fromSteps(steps: number): number {
  return steps / SCALE;
}
