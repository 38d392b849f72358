// On-point setting: blocks turned 45 degrees, the edges filled with side
// setting triangles (a square cut twice on the diagonal, so the long side on
// the quilt's edge is on the straight grain) and corner triangles (a square
// cut once). A block of finished side b has diagonal b sqrt 2.

import Decimal from 'decimal.js';
import { requireCount } from './errors';
import { BorderOptions, BorderPlan, planBorders } from './grid-layout';
import { Length, requireNonNegative, requirePositive, Size } from './measure';
import { cutSize, CutSize } from './rounding';
import { addSeamAllowance, AllowanceOptions, resolveAllowance, UnitCut } from './seam-allowance';
import { halfSquareSquareSide, quarterSquareSquareSide } from './triangle-cut';

const SQRT2 = new Decimal(2).sqrt();

/** Diagonal of a square block: side x sqrt 2. */
export function blockDiagonal(finishedSide: Length): Length {
  return requirePositive(finishedSide, 'block size').times(SQRT2);
}

export interface SettingTriangleOptions extends AllowanceOptions {
  /** Extra added to the cut square so the triangles can be trimmed after sewing; default 0. */
  oversize?: Length;
}

/** Side setting triangles for blocks of finished side `blockSide`: squares cut twice, 4 triangles each. */
export function sideSettingTriangleCut(blockSide: Length, options: SettingTriangleOptions = {}): UnitCut {
  const diagonal = blockDiagonal(blockSide);
  const { allowance, ruler } = resolveAllowance(options, blockSide);
  const oversize = requireNonNegative(options.oversize ?? Length.zero, 'oversize');
  const side = cutSize(quarterSquareSquareSide(diagonal, allowance).plus(oversize), ruler);
  return {
    unit: 'side-setting-triangle',
    method: 'square cut twice on the diagonal',
    finished: { width: diagonal, height: diagonal.dividedBy(2) },
    allowance,
    unitsPerBatch: 4,
    pieces: [{ role: 'side setting triangle', shape: 'square', width: side, height: side, quantity: 1, diagonalCuts: 2, piecesEach: 4 }],
  };
}

/** Corner triangles for blocks of finished side `blockSide`: a square cut once gives 2. */
export function cornerSettingTriangleCut(blockSide: Length, options: SettingTriangleOptions = {}): UnitCut {
  const diagonal = blockDiagonal(blockSide);
  const { allowance, ruler } = resolveAllowance(options, blockSide);
  const oversize = requireNonNegative(options.oversize ?? Length.zero, 'oversize');
  const leg = diagonal.dividedBy(2);
  const side = cutSize(halfSquareSquareSide(leg, allowance).plus(oversize), ruler);
  return {
    unit: 'corner-setting-triangle',
    method: 'square cut once on the diagonal',
    finished: { width: leg, height: leg },
    allowance,
    unitsPerBatch: 2,
    pieces: [{ role: 'corner triangle', shape: 'square', width: side, height: side, quantity: 1, diagonalCuts: 1, piecesEach: 2 }],
  };
}

export interface OnPointLayoutInput extends SettingTriangleOptions, BorderOptions {
  /** Whole blocks along the top edge. */
  across: number;
  /** Whole blocks down the side edge. */
  down: number;
  /** Finished block side. */
  block: Length;
  /** Border widths round the on-point centre, innermost first. */
  borders?: readonly Length[];
}

export interface OnPointLayout {
  across: number;
  down: number;
  blockDiagonal: Length;
  /** Exact finished size of the on-point centre: across x diagonal by down x diagonal. */
  centre: Size;
  /** Finished size of the whole top, borders included. */
  finished: Size;
  borders: BorderPlan[];
  blocks: { count: number; finished: Length; cut: CutSize };
  sideTriangles: { count: number; squares: number; cut: UnitCut };
  cornerTriangles: { count: number; squares: number; cut: UnitCut };
}

/**
 * An on-point centre of `across` x `down` whole blocks: it holds
 * across x down + (across - 1)(down - 1) blocks, 2(across - 1) + 2(down - 1)
 * side setting triangles and 4 corner triangles.
 */
export function onPointLayout(input: OnPointLayoutInput): OnPointLayout {
  const across = requireCount(input.across, 'blocks across');
  const down = requireCount(input.down, 'blocks down');
  const diagonal = blockDiagonal(input.block);
  const { allowance, ruler } = resolveAllowance(input, input.block);
  const sideCount = 2 * (across - 1) + 2 * (down - 1);
  const side = sideSettingTriangleCut(input.block, input);
  const corner = cornerSettingTriangleCut(input.block, input);
  const centre = { width: diagonal.times(across), height: diagonal.times(down) };
  const borders = planBorders(centre, input.borders ?? [], input);
  return {
    across,
    down,
    blockDiagonal: diagonal,
    centre,
    finished: borders.length > 0 ? borders[borders.length - 1].finishedAfter : centre,
    borders,
    blocks: {
      count: across * down + (across - 1) * (down - 1),
      finished: input.block,
      cut: cutSize(addSeamAllowance(input.block, allowance), ruler),
    },
    sideTriangles: { count: sideCount, squares: Math.ceil(sideCount / 4), cut: side },
    cornerTriangles: { count: 4, squares: 2, cut: corner },
  };
}
