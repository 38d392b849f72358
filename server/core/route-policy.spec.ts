import { CALLERS, type Caller } from './roles';
import { ROUTE_POLICY } from './route-policy';
import { registeredRoutes } from './secured-router';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';

/**
 * Every route the policy declares, called by every kind of caller: a caller
 * outside the allowed set gets 401 (nobody signed in) or 403 (wrong role);
 * a caller inside it is never refused for who they are.
 */
describe('role x route matrix', () => {
  let t: TestApp;
  const agents = {} as Record<Caller, ApiAgent>;
  let ids: { client: number; user: number };

  beforeAll(async () => {
    t = await startTestApp();
    const owner = await addUser(t.knex, 'owner');
    const workroom = await addUser(t.knex, 'workroom');
    const client = await addUser(t.knex, 'client');
    agents.anonymous = await new ApiAgent(t.app).start();
    agents.owner = await signedIn(t.app, owner.email);
    agents.workroom = await signedIn(t.app, workroom.email);
    agents.client = await signedIn(t.app, client.email);
    ids = { client: client.clientId!, user: workroom.id };
  });
  afterAll(() => t.close());

  it('registers exactly the routes the policy declares', () => {
    expect([...registeredRoutes].sort()).toEqual(Object.keys(ROUTE_POLICY).sort());
  });

  const cases = Object.entries(ROUTE_POLICY).flatMap(([route, allowed]) =>
    CALLERS.map((caller) => ({ route, caller, allowed: (allowed as readonly Caller[]).includes(caller) })),
  );

  it.each(cases)('$route as $caller: allowed=$allowed', async ({ route, caller, allowed }) => {
    const [method, pattern] = route.split(' ') as [string, string];
    // Sign-out would end the session the next cases need; check it on a throwaway agent.
    const agent = route === 'POST /api/auth/sign-out' ? await throwaway(caller) : agents[caller];
    const url = pattern.replace('/api/users/:id', `/api/users/${ids.user}`).replace(':id', String(ids.client));
    const body = route === 'DELETE /api/clients/:id' ? undefined : {};
    const target = route === 'DELETE /api/clients/:id' ? url.replace(String(ids.client), '999999') : url;
    const res =
      method === 'GET' ? await agent.get(target) : await agent.send(method.toLowerCase() as 'post', target, body);
    if (allowed) {
      expect([401, 403]).not.toContain(res.status);
    } else {
      expect(res.status).toBe(caller === 'anonymous' ? 401 : 403);
      expect(res.body.error.code).toBe(caller === 'anonymous' ? 'unauthenticated' : 'forbidden');
    }
  });

  async function throwaway(caller: Caller): Promise<ApiAgent> {
    if (caller === 'anonymous') return new ApiAgent(t.app).start();
    const user = await addUser(t.knex, caller);
    return signedIn(t.app, user.email);
  }
});
