import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';

describe('the commission page: quoted against logged hours', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;
  let clientId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    client = await signedIn(t.app, c.email);
  });
  afterAll(() => t.close());

  const labour = (stage: string, quantity: string) => ({ kind: 'labour', description: `Labour: ${stage}`, quantity, unit: 'hours', unitPricePence: 3000, stage });

  it('shows the owner quoted and logged hours per stage with the margin, and neither the workroom nor the client', async () => {
    const id = await addCommission(t.knex, clientId, { stage: 'piecing' });
    await owner.patch('/api/settings', { hourlyRatePence: 3000, vatRegistered: false });
    // The trial's quote: 18.25 h of labour at £30, sent.
    const quote = await owner.post(`/api/commissions/${id}/quotes`, {
      lines: [labour('preparation', '3'), labour('piecing', '10'), labour('quilting', '4'), labour('binding', '1.25'), { kind: 'material', description: 'Backing', quantity: '2', unit: 'm', unitPricePence: 1450 }],
    });
    expect(quote.status).toBe(201);
    // Before a quote is sent there is nothing to compare with.
    expect((await owner.get(`/api/commissions/${id}`)).body.hoursCompared).toBeNull();
    await t.knex('quotes').where('id', quote.body.id).update({ status: 'sent' });
    // 21.5 h logged.
    for (const [stage, hours] of [['preparation', 2.5], ['piecing', 7.5], ['piecing', 5], ['quilting', 4.5], ['binding', 1], ['cutting', 1]] as const) {
      expect((await workroom.post(`/api/commissions/${id}/hours`, { stage, hours, workedOn: '2026-11-20' })).status).toBe(201);
    }
    const page = await owner.get(`/api/commissions/${id}`);
    expect(page.body.hoursCompared).toMatchObject({ quoteId: quote.body.id, quoteVersion: 1, hourlyRatePence: 3000 });
    expect(page.body.hoursCompared.stages.map((s: { stage: string; quotedHours: string; loggedHours: string }) => [s.stage, s.quotedHours, s.loggedHours])).toEqual([
      ['preparation', '3.00', '2.50'],
      ['cutting', '0.00', '1.00'],
      ['piecing', '10.00', '12.50'],
      ['quilting', '4.00', '4.50'],
      ['binding', '1.25', '1.00'],
    ]);
    // Hand-worked: 18.25 h x £30 = £547.50 quoted labour; 21.5 h x £30 = £645.00 worked; margin -£97.50. The backing line is not labour.
    expect(page.body.hoursCompared.total).toEqual({ quotedHours: '18.25', loggedHours: '21.50', differenceHours: '3.25', quotedPence: 54750, loggedCostPence: 64500, marginPence: -9750 });

    const seenByWorkroom = await workroom.get(`/api/commissions/${id}`);
    expect(seenByWorkroom.status).toBe(200);
    expect(seenByWorkroom.body.hours.total).toBe('21.50');
    expect(seenByWorkroom.body).not.toHaveProperty('hoursCompared');
    const seenByClient = await client.get(`/api/commissions/${id}`);
    expect(seenByClient.status).toBe(200);
    expect(seenByClient.body).not.toHaveProperty('hoursCompared');
  });
});
