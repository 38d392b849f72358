import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { startFakePayments, DECLINED_CARD, PAYING_CARD, type FakePayments } from '../../scripts/fakes/fake-payments';
import { FAKE_PAYMENTS_WEBHOOK_SECRET } from '../core/config';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import { tableFingerprints } from '../testing/table-fingerprints';

describe('payments through the provider SDK and its webhooks', () => {
  let fake: FakePayments;
  let t: TestApp;
  let server: Server;
  let owner: ApiAgent;
  let client: ApiAgent;
  let clientId: number;
  const signer = new Stripe('sk_test_signer');

  /** A webhook signed the way the provider signs them. */
  const webhook = (event: object, secret = FAKE_PAYMENTS_WEBHOOK_SECRET) => {
    const payload = JSON.stringify(event);
    return new ApiAgent(t.app).agent
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signer.webhooks.generateTestHeaderString({ payload, secret }))
      .send(payload);
  };
  const completed = (eventId: string, sessionId: string, amount: number) => ({
    id: eventId,
    object: 'event',
    type: 'checkout.session.completed',
    data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'paid', amount_total: amount, payment_intent: `pi_${sessionId}` } },
  });

  /** A quote the client has accepted, its deposit not asked for yet. */
  async function acceptedQuote() {
    const commission = await addCommission(t.knex, clientId);
    const q = await sendQuote(owner, commission);
    await client.post(`/api/quotes/${q.id}/accept`, { name: 'Nell Ashby' });
    return { commission, q };
  }

  /** An accepted quote with a deposit checkout started; returns the session the fake made. */
  async function acceptedWithCheckout(kind: 'deposit' | 'balance' = 'deposit') {
    const { commission, q } = await acceptedQuote();
    const res = await client.post(`/api/quotes/${q.id}/deposit-checkout`);
    expect(res.status).toBe(200);
    const sessionId = new URL(res.body.url).pathname.split('/').pop()!;
    void kind;
    return { commission, quote: q, sessionId, url: res.body.url as string };
  }

  beforeAll(async () => {
    fake = await startFakePayments({ webhookUrl: 'http://127.0.0.1:9/unset', quiet: true });
    t = await startTestApp({ payments: { secretKey: 'sk_test_keepstitch_local_fake', webhookSecret: FAKE_PAYMENTS_WEBHOOK_SECRET, apiUrl: fake.baseUrl } });
    server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    fake.setWebhookUrl(`http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook`);
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Nell Ashby', email: 'nell@post.test' });
    client = await signedIn(t.app, c.email);
  });
  afterAll(async () => {
    server.closeAllConnections();
    await new Promise((r) => server.close(r));
    await fake.close();
    await t.close();
  });

  it('takes the deposit through hosted checkout: the signed webhook books the commission and queues a receipt', async () => {
    const { commission, quote, sessionId, url } = await acceptedWithCheckout();
    expect(url.startsWith(fake.baseUrl)).toBe(true);
    // Hand-worked (money-fixtures): 10.5 h x 30.00 + 2.5 m x 14.50 = 351.25 net, VAT 70.25, total 421.50, 30% deposit 126.45.
    expect(quote.totals).toEqual({ netPence: 35125, vatPence: 7025, totalPence: 42150, depositPence: 12645, balancePence: 29505 });
    expect(fake.sessions.get(sessionId)!.amount_total).toBe(12645);
    expect(await fake.pay(sessionId)).toBe(200);
    const detail = await owner.get(`/api/commissions/${commission}`);
    expect(detail.body.stage).toBe('booked');
    expect(detail.body.stageHistory.at(-1)).toMatchObject({ toStage: 'booked', note: 'Deposit paid' });
    const payments = await client.get(`/api/commissions/${commission}/payments`);
    expect(payments.body.items).toEqual([expect.objectContaining({ kind: 'deposit', amountPence: 12645, status: 'paid' })]);
    expect(payments.body.due).toMatchObject({ depositPaid: true, balancePence: 29505, balancePaid: false });
    expect(await t.knex('outboxMails').where({ commissionId: commission, kind: 'receipt_deposit' })).toHaveLength(1);
    expect((await client.post(`/api/quotes/${quote.id}/deposit-checkout`)).status).toBe(409);
  });

  it('refuses a webhook with a bad signature with a 400 and changes nothing', async () => {
    const { sessionId } = await acceptedWithCheckout();
    const res = await webhook(completed('evt_forged', sessionId, 12645), 'whsec_not_the_secret');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_signature');
    expect((await t.knex('payments').where('checkoutSessionId', sessionId).first()).status).toBe('pending');
    expect(await t.knex('webhookEvents').where('id', 'evt_forged')).toHaveLength(0);
  });

  it('processes the same event sent 10 times exactly once', async () => {
    const { commission, sessionId } = await acceptedWithCheckout();
    const answers = await Promise.all(Array.from({ length: 10 }, () => webhook(completed('evt_repeat', sessionId, 12645))));
    expect(answers.every((r) => r.status === 200)).toBe(true);
    expect(answers.filter((r) => r.body.outcome === 'processed')).toHaveLength(1);
    expect(await t.knex('payments').where({ commissionId: commission, status: 'paid' })).toHaveLength(1);
    expect(await t.knex('stageMoves').where({ commissionId: commission, toStage: 'booked' })).toHaveLength(1);
    expect(await t.knex('outboxMails').where({ commissionId: commission, kind: 'receipt_deposit' })).toHaveLength(1);
  });

  it('handles a balance event that arrives before the deposit event, and no penny is off', async () => {
    const { commission, quote, sessionId: depositSession } = await acceptedWithCheckout();
    // The deposit is paid at the provider but its event is late; the client pays the balance too.
    await t.knex('payments').where('checkoutSessionId', depositSession).update({ status: 'paid', paidAt: new Date() });
    const balance = await client.post(`/api/commissions/${commission}/balance-checkout`);
    expect(balance.status).toBe(200);
    const balanceSession = new URL(balance.body.url).pathname.split('/').pop()!;
    expect(fake.sessions.get(balanceSession)!.amount_total).toBe(quote.totals.totalPence - quote.totals.depositPence);
    await t.knex('payments').where('checkoutSessionId', depositSession).update({ status: 'pending', paidAt: null });
    expect((await webhook(completed('evt_balance_first', balanceSession, 29505))).body.outcome).toBe('processed');
    expect((await webhook(completed('evt_deposit_late', depositSession, 12645))).body.outcome).toBe('processed');
    const paid = await t.knex('payments').where({ commissionId: commission, status: 'paid' }).orderBy('kind');
    expect(paid.map((p) => [p.kind, p.amountPence])).toEqual([['balance', 29505], ['deposit', 12645]]);
    expect(paid.reduce((s, p) => s + p.amountPence, 0)).toBe(quote.totals.totalPence);
    expect((await owner.get(`/api/commissions/${commission}`)).body.stage).toBe('booked');
  });

  it('holds delivery until the balance is paid', async () => {
    const { commission, sessionId } = await acceptedWithCheckout();
    await fake.pay(sessionId);
    await t.knex('commissions').where('id', commission).update({ stage: 'ready' });
    const refused = await owner.post(`/api/commissions/${commission}/stage`, { to: 'delivered' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('The balance has not been paid yet; it is due before delivery.');
    const balance = await client.post(`/api/commissions/${commission}/balance-checkout`);
    await fake.pay(new URL(balance.body.url).pathname.split('/').pop()!);
    expect((await owner.post(`/api/commissions/${commission}/stage`, { to: 'delivered' })).status).toBe(200);
  });

  it('shows a clear message on the checkout page for a declined card, and takes nothing', async () => {
    const { sessionId, url } = await acceptedWithCheckout();
    const declined = await fetch(url, { method: 'POST', body: new URLSearchParams({ card: DECLINED_CARD }), redirect: 'manual' });
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined. No money was taken.');
    expect((await t.knex('payments').where('checkoutSessionId', sessionId).first()).status).toBe('pending');
    const paid = await fetch(url, { method: 'POST', body: new URLSearchParams({ card: PAYING_CARD }), redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(/\/portal\/\d+\?payment=done$/);
    expect((await t.knex('payments').where('checkoutSessionId', sessionId).first()).status).toBe('paid');
  });

  it('refunds the deposit when the owner cancels', async () => {
    const { commission, sessionId } = await acceptedWithCheckout();
    await fake.pay(sessionId);
    expect((await owner.post(`/api/commissions/${commission}/refund-deposit`)).status).toBe(409);
    await owner.post(`/api/commissions/${commission}/stage`, { to: 'cancelled', note: 'Client moved abroad' });
    const refund = await owner.post(`/api/commissions/${commission}/refund-deposit`);
    expect(refund.status).toBe(200);
    expect(refund.body).toMatchObject({ kind: 'deposit', status: 'refunded' });
    expect((await owner.post(`/api/commissions/${commission}/refund-deposit`)).status).toBe(409);
  });

  it('never lets the workroom or another client start or see payments', async () => {
    const { commission, quote } = await acceptedWithCheckout();
    const workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const other = await signedIn(t.app, (await addUser(t.knex, 'client')).email);
    expect((await workroom.get(`/api/commissions/${commission}/payments`)).status).toBe(403);
    expect((await other.get(`/api/commissions/${commission}/payments`)).status).toBe(404);
    expect((await other.post(`/api/quotes/${quote.id}/deposit-checkout`)).status).toBe(404);
  });

  describe('while the payment service is down', () => {
    const unchanged = () => tableFingerprints(t.url, ['session']);
    const NOT_ANSWERING = { code: 'payments_unavailable', message: 'The card payment service is not answering. Nothing was charged; please try again in a few minutes.' };
    afterEach(() => fake.start());

    it('answers a deposit checkout with 503 saying nothing was charged, writes nothing, and takes the deposit once the service is back', async () => {
      const { commission, q } = await acceptedQuote();
      await fake.stop();
      const before = await unchanged();
      const res = await client.post(`/api/quotes/${q.id}/deposit-checkout`);
      expect(res.status).toBe(503);
      expect(res.body.error).toEqual(NOT_ANSWERING);
      expect(await unchanged()).toEqual(before);

      await fake.start();
      const again = await client.post(`/api/quotes/${q.id}/deposit-checkout`);
      expect(again.status).toBe(200);
      expect(await fake.pay(new URL(again.body.url).pathname.split('/').pop()!)).toBe(200);
      expect(await t.knex('payments').where({ commissionId: commission })).toEqual([expect.objectContaining({ kind: 'deposit', status: 'paid' })]);
      expect(await t.knex('stageMoves').where({ commissionId: commission, toStage: 'booked' })).toHaveLength(1);
    });

    it('answers 503 and writes nothing when the service falls over in the middle of the call', async () => {
      const { q } = await acceptedQuote();
      const before = await unchanged();
      const arrived = fake.hold();
      const answer = client.post(`/api/quotes/${q.id}/deposit-checkout`);
      await arrived;
      await fake.stop();
      const res = await answer;
      expect(res.status).toBe(503);
      expect(res.body.error).toEqual(NOT_ANSWERING);
      expect(await unchanged()).toEqual(before);
    });

    it('answers a refund with 503 and leaves the deposit paid', async () => {
      const { commission, sessionId } = await acceptedWithCheckout();
      await fake.pay(sessionId);
      await owner.post(`/api/commissions/${commission}/stage`, { to: 'cancelled', note: 'Client moved abroad' });
      await fake.stop();
      const before = await unchanged();
      const res = await owner.post(`/api/commissions/${commission}/refund-deposit`);
      expect(res.status).toBe(503);
      expect(res.body.error.message).toBe('The card payment service did not accept the refund just now. Nothing changed; try again shortly.');
      expect(await unchanged()).toEqual(before);
      await fake.start();
      expect((await owner.post(`/api/commissions/${commission}/refund-deposit`)).body).toMatchObject({ kind: 'deposit', status: 'refunded' });
    });
  });
});
