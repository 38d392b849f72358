import type { ApiAgent } from './test-app';

/** A quote sent to the client: 2 lines, 20% VAT per line, 30% deposit (hand-worked totals in the specs). */
export async function sendQuote(owner: ApiAgent, commissionId: number) {
  await owner.patch('/api/settings', { vatRegistered: true, vatRate: '20', vatMode: 'line', depositPercent: 30, validityDays: 30, studioName: 'Test Studio' });
  const draft = await owner.post(`/api/commissions/${commissionId}/quotes`, {
    lines: [
      { kind: 'labour', description: 'Piecing and quilting', quantity: '10.5', unit: 'hours', unitPricePence: 3000, stage: 'piecing' },
      { kind: 'material', description: 'Backing, 2.5 m', quantity: '2.5', unit: 'm', unitPricePence: 1450 },
    ],
  });
  if (draft.status !== 201) throw new Error(`quote not created: ${JSON.stringify(draft.body)}`);
  const sent = await owner.post(`/api/quotes/${draft.body.id}/send`);
  if (sent.status !== 200) throw new Error(`quote not sent: ${JSON.stringify(sent.body)}`);
  return sent.body as { id: number; totals: { totalPence: number; depositPence: number; balancePence: number } };
}
