// Suggests the rows and columns of a grid (and a border width) whose finished
// size comes closest to a target size, with the difference shown.

import { DomainError } from './errors';
import { Length, requireNonNegative, requirePositive, Size } from './measure';

export interface SuggestGridInput {
  /** Wanted finished size of the quilt. */
  target: Size;
  /** Finished block size (a Length for square blocks). */
  block: Size | Length;
  /** Sashing between blocks (not round the outside); default none. */
  sashingWidth?: Length;
  /** Border widths to try, from `min` to `max` in `step`s; default no border. */
  border?: { min: Length; max: Length; step: Length };
  /** How many suggestions to return, best first; default 5. */
  limit?: number;
}

export interface GridSuggestion {
  rows: number;
  columns: number;
  borderWidth: Length;
  finished: Size;
  /** Finished minus target, each way (negative: smaller than wanted). */
  difference: Size;
}

const MAX_BORDER_STEPS = 200;
const MAX_BLOCKS_PER_SIDE = 500;

function candidates(target: Length, unit: Length, gap: Length): number[] {
  // n blocks with n - 1 gaps: n (unit + gap) - gap = target.
  const n = target.plus(gap).ratio(unit.plus(gap));
  const low = Math.max(1, n.floor().toNumber());
  return [...new Set([low, low + 1])].filter((v) => v <= MAX_BLOCKS_PER_SIDE);
}

/** Grid suggestions ordered by the total of the width and length differences, then fewer blocks. */
export function suggestGrid(input: SuggestGridInput): GridSuggestion[] {
  const target = { width: requirePositive(input.target.width, 'target width'), height: requirePositive(input.target.height, 'target length') };
  const block = input.block instanceof Length ? { width: input.block, height: input.block } : input.block;
  requirePositive(block.width, 'block width');
  requirePositive(block.height, 'block height');
  const gap = requireNonNegative(input.sashingWidth ?? Length.zero, 'sashing width');
  const limit = Math.max(1, Math.floor(input.limit ?? 5));

  const borders: Length[] = [];
  if (input.border) {
    const { min, max, step } = input.border;
    requireNonNegative(min, 'smallest border');
    requirePositive(step, 'border step');
    if (max.lt(min)) throw new DomainError('out-of-range', 'Expected the largest border to be at least the smallest.', 'border');
    const steps = max.minus(min).ratio(step).floor().toNumber();
    if (steps > MAX_BORDER_STEPS) {
      throw new DomainError('too-large', `Expected at most ${MAX_BORDER_STEPS} border widths to try; use a larger step.`, 'border');
    }
    for (let i = 0; i <= steps; i++) borders.push(min.plus(step.times(i)));
  } else {
    borders.push(Length.zero);
  }

  const found: GridSuggestion[] = [];
  for (const borderWidth of borders) {
    const inner = {
      width: target.width.minus(borderWidth.times(2)),
      height: target.height.minus(borderWidth.times(2)),
    };
    if (!inner.width.isPositive() || !inner.height.isPositive()) continue;
    for (const columns of candidates(inner.width, block.width, gap)) {
      for (const rows of candidates(inner.height, block.height, gap)) {
        const finished = {
          width: block.width.times(columns).plus(gap.times(columns - 1)).plus(borderWidth.times(2)),
          height: block.height.times(rows).plus(gap.times(rows - 1)).plus(borderWidth.times(2)),
        };
        found.push({
          rows,
          columns,
          borderWidth,
          finished,
          difference: { width: finished.width.minus(target.width), height: finished.height.minus(target.height) },
        });
      }
    }
  }
  const score = (s: GridSuggestion) => s.difference.width.abs().plus(s.difference.height.abs());
  found.sort((a, b) => score(a).compare(score(b)) || a.rows * a.columns - b.rows * b.columns || a.borderWidth.compare(b.borderWidth));
  return found.slice(0, limit);
}
