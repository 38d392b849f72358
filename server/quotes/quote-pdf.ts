import { formatPounds, type Caution } from '@keepstitch/shared';
import { newDocument, toBuffer } from '../core/pdf';

export interface QuotePdfData {
  studio: { name: string; address: string; email: string | null; vatNumber: string | null; paymentTerms: string };
  client: { name: string; address: string | null };
  commission: { title: string; id: number };
  quote: { version: number; sentAt: Date | null; validUntil: string | null; intro: string | null; vatRate: string | null; depositPercent: string };
  lines: Array<{ description: string; quantity: string; unit: string; unitPricePence: string; netPence: number; vatPence: number }>;
  totals: { netPence: number; vatPence: number; totalPence: number; depositPence: number; balancePence: number };
  vatMode: 'line' | 'invoice';
  cautions: Caution[];
}

const day = (d: Date | string | null) =>
  d ? new Date(typeof d === 'string' ? `${d}T12:00:00Z` : d).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }) : '';

/** The quote as the client receives it: studio, client, lines, VAT, total, deposit, validity, terms and cautions. */
export async function quotePdf(d: QuotePdfData): Promise<Buffer> {
  const doc = newDocument(`Quote ${d.commission.id}-v${d.quote.version} for ${d.commission.title}`, { margin: 56, author: d.studio.name });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;

  doc.font('Lato-Bold').fontSize(20).text(d.studio.name);
  doc.font('Lato').fontSize(9).fillColor('#444').text(d.studio.address);
  if (d.studio.email) doc.text(d.studio.email);
  if (d.studio.vatNumber) doc.text(`VAT number ${d.studio.vatNumber}`);
  doc.moveDown(1.2).fillColor('#000');

  doc.font('Lato-Bold').fontSize(15).text(`Quote for ${d.commission.title}`);
  doc.font('Lato').fontSize(10).text(`Version ${d.quote.version}${d.quote.sentAt ? `, sent ${day(d.quote.sentAt)}` : ' (draft)'}`);
  if (d.quote.validUntil) doc.text(`Valid until ${day(d.quote.validUntil)}`);
  doc.moveDown(0.6).text(`For: ${d.client.name}`);
  if (d.client.address) doc.fillColor('#444').text(d.client.address).fillColor('#000');
  if (d.quote.intro) doc.moveDown(0.6).text(d.quote.intro);
  doc.moveDown(0.8);

  const cols = [left, left + width * 0.52, left + width * 0.68, left + width * 0.84];
  const header = (y: number) => {
    doc.font('Lato-Bold').fontSize(9);
    doc.text('Item', cols[0]!, y, { width: width * 0.5 });
    doc.text('Quantity', cols[1]!, y, { width: width * 0.15, align: 'right' });
    doc.text('Unit price', cols[2]!, y, { width: width * 0.15, align: 'right' });
    doc.text('Amount', cols[3]!, y, { width: width * 0.16, align: 'right' });
    doc.font('Lato');
    doc.moveTo(left, y + 13).lineTo(left + width, y + 13).lineWidth(0.5).stroke();
    return y + 18;
  };
  let y = header(doc.y);
  for (const line of d.lines) {
    const h = doc.heightOfString(line.description, { width: width * 0.5 });
    if (y + h > doc.page.height - doc.page.margins.bottom - 140) {
      doc.addPage();
      y = header(doc.page.margins.top);
    }
    doc.fontSize(9).text(line.description, cols[0]!, y, { width: width * 0.5 });
    doc.text(`${trimQuantity(line.quantity)} ${line.unit}`, cols[1]!, y, { width: width * 0.15, align: 'right' });
    doc.text(formatPounds(Number(line.unitPricePence)), cols[2]!, y, { width: width * 0.15, align: 'right' });
    doc.text(formatPounds(line.netPence), cols[3]!, y, { width: width * 0.16, align: 'right' });
    y += Math.max(h, 12) + 4;
  }
  doc.moveTo(left, y).lineTo(left + width, y).lineWidth(0.5).stroke();
  y += 6;
  const total = (label: string, pence: number, bold = false) => {
    doc.font(bold ? 'Lato-Bold' : 'Lato').fontSize(bold ? 11 : 10);
    doc.text(label, cols[1]!, y, { width: width * 0.31, align: 'right' });
    doc.text(formatPounds(pence), cols[3]!, y, { width: width * 0.16, align: 'right' });
    y += bold ? 17 : 14;
  };
  total('Subtotal', d.totals.netPence);
  if (d.quote.vatRate !== null) total(`VAT at ${d.quote.vatRate}%${d.vatMode === 'invoice' ? ' (on the total)' : ''}`, d.totals.vatPence);
  total('Total', d.totals.totalPence, true);
  total(`Deposit due on acceptance (${Number(d.quote.depositPercent)}%)`, d.totals.depositPence);
  total('Balance due before delivery', d.totals.balancePence);
  if (d.quote.vatRate === null) {
    doc.font('Lato').fontSize(8).text('The studio is not VAT registered; no VAT is charged.', left, y, { width });
    y += 12;
  }

  doc.font('Lato').fontSize(9).fillColor('#000');
  doc.text('', left, y + 10);
  doc.font('Lato-Bold').text('Terms');
  doc.font('Lato').text(d.studio.paymentTerms, { width });
  for (const c of d.cautions) {
    doc.moveDown(0.8).font('Lato-Bold').text(c.title);
    doc.font('Lato').text(c.text, { width });
    doc.fillColor('#555').fontSize(8).text(c.source, { width }).fillColor('#000').fontSize(9);
  }
  return toBuffer(doc);
}

function trimQuantity(q: string): string {
  return q.includes('.') ? q.replace(/0+$/, '').replace(/\.$/, '') : q;
}
