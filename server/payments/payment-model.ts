import { Model } from 'objection';

export class PaymentModel extends Model {
  static override tableName = 'payments';
  id!: number;
  commissionId!: number;
  quoteId!: number;
  kind!: 'deposit' | 'balance';
  amountPence!: number;
  status!: 'pending' | 'paid' | 'failed' | 'expired' | 'refunded';
  checkoutSessionId!: string | null;
  paymentIntentId!: string | null;
  refundId!: string | null;
  paidAt!: Date | null;
  refundedAt!: Date | null;
  createdAt!: Date;
}
