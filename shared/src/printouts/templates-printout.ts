// The full-size templates of a design's curved pieces, each drawn 1:1 with its
// sizes, and check squares to measure before cutting.

import { Length } from '../measure';
import { formatCutSize } from '../format-length';
import type { Template } from '../design/derive-design';
import { NO_DESIGN_YET, PAPERS, versionLine, type PrintOptions, type PrintableDesign } from './printable-design';
import type { CheckSquaresFigure, PrintoutContent, Section } from './printout-content';

/** "cut top 2 1/4 in (55 mm); ...": a template's sizes in both unit systems. */
export function templateSizes(t: Template): string {
  return t.sizeText.map((s) => `${s.label} ${formatCutSize(Length.millimetres(s.mm))} (${formatCutSize(Length.millimetres(s.mm), 'metric', 'mm')})`).join('; ');
}

/** What a template's inner (dashed) line is. */
export function templateInnerLine(t: Template): string {
  return t.kind === 'blade' ? 'sewing line' : 'card template (finished edge)';
}

export const CHECK_SQUARES: CheckSquaresFigure = {
  kind: 'check-squares',
  squares: [
    { mm: 25.4, name: 'check-inch', label: '1 in check square', text: 'Print at 100% ("actual size"). Measure this square: it must be exactly 1 in.' },
    { mm: 25, name: 'check-cm', label: '2.5 cm check square', text: 'It must be exactly 2.5 cm on each side.' },
  ],
};

export function templatesPrintout(d: PrintableDesign, options: PrintOptions): PrintoutContent {
  const title = 'Full-size templates';
  const v = d.version;
  if (!v) return { title, meta: [], sections: [{ blocks: [{ kind: 'paragraph', text: NO_DESIGN_YET }] }], layout: 'flow' };
  const checks: Section = {
    mark: 'checks',
    blocks: [
      {
        kind: 'paragraph',
        tone: 'note',
        mark: 'scale-note',
        only: 'page',
        text: 'The PDF is the exact-scale version. A browser may scale a page when it prints: choose 100% or “actual size” (not “fit to page”), then measure both check squares before cutting. A template larger than one sheet is tiled across pages, with overlap marks, in the PDF only.',
      },
      { kind: 'figure', figure: CHECK_SQUARES },
    ],
  };
  const sheets: Section[] = v.derived.templates.map((t) => ({
    heading: t.name,
    mark: 'template',
    blocks: [
      { kind: 'paragraph', text: `Solid line: cut line (seam allowance included). Dashed line: ${templateInnerLine(t)}. ${templateSizes(t)}` },
      {
        kind: 'figure',
        figure: {
          kind: 'template',
          template: t,
          tooBig: 'Larger than one sheet: print this template from the PDF, which tiles it across pages.',
          tiles: 'Tiles overlap by 1/2 in: lay each over its neighbour so the red crosses and the dashed overlap lines meet, then tape.',
        },
      },
    ],
  }));
  const none: Section[] = sheets.length ? [] : [{ blocks: [{ kind: 'paragraph', mark: 'no-templates', text: 'This design has no curved pieces, so it needs no templates.' }] }];
  return {
    title,
    meta: [`${versionLine(d, options, options.paper ? `, ${PAPERS[options.paper]}` : '')}. Full size.`],
    sections: [checks, ...sheets, ...none],
    layout: 'sheets',
  };
}
