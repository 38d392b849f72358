import * as fc from 'fast-check';
import { ROUTE_POLICY } from './route-policy';
import type { Caller } from './roles';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import { tableFingerprints } from '../testing/table-fingerprints';

/**
 * Hostile and broken input on every write route that reads a JSON body: each
 * generated body is refused with a 4xx and a message, never a 5xx, and leaves
 * the database exactly as it was. The route list comes from ROUTE_POLICY; the
 * routes below are those whose handlers read a body. FUZZ_RUNS sets how many
 * bodies per route (npm test runs a quick pass of 40; `npm run test:bad-input` runs 500).
 */
const RUNS = Number(process.env['FUZZ_RUNS'] ?? 40);
const READS_BODY = new Set([
  'POST /api/auth/sign-in',
  'POST /api/auth/password',
  'POST /api/clients',
  'PATCH /api/clients/:id',
  'POST /api/users',
  'POST /api/users/:id/password',
  'POST /api/commissions',
  'PATCH /api/commissions/:id',
  'POST /api/commissions/:id/stage',
  'POST /api/commissions/:id/hours',
  'POST /api/commissions/:id/garments',
  'POST /api/commissions/:id/design',
  'POST /api/commissions/:id/design/preview',
  'POST /api/commissions/:id/design/response',
  'PATCH /api/garments/:id',
  'POST /api/garments/:id/events',
  'POST /api/garments/:id/panels',
  'PATCH /api/panels/:id',
  'POST /api/stock',
  'PATCH /api/stock/:id',
  'PATCH /api/settings',
  'POST /api/commissions/:id/quotes',
  'PUT /api/quotes/:id',
  'POST /api/quotes/:id/accept',
  'POST /api/quotes/:id/decline',
]);

const FIELDS = ['name', 'email', 'phone', 'title', 'kind', 'ageGroup', 'width', 'height', 'length', 'unit', 'deadline', 'budgetPence', 'to', 'note', 'stage', 'hours', 'workedOn', 'description', 'fibre', 'features', 'place', 'returnMethod', 'correctsEventId', 'grain', 'lines', 'quantity', 'unitPricePence', 'depositPercent', 'vatRate', 'password', 'role', 'clientId', 'body', 'response', 'hourlyRatePence', 'blockMinutes', 'costPence'];

const nasty = fc.oneof(
  fc.constantFrom('', ' ', '1/0', '-3', '7 1/2 3/4', 'NaN', 'Infinity', '1e999', '0', '2027-02-30', 'yesterday', "'; DROP TABLE clients; --", '<script>alert(1)</script>', '../../etc/passwd', '\u0000', '\ud800', '%00', '{{7*7}}'),
  fc.string({ maxLength: 40 }),
  fc.string({ minLength: 5000, maxLength: 20000 }),
  fc.integer(),
  fc.double(),
  fc.constantFrom(-1, 0, 2 ** 53, -(2 ** 31), 1e308, null, true, false),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 4 }),
);

/** A body that cannot be valid: not an object at all, or an object carrying a field no route accepts. */
const badBody = fc.oneof(
  { weight: 1, arbitrary: fc.oneof(fc.constant(null), fc.integer(), fc.string(), fc.array(nasty, { maxLength: 3 })) },
  { weight: 4, arbitrary: fc.tuple(fc.dictionary(fc.constantFrom(...FIELDS), nasty, { maxKeys: 8 }), nasty).map(([fields, extra]) => ({ ...fields, notAField: extra })) },
);

/** Every table but the session store (each request touches its session) and knex's own. */
const fingerprint = (t: TestApp) => tableFingerprints(t.url, ['session', 'knex_migrations', 'knex_migrations_lock']);

describe('bad input on every write route', () => {
  let t: TestApp;
  const agents = {} as Record<Exclude<Caller, 'anonymous'>, ApiAgent>;
  let anonymous: ApiAgent;
  let ids: Record<string, number>;

  beforeAll(async () => {
    t = await startTestApp();
    const owner = await addUser(t.knex, 'owner');
    const workroom = await addUser(t.knex, 'workroom');
    const client = await addUser(t.knex, 'client');
    agents.owner = await signedIn(t.app, owner.email);
    agents.workroom = await signedIn(t.app, workroom.email);
    agents.client = await signedIn(t.app, client.email);
    anonymous = await new ApiAgent(t.app).start();
    await t.knex('clients').where('id', client.clientId!).update({ email: 'fuzz@post.test' });
    const commission = await addCommission(t.knex, client.clientId!);
    const [garment] = await t.knex('garments').insert({ commissionId: commission, description: 'Shirt' }).returning('id');
    const [panel] = await t.knex('panels').insert({ garmentId: garment.id, name: 'back', widthMm: '300', heightMm: '400' }).returning('id');
    const [stock] = await t.knex('stockFabrics').insert({ name: 'Calico', widthMm: '1100', lengthMm: '5000' }).returning('id');
    const sent = await sendQuote(agents.owner, commission);
    const draft = await agents.owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'extra', description: 'Label', quantity: 1, unitPricePence: 500 }] });
    ids = { clients: client.clientId!, users: workroom.id, commissions: commission, garments: garment.id, panels: panel.id, stock: stock.id, quotesDraft: draft.body.id, quotesSent: sent.id };
  }, 30_000);
  afterAll(() => t.close());

  const routes = Object.entries(ROUTE_POLICY).filter(([route]) => READS_BODY.has(route));

  it('covers every body-reading route the policy declares', () => {
    expect(routes.map(([r]) => r).sort()).toEqual([...READS_BODY].sort());
  });

  it.each(routes)('%s refuses every bad body with a 4xx and changes nothing', async (route, callers) => {
    const [method, pattern] = route.split(' ') as [string, string];
    const caller = (['owner', 'client', 'anonymous'] as const).find((c) => (callers as readonly Caller[]).includes(c))!;
    const agent = caller === 'anonymous' ? anonymous : agents[caller];
    const area = pattern.split('/')[2]!;
    const id = area === 'quotes' ? (method === 'PUT' ? ids['quotesDraft'] : ids['quotesSent']) : ids[area];
    const url = pattern.replace(':id', String(id));
    const before = await fingerprint(t);
    await fc.assert(
      fc.asyncProperty(badBody, async (body) => {
        const res = await agent.agent[method.toLowerCase() as 'post'](url)
          .set('X-XSRF-TOKEN', agent.csrf)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        if (res.status < 400 || res.status >= 500 || typeof res.body?.error?.message !== 'string') {
          throw new Error(`${route} answered ${res.status} ${JSON.stringify(res.body).slice(0, 300)} to ${JSON.stringify(body).slice(0, 300)}`);
        }
      }),
      { numRuns: RUNS, seed: 20261202 },
    );
    expect(await fingerprint(t)).toEqual(before);
  }, 120_000);

  it.each(Object.keys(ROUTE_POLICY).filter((r) => r.includes(':id') && !r.startsWith('GET')))('%s answers a guessed or malformed id with a 4xx, never a 5xx', async (route) => {
    const [method, pattern] = route.split(' ') as [string, string];
    await fc.assert(
      fc.asyncProperty(fc.oneof(fc.constantFrom('0', '-1', '99999999', '1.5', '1e3', 'abc', '%27%20OR%201%3D1', '..%2F..'), fc.integer({ min: 100000, max: 2 ** 31 - 1 }).map(String)), async (bad) => {
        const res = await agents.owner.send(method.toLowerCase() as 'post', pattern.replace(':id', bad).replace(':n', '0'), {});
        if (res.status >= 500) throw new Error(`${route} with id ${bad} answered ${res.status}`);
      }),
      { numRuns: 12, seed: 7 },
    );
  });
});
