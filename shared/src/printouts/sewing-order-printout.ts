// The piecing sequence of each block kind, then the top, with how many times
// each step is done and how to press.

import { NO_DESIGN_YET, versionLine, type PrintOptions, type PrintableDesign } from './printable-design';
import type { PrintoutContent } from './printout-content';

export function sewingOrderPrintout(d: PrintableDesign, options: PrintOptions): PrintoutContent {
  const v = d.version;
  if (!v) return { title: 'Sewing order', meta: [], sections: [{ blocks: [{ kind: 'paragraph', text: NO_DESIGN_YET }] }], layout: 'flow' };
  return {
    title: 'Sewing order',
    meta: [versionLine(d, options), 'Chain-piece where you can: feed pairs through one after another without cutting the thread. The number in brackets is how many times to do each step.'],
    sections: v.derived.sewing.map((s) => ({
      heading: s.title,
      mark: 'sewing-section',
      blocks: [
        { kind: 'list', style: 'steps', itemMark: 'sewing-step', items: s.steps.map((st) => ({ text: st.text, ...(st.count !== undefined ? { count: st.count } : {}) })) },
        { kind: 'paragraph', tone: 'quiet', mark: 'pressing', text: [{ text: 'Pressing: ', bold: true }, { text: s.pressing }] },
      ],
    })),
    layout: 'flow',
  };
}
