// The care card that goes with the finished piece: how to wash it, what went
// into it by fibre, who made it, and the safety notices for its age group.

import { COMMISSION_KIND, fibreLine, fibreName, type FibreGroup } from '../workflow/vocabulary';
import type { Block, PrintoutContent, Section } from './printout-content';
import type { PrintOptions } from './printable-design';

/** The care card as the server gives it. */
export interface CareCardData {
  commission: { id: number; title: string; kind: string; ageGroup: string };
  maker: string;
  washing: readonly string[];
  fibres: readonly FibreGroup[];
  cautions: readonly { code: string; title: string; text: string; source: string }[];
  deferNote: string;
}

export function careCardPrintout(card: CareCardData, _options: PrintOptions): PrintoutContent {
  const kind = ((COMMISSION_KIND.labels as Record<string, string>)[card.commission.kind] ?? 'piece').toLowerCase();
  const safety: Section[] = card.cautions.length
    ? [
        {
          heading: 'Safety',
          tone: 'alert',
          blocks: card.cautions.map(
            (c): Block => ({ kind: 'group', heading: c.title, mark: 'caution', blocks: [{ kind: 'paragraph', text: c.text }, { kind: 'paragraph', text: c.source, tone: 'small' }] }),
          ),
        },
      ]
    : [];
  return {
    title: `Caring for your ${kind}`,
    meta: [card.commission.title, `Made by ${card.maker}`],
    sections: [
      { heading: 'Washing and pressing', blocks: [{ kind: 'list', style: 'bullets', mark: 'washing', items: card.washing.map((text) => ({ text })) }] },
      {
        heading: 'What went into it',
        blocks: [
          {
            kind: 'list',
            style: 'bullets',
            mark: 'fibres',
            items: card.fibres.length ? card.fibres.map((f) => ({ text: [{ text: `${fibreName(f.fibre)}:`, bold: true }, { text: ` ${fibreLine(f)}` }] })) : [{ text: 'No fabrics recorded yet.' }],
          },
        ],
      },
      ...safety,
      { blocks: [{ kind: 'paragraph', tone: 'quiet', mark: 'defer-note', text: card.deferNote }] },
    ],
    layout: 'flow',
  };
}
