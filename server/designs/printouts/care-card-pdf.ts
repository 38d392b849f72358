import { COMMISSION_KIND, fibreLine, fibreName } from '@keepstitch/shared';
import { heading, newDocument, toBuffer } from './pdf-document';
import type { careCard } from '../designs-service';

type CareCard = Awaited<ReturnType<typeof careCard>>;

/** The care card that goes with the finished piece. */
export async function careCardPdf(card: CareCard): Promise<Buffer> {
  const doc = newDocument(`Care card: ${card.commission.title}`);
  heading(doc, `Caring for your ${COMMISSION_KIND.labels[card.commission.kind].toLowerCase()}`, [card.commission.title, `Made by ${card.maker}`]);
  doc.font('Lato-Bold').fontSize(12).text('Washing and pressing');
  doc.font('Lato').fontSize(10);
  for (const w of card.washing) doc.text(`\u2022 ${w}`, { indent: 6 });
  doc.moveDown(0.6);
  doc.font('Lato-Bold').fontSize(12).text('What went into it');
  doc.font('Lato').fontSize(10);
  for (const f of card.fibres) doc.text(`\u2022 ${fibreName(f.fibre)}: ${fibreLine(f)}`, { indent: 6 });
  if (card.cautions.length) {
    doc.moveDown(0.6);
    doc.font('Lato-Bold').fontSize(12).fillColor('#8a1c1c').text('Safety').fillColor('#000');
    for (const c of card.cautions) {
      doc.font('Lato-Bold').fontSize(10).text(c.title);
      doc.font('Lato').fontSize(10).text(c.text);
      doc.fontSize(8).fillColor('#555').text(c.source).fillColor('#000');
      doc.moveDown(0.3);
    }
  }
  doc.moveDown(0.6);
  doc.font('Lato').fontSize(9).fillColor('#333').text(card.deferNote);
  return toBuffer(doc);
}
