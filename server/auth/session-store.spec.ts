import request from 'supertest';
import { ApiAgent, addUser, signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../testing/test-app';
import { SessionStore } from './session-store';

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

describe('session store: what is stored, and for how long', () => {
  let t: TestApp;
  const sessionRows = async () => Number((await t.knex('session').count('* as n'))[0]!.n);

  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('stores no session for anonymous requests, and a fresh browser still signs in', async () => {
    const before = await sessionRows();
    for (let i = 0; i < 20; i++) {
      const res = await new ApiAgent(t.app).get('/api/auth/me');
      expect(res.status).toBe(200);
      expect(res.body.user).toBeNull();
    }
    expect(await sessionRows()).toBe(before);

    const user = await addUser(t.knex, 'workroom');
    const fresh = await new ApiAgent(t.app).start();
    expect(fresh.sessionCookie).toBe('');
    expect((await fresh.signIn(user.email)).status).toBe(200);
    expect(await sessionRows()).toBe(before + 1);
    // The token it was given on signing in works for its next change.
    expect((await fresh.post('/api/auth/sign-out')).status).toBe(204);
    expect(await sessionRows()).toBe(before);
  });

  it("binds an anonymous browser's security token to that browser", async () => {
    const user = await addUser(t.knex, 'workroom');
    const visit = async () => {
      const cookies = String((await request(t.app).get('/api/auth/me')).headers['set-cookie']);
      return { anon: /ks\.anon=([^;]+)/.exec(cookies)![1]!, token: decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(cookies)![1]!) };
    };
    const signIn = (anon: string, token: string) =>
      request(t.app)
        .post('/api/auth/sign-in')
        .set('Cookie', `ks.anon=${anon}; XSRF-TOKEN=${encodeURIComponent(token)}`)
        .set('X-XSRF-TOKEN', token)
        .send({ email: user.email, password: TEST_PASSWORD });
    const mine = await visit();
    const theirs = await visit();
    expect(theirs.anon).not.toBe(mine.anon);
    const borrowed = await signIn(theirs.anon, mine.token);
    expect(borrowed.status).toBe(403);
    expect(borrowed.body.error.code).toBe('csrf');
    expect((await signIn(mine.anon, mine.token)).status).toBe(200);
  });

  it('removes sessions that have expired when it prunes, and keeps live ones', async () => {
    const user = await addUser(t.knex, 'workroom');
    const live = await signedIn(t.app, user.email);
    await t.knex('session').insert({ sid: 'expired-one', sess: JSON.stringify({ cookie: {} }), expire: t.knex.raw("now() - interval '1 minute'") });
    const store = new SessionStore({ pool: t.sessionPool, pruneSeconds: false, touchSeconds: 60 });
    await new Promise<void>((resolve, reject) => store.pruneSessions((err) => (err ? reject(err) : resolve())));
    expect(await t.knex('session').where('sid', 'expired-one')).toHaveLength(0);
    expect(await t.knex('session').where('sid', live.sessionId)).toHaveLength(1);
  });
});
