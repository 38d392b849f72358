import { addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';

describe('session store: the user read with the session', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('reads a signed-in session and its user in one query', async () => {
    const user = await addUser(t.knex, 'workroom');
    const agent = await signedIn(t.app, user.email);
    const sessionQueries: string[] = [];
    const appQueries: string[] = [];
    const spy = jest.spyOn(t.sessionPool, 'query');
    const count = (q: { sql: string }) => appQueries.push(q.sql);
    t.knex.on('query', count);
    const me = await agent.get('/api/auth/me');
    t.knex.off('query', count);
    for (const call of spy.mock.calls) sessionQueries.push(String(call[0]));
    spy.mockRestore();

    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ id: user.id, role: 'workroom' });
    expect(sessionQueries.filter((q) => /FROM session/i.test(q))).toHaveLength(1);
    expect(sessionQueries[0]).toMatch(/JOIN users/);
    expect(appQueries.filter((q) => /"users"/.test(q))).toEqual([]);
  });

  it('sees a change to the user on the very next request', async () => {
    const user = await addUser(t.knex, 'workroom');
    const agent = await signedIn(t.app, user.email);
    await t.knex('users').where({ id: user.id }).update({ name: 'Renamed since', role: 'owner' });
    const me = await agent.get('/api/auth/me');
    expect(me.body.user).toMatchObject({ id: user.id, name: 'Renamed since', role: 'owner' });
  });

  it('ends the session of a user who no longer exists', async () => {
    const user = await addUser(t.knex, 'workroom');
    const agent = await signedIn(t.app, user.email);
    await t.knex('users').where({ id: user.id }).delete();
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user ?? null).toBeNull();
    expect((await agent.get('/api/commissions')).status).toBe(401);
  });

  it('still ends the session when the password changed after it began', async () => {
    const user = await addUser(t.knex, 'workroom');
    const agent = await signedIn(t.app, user.email);
    await t.knex('users').where({ id: user.id }).update({ passwordChangedAt: new Date(Date.now() + 1000) });
    expect((await agent.get('/api/commissions')).status).toBe(401);
  });
});
