import express from 'express';
import type { Knex } from 'knex';
import type Stripe from 'stripe';
import type { AppConfig } from '../core/config';
import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { invoiceFor, receiptFor } from './payment-documents';
import { recordManualPayment, undoManualPayment } from './manual-payments';
import { manualPaymentSchema, undoPaymentSchema } from './payments-schemas';
import * as payments from './payments-service';
import { paymentState } from './payment-state';

/** The provider's webhook: mounted before the JSON parser, sessions and CSRF, as it carries its own signature. */
export function paymentsWebhookRouter(provider: Stripe, config: AppConfig, knex: Knex, kickMail: () => void) {
  const r = securedRouter('/api/payments');
  r.post('/webhook', express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const outcome = await payments.handleWebhook(provider, config, knex, body, req.get('stripe-signature'));
    if (outcome === 'processed' || outcome === 'held' || outcome === 'overpaid') kickMail();
    res.json({ received: true, outcome });
  });
  return r.router;
}

export function paymentsRouter(provider: Stripe, config: AppConfig, kickMail: () => void) {
  const quotes = securedRouter('/api/quotes');
  quotes.post('/:id/deposit-checkout', async (req, res) => {
    res.json(await payments.depositCheckout(provider, config, signedInUser(req), parseId(req.params['id'], 'That quote')));
  });

  const commissions = securedRouter('/api/commissions');
  commissions.post('/:id/balance-checkout', async (req, res) => {
    res.json(await payments.balanceCheckout(provider, config, signedInUser(req), parseId(req.params['id'], 'That commission')));
  });
  commissions.get('/:id/payments', async (req, res) => {
    const id = parseId(req.params['id'], 'That commission');
    const [items, state] = await Promise.all([payments.listPayments(signedInUser(req), id), paymentState(id)]);
    res.json({
      items,
      due: state ? { depositPence: state.depositPence, depositPaid: state.depositPaid, balancePence: state.balancePence, balancePaid: state.balancePaid, quoteId: state.quote.id } : null,
    });
  });
  commissions.post('/:id/refund-deposit', async (req, res) => {
    res.json(await payments.refundDeposit(provider, parseId(req.params['id'], 'That commission')));
  });
  // The owner's answer to a payment held for review (accept it as it arrived, or refund it), or to an overpayment whose refund did not go through.
  commissions.post('/:id/payments/:paymentId/accept', async (req, res) => {
    const payment = await payments.acceptHeldPayment(config, parseId(req.params['id'], 'That commission'), parseId(req.params['paymentId'], 'That payment'));
    kickMail();
    res.json(payment);
  });
  commissions.post('/:id/payments/:paymentId/refund', async (req, res) => {
    res.json(await payments.refundPayment(provider, parseId(req.params['id'], 'That commission'), parseId(req.params['paymentId'], 'That payment')));
  });
  // Money outside the card checkout: the owner records it (it counts as a card payment does) and may undo it with a note.
  commissions.post('/:id/payments/manual', async (req, res) => {
    const id = parseId(req.params['id'], 'That commission');
    const payment = await recordManualPayment(config, signedInUser(req), id, parseInput(manualPaymentSchema, req.body, 'payment'));
    kickMail();
    res.status(201).json(payment);
  });
  commissions.post('/:id/payments/:paymentId/undo', async (req, res) => {
    const { note } = parseInput(undoPaymentSchema, req.body, 'undo');
    res.json(await undoManualPayment(signedInUser(req), parseId(req.params['id'], 'That commission'), parseId(req.params['paymentId'], 'That payment'), note));
  });
  // The receipt of each payment, and the invoice for the balance, as PDFs.
  commissions.get('/:id/payments/:paymentId/receipt', async (req, res) => {
    const { pdf, fileName } = await receiptFor(signedInUser(req), parseId(req.params['id'], 'That commission'), parseId(req.params['paymentId'], 'That receipt'));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${fileName}"`);
    res.send(pdf);
  });
  commissions.get('/:id/invoice', async (req, res) => {
    const { pdf, fileName } = await invoiceFor(signedInUser(req), parseId(req.params['id'], 'That commission'));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${fileName}"`);
    res.send(pdf);
  });
  return [quotes.router, commissions.router];
}
