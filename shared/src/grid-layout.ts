// Straight-set grid layouts: rows x columns of blocks, optional sashing with
// or without cornerstones, and any number of borders (innermost first, each
// added sides first, then top and bottom). Every strip's cut size is its
// finished size + 2 x allowance each way; strips longer than the usable width
// of fabric are pieced from width-of-fabric (WOF) strips with straight joins.

import { DomainError, requireCount } from './errors';
import { DEFAULT_USABLE_WIDTH } from './fabric-width';
import { Length, requirePositive, Size } from './measure';
import { cutSize, CutSize, RulerStep } from './rounding';
import { addSeamAllowance, AllowanceOptions, resolveAllowance } from './seam-allowance';


export interface SashingInput {
  width: Length;
  /** Squares where sashing strips cross; without them the strips between rows run the full width. */
  cornerstones?: boolean;
  /** Sashing round the outside of the blocks too; default false. */
  outer?: boolean;
}

export interface GridLayoutInput extends BorderOptions {
  rows: number;
  columns: number;
  /** Finished block size (a Length for square blocks). */
  block: Size | Length;
  sashing?: SashingInput;
  /** Border widths, innermost first. */
  borders?: readonly Length[];
}

/** How a strip longer than the fabric's usable width is pieced. */
export interface Piecing {
  /** WOF strips joined end to end for one strip (1 when it is not pieced). */
  wofStrips: number;
  joins: number;
}

/** A group of identical strips. */
export interface StripGroup {
  name: string;
  count: number;
  /** Finished size: length x width as `length` and `width`. */
  finished: { length: Length; width: Length };
  cut: { length: CutSize; width: CutSize };
  piecing: Piecing;
}

export interface BorderPlan {
  /** 1 for the innermost border. */
  number: number;
  width: Length;
  /** The two side strips (added first). */
  sides: StripGroup;
  /** The top and bottom strips (added after the sides, so they are longer). */
  topAndBottom: StripGroup;
  /** WOF strips to cut for the whole border when strips are joined end to end and cut to length. */
  wofStrips: number;
  /** Size of the top once this border is on. */
  finishedAfter: Size;
}

export interface GridLayout {
  rows: number;
  columns: number;
  allowance: Length;
  /** Finished size of the whole top. */
  finished: Size;
  /** Finished size of the blocks and sashing, before borders. */
  centre: Size;
  blocks: { count: number; finished: Size; cut: { width: CutSize; height: CutSize } };
  sashing: { strips: StripGroup[]; cornerstones: { count: number; finished: Length; cut: CutSize } | null } | null;
  borders: BorderPlan[];
  /** Finished widths met crossing the top left to right, and heights top to bottom; they sum to `finished`. */
  parts: { across: Length[]; down: Length[] };
}

function blockSize(block: Size | Length): Size {
  const size = block instanceof Length ? { width: block, height: block } : block;
  return { width: requirePositive(size.width, 'block width'), height: requirePositive(size.height, 'block height') };
}

/** How many WOF strips of `usable` make one strip of `cutLength`, losing 2 x allowance at each straight join. */
export function piecingFor(cutLength: Length, usable: Length, allowance: Length): Piecing {
  if (cutLength.lte(usable)) return { wofStrips: 1, joins: 0 };
  const gain = usable.minus(allowance.times(2));
  const n = cutLength.minus(allowance.times(2)).ratio(gain).ceil().toNumber();
  return { wofStrips: n, joins: n - 1 };
}

/** WOF strips for `count` strips of `cutLength` joined end to end then cut to length. */
export function wofStripsEndToEnd(cutLength: Length, count: number, usable: Length, allowance: Length): number {
  if (cutLength.lte(usable)) {
    const perStrip = usable.ratio(cutLength).floor().toNumber();
    return Math.ceil(count / perStrip);
  }
  const total = cutLength.times(count);
  const gain = usable.minus(allowance.times(2));
  return total.minus(allowance.times(2)).ratio(gain).ceil().toNumber();
}

function stripGroup(
  name: string,
  count: number,
  length: Length,
  width: Length,
  allowance: Length,
  ruler: RulerStep,
  usable: Length | null,
): StripGroup {
  const cutLength = cutSize(addSeamAllowance(length, allowance), ruler);
  return {
    name,
    count,
    finished: { length, width },
    cut: { length: cutLength, width: cutSize(addSeamAllowance(width, allowance), ruler) },
    piecing: usable === null ? { wofStrips: 1, joins: 0 } : piecingFor(cutLength.rounded, usable, allowance),
  };
}

/** Plans a straight-set grid top: finished size and every strip, cornerstone and border. */
export function gridLayout(input: GridLayoutInput): GridLayout {
  const rows = requireCount(input.rows, 'rows', 1, 500);
  const columns = requireCount(input.columns, 'columns', 1, 500);
  const block = blockSize(input.block);
  const { allowance, ruler } = resolveAllowance(input, block.width, block.height);
  const usable = requirePositive(input.usableWidth ?? DEFAULT_USABLE_WIDTH, 'usable width');
  if (usable.lte(allowance.times(4))) {
    throw new DomainError('too-small', 'Expected a usable fabric width larger than four seam allowances.', 'usable width');
  }

  const across: Length[] = [];
  const down: Length[] = [];
  let strips: StripGroup[] = [];
  let cornerstones: { count: number; finished: Length; cut: CutSize } | null = null;
  const sashing = input.sashing;
  const sw = sashing ? requirePositive(sashing.width, 'sashing width') : Length.zero;
  const outer = !!sashing?.outer;
  for (let c = 0; c < columns; c++) {
    if (sashing && (c > 0 || outer)) across.push(sw);
    across.push(block.width);
  }
  if (outer) across.push(sw);
  for (let r = 0; r < rows; r++) {
    if (sashing && (r > 0 || outer)) down.push(sw);
    down.push(block.height);
  }
  if (outer) down.push(sw);
  const centre = { width: Length.sum(across), height: Length.sum(down) };

  if (sashing) {
    resolveAllowance(input, sw);
    const verticalPerRow = columns - 1 + (outer ? 2 : 0);
    const horizontalLines = rows - 1 + (outer ? 2 : 0);
    strips = [];
    if (verticalPerRow > 0) {
      strips.push(stripGroup('between blocks in each row', verticalPerRow * rows, block.height, sw, allowance, ruler, usable));
    }
    if (horizontalLines > 0) {
      if (sashing.cornerstones) {
        strips.push(stripGroup('between rows, block length', horizontalLines * columns, block.width, sw, allowance, ruler, usable));
        cornerstones = {
          count: horizontalLines * verticalPerRow,
          finished: sw,
          cut: cutSize(addSeamAllowance(sw, allowance), ruler),
        };
        if (cornerstones.count === 0) cornerstones = null;
      } else {
        strips.push(stripGroup('between rows, full width', horizontalLines, centre.width, sw, allowance, ruler, usable));
      }
    }
  }

  const borders = planBorders(centre, input.borders ?? [], input);
  for (const border of borders) {
    across.unshift(border.width);
    across.push(border.width);
    down.unshift(border.width);
    down.push(border.width);
  }
  const finished = borders.length > 0 ? borders[borders.length - 1].finishedAfter : centre;

  return {
    rows,
    columns,
    allowance,
    finished,
    centre,
    blocks: {
      count: rows * columns,
      finished: block,
      cut: {
        width: cutSize(addSeamAllowance(block.width, allowance), ruler),
        height: cutSize(addSeamAllowance(block.height, allowance), ruler),
      },
    },
    sashing: sashing ? { strips, cornerstones } : null,
    borders,
    parts: { across, down },
  };
}

export interface BorderOptions extends AllowanceOptions {
  /** Usable width of the fabric strips are cut across; default 40 in. */
  usableWidth?: Length;
  /** Cut border strips across the width (pieced when too long) or along the length (unpieced); default across. */
  borderGrain?: 'across-width' | 'lengthwise';
}

/**
 * Borders round any finished centre (a grid, an on-point centre, a medallion),
 * innermost first; each is added sides first, then top and bottom.
 */
export function planBorders(centre: Size, widths: readonly Length[], options: BorderOptions = {}): BorderPlan[] {
  requirePositive(centre.width, 'centre width');
  requirePositive(centre.height, 'centre height');
  const { allowance, ruler } = resolveAllowance(options);
  const usable = requirePositive(options.usableWidth ?? DEFAULT_USABLE_WIDTH, 'usable width');
  if (usable.lte(allowance.times(4))) {
    throw new DomainError('too-small', 'Expected a usable fabric width larger than four seam allowances.', 'usable width');
  }
  const grainUsable = options.borderGrain === 'lengthwise' ? null : usable;
  const borders: BorderPlan[] = [];
  let current: Size = centre;
  widths.forEach((width, i) => {
    requirePositive(width, `border ${i + 1} width`);
    resolveAllowance(options, width);
    const sides = stripGroup('sides', 2, current.height, width, allowance, ruler, grainUsable);
    const after = { width: current.width.plus(width.times(2)), height: current.height.plus(width.times(2)) };
    const topAndBottom = stripGroup('top and bottom', 2, after.width, width, allowance, ruler, grainUsable);
    const wofStrips =
      grainUsable === null
        ? 0
        : wofStripsEndToEnd(sides.cut.length.rounded, 2, usable, allowance) +
          wofStripsEndToEnd(topAndBottom.cut.length.rounded, 2, usable, allowance);
    borders.push({ number: i + 1, width, sides, topAndBottom, wofStrips, finishedAfter: after });
    current = after;
  });
  return borders;
}
