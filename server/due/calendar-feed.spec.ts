import { addDays, today } from '../core/calendar';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';

/** The VEVENT blocks of an iCalendar text, each as its unfolded property lines (RFC 5545, 3.1). */
function events(ics: string): Array<Record<string, string>> {
  const lines = ics.replace(/\r\n[ \t]/g, '').split('\r\n');
  const out: Array<Record<string, string>> = [];
  let current: Record<string, string> | null = null;
  for (const line of lines) {
    if (line === 'BEGIN:VEVENT') current = {};
    else if (line === 'END:VEVENT') {
      out.push(current!);
      current = null;
    } else if (current) {
      const colon = line.indexOf(':');
      current[line.slice(0, colon)] = line.slice(colon + 1);
    }
  }
  return out;
}

describe('the calendar feed of deadlines', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let commission: number;
  const anonymous = () => new ApiAgent(t.app);
  const path = (url: string) => new URL(url).pathname;
  const day = addDays(today(), 5);

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const c = await addUser(t.knex, 'client');
    await t.knex('clients').where('id', c.clientId!).update({ name: 'Odile Fenwick', email: 'odile@post.test', phone: '01632 960123', address: '4 Mill Lane' });
    commission = await addCommission(t.knex, c.clientId!, { title: 'Christening quilt', deadline: day, stage: 'piecing' });
    await addCommission(t.knex, c.clientId!, { title: 'Cancelled quilt', deadline: day, stage: 'cancelled' });
    await addCommission(t.knex, c.clientId!, { title: 'No date quilt' });
  });
  afterAll(() => t.close());

  it('has no address until the owner makes one', async () => {
    expect((await owner.get('/api/settings')).body.calendarFeedMadeAt).toBeNull();
    expect((await anonymous().get(`/api/calendar/${'a'.repeat(43)}.ics`)).status).toBe(404);
  });

  it('serves the deadlines as valid iCalendar all-day events with the title and stage and nothing about the client', async () => {
    const made = await owner.post('/api/settings/calendar-feed');
    expect(made.status).toBe(201);
    expect(made.body.url).toMatch(/^http:\/\/127\.0\.0\.1:4300\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
    const res = await anonymous().get(path(made.body.url));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const ics = res.text;
    expect(ics.startsWith('BEGIN:VCALENDAR\r\n')).toBe(true);
    expect(ics.trimEnd().endsWith('END:VCALENDAR')).toBe(true);
    expect(ics).toContain('VERSION:2.0');
    expect(ics).toMatch(/PRODID:/);
    const list = events(ics);
    expect(list).toHaveLength(1);
    const compact = day.replace(/-/g, '');
    expect(list[0]).toMatchObject({
      'DTSTART;VALUE=DATE': compact,
      'DTEND;VALUE=DATE': addDays(day, 1).replace(/-/g, ''),
      SUMMARY: 'Due: Christening quilt (Piecing)',
      UID: `commission-${commission}-deadline@127.0.0.1:4300`,
    });
    expect(list[0]!['DTSTAMP']).toMatch(/^\d{8}T\d{6}Z$/);
    for (const secret of ['Odile', 'Fenwick', 'odile@post.test', '01632', 'Mill Lane']) expect(ics).not.toContain(secret);
  });

  it('never sends the hash of the secret with the settings', async () => {
    const settings = (await owner.get('/api/settings')).body;
    expect(settings).not.toHaveProperty('calendarFeedHash');
    expect(settings.calendarFeedMadeAt).toEqual(expect.any(String));
    expect((await t.knex('studioSettings').first()).calendarFeedHash).toMatch(/^[0-9a-f]{64}$/);
  });

  it('answers 404 for a wrong secret', async () => {
    const made = await owner.post('/api/settings/calendar-feed');
    const good = path(made.body.url);
    const secret = good.split('/').pop()!.replace('.ics', '');
    const wrong = secret.slice(0, -1) + (secret.endsWith('A') ? 'B' : 'A');
    for (const url of [`/api/calendar/${wrong}.ics`, `/api/calendar/${wrong}`, '/api/calendar/short.ics', `/api/calendar/${secret}.txt`]) {
      const res = await anonymous().get(url);
      expect(res.status).toBe(404);
      expect(res.text).not.toContain('VCALENDAR');
    }
    // With or without .ics, the right one works.
    expect((await anonymous().get(`/api/calendar/${secret}`)).status).toBe(200);
  });

  it('stops the old address when the owner makes a new one, and all of them when she turns it off', async () => {
    const first = path((await owner.post('/api/settings/calendar-feed')).body.url);
    expect((await anonymous().get(first)).status).toBe(200);
    const second = path((await owner.post('/api/settings/calendar-feed')).body.url);
    expect(second).not.toBe(first);
    expect((await anonymous().get(first)).status).toBe(404);
    expect((await anonymous().get(second)).status).toBe(200);
    expect((await owner.delete('/api/settings/calendar-feed')).status).toBe(204);
    expect((await anonymous().get(second)).status).toBe(404);
    expect((await owner.get('/api/settings')).body.calendarFeedMadeAt).toBeNull();
  });

  it('lets only the owner make or stop the address', async () => {
    const workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    expect((await workroom.post('/api/settings/calendar-feed')).status).toBe(403);
    expect((await workroom.delete('/api/settings/calendar-feed')).status).toBe(403);
  });
});
