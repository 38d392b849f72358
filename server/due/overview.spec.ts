import { addDays, today } from '../core/calendar';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import { acceptedWithDeposit, logGarment, sharedDesign } from '../testing/due-fixtures';
import { endOfWeek, weekOf } from './due-dates';

describe('the overview (what is due)', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;
  let clientId: number;
  const day = today();
  const nextWeekEnds = addDays(endOfWeek(day), 7);

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const c = await addUser(t.knex, 'client');
    clientId = c.clientId!;
    client = await signedIn(t.app, c.email);
    await t.knex('clients').where('id', clientId).update({ name: 'Ines Marlow', email: 'ines@post.test' });
  });
  afterAll(() => t.close());

  it('counts weeks from Monday to Sunday', () => {
    // 4 December 2026 is a Friday (any calendar).
    expect(endOfWeek('2026-12-04')).toBe('2026-12-06');
    expect(endOfWeek('2026-12-06')).toBe('2026-12-06');
    expect(endOfWeek('2026-12-07')).toBe('2026-12-13');
    expect(weekOf('2026-12-03', '2026-12-04')).toBe('overdue');
    expect(weekOf('2026-12-06', '2026-12-04')).toBe('this');
    expect(weekOf('2026-12-07', '2026-12-04')).toBe('next');
  });

  it('shows an empty page with every section when nothing is due', async () => {
    const res = await owner.get('/api/overview');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ today: day, nextWeekEnds, deadlines: [], garmentsExpected: [], designsAwaiting: [], quotesExpiring: [], balancesDue: [] });
  });

  it('lists the open deadlines up to the end of next week with their stage, overdue ones first', async () => {
    const overdue = await addCommission(t.knex, clientId, { title: 'Late baby quilt', deadline: addDays(day, -2), stage: 'piecing' });
    const soon = await addCommission(t.knex, clientId, { title: 'Wedding quilt', deadline: day, stage: 'quilting' });
    const next = await addCommission(t.knex, clientId, { title: 'Rugby shirt quilt', deadline: nextWeekEnds, stage: 'booked' });
    await addCommission(t.knex, clientId, { title: 'Far off quilt', deadline: addDays(nextWeekEnds, 1) });
    await addCommission(t.knex, clientId, { title: 'Delivered quilt', deadline: day, stage: 'delivered' });
    await addCommission(t.knex, clientId, { title: 'Cancelled quilt', deadline: day, stage: 'cancelled' });

    const { deadlines } = (await owner.get('/api/overview')).body;
    expect(deadlines).toEqual([
      { commissionId: overdue, title: 'Late baby quilt', clientName: 'Ines Marlow', stage: 'piecing', deadline: addDays(day, -2), daysLeft: -2, week: 'overdue' },
      { commissionId: soon, title: 'Wedding quilt', clientName: 'Ines Marlow', stage: 'quilting', deadline: day, daysLeft: 0, week: 'this' },
      expect.objectContaining({ commissionId: next, stage: 'booked', week: 'next' }),
    ]);
  });

  it('lists garments not arrived yet and designs the client has not answered', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Memory quilt for Dad', stage: 'booked' });
    await logGarment(owner, commission, 'Blue work shirt');
    await logGarment(owner, commission, 'Tartan scarf', true);
    await sharedDesign(owner, commission);
    const answered = await addCommission(t.knex, clientId, { title: 'Answered design quilt' });
    await sharedDesign(owner, answered);
    await client.post(`/api/commissions/${answered}/design/response`, { response: 'approved' });

    const body = (await owner.get('/api/overview')).body;
    expect(body.garmentsExpected).toEqual([expect.objectContaining({ commissionId: commission, title: 'Memory quilt for Dad', description: 'Blue work shirt', waitingDays: 0 })]);
    expect(body.designsAwaiting).toEqual([{ commissionId: commission, title: 'Memory quilt for Dad', version: 1, sharedOn: day, waitingDays: 0 }]);
  });

  it('shows the owner quotes running out within a week and balances still owed', async () => {
    const quoted = await addCommission(t.knex, clientId, { title: 'Quoted quilt', stage: 'quoted' });
    const q = await sendQuote(owner, quoted);
    await t.knex('quotes').where('id', q.id).update({ validUntil: addDays(day, 3) });
    const later = await addCommission(t.knex, clientId, { title: 'Later quote quilt', stage: 'quoted' });
    await sendQuote(owner, later); // valid for 30 days: not yet
    const booked = await addCommission(t.knex, clientId, { title: 'Booked quilt', stage: 'booked', deadline: addDays(day, 40) });
    const accepted = await acceptedWithDeposit(t.knex, owner, booked);

    const body = (await owner.get('/api/overview')).body;
    expect(body.quotesExpiring).toEqual([{ quoteId: q.id, commissionId: quoted, title: 'Quoted quilt', version: 1, validUntil: addDays(day, 3), daysLeft: 3, totalPence: q.totals.totalPence }]);
    expect(body.balancesDue).toEqual([{ commissionId: booked, title: 'Booked quilt', stage: 'booked', deadline: addDays(day, 40), balancePence: accepted.totals.totalPence - accepted.totals.depositPence }]);
  });

  it('gives the workroom the same page without any money', async () => {
    const res = await workroom.get('/api/overview');
    expect(res.status).toBe(200);
    expect(res.body.deadlines.length).toBeGreaterThan(0);
    expect(res.body.garmentsExpected.length).toBe(1);
    expect(res.body).not.toHaveProperty('quotesExpiring');
    expect(res.body).not.toHaveProperty('balancesDue');
    expect(JSON.stringify(res.body)).not.toMatch(/Pence|validUntil/);
  });

  it('is not for clients', async () => {
    expect((await client.get('/api/overview')).status).toBe(403);
  });
});
