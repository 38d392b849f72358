import type Stripe from 'stripe';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import type { AppConfig } from '../core/config';
import { ClientModel } from '../clients/client-model';
import { CommissionModel, StageMoveModel } from '../commissions/commission-model';
import { findVisibleCommission } from '../commissions/commissions-service';
import { enqueueMail } from '../mail/outbox-service';
import { receiptMail } from '../mail/mail-templates';
import { StudioSettingsModel } from '../settings/settings-model';
import { QuoteModel } from '../quotes/quote-model';
import { paymentState } from './payment-state';
import { PaymentModel } from './payment-model';

export function paymentView(p: PaymentModel) {
  return { id: p.id, kind: p.kind, amountPence: p.amountPence, status: p.status, paidAt: p.paidAt, refundedAt: p.refundedAt, createdAt: p.createdAt, quoteId: p.quoteId };
}

export async function listPayments(user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  const rows = await PaymentModel.query().where('commissionId', commissionId).whereNot('status', 'pending').orderBy('id');
  return rows.map(paymentView);
}

/**
 * Starts a hosted checkout. The payment's id is reserved first (the provider
 * keeps it as its reference) and its row written only once the provider has
 * made the session, so a provider that is down, or falls over mid-call, leaves
 * no row behind.
 */
async function startCheckout(provider: Stripe, config: AppConfig, p: { user: Express.User; commissionId: number; quote: QuoteModel; kind: 'deposit' | 'balance'; amountPence: number }) {
  const commission = (await CommissionModel.query().findById(p.commissionId))!;
  const client = await ClientModel.query().findById(commission.clientId);
  const settings = await StudioSettingsModel.current();
  const reserved = await PaymentModel.knex().raw<{ rows: Array<{ id: string }> }>(`SELECT nextval(pg_get_serial_sequence('payments', 'id')) AS id`);
  const paymentId = Number(reserved.rows[0]!.id);
  const back = `${config.appUrl}/portal/${p.commissionId}`;
  let session: Stripe.Checkout.Session;
  try {
    session = await provider.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'gbp', unit_amount: p.amountPence, product_data: { name: `${settings.studioName}: ${p.kind} for ${commission.title}` } } }],
      success_url: `${back}?payment=done`,
      cancel_url: `${back}?payment=cancelled`,
      client_reference_id: String(paymentId),
      customer_email: client?.email ?? undefined,
      metadata: { paymentId: String(paymentId), commissionId: String(p.commissionId), kind: p.kind },
    });
  } catch (err) {
    console.error('Payment provider:', (err as Error).message);
    throw new AppError(503, 'payments_unavailable', 'The card payment service is not answering. Nothing was charged; please try again in a few minutes.');
  }
  await PaymentModel.query().insert({ id: paymentId, commissionId: p.commissionId, quoteId: p.quote.id, kind: p.kind, amountPence: p.amountPence, status: 'pending', checkoutSessionId: session.id });
  return { url: session.url! };
}

export async function depositCheckout(provider: Stripe, config: AppConfig, user: Express.User, quoteId: number) {
  const quote = await QuoteModel.query().findById(quoteId);
  if (!quote) throw AppError.notFound('That quote');
  await findVisibleCommission(user, quote.commissionId).catch(() => {
    throw AppError.notFound('That quote');
  });
  if (quote.status !== 'accepted') throw new AppError(409, 'not_accepted', 'Accept the quote before paying the deposit.');
  const state = await paymentState(quote.commissionId);
  if (!state || state.quote.id !== quote.id) throw new AppError(409, 'not_accepted', 'This is not the accepted quote.');
  if (state.depositPaid) throw new AppError(409, 'already_paid', 'The deposit has already been paid. Thank you.');
  if (state.depositPence <= 0) throw new AppError(409, 'nothing_due', 'No deposit is due on this quote.');
  return startCheckout(provider, config, { user, commissionId: quote.commissionId, quote, kind: 'deposit', amountPence: state.depositPence });
}

export async function balanceCheckout(provider: Stripe, config: AppConfig, user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  const state = await paymentState(commissionId);
  if (!state) throw new AppError(409, 'not_accepted', 'There is no accepted quote to pay.');
  if (!state.depositPaid && state.depositPence > 0) throw new AppError(409, 'deposit_first', 'Pay the deposit first.');
  if (state.balancePaid || state.balancePence <= 0) throw new AppError(409, 'already_paid', 'Nothing more is owed. Thank you.');
  return startCheckout(provider, config, { user, commissionId, quote: state.quote, kind: 'balance', amountPence: state.balancePence });
}

/**
 * A webhook from the payment provider, its signature checked on the raw body.
 * Each event is processed once: its id is recorded in the same transaction as
 * the payment and the stage change, so a replay changes nothing.
 */
export async function handleWebhook(provider: Stripe, config: AppConfig, knex: Knex, rawBody: Buffer, signature: string | undefined): Promise<'processed' | 'duplicate' | 'ignored'> {
  let event: Stripe.Event;
  try {
    event = provider.webhooks.constructEvent(rawBody, signature ?? '', config.payments.webhookSecret);
  } catch {
    throw new AppError(400, 'bad_signature', 'The webhook signature does not match.');
  }
  return knex.transaction(async (trx) => {
    const inserted = await trx('webhook_events').insert({ id: event.id, type: event.type }).onConflict('id').ignore().returning('id');
    if (inserted.length === 0) return 'duplicate' as const;
    if (event.type !== 'checkout.session.completed') return 'ignored' as const;
    const session = event.data.object as Stripe.Checkout.Session;
    if (session.payment_status !== 'paid') return 'ignored' as const;
    const payment = await PaymentModel.query(trx).where('checkoutSessionId', session.id).forUpdate().first();
    if (!payment || payment.status === 'paid' || payment.status === 'refunded') return 'ignored' as const;
    if (session.amount_total !== payment.amountPence) {
      console.error(`Payment ${payment.id}: paid ${session.amount_total} but ${payment.amountPence} was asked; recorded as paid for review.`);
    }
    const paidAt = new Date();
    await PaymentModel.query(trx)
      .patch({ status: 'paid', paidAt, paymentIntentId: typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null) })
      .findById(payment.id);
    const commission = (await CommissionModel.query(trx).findById(payment.commissionId).forUpdate())!;
    if (payment.kind === 'deposit' && ['enquiry', 'quoted'].includes(commission.stage)) {
      await CommissionModel.query(trx).patch({ stage: 'booked' }).findById(commission.id);
      await StageMoveModel.query(trx).insert({ commissionId: commission.id, fromStage: commission.stage, toStage: 'booked', movedBy: null, note: 'Deposit paid' });
    }
    const client = await ClientModel.query(trx).findById(commission.clientId);
    if (client?.email) {
      const settings = await StudioSettingsModel.query(trx).findById(1);
      const mail = receiptMail({ clientName: client.name, studioName: settings!.studioName, title: commission.title, kind: payment.kind, amountPence: payment.amountPence, paidAt, link: `${config.appUrl}/portal/${commission.id}` });
      await enqueueMail(trx, { kind: `receipt_${payment.kind}`, to: client.email, ...mail, commissionId: commission.id });
    }
    return 'processed' as const;
  });
}

/** Refunds a paid deposit when the owner cancels the commission. */
export async function refundDeposit(provider: Stripe, commissionId: number) {
  const commission = await CommissionModel.query().findById(commissionId);
  if (!commission) throw AppError.notFound('That commission');
  if (commission.stage !== 'cancelled') throw new AppError(409, 'not_cancelled', 'Cancel the commission before refunding its deposit.');
  const deposit = await PaymentModel.query().where({ commissionId, kind: 'deposit', status: 'paid' }).first();
  if (!deposit || !deposit.paymentIntentId) throw new AppError(409, 'nothing_to_refund', 'There is no paid deposit to refund.');
  let refund: Stripe.Refund;
  try {
    refund = await provider.refunds.create({ payment_intent: deposit.paymentIntentId }, { idempotencyKey: `refund-deposit-${deposit.id}` });
  } catch (err) {
    console.error('Payment provider:', (err as Error).message);
    throw new AppError(503, 'payments_unavailable', 'The card payment service did not accept the refund just now. Nothing changed; try again shortly.');
  }
  const updated = await PaymentModel.query().patchAndFetchById(deposit.id, { status: 'refunded', refundId: refund.id, refundedAt: new Date() });
  return paymentView(updated);
}
