import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';

describe("a client's record: their commissions, quotes and payments", () => {
  // The first case sends two quotes and records a payment: slow on a busy machine.
  jest.setTimeout(20_000);
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;
  let clientId: number;
  let otherClientId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Ida Hartley', email: 'ida@post.test' });
    client = await signedIn(t.app, c.email);
    otherClientId = (await addUser(t.knex, 'client')).clientId!;
    await t.knex('clients').where('id', otherClientId).update({ email: 'other@post.test' });
  });
  afterAll(() => t.close());

  it('lists the commissions newest first, the quotes sent and the payments that moved money, and nothing of another client', async () => {
    const older = await addCommission(t.knex, clientId, { title: 'Cot quilt', createdAt: new Date('2026-01-05T10:00:00Z') });
    const newer = await addCommission(t.knex, clientId, { title: 'Shirt quilt', createdAt: new Date('2026-06-05T10:00:00Z') });
    const theirs = await addCommission(t.knex, otherClientId, { title: 'Not hers' });
    const sent = await sendQuote(owner, newer);
    await client.post(`/api/quotes/${sent.id}/accept`, { name: 'Ida Hartley' });
    // A draft on the older commission is not part of the record yet; a quote of another client never is.
    await owner.post(`/api/commissions/${older}/quotes`, { lines: [{ kind: 'labour', description: 'Draft', quantity: '1', unit: 'hours', unitPricePence: 3000 }] });
    await sendQuote(owner, theirs);
    const paid = await owner.post(`/api/commissions/${newer}/payments/manual`, { kind: 'deposit', amountPence: sent.totals.depositPence, method: 'cash', receivedOn: '2026-11-20', reference: 'Cash at the fitting' });
    expect(paid.status).toBe(201);
    await t.knex('payments').insert({ commissionId: newer, quoteId: sent.id, kind: 'balance', amountPence: 100, status: 'pending', checkoutSessionId: 'cs_open' });

    const res = await owner.get(`/api/clients/${clientId}/record`);
    expect(res.status).toBe(200);
    expect(res.body.client).toMatchObject({ id: clientId, name: 'Ida Hartley' });
    expect(res.body.commissions.map((c: { title: string }) => c.title)).toEqual(['Shirt quilt', 'Cot quilt']);
    expect(res.body.commissions[0]).toMatchObject({ id: newer, stage: 'booked' });
    expect(res.body.quotes).toEqual([expect.objectContaining({ commissionId: newer, version: 1, status: 'accepted', totalPence: 42150 })]);
    expect(res.body.payments).toEqual([expect.objectContaining({ commissionId: newer, kind: 'deposit', method: 'cash', status: 'paid', reference: 'Cash at the fitting', receiptNumber: paid.body.receiptNumber })]);
    expect(res.body.payments[0]).not.toHaveProperty('checkoutSessionId');
  });

  it('is the owner’s: the workroom and the client are refused, an unknown client is not found', async () => {
    expect((await workroom.get(`/api/clients/${clientId}/record`)).status).toBe(403);
    expect((await client.get(`/api/clients/${clientId}/record`)).status).toBe(403);
    const missing = await owner.get('/api/clients/999999/record');
    expect(missing.status).toBe(404);
  });
});
