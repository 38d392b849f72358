import { formatPounds } from '@keepstitch/shared';
import { newDocument, toBuffer } from '../core/pdf';

export interface StudioOnPaper {
  name: string;
  address: string;
  email: string | null;
  /** Null when the studio is not VAT registered. */
  vatNumber: string | null;
}

export interface ReceiptPdfData {
  number: string;
  studio: StudioOnPaper;
  client: { name: string; address: string | null };
  commission: { title: string; id: number };
  payment: { kind: 'deposit' | 'balance'; amountPence: number; method: 'card' | 'cash' | 'bank_transfer'; reference: string | null; paidOn: string; status: string };
  /** The VAT within what was paid; null when the studio was not VAT registered. */
  vat: { rate: string; pence: number } | null;
  quote: { version: number; totalPence: number };
  paidSoFarPence: number;
}

export interface InvoicePdfData {
  number: string;
  issuedOn: string;
  studio: StudioOnPaper & { paymentTerms: string };
  client: { name: string; address: string | null };
  commission: { title: string; id: number };
  quote: { version: number; acceptedOn: string | null; vatRate: string | null; vatMode: 'line' | 'invoice' };
  lines: Array<{ description: string; netPence: number }>;
  totals: { netPence: number; vatPence: number; totalPence: number };
  received: Array<{ receipt: string; kind: string; how: string; paidOn: string; pence: number }>;
  balanceDuePence: number;
}

export const METHOD_WORDS = { card: 'Card', cash: 'Cash', bank_transfer: 'Bank transfer' } as const;

const day = (d: string | null) => (d ? new Date(`${d}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }) : '');

/** The VAT line every receipt and invoice carries, registered or not. */
export function vatStatus(vatNumber: string | null, rate: string | null): string {
  if (rate === null || !vatNumber) return 'The studio is not VAT registered; no VAT is charged.';
  return `VAT registered, VAT number ${vatNumber}. VAT is charged at ${rate}%.`;
}

function letterhead(doc: PDFKit.PDFDocument, studio: StudioOnPaper) {
  doc.font('Lato-Bold').fontSize(20).text(studio.name);
  doc.font('Lato').fontSize(9).fillColor('#444').text(studio.address);
  if (studio.email) doc.text(studio.email);
  if (studio.vatNumber) doc.text(`VAT number ${studio.vatNumber}`);
  doc.moveDown(1.2).fillColor('#000');
}

function row(doc: PDFKit.PDFDocument, label: string, value: string, width: number, bold = false) {
  const left = doc.page.margins.left;
  const y = doc.y;
  doc.font(bold ? 'Lato-Bold' : 'Lato').fontSize(bold ? 11 : 10);
  doc.text(label, left, y, { width: width * 0.6 });
  doc.text(value, left + width * 0.6, y, { width: width * 0.4, align: 'right' });
  doc.moveDown(0.3);
}

/** A receipt for one payment that counted: card, cash or bank transfer. */
export async function receiptPdf(d: ReceiptPdfData): Promise<Buffer> {
  const doc = newDocument(`Receipt ${d.number} for ${d.commission.title}`, { margin: 56, author: d.studio.name });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  letterhead(doc, d.studio);

  doc.font('Lato-Bold').fontSize(15).text(`Receipt ${d.number}`);
  doc.font('Lato').fontSize(10).text(`Received ${day(d.payment.paidOn)}`);
  if (d.payment.status === 'undone') doc.font('Lato-Bold').fillColor('#a00').text('This payment was taken back by the studio and no longer counts.').fillColor('#000').font('Lato');
  if (d.payment.status === 'refunded') doc.font('Lato-Bold').text('This payment has since been refunded.').font('Lato');
  doc.moveDown(0.6).text(`From: ${d.client.name}`);
  if (d.client.address) doc.fillColor('#444').text(d.client.address).fillColor('#000');
  doc.moveDown(0.8);

  row(doc, `${d.payment.kind === 'deposit' ? 'Deposit' : 'Balance'} for ${d.commission.title} (quote version ${d.quote.version})`, formatPounds(d.payment.amountPence), width, true);
  row(doc, 'Paid by', METHOD_WORDS[d.payment.method], width);
  if (d.payment.reference) row(doc, 'Reference', d.payment.reference, width);
  if (d.vat) row(doc, `Of which VAT at ${d.vat.rate}%`, formatPounds(d.vat.pence), width);
  row(doc, 'Quote total', formatPounds(d.quote.totalPence), width);
  row(doc, 'Paid so far', formatPounds(d.paidSoFarPence), width);
  row(doc, 'Still to pay', formatPounds(Math.max(0, d.quote.totalPence - d.paidSoFarPence)), width);
  doc.moveDown(0.8).font('Lato').fontSize(9).text(vatStatus(d.studio.vatNumber, d.vat?.rate ?? null), left, doc.y, { width });
  doc.text('Thank you.', { width });
  return toBuffer(doc);
}

/** The invoice for the balance, from the accepted quote: what was made, the totals with VAT, what has been received, what is due. */
export async function invoicePdf(d: InvoicePdfData): Promise<Buffer> {
  const doc = newDocument(`Invoice ${d.number} for ${d.commission.title}`, { margin: 56, author: d.studio.name });
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  letterhead(doc, d.studio);

  doc.font('Lato-Bold').fontSize(15).text(`Invoice ${d.number}`);
  doc.font('Lato').fontSize(10).text(`Issued ${day(d.issuedOn)}`);
  doc.text(`For ${d.commission.title}, as quoted in version ${d.quote.version}${d.quote.acceptedOn ? `, accepted ${day(d.quote.acceptedOn)}` : ''}`);
  doc.moveDown(0.6).text(`To: ${d.client.name}`);
  if (d.client.address) doc.fillColor('#444').text(d.client.address).fillColor('#000');
  doc.moveDown(0.8);

  for (const line of d.lines) row(doc, line.description, formatPounds(line.netPence), width);
  doc.moveDown(0.3);
  row(doc, 'Subtotal', formatPounds(d.totals.netPence), width);
  if (d.quote.vatRate !== null) row(doc, `VAT at ${d.quote.vatRate}%${d.quote.vatMode === 'invoice' ? ' (on the total)' : ''}`, formatPounds(d.totals.vatPence), width);
  row(doc, 'Total', formatPounds(d.totals.totalPence), width, true);
  doc.moveDown(0.4);
  for (const r of d.received) row(doc, `Received: ${r.kind}, ${r.how}, ${day(r.paidOn)} (receipt ${r.receipt})`, `-${formatPounds(r.pence)}`, width);
  row(doc, 'Balance due', formatPounds(d.balanceDuePence), width, true);

  doc.moveDown(0.8).font('Lato').fontSize(9).text(vatStatus(d.studio.vatNumber, d.quote.vatRate), left, doc.y, { width });
  doc.moveDown(0.6).font('Lato-Bold').text('Terms');
  doc.font('Lato').text(d.studio.paymentTerms, { width });
  return toBuffer(doc);
}
