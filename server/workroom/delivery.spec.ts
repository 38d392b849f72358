import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { readPdf } from '../testing/pdf-reader';

describe('delivery as a checklist of each garment’s custody', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let clientId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    clientId = (await addUser(t.knex, 'client')).clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Ada Threadgood', email: 'ada@example.test' });
  });
  afterAll(() => t.close());

  async function readyCommissionWith(garments: Array<{ description: string; returnsToClient?: string }>) {
    const id = await addCommission(t.knex, clientId, { stage: 'ready', title: 'Shirt quilt for Ada' });
    const ids: number[] = [];
    for (const g of garments) {
      const res = await owner.post(`/api/commissions/${id}/garments`, g);
      expect(res.status).toBe(201);
      ids.push(res.body.id);
      expect((await owner.post(`/api/garments/${res.body.id}/events`, { kind: 'received' })).status).toBe(201);
    }
    return { id, garments: ids };
  }

  it('refuses delivery while a garment’s custody is open, naming it, and delivers once each garment’s custody has ended', async () => {
    const { id, garments } = await readyCommissionWith([{ description: 'Blue work shirt' }, { description: 'Floral dress', returnsToClient: 'Collar, cuffs and buttons' }]);
    expect((await owner.post(`/api/garments/${garments[0]}/events`, { kind: 'used' })).status).toBe(201);

    const refused = await owner.post(`/api/commissions/${id}/stage`, { to: 'delivered' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe('Record what became of “Floral dress” first (used in the piece, returned whole or leftovers returned): its custody is still open.');
    expect((await t.knex('commissions').where('id', id).first()).stage).toBe('ready');
    expect(await t.knex('outboxMails').where({ commissionId: id })).toHaveLength(0);

    // The page offers delivered disabled, with the same reason.
    const page = await owner.get(`/api/commissions/${id}`);
    expect(page.body.stageOptions).toContainEqual({ stage: 'delivered', allowed: false, reason: refused.body.error.message });
    expect(page.body.nextStages).not.toContain('delivered');

    expect((await owner.post(`/api/garments/${garments[1]}/events`, { kind: 'leftovers_returned', returnMethod: 'post', trackingRef: 'KS-4471', note: 'Wrapped in tissue' })).status).toBe(201);
    const moved = await owner.post(`/api/commissions/${id}/stage`, { to: 'delivered' });
    expect(moved.status).toBe(200);
    expect(moved.body.stage).toBe('delivered');

    const mails = await t.knex('outboxMails').where({ commissionId: id, kind: 'delivered' });
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ toAddress: 'ada@example.test', subject: 'Delivered: Shirt quilt for Ada' });
    expect(mails[0].textBody).toContain('- Blue work shirt: used in the piece; nothing comes back.');
    expect(mails[0].textBody).toContain('- Floral dress: leftovers returned by post (tracking KS-4471): Collar, cuffs and buttons. Note: Wrapped in tissue');
    expect(mails[0].htmlBody).toContain('<li>Floral dress: leftovers returned by post (tracking KS-4471): Collar, cuffs and buttons. Note: Wrapped in tissue</li>');
    expect(mails[0].attachments).toHaveLength(1);
    expect(mails[0].attachments[0]).toMatchObject({ filename: `care-card-${id}.pdf`, contentType: 'application/pdf' });
    const pdf = Buffer.from(mails[0].attachments[0].content, 'base64');
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(readPdf(pdf).text).toMatch(/Caring for your memory quilt.*Washing and pressing/);
  });

  it('refuses a posted leftovers return without its tracking reference', async () => {
    const { garments } = await readyCommissionWith([{ description: 'Grey jumper' }]);
    const res = await owner.post(`/api/garments/${garments[0]}/events`, { kind: 'leftovers_returned', returnMethod: 'post' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ trackingRef: 'Give the tracking reference for leftovers sent by post.' });
  });

  it('counts a place given on receipt as where the garment is stored', async () => {
    const id = await addCommission(t.knex, clientId, { stage: 'booked' });
    const g = (await owner.post(`/api/commissions/${id}/garments`, { description: 'Striped shirt' })).body.id;
    const res = await owner.post(`/api/garments/${g}/events`, { kind: 'received', place: 'Box 7' });
    expect(res.body.state).toMatchObject({ status: 'in_studio', place: 'Box 7' });
    expect((await owner.get(`/api/garments/${g}`)).body.place).toBe('Box 7');
    expect((await owner.get(`/api/commissions/${id}`)).body.garments[0].place).toBe('Box 7');
  });

  it('lists every other stage with whether it is allowed and why not', async () => {
    const id = await addCommission(t.knex, clientId, { stage: 'preparation' });
    const a = (await owner.post(`/api/commissions/${id}/garments`, { description: 'Linen shirt' })).body.id;
    await owner.post(`/api/commissions/${id}/garments`, { description: 'Cord trousers' });
    await owner.post(`/api/garments/${a}/events`, { kind: 'received' });
    const page = (await owner.get(`/api/commissions/${id}`)).body;
    expect(page.stageOptions.find((o: { stage: string }) => o.stage === 'cutting')).toEqual({
      stage: 'cutting',
      allowed: false,
      reason: '1 garment has not been received yet; cutting waits until every garment is in.',
    });
    expect(page.stageOptions.map((o: { stage: string }) => o.stage)).not.toContain('preparation');
    expect(page.nextStages).not.toContain('cutting');
  });
});
