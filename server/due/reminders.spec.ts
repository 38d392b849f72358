import { addDays, today } from '../core/calendar';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import { acceptedWithDeposit, logGarment } from '../testing/due-fixtures';
import { startReminderSweeps, sweepReminders } from './reminders';

const APP = 'http://studio.test';

describe('reminders', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let clientId: number;
  const day = today();
  const reminders = (kind: string) => t.knex('outboxMails').where('kind', `reminder_${kind}`).orderBy('id');

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    clientId = (await addUser(t.knex, 'client')).clientId!;
    await t.knex('clients').where('id', clientId).update({ name: 'Wren Ashby', email: 'wren@post.test' });
  });
  afterAll(() => t.close());

  it('reminds of a quote about to run out once, however many sweeps run, at once or one after another', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Graduation quilt', stage: 'quoted' });
    const q = await sendQuote(owner, commission);
    await t.knex('quotes').where('id', q.id).update({ validUntil: addDays(day, 2) });
    const far = await addCommission(t.knex, clientId, { title: 'Far quote quilt', stage: 'quoted' });
    await sendQuote(owner, far); // runs out in 30 days: no reminder yet

    const counts = await Promise.all([sweepReminders(APP), sweepReminders(APP)]);
    expect(counts.reduce((a, b) => a + b, 0)).toBe(1);
    expect(await sweepReminders(APP)).toBe(0);
    const mails = await reminders('quote_expiry');
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ toAddress: 'wren@post.test', commissionId: commission, status: 'pending' });
    expect(mails[0].subject).toContain('Graduation quilt');
    expect(mails[0].textBody).toContain(`${APP}/portal/${commission}?quote=${q.id}`);
    expect(await t.knex('remindersSent').where({ kind: 'quote_expiry', subjectId: q.id })).toEqual([expect.objectContaining({ dueOn: addDays(day, 2), outboxMailId: mails[0].id })]);
  });

  it('reminds of a balance due in the week before the deadline, not before', async () => {
    const soon = await addCommission(t.knex, clientId, { title: 'Anniversary quilt', stage: 'binding', deadline: addDays(day, 6) });
    const q = await acceptedWithDeposit(t.knex, owner, soon);
    const later = await addCommission(t.knex, clientId, { title: 'Later quilt', stage: 'piecing', deadline: addDays(day, 20) });
    await acceptedWithDeposit(t.knex, owner, later);

    expect(await sweepReminders(APP)).toBe(1);
    const mails = await reminders('balance_due');
    expect(mails.map((m) => m.commissionId)).toEqual([soon]);
    expect(mails[0].textBody).toContain('£');
    expect(mails[0].textBody).toContain(String((q.totals.totalPence - q.totals.depositPence) / 100));
    // Twenty days on, the later one is a week away.
    expect(await sweepReminders(APP, addDays(day, 14))).toBe(1);
    expect((await reminders('balance_due')).map((m) => m.commissionId)).toEqual([soon, later]);
  });

  it('sends no reminder of a kind the owner switched off, and sends it once switched on again', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Rag quilt', stage: 'booked' });
    const g = await logGarment(owner, commission, 'Checked flannel shirt');
    await logGarment(owner, commission, 'Arrived tea towel', true);
    await t.knex('garments').where('id', g.id).update({ createdAt: new Date(Date.now() - 15 * 86_400_000) });
    expect((await owner.patch('/api/settings', { remindGarmentsLate: false })).body.remindGarmentsLate).toBe(false);

    expect(await sweepReminders(APP)).toBe(0);
    expect(await reminders('garments_late')).toHaveLength(0);

    await owner.patch('/api/settings', { remindGarmentsLate: true });
    expect(await sweepReminders(APP)).toBe(1);
    const [mail] = await reminders('garments_late');
    expect(mail.textBody).toContain('Checked flannel shirt');
    expect(mail.textBody).not.toContain('Arrived tea towel');
  });

  it('waits the number of days the owner set before a garment reminder', async () => {
    await owner.patch('/api/settings', { garmentsLateDays: 30 });
    const commission = await addCommission(t.knex, clientId, { title: 'Patience quilt', stage: 'booked' });
    const g = await logGarment(owner, commission, 'Wool jumper');
    await t.knex('garments').where('id', g.id).update({ createdAt: new Date(Date.now() - 20 * 86_400_000) });
    expect(await sweepReminders(APP)).toBe(0);
    expect(await sweepReminders(APP, addDays(day, 10))).toBe(1);
    expect((await reminders('garments_late')).map((m) => m.commissionId)).toContain(commission);
    await owner.patch('/api/settings', { garmentsLateDays: 14 });
  });

  it('refuses a bad reminder setting with a message', async () => {
    const res = await owner.patch('/api/settings', { garmentsLateDays: 0, remindQuoteExpiry: 'yes' });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toContain('at least 1 day');
  });

  it('sends a garment reminder once even when the days to wait are changed after it went', async () => {
    const before = (await reminders('garments_late')).length;
    await owner.patch('/api/settings', { garmentsLateDays: 5 });
    expect(await sweepReminders(APP)).toBe(0);
    expect(await reminders('garments_late')).toHaveLength(before);
    await owner.patch('/api/settings', { garmentsLateDays: 14 });
  });

  it('does not send anything again after a restart: the first sweep of a new process finds it all sent', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Restart quilt', stage: 'quoted' });
    const q = await sendQuote(owner, commission);
    await t.knex('quotes').where('id', q.id).update({ validUntil: day });
    expect(await sweepReminders(APP)).toBe(1);
    const before = Number((await t.knex('outboxMails').count({ n: '*' }).first())!.n);
    const kicks: number[] = [];
    const first = startReminderSweeps(APP, () => kicks.push(1), 60_000);
    await first.firstSweep;
    first.stop();
    const second = startReminderSweeps(APP, () => kicks.push(2), 60_000);
    await second.firstSweep;
    second.stop();
    expect(Number((await t.knex('outboxMails').count({ n: '*' }).first())!.n)).toBe(before);
    expect(kicks).toEqual([]);
  });

  it('sends on the first sweep after a start what came due while the server was stopped', async () => {
    const commission = await addCommission(t.knex, clientId, { title: 'Overnight quilt', stage: 'quoted' });
    const q = await sendQuote(owner, commission);
    await t.knex('quotes').where('id', q.id).update({ validUntil: addDays(day, 1) });
    const kicks: string[] = [];
    const sweeps = startReminderSweeps(APP, () => kicks.push('kick'), 60_000);
    await sweeps.firstSweep;
    sweeps.stop();
    expect(kicks).toEqual(['kick']);
    expect((await reminders('quote_expiry')).map((m) => m.commissionId)).toContain(commission);
  });
});
