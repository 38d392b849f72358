import type { AppConfig } from '../core/config';
import { AppError } from '../core/app-error';
import { CommissionModel } from '../models/commission-model';
import { PaymentModel, countedPence } from '../models/payment-model';
import { formatPounds } from '@keepstitch/shared';
import { paymentState } from './payment-state';
import type { ManualPaymentInput } from './payments-schemas';
import { countPayment, lockedPayment, paymentView, receiptLabel } from './payments-service';

const KIND_WORD = { deposit: 'deposit', balance: 'balance' } as const;

/**
 * The owner records money received outside the card checkout (cash, bank
 * transfer). It counts as a card payment of its kind does, through the same
 * countPayment: a deposit books the commission, the client gets a receipt.
 * Refused when that kind is already paid or held for review, when no priced
 * quote is accepted, when the balance comes before the deposit, or when the
 * amount is more than is owed. The commission row is locked, as for a checkout.
 */
export async function recordManualPayment(config: AppConfig, user: Express.User, commissionId: number, input: ManualPaymentInput) {
  return CommissionModel.transaction(async (trx) => {
    const commission = await CommissionModel.query(trx).findById(commissionId).forUpdate();
    if (!commission) throw AppError.notFound('That commission');
    const state = await paymentState(commissionId, trx);
    if (!state) throw new AppError(409, 'not_accepted', 'There is no accepted quote on this commission yet: a payment is recorded against the accepted quote.');
    const word = KIND_WORD[input.kind];
    const paid = await PaymentModel.query(trx).where({ commissionId, kind: input.kind }).whereIn('status', ['paid', 'held']).first();
    if (paid) {
      const how = paid.status === 'held' ? 'arrived by card and is waiting for your review' : `has already been paid (${formatPounds(countedPence(paid))}, receipt ${receiptLabel(paid.receiptNumber)})`;
      throw new AppError(409, 'already_paid', `The ${word} ${how}. If that was recorded by mistake, undo it first; nothing was recorded now.`, { kind: `The ${word} is already paid.` });
    }
    if (input.kind === 'balance' && !state.depositPaid && state.depositPence > 0) {
      throw new AppError(409, 'deposit_first', 'Record the deposit before the balance. Nothing was recorded.', { kind: 'The deposit is not paid yet.' });
    }
    const owed = input.kind === 'deposit' ? state.quote.totalPence! - state.paidPence : state.balancePence;
    if (input.amountPence > owed) {
      throw new AppError(409, 'more_than_owed', `${formatPounds(input.amountPence)} is more than the ${formatPounds(owed)} still owed on the accepted quote. Check the amount; nothing was recorded.`, { amountPence: `At most ${formatPounds(owed)} is owed.` });
    }
    const inserted = await PaymentModel.query(trx).insertAndFetch({
      commissionId,
      quoteId: state.quote.id,
      kind: input.kind,
      amountPence: input.amountPence,
      receivedPence: input.amountPence,
      status: 'paid',
      method: input.method,
      reference: input.reference,
      receivedOn: input.receivedOn,
      paidAt: new Date(`${input.receivedOn}T12:00:00Z`),
      recordedBy: user.id,
    });
    await countPayment(trx, config, inserted);
    return paymentView((await PaymentModel.query(trx).findById(inserted.id))!);
  });
}

/**
 * The owner takes back a payment recorded by hand, with a note saying why. It
 * stops counting (what is owed goes back up) and keeps its row and receipt
 * number, marked undone. The commission's stage is left where it is: moving
 * it back is the owner's own decision on the commission page. A card payment
 * is never undone here: its money went through the provider, and goes back
 * only as a refund.
 */
export async function undoManualPayment(user: Express.User, commissionId: number, paymentId: number, note: string) {
  return PaymentModel.transaction(async (trx) => {
    const payment = await lockedPayment(trx, commissionId, paymentId);
    if (payment.method === 'card') throw new AppError(409, 'card_payment', 'A card payment cannot be undone here; it goes back to the client only as a refund.');
    if (payment.status !== 'paid') throw new AppError(409, 'not_counted', 'This payment has already been undone. Refresh the page to see where it stands.');
    const undone = await PaymentModel.query(trx).patchAndFetchById(payment.id, { status: 'undone', undoneAt: new Date(), undoneBy: user.id, undoNote: note });
    return paymentView(undone);
  });
}
