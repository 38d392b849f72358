// Rails: the block cut into equal rectangles stacked top to bottom.

import { rectangleCut } from '../../seam-allowance';
import { defineBlockKind, fromUnit, rect } from './block-kind';

export const rectangles = defineBlockKind({
  kind: 'rectangles',
  label: 'Rectangles (rails)',
  roles: ['rail'],
  inputs: [{ name: 'units', type: 'count', label: 'Rails', default: 1, min: 1, max: 12 }],
  labour: { label: 'Rectangle', minutes: 8 },
  wholePiece: { role: 'rail', rails: (spec) => spec.units ?? 1 },
  cuts: (spec, side, opts) => {
    const units = spec.units ?? 1;
    const cut = rectangleCut({ width: side, height: side.dividedBy(units) }, opts);
    return { roles: [{ role: 'rail', piece: fromUnit(cut, 0), perBlock: (b) => b * units }] };
  },
  sewing: (spec, blocks) => {
    const units = spec.units ?? 1;
    return {
      steps: [
        { text: `Chain-piece the rails in pairs down their long edges (${units} rails a block)`, count: blocks * Math.floor(units / 2) },
        { text: `Join the rails of each block until it is ${units} rails deep`, count: blocks },
      ],
      pressing: 'Press every seam towards the darker rail.',
    };
  },
  shapes: (spec, { x, y, side: s }, add) => {
    const n = spec.units ?? 1;
    for (let i = 0; i < n; i++) add(rect(x, y + (i * s) / n, s, s / n), 'rail');
  },
});
