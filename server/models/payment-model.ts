import { Model } from 'objection';

/**
 * pending: a checkout is open. paid: the money counts. held: paid, but not the
 * amount asked; waits for the owner to accept or refund it. overpaid: arrived
 * for something already paid; refunded as soon as the provider takes it.
 * undone: recorded by hand, then taken back by the owner with a note.
 */
export type PaymentStatus = 'pending' | 'paid' | 'held' | 'overpaid' | 'failed' | 'expired' | 'refunded' | 'undone';
/** How the money came: the card checkout, or recorded by the owner. */
export type PaymentMethod = 'card' | 'cash' | 'bank_transfer';
export type RefundReason = 'cancelled' | 'overpaid' | 'amount_mismatch';

export class PaymentModel extends Model {
  static override tableName = 'payments';
  id!: number;
  commissionId!: number;
  quoteId!: number;
  kind!: 'deposit' | 'balance';
  /** What was asked. */
  amountPence!: number;
  /** What the provider says was paid; null until then. */
  receivedPence!: number | null;
  status!: PaymentStatus;
  checkoutSessionId!: string | null;
  paymentIntentId!: string | null;
  refundId!: string | null;
  refundReason!: RefundReason | null;
  paidAt!: Date | null;
  refundedAt!: Date | null;
  createdAt!: Date;
  method!: PaymentMethod;
  /** The owner's reference for money recorded by hand (a bank reference, "cash at the fitting"). */
  reference!: string | null;
  /** The day money recorded by hand arrived (YYYY-MM-DD). */
  receivedOn!: string | null;
  /** Set once the payment counts; receipts are numbered from it. */
  receiptNumber!: number | null;
  recordedBy!: number | null;
  undoneAt!: Date | null;
  undoneBy!: number | null;
  undoNote!: string | null;
}

/** The money a paid payment counts for: what arrived, or what was asked for one recorded before arrivals were kept. */
export function countedPence(p: Pick<PaymentModel, 'receivedPence' | 'amountPence'>): number {
  return p.receivedPence ?? p.amountPence;
}
