import request from 'supertest';
import { ApiAgent, addUser, signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../testing/test-app';

describe('sign-in, sessions and CSRF', () => {
  let t: TestApp;
  let owner: { id: number; email: string };

  beforeAll(async () => {
    t = await startTestApp();
    owner = await addUser(t.knex, 'owner');
  });
  afterAll(() => t.close());

  it('signs in with the right password and tells who is signed in', async () => {
    const agent = new ApiAgent(t.app);
    const res = await agent.signIn(owner.email.toUpperCase());
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: owner.id, email: owner.email, name: expect.any(String), role: 'owner', clientId: null });
    expect(res.body.user.passwordHash).toBeUndefined();
    const me = await agent.get('/api/auth/me');
    expect(me.body.user.id).toBe(owner.id);
  });

  it('refuses a wrong password and an unknown e-mail with the same 401', async () => {
    const a = await new ApiAgent(t.app).start();
    const wrong = await a.signIn(owner.email, 'not the password');
    const unknown = await a.signIn('nobody@example.test', TEST_PASSWORD);
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body.error).toEqual({ code: 'bad_credentials', message: expect.stringMatching(/do not match/) });
    }
    expect((await a.get('/api/auth/me')).body.user).toBeNull();
  });

  it('gives a new session id on sign-in, so a planted session id is worthless', async () => {
    // Someone signs in as themselves and plants their session cookie in the owner's browser.
    const planter = await addUser(t.knex, 'workroom');
    const theirs = await signedIn(t.app, planter.email);
    const planted = `ks.sid=${encodeURIComponent(theirs.sessionCookie)}`;
    const me = await request(t.app).get('/api/auth/me').set('Cookie', planted);
    const token = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(String(me.headers['set-cookie']))![1]!);
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('Cookie', `${planted}; XSRF-TOKEN=${encodeURIComponent(token)}`)
      .set('X-XSRF-TOKEN', token)
      .send({ email: owner.email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const fresh = /ks\.sid=s%3A([^.;]+)/.exec(String(res.headers['set-cookie']))?.[1];
    expect(fresh).toBeDefined();
    expect(fresh).not.toBe(theirs.sessionId);
    expect(await t.knex('session').where('sid', theirs.sessionId)).toHaveLength(0);
    expect((await theirs.get('/api/auth/me')).body.user).toBeNull();
  });

  it('destroys the session on sign-out: the old cookie no longer works', async () => {
    const agent = await signedIn(t.app, owner.email);
    const { sessionId, sessionCookie } = agent;
    expect(await t.knex('session').where('sid', sessionId)).toHaveLength(1);
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(await t.knex('session').where('sid', sessionId)).toHaveLength(0);
    const replay = await new ApiAgent(t.app).agent.get('/api/clients').set('Cookie', `ks.sid=${encodeURIComponent(sessionCookie)}`);
    expect(replay.status).toBe(401);
  });

  it('rejects a state-changing request without the CSRF token with a clear 403', async () => {
    const agent = await signedIn(t.app, owner.email);
    const res = await agent.agent.post('/api/clients').send({ name: 'No token' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    expect(res.body.error.message).toMatch(/security token/);
    const forged = await agent.agent.post('/api/clients').set('X-XSRF-TOKEN', 'forged.value').send({ name: 'Forged' });
    expect(forged.status).toBe(403);
    expect(await t.knex('clients').whereIn('name', ['No token', 'Forged'])).toHaveLength(0);
  });

  it('rejects a CSRF token taken from another session', async () => {
    const a = await signedIn(t.app, owner.email);
    const b = await signedIn(t.app, owner.email);
    const res = await b.agent.post('/api/clients').set('X-XSRF-TOKEN', a.csrf).send({ name: 'Cross' });
    expect(res.status).toBe(403);
  });

  it('ends every session of a user whose password is reset', async () => {
    const assistant = await addUser(t.knex, 'workroom');
    const theirs = await signedIn(t.app, assistant.email);
    const boss = await signedIn(t.app, owner.email);
    expect((await theirs.get('/api/clients')).status).toBe(200);
    const reset = await boss.post(`/api/users/${assistant.id}/password`, { password: 'a brand new password' });
    expect(reset.status).toBe(204);
    expect((await theirs.get('/api/clients')).status).toBe(401);
    expect((await new ApiAgent(t.app).signIn(assistant.email, 'a brand new password')).status).toBe(200);
  });

  it('lets a signed-in user change their own password: their other sessions end, this one goes on', async () => {
    const maker = await addUser(t.knex, 'client');
    const here = await signedIn(t.app, maker.email);
    const elsewhere = await signedIn(t.app, maker.email);
    const res = await here.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a fresh long password' });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(maker.id);
    expect((await here.get('/api/auth/me')).body.user.id).toBe(maker.id);
    expect((await here.post('/api/auth/sign-out')).status).toBe(204); // the fresh CSRF token works
    expect((await elsewhere.get('/api/auth/me')).body.user).toBeNull();
    expect((await new ApiAgent(t.app).signIn(maker.email)).status).toBe(401);
    expect((await new ApiAgent(t.app).signIn(maker.email, 'a fresh long password')).status).toBe(200);
  });

  it('refuses a password change without the right current password, and keeps the old one', async () => {
    const maker = await addUser(t.knex, 'workroom');
    const agent = await signedIn(t.app, maker.email);
    const wrong = await agent.post('/api/auth/password', { currentPassword: 'not my password', newPassword: 'a fresh long password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual({ currentPassword: 'This is not your current password.' });
    const same = await agent.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.newPassword).toMatch(/differs/);
    const short = await agent.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'short' });
    expect(short.body.error.fields.newPassword).toMatch(/at least 10/);
    expect((await agent.get('/api/clients')).status).toBe(200);
    expect((await new ApiAgent(t.app).signIn(maker.email)).status).toBe(200);
    const anonymous = await new ApiAgent(t.app).start();
    expect((await anonymous.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a fresh long password' })).status).toBe(401);
  });

  it('validates the sign-in body', async () => {
    const a = await new ApiAgent(t.app).start();
    const res = await a.post('/api/auth/sign-in', { email: '', extra: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      email: 'Enter your e-mail address.',
      password: 'Enter your password.',
      extra: 'This field is not accepted here.',
    });
  });
});

describe('sign-in rate limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ signInLimit: 3, signInWindowMs: 60_000 });
  });
  afterAll(() => t.close());

  it('answers 429 with a message once the failed attempts run out', async () => {
    const owner = await addUser(t.knex, 'owner');
    const a = await new ApiAgent(t.app).start();
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await a.signIn(owner.email, 'wrong password')).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const limited = await a.signIn(owner.email);
    expect(limited.status).toBe(429);
    expect(limited.body.error).toEqual({ code: 'rate_limited', message: expect.stringMatching(/wait 1 minute/) });
  });
});

describe('session expiry', () => {
  const expiresIn = async (t: TestApp, sid: string) => {
    const [row] = await t.knex('session').where('sid', sid).select(t.knex.raw('extract(epoch from expire - now()) AS seconds'));
    return Number(row.seconds);
  };

  describe('with the default settings', () => {
    let t: TestApp;
    let owner: { id: number; email: string };
    beforeAll(async () => {
      t = await startTestApp();
      owner = await addUser(t.knex, 'owner');
    });
    afterAll(() => t.close());

    it('ends a session idle for longer than its limit: the next request is signed out', async () => {
      const agent = await signedIn(t.app, owner.email);
      expect((await agent.get('/api/clients')).status).toBe(200);
      await t.knex('session').where('sid', agent.sessionId).update({ expire: t.knex.raw("now() - interval '1 second'") });
      const res = await agent.get('/api/clients');
      expect(res.status).toBe(401);
      expect(res.body.error.message).toMatch(/sign in/i);
      expect((await agent.get('/api/auth/me')).body.user).toBeNull();
    });

    it('lasts 12 hours from the last request, in the cookie and in the database', async () => {
      const agent = await signedIn(t.app, owner.email);
      expect(await expiresIn(t, agent.sessionId)).toBeGreaterThan(12 * 3600 - 60);
      const res = await agent.get('/api/clients');
      const cookie = String(res.headers['set-cookie']);
      const expires = Date.parse(/ks\.sid=[^;]+;[^,]*?Expires=([^;]+)/.exec(cookie)![1]!);
      expect(expires - Date.now()).toBeGreaterThan(12 * 3600 * 1000 - 60_000);
      expect(expires - Date.now()).toBeLessThanOrEqual(12 * 3600 * 1000);
    });

    it('writes an unchanged session row at most once a minute, not on every request', async () => {
      const agent = await signedIn(t.app, owner.email);
      // Pretend the row is about to expire; requests within the minute after sign-in leave it alone.
      await t.knex('session').where('sid', agent.sessionId).update({ expire: t.knex.raw("now() + interval '10 minutes'") });
      for (let i = 0; i < 3; i++) expect((await agent.get('/api/clients')).status).toBe(200);
      expect(await expiresIn(t, agent.sessionId)).toBeLessThan(11 * 60);
    });
  });

  describe('with a shorter limit and every request writing the expiry', () => {
    let t: TestApp;
    let owner: { id: number; email: string };
    beforeAll(async () => {
      t = await startTestApp({ sessionIdleMinutes: 30, sessionTouchSeconds: 0 });
      owner = await addUser(t.knex, 'owner');
    });
    afterAll(() => t.close());

    it('moves the expiry on with each request, so a working maker is never signed out mid-job', async () => {
      const agent = await signedIn(t.app, owner.email);
      await t.knex('session').where('sid', agent.sessionId).update({ expire: t.knex.raw("now() + interval '1 minute'") });
      expect((await agent.get('/api/clients')).status).toBe(200);
      const left = await expiresIn(t, agent.sessionId);
      expect(left).toBeGreaterThan(30 * 60 - 60);
      expect(left).toBeLessThanOrEqual(30 * 60 + 2); // the store rounds the expiry to whole seconds
    });
  });
});
