import type { Knex } from 'knex';
import { QuoteModel } from '../models/quote-model';
import { PaymentModel, countedPence } from '../models/payment-model';

/** The accepted quote of a commission, if any. */
export function acceptedQuote(commissionId: number, trx?: Knex.Transaction) {
  return QuoteModel.query(trx).where({ commissionId, status: 'accepted' }).orderBy('version', 'desc').first();
}

/** What is still owed on a commission's accepted quote; null when none is accepted. */
export async function paymentState(commissionId: number, trx?: Knex.Transaction) {
  const quote = await acceptedQuote(commissionId, trx);
  if (!quote || quote.totalPence === null || quote.depositPence === null) return null;
  return paymentStateFrom(quote, await paidPayments(commissionId, trx));
}

/** The payments made on a commission. */
export function paidPayments(commissionId: number, trx?: Knex.Transaction) {
  return PaymentModel.query(trx).where({ commissionId, status: 'paid' });
}

/** A payment of this kind held for the owner's review, if any: the client has paid and must not be asked again. */
export function heldPayment(commissionId: number, kind: 'deposit' | 'balance', trx?: Knex.Transaction) {
  return PaymentModel.query(trx).where({ commissionId, kind, status: 'held' }).first();
}

/** What is still owed, from the accepted quote and the payments made; null when no priced quote is accepted. */
export function paymentStateFrom(quote: QuoteModel | undefined, paid: PaymentModel[]) {
  if (!quote || quote.totalPence === null || quote.depositPence === null) return null;
  const depositPaid = paid.some((p) => p.kind === 'deposit');
  const balancePaid = paid.some((p) => p.kind === 'balance');
  const paidPence = paid.reduce((s, p) => s + countedPence(p), 0);
  return { quote, depositPaid, balancePaid, paidPence, depositPence: quote.depositPence, balancePence: Math.max(0, quote.totalPence - paidPence) };
}
