import { ROUTE_POLICY } from './route-policy';
import type { Caller } from './roles';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import sharp from 'sharp';

/**
 * Client B against client A's records, on every route the policy declares
 * that takes an id: whatever B is allowed to call, A's records answer 404
 * (never 200, never a change), and every state-changing route refuses a
 * request without its CSRF token.
 */
describe('one client never reaches another client\u2019s records', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let clientA: ApiAgent;
  let clientB: ApiAgent;
  let ids: Record<string, number>;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const a = await addUser(t.knex, 'client');
    const b = await addUser(t.knex, 'client');
    clientA = await signedIn(t.app, a.email);
    clientB = await signedIn(t.app, b.email);
    await t.knex('clients').where('id', a.clientId!).update({ name: 'Alma Private', email: 'alma@post.test' });
    const commission = await addCommission(t.knex, a.clientId!, { title: 'Alma private quilt' });
    const garment = (await clientA.post(`/api/commissions/${commission}/garments`, { description: 'Alma private shirt' })).body;
    const jpeg = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#123456' } }).jpeg().toBuffer();
    const photo = (await clientA.agent.post(`/api/garments/${garment.id}/photos`).set('X-XSRF-TOKEN', clientA.csrf).attach('photos', jpeg, 'a.jpg')).body.items[0];
    const quote = await sendQuote(owner, commission);
    ids = { clients: a.clientId!, commissions: commission, garments: garment.id, photos: photo.id, quotes: quote.id };
  }, 30_000);
  afterAll(() => t.close());

  const clientRoutes = Object.entries(ROUTE_POLICY)
    .filter(([route, callers]) => route.includes(':id') && (callers as readonly Caller[]).includes('client'))
    .map(([route]) => route);

  it('has client routes with ids to check', () => expect(clientRoutes.length).toBeGreaterThan(10));

  it.each(clientRoutes)('%s with client A\u2019s id answers client B with 404', async (route) => {
    const [method, pattern] = route.split(' ') as [string, string];
    const area = pattern.split('/')[2]!;
    const id = ids[area];
    if (id === undefined) throw new Error(`No record of client A for ${area}`);
    const before = await t.knex('commissions').where('id', ids['commissions']).first();
    const url = pattern.replace(':id', String(id));
    // A body that would be accepted on B's own record, so only ownership decides.
    const bodies: Record<string, object> = {
      'POST /api/quotes/:id/accept': { name: 'Bertie B' },
      'POST /api/commissions/:id/design/response': { response: 'approved' },
      'POST /api/commissions/:id/garments': { description: 'Sneaked in' },
    };
    const res = method === 'GET' ? await clientB.get(url) : await clientB.send(method.toLowerCase() as 'post', url, bodies[route] ?? {});
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toMatch(/Alma Private|alma@post\.test|Alma private/);
    expect(await t.knex('commissions').where('id', ids['commissions']).first()).toEqual(before);
  });

  it('never lists or finds client A\u2019s records for client B', async () => {
    expect((await clientB.get('/api/clients?q=Alma')).body.total).toBe(0);
    expect((await clientB.get('/api/commissions?q=Alma&pageSize=100')).body.total).toBe(0);
    expect((await clientB.get(`/api/commissions?clientId=${ids['clients']}`)).body.total).toBe(0);
    expect((await clientB.agent.get(`/api/photos/${ids['photos']}/image`)).status).toBe(404);
    expect((await clientB.agent.get(`/api/photos/${ids['photos']}/thumb`)).status).toBe(404);
    expect(await t.knex('garments').where('description', 'Sneaked in')).toHaveLength(0);
    // Client A does see them.
    expect((await clientA.agent.get(`/api/photos/${ids['photos']}/image`)).status).toBe(200);
  });

  const writes = Object.entries(ROUTE_POLICY)
    .filter(([route]) => !route.startsWith('GET') && route !== 'POST /api/payments/webhook')
    .map(([route, callers]) => [route, (callers as readonly Caller[]).find((c) => c !== 'anonymous') ?? 'anonymous'] as const);

  it.each(writes)('%s refuses a request without its CSRF token (403)', async (route, caller) => {
    const [method, pattern] = route.split(' ') as [string, string];
    const agent = caller === 'owner' ? owner : caller === 'client' ? clientA : await new ApiAgent(t.app).start();
    const url = pattern.replace(':id', String(ids['commissions'])).replace(':n', '0');
    const res = await agent.agent[method.toLowerCase() as 'post'](url).send({});
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
  });
});
