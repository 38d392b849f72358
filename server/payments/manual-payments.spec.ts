import { readPdf } from '../testing/pdf-reader';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';

/** The words of a PDF with runs of white space made one space, so a sentence split across text items still reads as one. */
const words = (pdf: Buffer) => readPdf(pdf).text.replace(/\s+/g, ' ');

describe('money outside the card: payments the owner records, receipts and the balance invoice', () => {
  // Each case sends and accepts a quote, and several read a PDF back in a reader process of its own: slow on a busy machine.
  jest.setTimeout(20_000);
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;
  let otherClient: ApiAgent;
  let clientId: number;

  /** A commission with the money-fixtures quote sent and accepted: total £421.50, deposit £126.45, balance £295.05. */
  async function accepted() {
    const commission = await addCommission(t.knex, clientId, { title: 'Hartley shirt quilt' });
    const q = await sendQuote(owner, commission);
    expect((await client.post(`/api/quotes/${q.id}/accept`, { name: 'Ida Hartley' })).status).toBe(200);
    return { commission, quote: q };
  }
  const cash = (extra: Record<string, unknown> = {}) => ({ kind: 'deposit', amountPence: 12645, method: 'cash', receivedOn: '2026-11-20', reference: 'Cash at the first fitting', ...extra });

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Ida Hartley', email: 'ida@post.test', address: '4 Loom Row, Fernby' });
    client = await signedIn(t.app, c.email);
    otherClient = await signedIn(t.app, (await addUser(t.knex, 'client')).email);
  });
  afterAll(() => t.close());

  it('books the commission with a cash deposit, as a card deposit does, and mails the client a numbered receipt', async () => {
    const { commission } = await accepted();
    const res = await owner.post(`/api/commissions/${commission}/payments/manual`, cash());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'deposit', amountPence: 12645, method: 'cash', status: 'paid', reference: 'Cash at the first fitting', receivedOn: '2026-11-20' });
    expect(res.body.receiptNumber).toEqual(expect.any(Number));
    const detail = await owner.get(`/api/commissions/${commission}`);
    expect(detail.body.stage).toBe('booked');
    expect(detail.body.stageHistory.at(-1)).toMatchObject({ toStage: 'booked', note: 'Deposit paid' });
    expect(await t.knex('outboxMails').where({ commissionId: commission, kind: 'receipt_deposit' })).toHaveLength(1);
    const seen = await client.get(`/api/commissions/${commission}/payments`);
    expect(seen.body.due).toMatchObject({ depositPaid: true, balancePence: 29505, balancePaid: false });
    expect(seen.body.items).toEqual([expect.objectContaining({ method: 'cash', reference: 'Cash at the first fitting' })]);
  });

  it('refuses a second deposit with a 409 that says it is already paid, and records nothing', async () => {
    const { commission } = await accepted();
    expect((await owner.post(`/api/commissions/${commission}/payments/manual`, cash())).status).toBe(201);
    const again = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ method: 'bank_transfer', reference: 'HARTLEY DEP' }));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_paid');
    expect(again.body.error.message).toMatch(/The deposit has already been paid \(£126\.45, receipt R-\d{4}\)/);
    expect(await t.knex('payments').where({ commissionId: commission })).toHaveLength(1);
  });

  it('refuses a balance before the deposit, more than is owed, and any payment without an accepted quote', async () => {
    const { commission } = await accepted();
    const early = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ kind: 'balance', amountPence: 29505 }));
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('deposit_first');
    const tooMuch = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ amountPence: 42151 }));
    expect(tooMuch.status).toBe(409);
    expect(tooMuch.body.error.fields).toEqual({ amountPence: 'At most £421.50 is owed.' });
    const bare = await addCommission(t.knex, clientId);
    expect((await owner.post(`/api/commissions/${bare}/payments/manual`, cash())).body.error.code).toBe('not_accepted');
    expect(await t.knex('payments').whereIn('commissionId', [commission, bare])).toHaveLength(0);
  });

  it('says which fields to correct on a bad payment', async () => {
    const { commission } = await accepted();
    const res = await owner.post(`/api/commissions/${commission}/payments/manual`, { kind: 'tip', amountPence: 12.5, method: 'cheque', receivedOn: '2026-02-30', reference: '  ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      kind: 'Choose whether this is the deposit or the balance.',
      amountPence: 'Enter the amount in whole pence.',
      method: 'Choose cash or bank transfer.',
      receivedOn: 'That date does not exist.',
      reference: expect.stringMatching(/^Enter a reference/),
    });
  });

  it('lets the owner undo a payment recorded by hand, with a note, after which it no longer counts and may be recorded again', async () => {
    const { commission } = await accepted();
    const paid = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ amountPence: 12000 }));
    const noNote = await owner.post(`/api/commissions/${commission}/payments/${paid.body.id}/undo`, { note: ' ' });
    expect(noNote.status).toBe(400);
    const undone = await owner.post(`/api/commissions/${commission}/payments/${paid.body.id}/undo`, { note: 'Typed £120.00; it was £126.45' });
    expect(undone.status).toBe(200);
    expect(undone.body).toMatchObject({ status: 'undone', undoNote: 'Typed £120.00; it was £126.45' });
    expect((await owner.get(`/api/commissions/${commission}/payments`)).body.due).toMatchObject({ depositPaid: false });
    expect((await owner.post(`/api/commissions/${commission}/payments/${paid.body.id}/undo`, { note: 'again' })).status).toBe(409);
    expect((await owner.post(`/api/commissions/${commission}/payments/manual`, cash())).status).toBe(201);
    const seen = await client.get(`/api/commissions/${commission}/payments`);
    expect(seen.body.items[0]).toMatchObject({ status: 'undone' });
    expect(seen.body.items[0]).not.toHaveProperty('undoNote');
  });

  it('prints a receipt with its number, the studio, the client, what was paid and how, and the VAT within it', async () => {
    const { commission } = await accepted();
    await t.knex('studioSettings').update({ vatNumber: 'GB123456789', address: '2 Bobbin Yard, Fernby' });
    // The quote froze the studio's details when it was sent, so the receipt reads them from there.
    await t.knex('quotes').where({ commissionId: commission }).update({ studioSnapshot: JSON.stringify({ name: 'Test Studio', address: '2 Bobbin Yard, Fernby', email: null, vatNumber: 'GB123456789', paymentTerms: 'Balance before delivery.' }) });
    const paid = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ method: 'bank_transfer', reference: 'HARTLEY DEP' }));
    const res = await client.get(`/api/commissions/${commission}/payments/${paid.body.id}/receipt`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = words(res.body as Buffer);
    const number = `R-${String(paid.body.receiptNumber).padStart(4, '0')}`;
    expect(text).toContain(`Receipt ${number}`);
    expect(text).toContain('Test Studio');
    expect(text).toContain('2 Bobbin Yard, Fernby');
    expect(text).toContain('From: Ida Hartley');
    expect(text).toContain('Deposit for Hartley shirt quilt (quote version 1) £126.45');
    expect(text).toContain('Paid by Bank transfer');
    expect(text).toContain('Reference HARTLEY DEP');
    expect(text).toContain('Received 20 November 2026');
    // VAT within the deposit in the quote's proportion: 12645 x 7025 / 42150 = 2107.5, half up 2108 (hand-worked).
    expect(text).toContain('Of which VAT at 20% £21.08');
    expect(text).toContain('Still to pay £295.05');
    expect(text).toContain('VAT registered, VAT number GB123456789.');
  });

  it('says on the receipt and the invoice that a studio not VAT registered charges no VAT', async () => {
    await owner.patch('/api/settings', { vatRegistered: false });
    const commission = await addCommission(t.knex, clientId, { title: 'Cot quilt' });
    const draft = await owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'labour', description: 'Making the cot quilt', quantity: '10', unit: 'hours', unitPricePence: 2500 }] });
    expect(draft.status).toBe(201);
    expect((await owner.post(`/api/quotes/${draft.body.id}/send`)).status).toBe(200);
    expect((await client.post(`/api/quotes/${draft.body.id}/accept`, { name: 'Ida Hartley' })).status).toBe(200);
    const deposit = (await owner.get(`/api/commissions/${commission}/payments`)).body.due.depositPence as number;
    const paid = await owner.post(`/api/commissions/${commission}/payments/manual`, cash({ amountPence: deposit }));
    expect(paid.status).toBe(201);
    const receipt = words((await owner.get(`/api/commissions/${commission}/payments/${paid.body.id}/receipt`)).body as Buffer);
    expect(receipt).toContain('The studio is not VAT registered; no VAT is charged.');
    expect(receipt).not.toContain('Of which VAT');
    const invoice = words((await client.get(`/api/commissions/${commission}/invoice`)).body as Buffer);
    expect(invoice).toContain('The studio is not VAT registered; no VAT is charged.');
    expect(invoice).not.toMatch(/VAT at \d/);
    await owner.patch('/api/settings', { vatRegistered: true, vatRate: '20' });
  });

  it('prints the balance invoice from the accepted quote: its lines, VAT, what was received and the balance due', async () => {
    const { commission } = await accepted();
    const paid = await owner.post(`/api/commissions/${commission}/payments/manual`, cash());
    const res = await client.get(`/api/commissions/${commission}/invoice`);
    expect(res.status).toBe(200);
    const text = words(res.body as Buffer);
    const version = (await t.knex('quotes').where({ commissionId: commission, status: 'accepted' }).first()).version;
    expect(text).toContain(`Invoice INV-${commission}-${version}`);
    expect(text).toContain('To: Ida Hartley');
    // Hand-worked (money-fixtures): 10.5 h x £30.00 = £315.00; 2.5 m x £14.50 = £36.25; VAT 70.25; total 421.50.
    expect(text).toContain('Piecing and quilting £315.00');
    expect(text).toContain('Backing, 2.5 m £36.25');
    expect(text).toContain('VAT at 20% £70.25');
    expect(text).toContain('Total £421.50');
    expect(text).toContain(`Received: deposit, cash, 20 November 2026 (receipt R-${String(paid.body.receiptNumber).padStart(4, '0')}) -£126.45`);
    expect(text).toContain('Balance due £295.05');
  });

  it('numbers receipts one after another, card or not', async () => {
    const a = await accepted();
    const b = await accepted();
    const first = await owner.post(`/api/commissions/${a.commission}/payments/manual`, cash());
    const second = await owner.post(`/api/commissions/${b.commission}/payments/manual`, cash());
    const balance = await owner.post(`/api/commissions/${a.commission}/payments/manual`, cash({ kind: 'balance', amountPence: 29505, method: 'bank_transfer', reference: 'HARTLEY BAL' }));
    expect([second.body.receiptNumber - first.body.receiptNumber, balance.body.receiptNumber - second.body.receiptNumber]).toEqual([1, 1]);
    expect((await owner.get(`/api/commissions/${a.commission}/payments`)).body.due).toMatchObject({ balancePaid: true, balancePence: 0 });
  });

  it('shows a client only its own receipts and invoices, never the workroom, and lets only the owner record or undo', async () => {
    const { commission } = await accepted();
    const paid = await owner.post(`/api/commissions/${commission}/payments/manual`, cash());
    const receipt = `/api/commissions/${commission}/payments/${paid.body.id}/receipt`;
    const invoice = `/api/commissions/${commission}/invoice`;
    expect((await otherClient.get(receipt)).status).toBe(404);
    expect((await otherClient.get(invoice)).status).toBe(404);
    expect((await workroom.get(receipt)).status).toBe(403);
    expect((await workroom.get(invoice)).status).toBe(403);
    expect((await workroom.get(`/api/commissions/${commission}/payments`)).status).toBe(403);
    expect((await client.post(`/api/commissions/${commission}/payments/manual`, cash({ kind: 'balance', amountPence: 29505 }))).status).toBe(403);
    expect((await workroom.post(`/api/commissions/${commission}/payments/manual`, cash({ kind: 'balance', amountPence: 29505 }))).status).toBe(403);
    expect((await client.post(`/api/commissions/${commission}/payments/${paid.body.id}/undo`, { note: 'not mine' })).status).toBe(403);
    expect((await t.knex('payments').where({ commissionId: commission, status: 'paid' })).length).toBe(1);
    // A payment of another commission is not found under this one.
    const other = await accepted();
    expect((await owner.get(`/api/commissions/${other.commission}/payments/${paid.body.id}/receipt`)).status).toBe(404);
  });

  it('never undoes a card payment: its money goes back only as a refund', async () => {
    const { commission, quote } = await accepted();
    const [row] = await t.knex('payments').insert({ commissionId: commission, quoteId: quote.id, kind: 'deposit', amountPence: 12645, receivedPence: 12645, status: 'paid', paidAt: new Date(), paymentIntentId: 'pi_card' }).returning('id');
    const res = await owner.post(`/api/commissions/${commission}/payments/${row.id}/undo`, { note: 'try' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('card_payment');
  });
});
