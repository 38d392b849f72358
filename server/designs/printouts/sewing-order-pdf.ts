import { ensureSpace, heading, newDocument, toBuffer, today } from './pdf-document';
import type { PrintableDesign } from './printable';

/** The piecing sequence for each block kind, then the top, with counts and pressing notes. */
export async function sewingOrderPdf(p: PrintableDesign): Promise<Buffer> {
  const { commission, version } = p;
  const doc = newDocument(`Sewing order: ${commission.title}`);
  heading(doc, 'Sewing order', [`${commission.title}, design version ${version.version}, printed ${today()}`, 'Chain-piece where you can: feed pairs through one after another without cutting the thread.']);
  for (const section of version.derived.sewing) {
    ensureSpace(doc, 90);
    doc.font('Lato-Bold').fontSize(13).text(section.title);
    doc.font('Lato').fontSize(10);
    section.steps.forEach((s, i) => doc.text(`${i + 1}. ${s.text}${s.count !== undefined ? `  [${s.count}]` : ''}`, { indent: 8 }));
    doc.font('Lato-Bold').fontSize(9).text('Pressing: ', { continued: true }).font('Lato').text(section.pressing);
    doc.moveDown(0.6);
  }
  return toBuffer(doc);
}
