// Half-square triangles: units along each side, each a dark and a light triangle.

import { halfSquareTriangleCut } from '../../triangle-cut';
import { defineBlockKind, fromUnit } from './block-kind';
import { eachUnit, unitRows } from './triangle-units';

export const hst = defineBlockKind({
  kind: 'hst',
  label: 'Half-square triangles',
  roles: ['dark', 'light'],
  inputs: [{ name: 'units', type: 'count', label: 'Units each way', default: 1, min: 1, max: 12 }],
  labour: { label: 'Half-square triangle (HST)', minutes: 12 },
  cuts: (spec, side, opts) => {
    const units = spec.units ?? 1;
    const cut = halfSquareTriangleCut(side.dividedBy(units), opts);
    const perBlock = (b: number) => Math.ceil((b * units * units) / cut.unitsPerBatch);
    const note = 'cut once on the diagonal';
    return {
      roles: [
        { role: 'dark', piece: fromUnit(cut, 0, note), perBlock },
        { role: 'light', piece: fromUnit(cut, 0, note), perBlock },
      ],
    };
  },
  sewing: (spec, blocks) => {
    const units = spec.units ?? 1;
    const total = blocks * units * units;
    return {
      steps: [
        { text: 'Chain-piece a dark and a light triangle along the long (bias) edge, without stretching it', count: total },
        { text: 'Trim each unit square to its unfinished size', count: total },
        ...unitRows(units, blocks),
      ],
      pressing: 'Press towards the dark fabric; press, do not iron back and forth, on the bias.',
    };
  },
  shapes: (spec, p, add) =>
    eachUnit(spec.units ?? 1, p, (ux, uy, u) => {
      add([[ux, uy], [ux + u, uy], [ux, uy + u]], 'light');
      add([[ux + u, uy], [ux + u, uy + u], [ux, uy + u]], 'dark');
    }),
});
