import { Model } from 'objection';

/**
 * pending: a checkout is open. paid: the money counts. held: paid, but not the
 * amount asked; waits for the owner to accept or refund it. overpaid: arrived
 * for something already paid; refunded as soon as the provider takes it.
 */
export type PaymentStatus = 'pending' | 'paid' | 'held' | 'overpaid' | 'failed' | 'expired' | 'refunded';
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
}

/** The money a paid payment counts for: what arrived, or what was asked for one recorded before arrivals were kept. */
export function countedPence(p: Pick<PaymentModel, 'receivedPence' | 'amountPence'>): number {
  return p.receivedPence ?? p.amountPence;
}
