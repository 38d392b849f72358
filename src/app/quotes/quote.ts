import * as z from 'zod/mini';

export const QUOTE_STATUSES = ['draft', 'sent', 'accepted', 'declined', 'superseded'] as const;
export type QuoteStatus = (typeof QUOTE_STATUSES)[number];

export const QUOTE_STATUS_LABELS: Readonly<Record<QuoteStatus, string>> = {
  draft: 'Draft',
  sent: 'Sent',
  accepted: 'Accepted',
  declined: 'Declined',
  superseded: 'Replaced by a newer version',
};

export const LINE_KINDS = ['material', 'labour', 'extra', 'discount'] as const;
export type LineKind = (typeof LINE_KINDS)[number];

export const LINE_KIND_LABELS: Readonly<Record<LineKind, string>> = {
  material: 'Materials',
  labour: 'Labour',
  extra: 'Extra',
  discount: 'Discount',
};

const text = z.optional(z.nullable(z.string()));

export const quoteLineSchema = z.object({
  id: z.optional(z.number()),
  position: z.optional(z.number()),
  kind: z.enum(LINE_KINDS),
  description: z.string(),
  quantity: z.string(),
  unit: z.string(),
  unitPricePence: z.number(),
  stage: text,
  netPence: z.optional(z.nullable(z.number())),
  vatPence: z.optional(z.nullable(z.number())),
});
export type QuoteLine = z.infer<typeof quoteLineSchema>;

export const quoteSchema = z.object({
  id: z.number(),
  commissionId: z.number(),
  version: z.number(),
  status: z.enum(QUOTE_STATUSES),
  intro: text,
  validUntil: text,
  expired: z.boolean(),
  depositPercent: z.number(),
  vatRate: z.nullable(z.enum(['20', '5', '0'])),
  vatMode: z.enum(['line', 'invoice']),
  lines: z.array(quoteLineSchema),
  totals: z.object({
    netPence: z.number(),
    vatPence: z.number(),
    totalPence: z.number(),
    depositPence: z.number(),
    balancePence: z.number(),
  }),
  sentAt: text,
  acceptedAt: text,
  acceptedName: text,
  declinedAt: text,
  declineNote: text,
  createdAt: z.string(),
});
export type Quote = z.infer<typeof quoteSchema>;

export const quoteListSchema = z.object({ items: z.array(quoteSchema) });

/** What the quote editor sends: lines with whole pence, quantity as typed. */
export interface QuoteDraft {
  intro?: string;
  lines: Array<{ kind: LineKind; description: string; quantity: string; unit: string; unitPricePence: number; stage?: string | null }>;
  depositPercent?: number;
}

export const PAYMENT_KIND_LABELS: Readonly<Record<string, string | undefined>> = { deposit: 'Deposit', balance: 'Balance' };
export const PAYMENT_STATUS_LABELS: Readonly<Record<string, string | undefined>> = {
  pending: 'Waiting',
  paid: 'Paid',
  failed: 'Not completed',
  held: 'Held for checking',
  overpaid: 'Paid twice: to be refunded',
  refunded: 'Refunded',
  undone: 'Undone by the studio',
};

/** Why a refunded payment went back, when it was not a cancellation. */
export const REFUND_REASON_LABELS: Readonly<Record<string, string | undefined>> = {
  overpaid: 'Refunded (paid twice)',
  amount_mismatch: 'Refunded (not the amount asked)',
};

export const paymentSchema = z.object({
  id: z.number(),
  kind: z.string(),
  /** What was asked. */
  amountPence: z.number(),
  /** What the card payment service says arrived; null until paid. */
  receivedPence: z.optional(z.nullable(z.number())),
  status: z.string(),
  refundReason: text,
  paidAt: text,
  refundedAt: text,
  /** card, cash or bank_transfer; absent from a server that does not send it. */
  method: z.optional(z.string()),
  reference: z.optional(z.nullable(z.string())),
  receivedOn: z.optional(z.nullable(z.string())),
  /** Set once the payment counts: it then has a receipt. */
  receiptNumber: z.optional(z.nullable(z.number())),
  undoNote: z.optional(z.nullable(z.string())),
});
export type Payment = z.infer<typeof paymentSchema>;

/** How a payment came. */
export const PAYMENT_METHOD_LABELS: Readonly<Record<string, string | undefined>> = { card: 'Card', cash: 'Cash', bank_transfer: 'Bank transfer' };

/** A payment the owner records by hand. */
export interface ManualPayment {
  kind: 'deposit' | 'balance';
  amountPence: number;
  method: 'cash' | 'bank_transfer';
  receivedOn: string;
  reference: string;
}

export const paymentsSchema = z.object({
  items: z.array(paymentSchema),
  due: z.nullable(
    z.object({
      depositPence: z.number(),
      depositPaid: z.boolean(),
      balancePence: z.number(),
      balancePaid: z.boolean(),
      quoteId: z.number(),
    }),
  ),
});
export type Payments = z.infer<typeof paymentsSchema>;

export const checkoutSchema = z.object({ url: z.string() });

/** Lines the server suggests from the commission's current design (none before there is a design). */
export const suggestionSchema = z.object({
  designVersion: z.nullable(z.number()),
  lines: z.array(
    z.object({
      kind: z.enum(LINE_KINDS),
      description: z.string(),
      quantity: z.string(),
      unit: z.string(),
      unitPricePence: z.number(),
      stage: z.optional(z.string()),
    }),
  ),
  /** What the suggestion left out unpriced, and why. */
  notes: z._default(z.array(z.string()), []),
  /** Per stage, how far logged hours ran from quoted ones on finished commissions. */
  learned: z._default(z.array(z.object({ stage: z.string(), ratio: z.string(), commissions: z.number(), blockKind: z.nullable(z.string()), basis: z.string() })), []),
});
export type QuoteSuggestion = z.infer<typeof suggestionSchema>;

/** "20% VAT per line", "VAT on the total", or null when no VAT is charged. */
export function vatLabel(q: Pick<Quote, 'vatRate' | 'vatMode'>): string | null {
  if (q.vatRate === null) return null;
  return `VAT at ${q.vatRate}% ${q.vatMode === 'line' ? '(worked per line)' : '(worked on the total)'}`;
}
