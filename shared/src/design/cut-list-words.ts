// The words of a cut list, the same on the print page and in the PDF: one
// line for each kind of piece cut from a source, and one for each cut of a
// panel, with the piece cut around a kept feature said to be so.

import type { CutRegion, CutStep } from '../cut-plan/cut-plan-types';
import type { DerivedPiece } from './derive-design';
import { keptFeatureNote, type KeptFeaturePlace } from './kept-feature-places';
import type { KeptFeaturePiece } from './plan-design';

/** The number a cut list gives a piece kind: its derived id without the "p". */
export const pieceNumber = (id: string): string => id.replace(/^p/, '');

/** "4 x square 12 1/2 in (Block B (Whole shirt square): square)" for a piece kind cut from one source. */
export function pieceLine(p: DerivedPiece, count: number, cut: (mm: string) => string): string {
  const size = p.widthMm === p.heightMm ? cut(p.widthMm) : `${cut(p.widthMm)} x ${cut(p.heightMm)}`;
  const diagonal = p.diagonalCuts === 1 ? ', cut once on the diagonal' : p.diagonalCuts === 2 ? ', cut twice on the diagonal' : '';
  return `${count} x ${p.shape} ${size} (${p.label})${diagonal}`;
}

/** A kept feature as the cut lists know it: the piece and copy cut around it, and the block it is for when known. */
export type KeptCut = Pick<KeptFeaturePiece, 'pieceId' | 'copy' | 'feature' | 'garment'> & Partial<Pick<KeptFeaturePlace, 'position'>>;

/** The note under a piece line for each copy of it cut around a kept feature: "1 of these keeps the breast pocket from ...". */
export function keptLines(pieceId: string, kept: readonly KeptCut[]): string[] {
  return kept.filter((k) => k.pieceId === pieceId).map((k) => `1 of these ${keptFeatureNote(k)}.`);
}

/** One line a maker reads for a cut: where to cut and what comes off, and which piece holds a kept feature. */
export function stepText(step: CutStep, pieces: ReadonlyMap<string, DerivedPiece>, at: (mm: number) => string, kept: readonly KeptCut[] = []): string {
  const way = step.direction === 'horizontal' ? 'across' : 'down';
  const from = step.direction === 'horizontal' ? 'from the top' : 'from the left';
  const where = step.region === 'panel' ? 'the panel' : `part ${step.region}`;
  const heldIn = (r: CutRegion) => (r.content === 'piece' ? kept.find((k) => k.pieceId === r.pieceId && k.copy === r.copy) : undefined);
  const piece = (r: CutRegion) => {
    const held = heldIn(r);
    return `piece ${pieceNumber(r.pieceId!)} (${pieces.get(r.pieceId!)?.label ?? r.pieceId})${held ? `, which ${keptFeatureNote(held)}` : ''}`;
  };
  const off = step.cutsOff;
  const what =
    off.content === 'piece'
      ? piece(off)
      : off.content === 'strip'
        ? `strip ${off.label}, ${at(off.width)} x ${at(off.height)}`
        : off.content === 'offcut'
          ? `offcut to keep, ${at(off.width)} x ${at(off.height)}`
          : 'waste';
  // What is left is named only when it is the piece holding a kept feature, so that piece is never missed.
  const left = heldIn(step.remaining) ? `; what is left is ${piece(step.remaining)}` : '';
  return `${step.step}. Cut ${where} ${way} at ${at(step.at)} ${from}: ${what}${left}`;
}
