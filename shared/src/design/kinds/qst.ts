// Quarter-square triangles: units along each side, each an hourglass of four triangles.

import { quarterSquareTriangleCut } from '../../triangle-cut';
import { defineBlockKind, fromUnit } from './block-kind';
import { eachUnit, unitRows } from './triangle-units';

export const qst = defineBlockKind({
  kind: 'qst',
  label: 'Quarter-square triangles',
  roles: ['dark', 'light'],
  inputs: [{ name: 'units', type: 'count', label: 'Units each way', default: 1, min: 1, max: 12 }],
  labour: { label: 'Quarter-square triangle (QST)', minutes: 15 },
  cuts: (spec, side, opts) => {
    const units = spec.units ?? 1;
    const cut = quarterSquareTriangleCut(side.dividedBy(units), opts);
    const perBlock = (b: number) => Math.ceil((b * units * units) / cut.unitsPerBatch);
    const note = 'cut twice on the diagonal';
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
        { text: 'Chain-piece the triangles in pairs along a short edge, a dark to a light', count: total * 2 },
        { text: 'Join the pairs into hourglass units, matching the centre', count: total },
        { text: 'Trim each unit square to its unfinished size', count: total },
        ...unitRows(units, blocks),
      ],
      pressing: 'Press towards the dark fabric; press, do not iron back and forth, on the bias.',
    };
  },
  shapes: (spec, p, add) =>
    eachUnit(spec.units ?? 1, p, (ux, uy, u) => {
      const m: [number, number] = [ux + u / 2, uy + u / 2];
      add([[ux, uy], [ux + u, uy], m], 'dark');
      add([[ux + u, uy], [ux + u, uy + u], m], 'light');
      add([[ux + u, uy + u], [ux, uy + u], m], 'dark');
      add([[ux, uy + u], [ux, uy], m], 'light');
    }),
});
