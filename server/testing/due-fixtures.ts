import type { Knex } from 'knex';
import { squaresDesign } from '../../shared/src/testing/design-fixtures';
import type { ApiAgent } from './test-app';
import { sendQuote } from './money-fixtures';

/** A sent quote, then accepted by the client with its deposit paid (written straight to the database). */
export async function acceptedWithDeposit(knex: Knex, owner: ApiAgent, commissionId: number) {
  const q = await sendQuote(owner, commissionId);
  await knex('quotes').where('id', q.id).update({ status: 'accepted', acceptedAt: new Date(), acceptedName: 'Test Client' });
  await knex('payments').insert({ commissionId, quoteId: q.id, kind: 'deposit', amountPence: q.totals.depositPence, receivedPence: q.totals.depositPence, status: 'paid', paidAt: new Date() });
  return q;
}

/** A garment logged on the commission; `receivedAfter` records its arrival. */
export async function logGarment(owner: ApiAgent, commissionId: number, description: string, received = false) {
  const g = await owner.post(`/api/commissions/${commissionId}/garments`, { description, fibre: 'cotton' });
  if (g.status !== 201) throw new Error(`garment not logged: ${JSON.stringify(g.body)}`);
  if (received) await owner.post(`/api/garments/${g.body.id}/events`, { kind: 'received', place: 'Shelf A' });
  return g.body as { id: number };
}

/** A design saved and shared with the client (not answered yet). */
export async function sharedDesign(owner: ApiAgent, commissionId: number) {
  const saved = await owner.post(`/api/commissions/${commissionId}/design`, { body: squaresDesign(8, 2, 2), note: 'First go' });
  if (saved.status !== 201) throw new Error(`design not saved: ${JSON.stringify(saved.body)}`);
  const shared = await owner.post(`/api/commissions/${commissionId}/design/share`);
  if (shared.status >= 300) throw new Error(`design not shared: ${JSON.stringify(shared.body)}`);
}
