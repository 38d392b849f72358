import { deriveDesign } from './derive-design';
import { planDesign } from './plan-design';
import { keptFeaturePieces, keptFeaturePlaces } from './kept-feature-places';
import { keptLines, pieceLine, stepText } from './cut-list-words';
import { Length } from '../measure';
import { formatCutSize, formatFinishedSize } from '../format-length';
import type { CutStep } from '../cut-plan/cut-plan-types';
import { flannelShirt, squaresDesign } from '../testing/design-fixtures';

const cut = (mm: string) => formatCutSize(Length.millimetres(mm), 'imperial');
const at = (mm: number) => formatFinishedSize(Length.millimetres(String(mm)), 'imperial');

const body = squaresDesign();
const sources = flannelShirt();

describe('cut list words', () => {
  const derived = deriveDesign(body);
  const summary = planDesign(body, derived, sources);
  const kept = keptFeaturePlaces(body, derived, keptFeaturePieces(summary));
  const pieces = new Map(derived.pieces.map((p) => [p.id, p]));
  const square = derived.pieces.find((p) => p.key === 'block:B:square')!;

  it('says how many of a piece kind to cut, at its cut size', () => {
    // Common practice: an 8 in finished square is cut 8 1/2 in.
    expect(pieceLine(square, 4, cut)).toBe(`4 x square 8 1/2 in (Block B (Whole shirt square): square)`);
  });

  it('notes under the piece line the copy cut around the pocket, and the block it is for', () => {
    expect(keptLines(square.id, kept)).toEqual(['1 of these keeps the breast pocket from the Green flannel shirt, centred, for block 4; cut with the feature centred.']);
    expect(keptLines('p99', kept)).toEqual([]);
  });

  it('names the kept piece in the cut that frees it, whether it comes off or is what is left', () => {
    const front = summary.plan.panels.find((pp) => pp.panelId === 'panel-31')!;
    const lines = front.cuts.map((c) => stepText(c, pieces, at, kept));
    expect(lines.filter((l) => l.includes('keeps the breast pocket'))).toHaveLength(1);
    expect(lines.join('\n')).toContain(`piece ${square.id.slice(1)} (${square.label}), which keeps the breast pocket from the Green flannel shirt, centred, for block 4; cut with the feature centred`);
    // The same cut, with the kept piece as what is left rather than what comes off.
    const isKept = (r: CutStep['cutsOff']) => r.content === 'piece' && r.pieceId === square.id && r.copy === 4;
    const step = front.cuts.find((c) => isKept(c.cutsOff) || isKept(c.remaining))!;
    const region = isKept(step.cutsOff) ? step.cutsOff : step.remaining;
    const swapped: CutStep = { ...step, cutsOff: { ...region, content: 'waste', pieceId: undefined, copy: undefined }, remaining: region };
    expect(stepText(swapped, pieces, at, kept)).toMatch(/: waste; what is left is piece \d+ \(.*\), which keeps the breast pocket/);
    // Without kept features the words are as before.
    expect(stepText(step, pieces, at)).not.toContain('keeps');
  });
});
