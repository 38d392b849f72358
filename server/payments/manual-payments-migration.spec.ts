import { createTestDatabase, type TestDatabase } from '../testing/test-database';
import { addCommission } from '../testing/fixtures';
import * as migration from '../../migrations/20261204203000_manual_payments';

// Payments recorded by hand and numbered receipts: the columns come and go, and payments that counted before get their numbers in the order they were paid.
describe('the manual payments migration', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  it('numbers the payments that counted before it in the order they were paid, and on the way down removes only those recorded by hand', async () => {
    const [client] = await db.knex('clients').insert({ name: 'Ida Hartley' }).returning('id');
    const commission = await addCommission(db.knex, client.id);
    const [quote] = await db.knex('quotes').insert({ commissionId: commission, version: 1, status: 'accepted', depositPercent: '30', vatMode: 'line' }).returning('id');
    const card = (kind: string, paidAt: string | null, status = 'paid') => ({ commissionId: commission, quoteId: quote.id, kind, amountPence: 1000, status, paidAt: paidAt ? new Date(paidAt) : null });

    await migration.down(db.knex);
    const [balance] = await db.knex('payments').insert(card('balance', '2026-11-02T10:00:00Z')).returning('id');
    const [deposit] = await db.knex('payments').insert(card('deposit', '2026-11-01T10:00:00Z', 'refunded')).returning('id');
    const [open] = await db.knex('payments').insert(card('deposit', null, 'pending')).returning('id');
    await migration.up(db.knex);
    const numbers = Object.fromEntries((await db.knex('payments').select('id', 'receiptNumber', 'method')).map((p) => [p.id, [p.receiptNumber, p.method]]));
    expect(numbers).toEqual({ [deposit.id]: [1, 'card'], [balance.id]: [2, 'card'], [open.id]: [null, 'card'] });
    // The next receipt follows on from them.
    expect((await db.knex.raw(`SELECT nextval('payment_receipt_numbers') AS n`)).rows[0].n).toBe('3');

    await db.knex('payments').where('id', balance.id).delete();
    await db.knex('payments').insert({ ...card('balance', '2026-11-03T10:00:00Z'), method: 'cash', receivedOn: '2026-11-03', reference: 'Cash' });
    await migration.down(db.knex);
    expect((await db.knex('payments').orderBy('id').pluck('id')).sort()).toEqual([deposit.id, open.id].sort());
    const columns = await db.knex('information_schema.columns').where({ table_name: 'payments' }).pluck('column_name');
    expect(columns).not.toContain('receipt_number');
    expect(columns).not.toContain('method');
    await migration.up(db.knex);
  });
});
