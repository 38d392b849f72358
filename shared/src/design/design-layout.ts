// The layout of a design: its finished size and centre, where each block
// position sits (straight or on point), and the pieces of the layout itself:
// sashing, cornerstones, borders and setting triangles.

import { DomainError } from '../errors';
import { Length, Size } from '../measure';
import { RulerStep, cutSize } from '../rounding';
import { gridLayout, StripGroup, BorderPlan } from '../grid-layout';
import { onPointLayout } from '../on-point';
import { DEFAULT_USABLE_WIDTH } from '../fabric-width';
import type { DesignBody } from './design-body';
import type { DerivedPosition, PieceGroup } from './derivation-types';
import { storedLength as L, type CutShape } from './kinds/block-kind';

/** One kind of layout piece to cut, before its fabric is known. */
export interface LayoutPiece {
  key: string;
  label: string;
  group: PieceGroup;
  piece: CutShape;
  count: number;
  lengthwise: boolean;
}

export interface DesignLayout {
  finished: Size;
  centre: Size;
  /** Finished widths across and heights down (borders, sashing, blocks). */
  across: Length[];
  down: Length[];
  /** Each block position, its fabrics not yet filled in. */
  positions: DerivedPosition[];
  layoutPieces: LayoutPiece[];
}

/** Positions a straight or on-point layout holds. */
export function positionCount(layout: DesignBody['layout']): number {
  const { rows, columns } = layout;
  return layout.setting === 'on-point' ? rows * columns + (rows - 1) * (columns - 1) : rows * columns;
}

/** The layout of a design with finished blocks of `side`, the pattern's block ids repeating over the positions. */
export function designLayout(body: DesignBody, pattern: readonly string[], side: Length, ruler: RulerStep): DesignLayout {
  const sashing = body.layout.sashing ? { width: L(body.layout.sashing.widthMm, 'sashing width'), cornerstones: body.layout.sashing.cornerstones } : undefined;
  const borders = body.layout.borders.map((b, i) => L(b, `border ${i + 1} width`));
  const usableWidth = DEFAULT_USABLE_WIDTH;
  const positions: DerivedPosition[] = [];
  const layoutPieces: LayoutPiece[] = [];
  let finished: Size;
  let centre: Size;
  let across: Length[];
  let down: Length[];
  const blockAt = (i: number) => pattern[i % pattern.length]!;
  const stripPieces = (key: string, label: string, group: PieceGroup, s: StripGroup) => {
    if (s.piecing.wofStrips > 1) {
      // Longer than the fabric is wide: cut width-of-fabric strips and join them.
      const wof = cutSize(usableWidth, ruler);
      layoutPieces.push({ key, label: `${label} (joined)`, group, piece: { shape: 'strip', width: wof, height: s.cut.width, diagonalCuts: 0, piecesEach: 1, note: `join ${s.piecing.wofStrips} to make each ${s.cut.length.rounded.to('in').toDecimalPlaces(3)} in strip` }, count: s.count * s.piecing.wofStrips, lengthwise: false });
    } else {
      layoutPieces.push({ key, label, group, piece: { shape: 'strip', width: s.cut.width, height: s.cut.length, diagonalCuts: 0, piecesEach: 1 }, count: s.count, lengthwise: true });
    }
  };
  const borderPieces = (list: BorderPlan[]) => {
    for (const b of list) {
      const wof = cutSize(usableWidth, ruler);
      layoutPieces.push({
        key: `border:${b.number}`,
        label: `Border ${b.number}`,
        group: 'border',
        piece: { shape: 'strip', width: wof, height: b.sides.cut.width, diagonalCuts: 0, piecesEach: 1, note: `join end to end; cut 2 sides ${b.sides.cut.length.rounded.to('in').toDecimalPlaces(3)} in, then top and bottom ${b.topAndBottom.cut.length.rounded.to('in').toDecimalPlaces(3)} in` },
        count: b.wofStrips,
        lengthwise: false,
      });
    }
  };

  if (body.layout.setting === 'straight') {
    const grid = gridLayout({ rows: body.layout.rows, columns: body.layout.columns, block: side, sashing, borders, ruler, usableWidth });
    finished = grid.finished;
    centre = grid.centre;
    across = grid.parts.across;
    down = grid.parts.down;
    const borderTotal = Length.sum(borders);
    const pitch = side.plus(sashing ? sashing.width : Length.zero);
    for (let r = 0; r < grid.rows; r++) {
      for (let c = 0; c < grid.columns; c++) {
        const index = r * grid.columns + c;
        positions.push({ index, blockId: blockAt(index), x: borderTotal.plus(pitch.times(c)).toNumber('mm'), y: borderTotal.plus(pitch.times(r)).toNumber('mm'), side: side.toNumber('mm'), onPoint: false, fabrics: {} });
      }
    }
    for (const s of grid.sashing?.strips ?? []) stripPieces('sashing', `Sashing, ${s.name}`, 'sashing', s);
    const cs = grid.sashing?.cornerstones;
    if (cs) layoutPieces.push({ key: 'cornerstones', label: 'Cornerstones', group: 'cornerstones', piece: { shape: 'square', width: cs.cut, height: cs.cut, diagonalCuts: 0, piecesEach: 1 }, count: cs.count, lengthwise: false });
    borderPieces(grid.borders);
  } else {
    if (sashing) throw new DomainError('out-of-range', 'Sashing is for straight settings; on point, set the blocks edge to edge.', 'sashing');
    const op = onPointLayout({ across: body.layout.columns, down: body.layout.rows, block: side, borders, ruler, usableWidth });
    finished = op.finished;
    centre = op.centre;
    across = [...borders].reverse().concat([op.centre.width], borders);
    down = [...borders].reverse().concat([op.centre.height], borders);
    const borderTotal = Length.sum(borders).toNumber('mm');
    const d = op.blockDiagonal.toNumber('mm');
    const s = side.toNumber('mm');
    let index = 0;
    const place = (cx: number, cy: number) => {
      positions.push({ index, blockId: blockAt(index), x: borderTotal + cx - s / 2, y: borderTotal + cy - s / 2, side: s, onPoint: true, fabrics: {} });
      index++;
    };
    // Row by row from the top: whole blocks on the outer lattice, the ones between on the inner.
    for (let r = 0; r < op.down; r++) {
      for (let c = 0; c < op.across; c++) place((c + 0.5) * d, (r + 0.5) * d);
      if (r < op.down - 1) for (let c = 0; c < op.across - 1; c++) place((c + 1) * d, (r + 1) * d);
    }
    const sideCut = op.sideTriangles.cut.pieces[0]!;
    const cornerCut = op.cornerTriangles.cut.pieces[0]!;
    layoutPieces.push({ key: 'setting-triangles', label: 'Side setting triangles', group: 'setting', piece: { shape: 'square', width: sideCut.width, height: sideCut.height, diagonalCuts: 2, piecesEach: 4, note: 'cut twice on the diagonal' }, count: op.sideTriangles.squares, lengthwise: false });
    layoutPieces.push({ key: 'setting-triangles', label: 'Corner setting triangles', group: 'setting', piece: { shape: 'square', width: cornerCut.width, height: cornerCut.height, diagonalCuts: 1, piecesEach: 2, note: 'cut once on the diagonal' }, count: op.cornerTriangles.squares, lengthwise: false });
    borderPieces(op.borders);
  }

  return { finished, centre, across, down, positions, layoutPieces };
}
