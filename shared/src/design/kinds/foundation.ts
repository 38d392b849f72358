// Stitch-and-flip strips on a foundation square, trimmed to size after sewing.

import { Length } from '../../measure';
import { cutSize } from '../../rounding';
import { foundationBlock } from '../../foundation-block';
import { defineBlockKind, rect, storedLength } from './block-kind';

export const foundation = defineBlockKind({
  kind: 'foundation',
  label: 'Stitch-and-flip foundation',
  roles: ['strip', 'foundation'],
  /** The mean showing width of the strips; 1 1/2 in when not set. */
  inputs: [{ name: 'meanStripWidthMm', type: 'length', label: 'Strip width' }],
  labour: { label: 'Foundation (stitch and flip)', minutes: 25 },
  cuts: (spec, side, opts) => {
    const field = `block ${spec.id}`;
    const mean = spec.meanStripWidthMm ? storedLength(spec.meanStripWidthMm, `${field} strip width`) : Length.inches('1.5');
    const f = foundationBlock({ finished: side, meanStripWidth: mean, ...opts });
    const strips = f.strips!;
    const stripLength = cutSize(strips.totalLength.dividedBy(strips.count), opts.ruler);
    const square = cutSize(f.foundation.width, opts.ruler);
    return {
      roles: [
        {
          role: 'strip',
          piece: { shape: 'strip', width: strips.cutWidth, height: stripLength, diagonalCuts: 0, piecesEach: 1, note: `average length; trim block to ${f.trimmed.width.rounded.to('in').toDecimalPlaces(3)} in` },
          perBlock: (b) => b * strips.count,
        },
        { role: 'foundation', piece: { shape: 'square', width: square, height: square, diagonalCuts: 0, piecesEach: 1, note: 'oversized, trimmed after sewing' }, perBlock: (b) => b },
      ],
    };
  },
  sewing: (_spec, blocks) => ({
    steps: [
      { text: 'Lay the first strip right side up across the middle of the foundation', count: blocks },
      { text: 'Stitch and flip each next strip, right sides together, then press it open' },
      { text: 'Trim each block to its unfinished size from the back', count: blocks },
    ],
    pressing: 'Press each strip open before the next; stay-stitch 1/8 in round the edge before trimming.',
  }),
  shapes: (_spec, { x, y, side: s }, add) => {
    add(rect(x, y, s, s), 'foundation');
    const strips = 5;
    for (let i = 0; i < strips; i += 2) {
      const a = (i / strips) * 2 * s;
      const b2 = ((i + 1) / strips) * 2 * s;
      const clip = (t: number): [number, number][] => (t <= s ? [[x + t, y], [x, y + t]] : [[x + s, y + t - s], [x + t - s, y + s]]);
      const [p1, p2] = clip(a);
      const [p3, p4] = clip(b2);
      const pts: [number, number][] = [p1!, p3!];
      if (a < s && b2 > s) pts.splice(1, 0, [x + s, y]);
      pts.push(p4!);
      if (a < s && b2 > s) pts.push([x, y + s]);
      pts.push(p2!);
      add(pts, 'strip');
    }
  },
});
