import Stripe from 'stripe';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import type { AppConfig } from '../core/config';
import { ClientModel } from '../models/client-model';
import { CommissionModel, StageMoveModel } from '../models/commission-model';
import { findVisibleCommission } from '../commissions/commission-access';
import { enqueueMail } from '../mail/outbox-service';
import { overpaymentMail, paymentHeldMail, receiptMail } from '../mail/mail-templates';
import { StudioSettingsModel } from '../models/settings-model';
import { QuoteModel } from '../models/quote-model';
import { UserModel } from '../models/user-model';
import { formatPounds } from '@keepstitch/shared';
import { heldPayment, paymentState } from './payment-state';
import { PaymentModel, countedPence, type PaymentStatus, type RefundReason } from '../models/payment-model';
import { present } from '../core/field-policy';
import type { Role } from '../core/roles';

type Kind = 'deposit' | 'balance';

/** A payment as the role may see it (FIELD_POLICY.payment): the card provider's ids are never sent. */
export function paymentView(p: PaymentModel, role: Role = 'owner') {
  return present('payment', role, {
    id: p.id,
    kind: p.kind,
    amountPence: p.amountPence,
    receivedPence: p.receivedPence,
    status: p.status,
    refundReason: p.refundReason,
    paidAt: p.paidAt,
    refundedAt: p.refundedAt,
    createdAt: p.createdAt,
    quoteId: p.quoteId,
    method: p.method,
    reference: p.reference,
    receivedOn: p.receivedOn,
    receiptNumber: p.receiptNumber,
    undoneAt: p.undoneAt,
    undoNote: p.undoNote,
  });
}

/** The payments where money moved: checkouts still open or given up are left out. */
export async function listPayments(user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  const rows = await CommissionModel.relatedQuery('payments').for(commissionId).whereNotIn('status', ['pending', 'expired']).orderBy('id');
  return rows.map((p) => paymentView(p, user.role));
}

const NOT_ANSWERING = 'The card payment service is not answering. Nothing was charged; please try again in a few minutes.';

/** A call to the provider; any failure is the service not answering (logged, never shown). */
async function ask<T>(call: () => Promise<T>, message = NOT_ANSWERING): Promise<T> {
  try {
    return await call();
  } catch (err) {
    console.error('Payment provider:', (err as Error).message);
    throw new AppError(503, 'payments_unavailable', message);
  }
}

const arriving = () => new AppError(409, 'payment_arriving', 'This payment has been made and is being confirmed. Refresh the page in a moment; there is no need to pay again.');

/**
 * The one open checkout of a commission's deposit or balance. While it is
 * open and still asks the amount due on the accepted quote, the same one is
 * given again (a second tab pays the same session, not a second one). When a
 * new one is needed (the amount or the quote changed) the old one is expired
 * at the provider first, so it can no longer be paid.
 *
 * The commission row is locked throughout, so two requests at once never make
 * two sessions. A new payment's id is reserved first (the provider keeps it as
 * its reference) and its row written only once the provider has made the
 * session, so a provider that is down, or falls over mid-call, leaves no row
 * behind.
 */
async function openCheckout(provider: Stripe, config: AppConfig, commissionId: number, kind: Kind, dueNow: (trx: Knex.Transaction) => Promise<{ quote: QuoteModel; amountPence: number }>) {
  return CommissionModel.transaction(async (trx) => {
    const commission = (await CommissionModel.query(trx).findById(commissionId).forUpdate())!;
    const { quote, amountPence } = await dueNow(trx);
    const held = await heldPayment(commissionId, kind, trx);
    if (held) {
      throw new AppError(409, 'payment_held', `Your payment of ${formatPounds(countedPence(held))} has reached the studio and is being checked. There is no need to pay again; the studio will be in touch.`);
    }
    const open = await PaymentModel.query(trx).where({ commissionId, kind, status: 'pending' }).whereNotNull('checkoutSessionId').orderBy('id', 'desc');
    let reuse: Stripe.Checkout.Session | null = null;
    for (const p of open) {
      const session = await retrieveSession(provider, p.checkoutSessionId!);
      if (session?.status === 'complete') throw arriving();
      if (session?.status === 'open') {
        if (!reuse && p.quoteId === quote.id && p.amountPence === amountPence && session.url) {
          reuse = session;
          continue;
        }
        await expireSession(provider, p.checkoutSessionId!);
      }
      await PaymentModel.query(trx).patch({ status: 'expired' }).findById(p.id);
    }
    if (reuse) return { url: reuse.url! };

    const client = await ClientModel.query(trx).findById(commission.clientId);
    const settings = await StudioSettingsModel.current(trx);
    const reserved = await trx.raw<{ rows: Array<{ id: string }> }>(`SELECT nextval(pg_get_serial_sequence('payments', 'id')) AS id`);
    const paymentId = Number(reserved.rows[0]!.id);
    const back = `${config.appUrl}/portal/${commissionId}`;
    const session = await ask(() =>
      provider.checkout.sessions.create({
        mode: 'payment',
        line_items: [{ quantity: 1, price_data: { currency: 'gbp', unit_amount: amountPence, product_data: { name: `${settings.studioName}: ${kind} for ${commission.title}` } } }],
        success_url: `${back}?payment=done`,
        cancel_url: `${back}?payment=cancelled`,
        client_reference_id: String(paymentId),
        customer_email: client?.email ?? undefined,
        metadata: { paymentId: String(paymentId), commissionId: String(commissionId), kind },
      }),
    );
    await PaymentModel.query(trx).insert({ id: paymentId, commissionId, quoteId: quote.id, kind, amountPence, status: 'pending', checkoutSessionId: session.id });
    return { url: session.url! };
  });
}

/** A session as the provider has it now; null when it no longer knows it (such as the local fake restarted), so it cannot be paid. */
async function retrieveSession(provider: Stripe, sessionId: string): Promise<Stripe.Checkout.Session | null> {
  try {
    return await provider.checkout.sessions.retrieve(sessionId);
  } catch (err) {
    if (err instanceof Stripe.errors.StripeError && err.statusCode === 404) return null;
    console.error('Payment provider:', (err as Error).message);
    throw new AppError(503, 'payments_unavailable', NOT_ANSWERING);
  }
}

/** Expires an open session; one that was paid meanwhile means the payment is on its way. */
async function expireSession(provider: Stripe, sessionId: string): Promise<void> {
  try {
    await provider.checkout.sessions.expire(sessionId);
  } catch (err) {
    const now = await retrieveSession(provider, sessionId);
    if (!now || now.status === 'expired') return;
    if (now.status === 'complete') throw arriving();
    console.error('Payment provider:', (err as Error).message);
    throw new AppError(503, 'payments_unavailable', NOT_ANSWERING);
  }
}

export async function depositCheckout(provider: Stripe, config: AppConfig, user: Express.User, quoteId: number) {
  const quote = await QuoteModel.query().findById(quoteId);
  if (!quote) throw AppError.notFound('That quote');
  await findVisibleCommission(user, quote.commissionId).catch(() => {
    throw AppError.notFound('That quote');
  });
  return openCheckout(provider, config, quote.commissionId, 'deposit', async (trx) => {
    const current = (await QuoteModel.query(trx).findById(quoteId))!;
    if (current.status !== 'accepted') throw new AppError(409, 'not_accepted', 'Accept the quote before paying the deposit.');
    const state = await paymentState(quote.commissionId, trx);
    if (!state || state.quote.id !== quote.id) throw new AppError(409, 'not_accepted', 'This is not the accepted quote.');
    if (state.depositPaid) throw new AppError(409, 'already_paid', 'The deposit has already been paid. Thank you.');
    if (state.depositPence <= 0) throw new AppError(409, 'nothing_due', 'No deposit is due on this quote.');
    return { quote: state.quote, amountPence: state.depositPence };
  });
}

export async function balanceCheckout(provider: Stripe, config: AppConfig, user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  return openCheckout(provider, config, commissionId, 'balance', async (trx) => {
    const state = await paymentState(commissionId, trx);
    if (!state) throw new AppError(409, 'not_accepted', 'There is no accepted quote to pay.');
    if (!state.depositPaid && state.depositPence > 0) {
      if (await heldPayment(commissionId, 'deposit', trx)) throw new AppError(409, 'deposit_held', 'Your deposit has reached the studio and is being checked; the balance can be paid once it is confirmed.');
      throw new AppError(409, 'deposit_first', 'Pay the deposit first.');
    }
    if (state.balancePaid || state.balancePence <= 0) throw new AppError(409, 'already_paid', 'Nothing more is owed. Thank you.');
    return { quote: state.quote, amountPence: state.balancePence };
  });
}

export type WebhookOutcome = 'processed' | 'held' | 'overpaid' | 'expired' | 'duplicate' | 'ignored';

/**
 * A webhook from the payment provider, its signature checked on the raw body.
 * Each event is processed once: its id is recorded in the same transaction as
 * what it changes, so a replay changes nothing. Every signed event is answered
 * 2xx once recorded, whatever it meant, so the provider stops sending it:
 * - the amount asked, for something not yet paid: paid (a deposit books the commission), receipt to the client;
 * - another amount: held for the owner's review, the owner told, nothing booked;
 * - for something already paid (or held): an overpayment, the owner told, and refunded straight away.
 */
export async function handleWebhook(provider: Stripe, config: AppConfig, knex: Knex, rawBody: Buffer, signature: string | undefined): Promise<WebhookOutcome> {
  let event: Stripe.Event;
  try {
    event = provider.webhooks.constructEvent(rawBody, signature ?? '', config.payments.webhookSecret);
  } catch {
    throw new AppError(400, 'bad_signature', 'The webhook signature does not match.');
  }
  const { outcome, payment } = await knex.transaction((trx) => recordEvent(trx, config, event));
  if (outcome === 'overpaid' && payment) {
    // After the commit: the overpayment is on record whether or not the provider takes the refund now.
    await refundPayment(provider, payment.commissionId, payment.id, { only: ['overpaid'] }).catch((err: Error) => {
      console.error(`Payment ${payment.id}: the overpayment is recorded but its refund failed (${err.message}); the owner can refund it from the commission page.`);
    });
  }
  return outcome;
}

async function recordEvent(trx: Knex.Transaction, config: AppConfig, event: Stripe.Event): Promise<{ outcome: WebhookOutcome; payment?: PaymentModel }> {
  const inserted = await trx('webhook_events').insert({ id: event.id, type: event.type }).onConflict('id').ignore().returning('id');
  if (inserted.length === 0) return { outcome: 'duplicate' };
  if (event.type !== 'checkout.session.completed' && event.type !== 'checkout.session.expired') return { outcome: 'ignored' };
  const session = event.data.object as Stripe.Checkout.Session;
  const found = await PaymentModel.query(trx).where('checkoutSessionId', session.id).first();
  if (!found) return { outcome: 'ignored' };
  // The commission first, then the payment: every writer of a commission's payments takes them in this order.
  await CommissionModel.query(trx).findById(found.commissionId).forUpdate();
  const payment = (await PaymentModel.query(trx).findById(found.id).forUpdate())!;

  if (event.type === 'checkout.session.expired') {
    if (payment.status !== 'pending') return { outcome: 'ignored' };
    await PaymentModel.query(trx).patch({ status: 'expired' }).findById(payment.id);
    return { outcome: 'expired' };
  }
  if (session.payment_status !== 'paid') return { outcome: 'ignored' };
  // This session's money is already on record (the same payment told twice).
  if (payment.status !== 'pending' && payment.status !== 'expired' && payment.status !== 'failed') return { outcome: 'ignored' };

  const paidAt = new Date();
  const arrived = {
    paidAt,
    receivedPence: session.amount_total ?? 0,
    paymentIntentId: typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null),
  };
  const already = await PaymentModel.query(trx).where({ commissionId: payment.commissionId, kind: payment.kind }).whereIn('status', ['paid', 'held']).whereNot('id', payment.id).first();
  if (already) {
    const overpaid = await PaymentModel.query(trx).patchAndFetchById(payment.id, { ...arrived, status: 'overpaid' });
    await tellOwner(trx, config, overpaid, 'overpaid');
    return { outcome: 'overpaid', payment: overpaid };
  }
  if (arrived.receivedPence !== payment.amountPence) {
    const held = await PaymentModel.query(trx).patchAndFetchById(payment.id, { ...arrived, status: 'held' });
    await tellOwner(trx, config, held, 'held');
    return { outcome: 'held', payment: held };
  }
  const paid = await PaymentModel.query(trx).patchAndFetchById(payment.id, { ...arrived, status: 'paid' });
  await countPayment(trx, config, paid);
  return { outcome: 'processed', payment: paid };
}

/** What a payment that counts does, however it came: it gets the next receipt number, a deposit books the commission, the client gets a receipt. */
export async function countPayment(trx: Knex.Transaction, config: AppConfig, payment: PaymentModel): Promise<void> {
  await trx.raw(`UPDATE payments SET receipt_number = nextval('payment_receipt_numbers') WHERE id = ? AND receipt_number IS NULL`, [payment.id]);
  const commission = (await CommissionModel.query(trx).findById(payment.commissionId))!;
  if (payment.kind === 'deposit' && ['enquiry', 'quoted'].includes(commission.stage)) {
    await CommissionModel.query(trx).patch({ stage: 'booked' }).findById(commission.id);
    await StageMoveModel.query(trx).insert({ commissionId: commission.id, fromStage: commission.stage, toStage: 'booked', movedBy: null, note: 'Deposit paid' });
  }
  const client = await ClientModel.query(trx).findById(commission.clientId);
  if (client?.email) {
    const settings = await StudioSettingsModel.current(trx);
    const mail = receiptMail({ clientName: client.name, studioName: settings.studioName, title: commission.title, kind: payment.kind, amountPence: countedPence(payment), paidAt: payment.paidAt ?? new Date(), link: `${config.appUrl}/portal/${commission.id}` });
    await enqueueMail(trx, { kind: `receipt_${payment.kind}`, to: client.email, ...mail, commissionId: commission.id });
  }
}

/** A mail to the studio about a payment that needs its eye: to the studio's address, or else to each owner. */
async function tellOwner(trx: Knex.Transaction, config: AppConfig, payment: PaymentModel, why: 'held' | 'overpaid'): Promise<void> {
  const commission = (await CommissionModel.query(trx).findById(payment.commissionId))!;
  const client = await ClientModel.query(trx).findById(commission.clientId);
  const settings = await StudioSettingsModel.current(trx);
  const to = settings.email ? [settings.email] : (await UserModel.query(trx).select('email').where('role', 'owner').orderBy('id')).map((u) => u.email);
  const about = { studioName: settings.studioName, clientName: client?.name ?? 'The client', title: commission.title, kind: payment.kind, receivedPence: countedPence(payment), link: `${config.appUrl}/commissions/${commission.id}` };
  const mail = why === 'held' ? paymentHeldMail({ ...about, askedPence: payment.amountPence }) : overpaymentMail(about);
  for (const address of to) {
    await enqueueMail(trx, { kind: why === 'held' ? 'payment_held' : 'payment_overpaid', to: address, ...mail, commissionId: commission.id });
  }
}

/** The owner's payment of a commission, locked; 404 when it is not one of the commission's. */
export async function lockedPayment(trx: Knex.Transaction, commissionId: number, paymentId: number) {
  const commission = await CommissionModel.query(trx).findById(commissionId).forUpdate();
  if (!commission) throw AppError.notFound('That commission');
  const payment = await PaymentModel.query(trx).findById(paymentId).where('commissionId', commissionId).forUpdate();
  if (!payment) throw AppError.notFound('That payment');
  return payment;
}

const WAS: Partial<Record<PaymentStatus, string>> = { paid: 'already counted', refunded: 'already refunded', overpaid: 'a second payment, to refund', pending: 'not paid yet', expired: 'a checkout that was never paid' };

/** The owner accepts a held payment as it arrived: it counts from now (a deposit books the commission) and the client gets a receipt. */
export async function acceptHeldPayment(config: AppConfig, commissionId: number, paymentId: number) {
  return PaymentModel.transaction(async (trx) => {
    const payment = await lockedPayment(trx, commissionId, paymentId);
    if (payment.status !== 'held') throw new AppError(409, 'not_held', `This payment is not waiting for your review: it is ${WAS[payment.status] ?? payment.status}. Refresh the page to see where it stands.`);
    const paid = await PaymentModel.query(trx).patchAndFetchById(payment.id, { status: 'paid' });
    await countPayment(trx, config, paid);
    return paymentView((await PaymentModel.query(trx).findById(paid.id))!);
  });
}

/**
 * Refunds a held payment or an overpayment in full through the provider. The
 * row stays locked while the provider is asked, so an accept cannot slip in
 * between; the idempotency key makes a retry return the same refund.
 */
export async function refundPayment(provider: Stripe, commissionId: number, paymentId: number, options: { only: PaymentStatus[] } = { only: ['held', 'overpaid'] }) {
  return PaymentModel.transaction(async (trx) => {
    const payment = await lockedPayment(trx, commissionId, paymentId);
    if (!options.only.includes(payment.status) || !payment.paymentIntentId) {
      throw new AppError(409, 'nothing_to_refund', `Only a held payment or a second payment is refunded here; this one is ${WAS[payment.status] ?? payment.status}. Refresh the page to see where it stands.`);
    }
    const reason: RefundReason = payment.status === 'held' ? 'amount_mismatch' : 'overpaid';
    const refund = await ask(
      () => provider.refunds.create({ payment_intent: payment.paymentIntentId!, metadata: { paymentId: String(payment.id), reason } }, { idempotencyKey: `refund-payment-${payment.id}` }),
      'The card payment service did not accept the refund just now. Nothing changed; try again shortly.',
    );
    const updated = await PaymentModel.query(trx).patchAndFetchById(payment.id, { status: 'refunded', refundId: refund.id, refundReason: reason, refundedAt: new Date() });
    return paymentView(updated);
  });
}

/** Refunds a paid deposit when the owner cancels the commission. */
export async function refundDeposit(provider: Stripe, commissionId: number) {
  const commission = await CommissionModel.query().findById(commissionId);
  if (!commission) throw AppError.notFound('That commission');
  if (commission.stage !== 'cancelled') throw new AppError(409, 'not_cancelled', 'Cancel the commission before refunding its deposit.');
  const deposit = await PaymentModel.query().where({ commissionId, kind: 'deposit', status: 'paid' }).first();
  if (!deposit || !deposit.paymentIntentId) throw new AppError(409, 'nothing_to_refund', 'There is no paid deposit to refund.');
  const refund = await ask(
    () => provider.refunds.create({ payment_intent: deposit.paymentIntentId! }, { idempotencyKey: `refund-deposit-${deposit.id}` }),
    'The card payment service did not accept the refund just now. Nothing changed; try again shortly.',
  );
  const updated = await PaymentModel.query().patchAndFetchById(deposit.id, { status: 'refunded', refundId: refund.id, refundReason: 'cancelled', refundedAt: new Date() });
  return paymentView(updated);
}

/** A receipt's number as printed: R-0001. */
export function receiptLabel(n: number | null): string {
  return n === null ? 'not numbered' : `R-${String(n).padStart(4, '0')}`;
}
