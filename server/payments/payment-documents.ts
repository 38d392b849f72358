import Decimal from 'decimal.js';
import { quoteTotals } from '@keepstitch/shared';
import { AppError } from '../core/app-error';
import { today } from '../core/calendar';
import { findVisibleCommission } from '../commissions/commission-access';
import { ClientModel } from '../models/client-model';
import type { CommissionModel } from '../models/commission-model';
import { PaymentModel, countedPence } from '../models/payment-model';
import { QuoteModel } from '../models/quote-model';
import { StudioSettingsModel } from '../models/settings-model';
import { METHOD_WORDS, invoicePdf, receiptPdf, type StudioOnPaper } from './payment-pdfs';
import { acceptedQuote, paidPayments } from './payment-state';
import { receiptLabel } from './payments-service';

const dateOf = (d: Date) => d.toISOString().slice(0, 10);

/** The studio as the quote froze it when it was sent (else as it is now), with its VAT number only if the quote charged VAT. */
async function studioFor(quote: QuoteModel): Promise<StudioOnPaper & { paymentTerms: string }> {
  const settings = await StudioSettingsModel.current();
  const frozen = quote.studioSnapshot as { name: string; address: string; email: string | null; vatNumber: string | null; paymentTerms: string } | null;
  const studio = frozen ?? { name: settings.studioName, address: settings.address, email: settings.email, vatNumber: settings.vatNumber, paymentTerms: settings.paymentTerms };
  return { ...studio, vatNumber: quote.vatRate === null ? null : studio.vatNumber };
}

async function clientOf(commission: CommissionModel) {
  const client = (await ClientModel.query().findById(commission.clientId))!;
  return { name: client.name, address: client.address };
}

/**
 * The receipt of one payment that counted (or counted once: refunded and
 * undone ones keep theirs, marked so). The client gets only its own
 * commissions' receipts; anything else is not found.
 */
export async function receiptFor(user: Express.User, commissionId: number, paymentId: number): Promise<{ pdf: Buffer; fileName: string }> {
  const commission = await findVisibleCommission(user, commissionId);
  const payment = await PaymentModel.query().findById(paymentId).where('commissionId', commissionId);
  if (!payment || payment.receiptNumber === null) throw AppError.notFound('That receipt');
  const quote = (await QuoteModel.query().findById(payment.quoteId))!;
  const paid = await paidPayments(commissionId);
  const pence = countedPence(payment);
  const totalPence = quote.totalPence ?? 0;
  // The VAT within the payment, in the quote's proportion of VAT to total (rounded to the penny, half up).
  const vat = quote.vatRate === null || !quote.vatPence || !totalPence ? null : { rate: quote.vatRate, pence: new Decimal(pence).times(quote.vatPence).dividedBy(totalPence).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber() };
  const number = receiptLabel(payment.receiptNumber);
  const pdf = await receiptPdf({
    number,
    studio: await studioFor(quote),
    client: await clientOf(commission),
    commission: { title: commission.title, id: commission.id },
    payment: { kind: payment.kind, amountPence: pence, method: payment.method, reference: payment.reference, paidOn: payment.receivedOn ?? dateOf(payment.paidAt ?? payment.createdAt), status: payment.status },
    vat,
    quote: { version: quote.version, totalPence },
    paidSoFarPence: paid.filter((p) => p.quoteId === quote.id).reduce((s, p) => s + countedPence(p), 0),
  });
  return { pdf, fileName: `receipt-${number}.pdf` };
}

/** The invoice for the balance, from the commission's accepted quote; numbered by commission and quote version. */
export async function invoiceFor(user: Express.User, commissionId: number): Promise<{ pdf: Buffer; fileName: string }> {
  const commission = await findVisibleCommission(user, commissionId);
  const accepted = await acceptedQuote(commissionId);
  if (!accepted || accepted.totalPence === null) throw new AppError(404, 'no_invoice', 'There is no invoice yet: it is made from the accepted quote.');
  const quote = (await QuoteModel.query().findById(accepted.id).withGraphFetched('lines').modifyGraph('lines', (q) => q.orderBy('position')))!;
  const lines = quote.lines ?? [];
  const worked = quoteTotals({ lines, vatRate: quote.vatRate, vatMode: quote.vatMode, depositPercent: quote.depositPercent });
  const paid = (await paidPayments(commissionId)).filter((p) => p.quoteId === quote.id).sort((a, b) => (a.receiptNumber ?? 0) - (b.receiptNumber ?? 0));
  const paidPence = paid.reduce((s, p) => s + countedPence(p), 0);
  const totalPence = quote.totalPence!;
  const number = `INV-${commission.id}-${quote.version}`;
  const pdf = await invoicePdf({
    number,
    issuedOn: today(),
    studio: await studioFor(quote),
    client: await clientOf(commission),
    commission: { title: commission.title, id: commission.id },
    quote: { version: quote.version, acceptedOn: quote.acceptedAt ? dateOf(quote.acceptedAt) : null, vatRate: quote.vatRate, vatMode: quote.vatMode },
    lines: lines.map((l, i) => ({ description: l.description, netPence: worked.lineNetPence[i]! })),
    totals: { netPence: quote.netPence!, vatPence: quote.vatPence!, totalPence },
    received: paid.map((p) => ({ receipt: receiptLabel(p.receiptNumber), kind: p.kind, how: METHOD_WORDS[p.method].toLowerCase(), paidOn: p.receivedOn ?? dateOf(p.paidAt ?? p.createdAt), pence: countedPence(p) })),
    balanceDuePence: Math.max(0, totalPence - paidPence),
  });
  return { pdf, fileName: `invoice-${number}.pdf` };
}
