// A plain square: one piece, the whole block.

import { squareCut } from '../../seam-allowance';
import { defineBlockKind, fromUnit, rect } from './block-kind';

export const square = defineBlockKind({
  kind: 'square',
  label: 'Plain square',
  roles: ['square'],
  inputs: [],
  labour: { label: 'Plain square', minutes: 5 },
  wholePiece: { role: 'square' },
  cuts: (_spec, side, opts) => ({ roles: [{ role: 'square', piece: fromUnit(squareCut(side, opts), 0), perBlock: (b) => b }] }),
  sewing: (_spec, blocks) => ({ steps: [{ text: 'Nothing to piece: each block is one square, ready for the rows', count: blocks }], pressing: 'Press each square flat before it goes into a row.' }),
  shapes: (_spec, { x, y, side }, add) => add(rect(x, y, side, side), 'square'),
});
