// Flying geese: columns of geese (each twice as wide as tall), a goose and two sky corners each.

import { DomainError } from '../../errors';
import { flyingGeeseCut } from '../../flying-geese';
import { defineBlockKind, fromUnit, rect } from './block-kind';

export const flyingGeese = defineBlockKind({
  kind: 'flying-geese',
  label: 'Flying geese',
  roles: ['goose', 'sky'],
  inputs: [
    /** Geese down each column (even; the block holds units x units/2 geese). */
    { name: 'units', type: 'count', label: 'Geese down a column', default: 2, min: 1, max: 12 },
    {
      name: 'method',
      type: 'choice',
      label: 'Method',
      default: 'four-at-a-time',
      options: [
        { value: 'four-at-a-time', label: 'Four at a time' },
        { value: 'stitch-and-flip', label: 'Stitch and flip' },
      ],
    },
  ],
  labour: { label: 'Flying geese', minutes: 15 },
  cuts: (spec, side, opts) => {
    const field = `block ${spec.id}`;
    const units = spec.units ?? 1;
    if (units % 2 !== 0) {
      throw new DomainError('shape-mismatch', `Expected an even number of geese down each column of ${field} (a goose is twice as wide as tall).`, `${field} units`);
    }
    const height = side.dividedBy(units);
    const cut = flyingGeeseCut({ width: height.times(2), height }, { ...opts, method: spec.method ?? 'four-at-a-time' });
    const geese = (b: number) => b * units * (units / 2);
    const batches = (b: number) => Math.ceil(geese(b) / cut.unitsPerBatch);
    const fourAtATime = cut.unitsPerBatch === 4;
    return {
      roles: [
        { role: 'goose', piece: fromUnit(cut, 0, fourAtATime ? 'cut twice on the diagonal' : undefined), perBlock: (b) => batches(b) * cut.pieces[0]!.quantity },
        { role: 'sky', piece: fromUnit(cut, 1, fourAtATime ? 'sew four at a time' : 'sew on the diagonal, trim'), perBlock: (b) => batches(b) * cut.pieces[1]!.quantity },
      ],
    };
  },
  sewing: (spec, blocks) => {
    const units = spec.units ?? 1;
    const geese = blocks * units * (units / 2);
    return {
      steps: [
        { text: spec.method === 'stitch-and-flip' ? 'Stitch a sky square on each end of a goose rectangle along the diagonal, trim and flip' : 'Make the geese four at a time: two small squares on the large one, sew each side of the diagonal, cut, repeat', count: geese },
        { text: 'Trim each goose to its unfinished size, keeping 1/4 in above the point', count: geese },
        { text: `Sew the geese into columns of ${units}, points up`, count: blocks * (units / 2) },
        ...(units > 2 ? [{ text: 'Join the columns of each block', count: blocks }] : []),
      ],
      pressing: 'Press towards the goose; press the column seams open to keep the points flat.',
    };
  },
  shapes: (spec, { x, y, side: s }, add) => {
    const n = spec.units ?? 1;
    const gh = s / n;
    const gw = gh * 2;
    for (let c = 0; c < n / 2; c++) {
      for (let r = 0; r < n; r++) {
        const gx = x + c * gw;
        const gy = y + r * gh;
        add(rect(gx, gy, gw, gh), 'sky');
        add([[gx, gy + gh], [gx + gw / 2, gy], [gx + gw, gy + gh]], 'goose');
      }
    }
  },
});
