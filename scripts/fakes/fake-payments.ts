/**
 * A local stand-in for the card-payment provider: the few API calls the app
 * makes through the provider's Node SDK (create, read and expire a hosted
 * checkout session, refund a payment, each POST honouring an idempotency
 * key), a small hosted checkout page, and signed
 * webhooks sent back to the app when a payment succeeds, as the real service
 * does. Test cards: 4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined.
 *
 *   node --import tsx scripts/fakes/fake-payments.ts   (FAKE_PAYMENTS_PORT, APP_URL, PAYMENTS_WEBHOOK_SECRET)
 */
import { randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import Stripe from 'stripe';

import { FAKE_PAYMENTS_SECRET_KEY, FAKE_PAYMENTS_WEBHOOK_SECRET } from '../../server/core/config';

export const FAKE_SECRET_KEY = FAKE_PAYMENTS_SECRET_KEY;
export const FAKE_WEBHOOK_SECRET = FAKE_PAYMENTS_WEBHOOK_SECRET;
export const PAYING_CARD = '4242424242424242';
export const DECLINED_CARD = '4000000000000002';

interface Session {
  id: string;
  object: 'checkout.session';
  amount_total: number;
  currency: string;
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  payment_intent: string | null;
  success_url: string;
  cancel_url: string;
  url: string;
  metadata: Record<string, string>;
  client_reference_id: string | null;
  customer_email: string | null;
  description: string;
  created: number;
}

interface Refund {
  id: string;
  object: 'refund';
  status: 'succeeded';
  amount: number;
  currency: string;
  payment_intent: string;
  metadata: Record<string, string>;
  created: number;
}

export interface FakePayments {
  port: number;
  baseUrl: string;
  sessions: Map<string, Session>;
  webhooksSent: Array<{ id: string; type: string; status: number }>;
  /** Every refund made, in order. */
  refunds: Refund[];
  /** Where webhooks go (the app's address may only be known after the fake starts). */
  setWebhookUrl(url: string): void;
  /**
   * Pays an open session as the checkout page would (for tests), returning the
   * webhook status; refuses one that is expired or paid. `paidPence` takes
   * another amount than the session asked, as a provider-side discount would.
   */
  pay(sessionId: string, paidPence?: number): Promise<number>;
  /** Sends an event already sent once more, newly signed, as the provider does when it retries; returns the webhook status. */
  resend(eventId: string): Promise<number>;
  /** Leaves API calls unanswered from now on; resolves when the first one arrives (a service falling over mid-call). */
  hold(): Promise<void>;
  /** Stops answering, cutting any call in flight, as a service that is down; its sessions are kept. */
  stop(): Promise<void>;
  /** Answers again on the same port after `stop()`, no longer holding calls. */
  start(): Promise<void>;
  close(): Promise<void>;
}

const id = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export async function startFakePayments(options: { port?: number; webhookUrl: string; webhookSecret?: string; secretKey?: string; quiet?: boolean }): Promise<FakePayments> {
  const secret = options.webhookSecret ?? FAKE_WEBHOOK_SECRET;
  const key = options.secretKey ?? FAKE_SECRET_KEY;
  const signer = new Stripe(key);
  const sessions = new Map<string, Session>();
  const webhooksSent: FakePayments['webhooksSent'] = [];
  const refunds: Refund[] = [];
  /** Answers already given to a POST with an idempotency key, replayed as the real service does. */
  const answered = new Map<string, { status: number; body: unknown }>();
  let webhookUrl = options.webhookUrl;
  const app = express();
  app.use(express.urlencoded({ extended: true }));
  let baseUrl = '';

  /** Every event's body as first sent, by id. */
  const payloads = new Map<string, string>();

  async function sendEvent(type: string, object: unknown): Promise<number> {
    const event = { id: id('evt'), object: 'event', type, created: Math.floor(Date.now() / 1000), livemode: false, data: { object }, api_version: Stripe.API_VERSION };
    payloads.set(event.id, JSON.stringify(event));
    return deliver(event.id, type);
  }

  async function deliver(eventId: string, type: string): Promise<number> {
    const payload = payloads.get(eventId)!;
    const header = signer.webhooks.generateTestHeaderString({ payload, secret });
    let status = 0;
    try {
      const res = await fetch(webhookUrl, { method: 'POST', headers: { 'Content-Type': 'application/json', 'Stripe-Signature': header }, body: payload });
      status = res.status;
    } catch {
      status = 0;
    }
    webhooksSent.push({ id: eventId, type, status });
    if (!options.quiet) console.log(`fake payments: sent ${type} -> ${status || 'no answer'}`);
    return status;
  }

  async function pay(sessionId: string, paidPence?: number): Promise<number> {
    const s = sessions.get(sessionId);
    if (!s) throw new Error(`no session ${sessionId}`);
    if (s.status !== 'open') throw new Error(`session ${sessionId} is ${s.status}, not open: it cannot be paid`);
    s.status = 'complete';
    s.payment_status = 'paid';
    if (paidPence !== undefined) s.amount_total = paidPence;
    s.payment_intent = id('pi');
    return sendEvent('checkout.session.completed', s);
  }

  // The provider's API, as far as the app uses it.
  const api = express.Router();
  let held: (() => void) | null = null;
  api.use((_req, _res, next) => (held ? held() : next()));
  api.use((req, res, next) => {
    if (req.get('authorization') !== `Bearer ${key}`) {
      res.status(401).json({ error: { type: 'invalid_request_error', message: 'Invalid API key provided.' } });
      return;
    }
    next();
  });
  api.use((req, res, next) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || !key) return next();
    const cacheKey = `${req.path} ${key}`;
    const earlier = answered.get(cacheKey);
    if (earlier) {
      res.status(earlier.status).json(earlier.body);
      return;
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      answered.set(cacheKey, { status: res.statusCode, body });
      return json(body);
    };
    next();
  });
  api.post('/checkout/sessions', (req, res) => {
    const body = req.body as Record<string, any>;
    const items = (body['line_items'] ?? []) as Array<{ quantity?: string; price_data?: { unit_amount?: string; currency?: string; product_data?: { name?: string } } }>;
    const amount = items.reduce((sum, i) => sum + Number(i.price_data?.unit_amount ?? 0) * Number(i.quantity ?? 1), 0);
    if (!Number.isInteger(amount) || amount <= 0) {
      res.status(400).json({ error: { type: 'invalid_request_error', message: 'line_items must have a positive amount.' } });
      return;
    }
    const sid = id('cs_test');
    const session: Session = {
      id: sid,
      object: 'checkout.session',
      amount_total: amount,
      currency: items[0]?.price_data?.currency ?? 'gbp',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      success_url: String(body['success_url'] ?? ''),
      cancel_url: String(body['cancel_url'] ?? ''),
      url: `${baseUrl}/pay/${sid}`,
      metadata: (body['metadata'] ?? {}) as Record<string, string>,
      client_reference_id: body['client_reference_id'] ?? null,
      customer_email: body['customer_email'] ?? null,
      description: items[0]?.price_data?.product_data?.name ?? 'Payment',
      created: Math.floor(Date.now() / 1000),
    };
    sessions.set(sid, session);
    res.json(session);
  });
  api.get('/checkout/sessions/:id', (req, res) => {
    const s = sessions.get(req.params['id']!);
    if (!s) {
      res.status(404).json({ error: { type: 'invalid_request_error', message: 'No such checkout session.' } });
      return;
    }
    res.json(s);
  });
  // Only an open session can be expired; once expired it can no longer be paid.
  api.post('/checkout/sessions/:id/expire', (req, res) => {
    const s = sessions.get(req.params['id']!);
    if (!s) {
      res.status(404).json({ error: { type: 'invalid_request_error', message: 'No such checkout session.' } });
      return;
    }
    if (s.status !== 'open') {
      res.status(400).json({ error: { type: 'invalid_request_error', message: `Only an open checkout session can be expired; this one is ${s.status}.` } });
      return;
    }
    s.status = 'expired';
    res.json(s);
  });
  api.post('/refunds', (req, res) => {
    const body = req.body as Record<string, any>;
    const intent = String(body['payment_intent'] ?? '');
    const s = [...sessions.values()].find((x) => x.payment_intent === intent && x.payment_status === 'paid');
    if (!s) {
      res.status(400).json({ error: { type: 'invalid_request_error', message: 'No paid payment with that id.' } });
      return;
    }
    if (refunds.some((r) => r.payment_intent === intent)) {
      res.status(400).json({ error: { type: 'invalid_request_error', code: 'charge_already_refunded', message: 'This payment has already been refunded.' } });
      return;
    }
    const refund: Refund = {
      id: id('re'),
      object: 'refund',
      status: 'succeeded',
      amount: s.amount_total,
      currency: s.currency,
      payment_intent: intent,
      metadata: (body['metadata'] ?? {}) as Record<string, string>,
      created: Math.floor(Date.now() / 1000),
    };
    refunds.push(refund);
    res.json(refund);
  });
  app.use('/v1', api);

  // The hosted checkout page.
  const page = (s: Session, message = '') => `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Test checkout</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>body{font-family:sans-serif;max-width:28rem;margin:3rem auto;padding:0 1rem;color:#222}label{display:block;margin:.8rem 0 .2rem}input{font-size:1.1rem;padding:.4rem;width:100%;box-sizing:border-box}button{margin-top:1rem;font-size:1.1rem;padding:.6rem 1.2rem}.alert{background:#fdecea;border:1px solid #b3261e;padding:.6rem;margin:1rem 0}.note{color:#555;font-size:.9rem}</style></head>
<body><main><p class="note">Local test checkout: no real card is charged.</p><h1>Pay ${escapeHtml(formatAmount(s.amount_total, s.currency))}</h1><p>${escapeHtml(s.description)}</p>
${message ? `<div class="alert" role="alert">${escapeHtml(message)}</div>` : ''}
${s.status === 'open' ? `<form method="post" action="/pay/${s.id}"><label for="card">Card number</label><input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required>
<label for="expiry">Expiry (MM/YY)</label><input id="expiry" name="expiry" value="12/34"><label for="cvc">CVC</label><input id="cvc" name="cvc" value="123">
<button type="submit">Pay ${escapeHtml(formatAmount(s.amount_total, s.currency))}</button></form><p><a href="${escapeHtml(s.cancel_url)}">Cancel and go back</a></p>` : `<p>This checkout is ${s.status === 'expired' ? 'expired' : 'finished'}.</p>`}
</main></body></html>`;

  app.get('/pay/:id', (req, res) => {
    const s = sessions.get(req.params['id']!);
    if (!s) {
      res.status(404).send('No such checkout.');
      return;
    }
    res.type('html').send(page(s));
  });
  app.post('/pay/:id', async (req, res) => {
    const s = sessions.get(req.params['id']!);
    if (!s) {
      res.status(404).send('No such checkout.');
      return;
    }
    if (s.status !== 'open') {
      res.status(410).type('html').send(page(s, s.status === 'expired' ? 'This checkout has expired and can no longer be paid. Go back and start the payment again.' : 'This checkout has already been paid.'));
      return;
    }
    const card = String((req.body as Record<string, string>)['card'] ?? '').replace(/\D/g, '');
    if (card === DECLINED_CARD) {
      res.status(402).type('html').send(page(s, 'Your card was declined. No money was taken. Try another card.'));
      return;
    }
    if (card !== PAYING_CARD) {
      res.status(400).type('html').send(page(s, 'That card number is not one of the test cards (4242 4242 4242 4242 pays; 4000 0000 0000 0002 is declined).'));
      return;
    }
    await pay(s.id);
    res.redirect(303, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id));
  });

  const listen = (port: number) =>
    new Promise<Server>((resolve, reject) => {
      const srv = app.listen(port, '127.0.0.1', () => resolve(srv));
      srv.once('error', reject);
    });
  let server: Server | null = await listen(options.port ?? 0);
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://127.0.0.1:${port}`;
  const stop = () =>
    new Promise<void>((r) => {
      const s = server;
      server = null;
      if (!s) return r();
      s.closeAllConnections();
      s.close(() => r());
    });
  return {
    port,
    baseUrl,
    sessions,
    webhooksSent,
    refunds,
    setWebhookUrl: (url: string) => {
      webhookUrl = url;
    },
    pay,
    resend: (eventId: string) => {
      const sent = webhooksSent.find((w) => w.id === eventId);
      if (!sent) throw new Error(`no event ${eventId} was sent`);
      return deliver(eventId, sent.type);
    },
    hold: () => new Promise<void>((r) => (held = r)),
    stop,
    async start() {
      held = null;
      server ??= await listen(port);
    },
    close: stop,
  };
}

function formatAmount(minor: number, currency: string): string {
  return `${currency.toLowerCase() === 'gbp' ? '\u00a3' : currency.toUpperCase() + ' '}${(minor / 100).toFixed(2)}`;
}

if (require.main === module) {
  const appUrl = process.env['APP_URL'] ?? `http://127.0.0.1:${process.env['PORT'] ?? 4300}`;
  startFakePayments({ port: Number(process.env['FAKE_PAYMENTS_PORT'] ?? 12111), webhookUrl: `${appUrl}/api/payments/webhook`, webhookSecret: process.env['PAYMENTS_WEBHOOK_SECRET'] })
    .then((f) => {
      console.log(`fake payments: API and checkout on ${f.baseUrl}`);
      const stop = () => {
        setTimeout(() => process.exit(0), 2000).unref();
        void f.close().then(() => process.exit(0));
      };
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    })
    .catch((err: Error) => {
      console.error(`fake payments: ${err.message}`);
      process.exit(1);
    });
}
