import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { ALL_STAGES } from '@keepstitch/shared';
import { addCommission } from '../testing/fixtures';

describe('commissions API', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let clientA: ApiAgent;
  let clientB: ApiAgent;
  let clientAId: number;
  let clientBId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const a = await addUser(t.knex, 'client');
    const b = await addUser(t.knex, 'client');
    clientAId = a.clientId!;
    clientBId = b.clientId!;
    clientA = await signedIn(t.app, a.email);
    clientB = await signedIn(t.app, b.email);
  });
  afterAll(() => t.close());

  it('opens a commission at enquiry, with its size held exactly from fractions', async () => {
    const res = await owner.post('/api/commissions', {
      clientId: clientAId,
      title: 'Work-shirt memory quilt',
      kind: 'memory_quilt',
      recipient: 'Her son',
      ageGroup: 'adult',
      width: '60 1/2',
      length: '80',
      unit: 'in',
      deadline: '2027-03-01',
      budgetPence: 45000,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ stage: 'enquiry', widthMm: '1536.7', lengthMm: '2032', deadline: '2027-03-01', budgetPence: 45000 });
    const detail = await owner.get(`/api/commissions/${res.body.id}`);
    expect(detail.body.stageHistory).toEqual([expect.objectContaining({ fromStage: null, toStage: 'enquiry' })]);
    expect(detail.body.client).toEqual({ id: clientAId, name: expect.any(String) });
  });

  it('rejects bad commission input with field messages', async () => {
    const res = await owner.post('/api/commissions', { clientId: clientAId, title: '', kind: 'duvet', ageGroup: 'teen', width: '7 1/2 3/4', deadline: '2027-02-30', budgetPence: -1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['ageGroup', 'budgetPence', 'deadline', 'kind', 'title', 'width']);
    expect(res.body.error.fields.deadline).toBe('That date does not exist.');
    const noClient = await owner.post('/api/commissions', { clientId: 999999, title: 'X', kind: 'cushion', ageGroup: 'adult' });
    expect(noClient.status).toBe(400);
  });

  it('sorts by stage in the workroom order of the stages, not by the alphabet', async () => {
    const client = await addUser(t.knex, 'client');
    // Inserted in an order that is neither the stages' order nor the alphabet's.
    for (const stage of ['ready', 'cancelled', 'booked', 'cutting', 'enquiry', 'garments_in']) await addCommission(t.knex, client.clientId!, { stage });
    const asc = await owner.get(`/api/commissions?clientId=${client.clientId}&sort=stage&dir=asc`);
    expect(asc.status).toBe(200);
    const order = asc.body.items.map((c: { stage: string }) => c.stage);
    expect(order).toEqual(['enquiry', 'booked', 'garments_in', 'cutting', 'ready', 'cancelled']);
    expect(order).toEqual([...order].sort((a, b) => ALL_STAGES.indexOf(a) - ALL_STAGES.indexOf(b)));
    const desc = await owner.get(`/api/commissions?clientId=${client.clientId}&sort=stage&dir=desc`);
    expect(desc.body.items.map((c: { stage: string }) => c.stage)).toEqual([...order].reverse());
  });

  it('moves through the stages by the rules and records each move', async () => {
    const id = await addCommission(t.knex, clientAId);
    const move = (to: string, note?: string) => workroom.post(`/api/commissions/${id}/stage`, note ? { to, note } : { to });
    expect((await move('booked')).status).toBe(200);
    const early = await move('cutting');
    expect(early.status).toBe(409);
    expect(early.body.error.message).toBe('"Cutting" comes after "Garments in": move to that stage first.');
    const noGarments = await move('garments_in');
    expect(noGarments.status).toBe(409);
    const [g] = await t.knex('garments').insert({ commissionId: id, description: 'Blue shirt' }).returning('id');
    await t.knex('custodyEvents').insert({ garmentId: g.id, kind: 'received' });
    expect((await move('garments_in')).status).toBe(200);
    expect((await move('preparation')).status).toBe(200);
    expect((await move('cutting')).body).toMatchObject({ stage: 'cutting' });
    const back = await move('preparation');
    expect(back.status).toBe(400);
    expect(back.body.error.fields.note).toBe('A note is needed for this move.');
    expect((await move('preparation', 'Moved on too soon')).status).toBe(200);
    const detail = await owner.get(`/api/commissions/${id}`);
    expect(detail.body.stageHistory.map((m: { toStage: string }) => m.toStage)).toEqual(['booked', 'garments_in', 'preparation', 'cutting', 'preparation']);
    expect(detail.body.stage).toBe('preparation');
  });

  it('refuses delivery before ready and cancels only with a note', async () => {
    const id = await addCommission(t.knex, clientAId, { stage: 'binding' });
    expect((await owner.post(`/api/commissions/${id}/stage`, { to: 'delivered' })).status).toBe(409);
    expect((await owner.post(`/api/commissions/${id}/stage`, { to: 'cancelled' })).status).toBe(400);
    expect((await owner.post(`/api/commissions/${id}/stage`, { to: 'cancelled', note: 'Client changed her mind' })).status).toBe(200);
    expect((await owner.post(`/api/commissions/${id}/stage`, { to: 'enquiry', note: 'Reopen' })).status).toBe(409);
  });

  it('logs hours by stage and totals them; clients never see hours', async () => {
    const id = await addCommission(t.knex, clientAId);
    expect((await workroom.post(`/api/commissions/${id}/hours`, { stage: 'cutting', hours: 1.5, workedOn: '2026-11-20' })).status).toBe(201);
    expect((await owner.post(`/api/commissions/${id}/hours`, { stage: 'cutting', hours: 2.25, workedOn: '2026-11-21', note: 'Plate blades' })).status).toBe(201);
    const bad = await owner.post(`/api/commissions/${id}/hours`, { stage: 'cutting', hours: 30, workedOn: 'yesterday' });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['hours', 'workedOn']);
    const detail = await owner.get(`/api/commissions/${id}`);
    expect(detail.body.hours.byStage).toEqual({ cutting: '3.75' });
    expect(detail.body.hours.total).toBe('3.75');
    const theirs = await clientA.get(`/api/commissions/${id}`);
    expect(theirs.status).toBe(200);
    expect(theirs.body.hours).toBeUndefined();
    expect(theirs.body.notes).toBeUndefined();
  });

  it('shows a client only its own commissions and 404s the rest', async () => {
    const mine = await addCommission(t.knex, clientAId, { title: 'Mine' });
    const theirs = await addCommission(t.knex, clientBId, { title: 'Theirs' });
    const list = await clientA.get('/api/commissions?pageSize=100');
    expect(list.body.items.every((c: { clientId: number }) => c.clientId === clientAId)).toBe(true);
    expect((await clientA.get(`/api/commissions/${theirs}`)).status).toBe(404);
    expect((await clientA.get(`/api/commissions?clientId=${clientBId}`)).body.total).toBe(0);
    expect((await clientB.get(`/api/commissions/${mine}`)).status).toBe(404);
    expect((await clientA.post(`/api/commissions/${mine}/stage`, { to: 'booked' })).status).toBe(403);
  });

  it('hides the budget from the workroom', async () => {
    const id = await addCommission(t.knex, clientAId, { budgetPence: 30000 });
    expect((await workroom.get(`/api/commissions/${id}`)).body.budgetPence).toBeUndefined();
    expect((await owner.get(`/api/commissions/${id}`)).body.budgetPence).toBe(30000);
  });

  it('filters by stage, client, text and deadline window, and pages', async () => {
    const soon = new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10);
    const late = new Date(Date.now() - 2 * 86_400_000).toISOString().slice(0, 10);
    await addCommission(t.knex, clientBId, { title: 'Zinnia cushion', stage: 'piecing', deadline: soon });
    await addCommission(t.knex, clientBId, { title: 'Zinnia wall hanging', stage: 'quilting', deadline: late });
    const byStage = await owner.get('/api/commissions?stage=piecing,quilting&q=zinnia');
    expect(byStage.body.total).toBe(2);
    const due = await owner.get('/api/commissions?dueWithinDays=7&q=zinnia&sort=deadline');
    expect(due.body.items.map((c: { title: string }) => c.title)).toEqual(['Zinnia wall hanging', 'Zinnia cushion']);
    expect(due.body.items[0]).toMatchObject({ overdue: true, daysLeft: -2 });
    expect(due.body.items[1]).toMatchObject({ overdue: false, daysLeft: 5 });
    const paged = await owner.get('/api/commissions?q=zinnia&pageSize=1&page=1&sort=title');
    expect(paged.body.items.map((c: { title: string }) => c.title)).toEqual(['Zinnia wall hanging']);
    expect(paged.body.total).toBe(2);
    expect(paged.body.items[0].client).toEqual({ id: clientBId, name: expect.any(String) });
    expect(Object.keys(paged.body.items[0])).not.toContain('pageTotal');
    expect(Object.keys(paged.body.items[0])).not.toContain('clientName');
    expect((await owner.get('/api/commissions?q=zinnia&pageSize=1&page=9')).body).toEqual({ items: [], total: 2 });
    expect((await owner.get('/api/commissions?stage=nowhere')).status).toBe(400);
  });

  it('carries the safe-sleep notice on a commission for a baby under 12 months', async () => {
    const id = await addCommission(t.knex, clientAId, { kind: 'baby_quilt', ageGroup: 'baby_under_1' });
    const detail = await clientA.get(`/api/commissions/${id}`);
    expect(detail.body.cautions.map((c: { code: string }) => c.code)).toContain('safe_sleep');
  });

  it('will not delete a client who still has commissions', async () => {
    const res = await owner.delete(`/api/clients/${clientBId}`);
    expect(res.status).toBe(409);
  });
});
