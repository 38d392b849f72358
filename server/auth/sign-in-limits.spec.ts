import { Pool } from 'pg';
import request from 'supertest';
import { createApp } from '../app';
import { ApiAgent, addUser, signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../testing/test-app';
import { ADDRESS_REFUSE_FACTOR } from './sign-in-limits';

/** One sign-in attempt by a browser, from the address a proxy in front says (X-Forwarded-For). */
async function attempt(browser: ApiAgent, email: string, password: string, from?: string) {
  if (!browser.csrf) await browser.start();
  const req = browser.agent.post('/api/auth/sign-in').set('X-XSRF-TOKEN', browser.csrf);
  if (from) req.set('X-Forwarded-For', from);
  const started = Date.now();
  const res = await req.send({ email, password });
  // A sign-in brings a fresh CSRF token, as the app's own client takes it.
  const token = /XSRF-TOKEN=([^;]+)/.exec(String(res.headers['set-cookie'] ?? ''))?.[1];
  if (token) browser.csrf = decodeURIComponent(token);
  return { status: res.status, message: String(res.body?.error?.message ?? ''), ms: Date.now() - started, cookies: String(res.headers['set-cookie'] ?? '') };
}

/** A sign-in from a new browser that holds only the given known-browser cookie value. */
async function withKnownCookie(t: TestApp, known: string, email: string) {
  const me = await request(t.app).get('/api/auth/me');
  const cookies = String(me.headers['set-cookie']);
  const token = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(cookies)![1]!);
  const anon = /ks\.anon=([^;]+)/.exec(cookies)![1]!;
  const res = await request(t.app)
    .post('/api/auth/sign-in')
    .set('Cookie', `ks.anon=${anon}; XSRF-TOKEN=${encodeURIComponent(token)}; ks.known=${known}`)
    .set('X-XSRF-TOKEN', token)
    .send({ email, password: TEST_PASSWORD });
  return res.status;
}

describe('sign-in limits, from one address', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ signInLimit: 10, signInAddressLimit: 10, signInDelayMs: 300, signInWindowMs: 60_000 });
  });
  afterAll(() => t.close());

  it("lets another user sign in with the right password after ten wrong guesses at one account from the same address, only slowed", async () => {
    const a = await addUser(t.knex, 'owner');
    const b = await addUser(t.knex, 'workroom');
    const guesser = new ApiAgent(t.app);
    const guesses: number[] = [];
    for (let i = 0; i < 10; i++) guesses.push((await attempt(guesser, a.email, `wrong ${i}`)).status);
    expect(guesses).toEqual(Array(10).fill(401));
    const eleventh = await attempt(guesser, a.email, 'wrong again');
    expect(eleventh.status).toBe(429);
    expect(eleventh.message).toMatch(/for this account.*wait 1 minute/);

    const colleague = await attempt(new ApiAgent(t.app), b.email, TEST_PASSWORD);
    expect(colleague.status).toBe(200);
    expect(colleague.ms).toBeGreaterThanOrEqual(300);
    // B's own mistake is told as a mistake, not as a lock-out.
    expect((await attempt(new ApiAgent(t.app), b.email, 'typo')).status).toBe(401);
  });

  it('counts only failures: right passwords leave an address with nothing counted against it', async () => {
    await t.knex('sign_in_limits').delete();
    const c = await addUser(t.knex, 'workroom');
    for (let i = 0; i < 12; i++) expect((await attempt(new ApiAgent(t.app), c.email, TEST_PASSWORD)).status).toBe(200);
    const rows = await t.knex('sign_in_limits').where('key', 'like', 'address:%').select('points');
    expect(rows.map((r) => r.points)).toEqual([0]);
  });
});

describe('sign-in limits, per account from many addresses', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ trustProxy: 1, signInLimit: 3, signInAddressLimit: 10, signInDelayMs: 0, signInWindowMs: 60_000 });
  });
  afterAll(() => t.close());

  it('refuses an account after its limit of wrong guesses from many addresses, the right password too', async () => {
    const a = await addUser(t.knex, 'owner');
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await attempt(new ApiAgent(t.app), a.email, `guess ${i}`, `198.51.100.${10 + i}`)).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const rightPassword = await attempt(new ApiAgent(t.app), a.email, TEST_PASSWORD, '198.51.100.99');
    expect(rightPassword.status).toBe(429);
    expect(rightPassword.message).toMatch(/Too many wrong passwords for this account\. Please wait 1 minute and try again, or sign in from a browser you have signed in with before\./);
    // Another account is not affected.
    const b = await addUser(t.knex, 'workroom');
    expect((await attempt(new ApiAgent(t.app), b.email, TEST_PASSWORD, '198.51.100.10')).status).toBe(200);
  });

  it('still lets in a browser that signed in to the account before, within a limit of its own', async () => {
    const maker = await addUser(t.knex, 'workroom');
    const other = await addUser(t.knex, 'workroom');
    const usual = new ApiAgent(t.app);
    const first = await attempt(usual, maker.email, TEST_PASSWORD, '192.0.2.1');
    expect(first.status).toBe(200);
    const known = /ks\.known=([^;]+)/.exec(first.cookies)?.[1];
    expect(known).toBeDefined();
    expect((await usual.post('/api/auth/sign-out')).status).toBe(204);
    usual.csrf = '';

    // Someone elsewhere uses up both accounts' limits.
    for (const email of [maker.email, other.email]) {
      for (let i = 0; i < 4; i++) await attempt(new ApiAgent(t.app), email, `guess ${i}`, `203.0.113.${i}`);
      expect((await attempt(new ApiAgent(t.app), email, TEST_PASSWORD, '203.0.113.50')).status).toBe(429);
    }

    const back = await attempt(usual, maker.email, TEST_PASSWORD, '192.0.2.77');
    expect(back.status).toBe(200);
    expect((await usual.get('/api/auth/me')).body.user.email).toBe(maker.email);
    expect((await usual.post('/api/auth/sign-out')).status).toBe(204);
    usual.csrf = '';
    // The cookie vouches for the account it signed in to, not for another.
    expect((await attempt(usual, other.email, TEST_PASSWORD, '192.0.2.77')).status).toBe(429);
    // It is the signed cookie that vouches: the same value works from anywhere, an altered one does not.
    expect(await withKnownCookie(t, known!, maker.email)).toBe(200);
    const altered = known!.replace(/.$/, (c) => (c === 'A' ? 'B' : 'A'));
    expect(await withKnownCookie(t, altered, maker.email)).toBe(429);

    // The known browser's own wrong guesses are limited too.
    const own: number[] = [];
    for (let i = 0; i < 4; i++) own.push((await attempt(usual, maker.email, `slip ${i}`, '192.0.2.77')).status);
    expect(own).toEqual([401, 401, 401, 429]);
  });

  it('counts X-Forwarded-For as the address when TRUST_PROXY trusts the proxy', async () => {
    await t.knex('sign_in_limits').delete();
    const e = await addUser(t.knex, 'workroom');
    await attempt(new ApiAgent(t.app), e.email, 'wrong', '198.51.100.200');
    const keys = (await t.knex('sign_in_limits').select('key')).map((r) => r.key as string);
    expect(keys.filter((k) => k.startsWith('address:'))).toEqual(['address:198.51.100.200']);
  });
});

/** Wrong guesses from one forwarded address until it is refused, then the right password from there and from elsewhere. */
async function exhaustForwardedAddress(t: TestApp) {
  const user = await addUser(t.knex, 'workroom');
  const browser = new ApiAgent(t.app);
  for (let i = 0; i < 2 * ADDRESS_REFUSE_FACTOR; i++) expect((await attempt(browser, user.email, `wrong ${i}`, '203.0.113.7')).status).toBe(401);
  return {
    sameAddress: await attempt(new ApiAgent(t.app), user.email, TEST_PASSWORD, '203.0.113.7'),
    otherAddress: await attempt(new ApiAgent(t.app), user.email, TEST_PASSWORD, '203.0.113.8'),
  };
}
// An address is slowed past 2 failures and refused past 2 × ADDRESS_REFUSE_FACTOR; no delay, to keep the test quick.
const ADDRESS_LIMITS = { signInLimit: 1000, signInAddressLimit: 2, signInDelayMs: 0, signInWindowMs: 60_000 };

describe('sign-in limits behind a proxy TRUST_PROXY names', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ ...ADDRESS_LIMITS, trustProxy: ['loopback'] });
  });
  afterAll(() => t.close());

  it('counts the address X-Forwarded-For gives: each client behind the proxy is limited on its own', async () => {
    const { sameAddress, otherAddress } = await exhaustForwardedAddress(t);
    expect(sameAddress.status).toBe(429);
    expect(sameAddress.message).toMatch(/Too many sign-in attempts from here\. Please wait 1 minute/);
    expect(otherAddress.status).toBe(200);
  });
});

describe('sign-in limits without TRUST_PROXY', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp(ADDRESS_LIMITS);
  });
  afterAll(() => t.close());

  it('ignores X-Forwarded-For, which anyone can send: every request counts as from the connection', async () => {
    const { sameAddress, otherAddress } = await exhaustForwardedAddress(t);
    expect(sameAddress.status).toBe(429);
    expect(otherAddress.status).toBe(429);
  });
});

describe('sign-in limits across app instances', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ signInLimit: 3, signInWindowMs: 60_000 });
  });
  afterAll(() => t.close());

  it('keeps the count in the database: a second app on the same database (a restart) sees it', async () => {
    const a = await addUser(t.knex, 'owner');
    for (let i = 0; i < 3; i++) expect((await attempt(new ApiAgent(t.app), a.email, `wrong ${i}`)).status).toBe(401);
    const pool = new Pool({ connectionString: t.url, max: 2 });
    try {
      const restarted = createApp({ config: t.config, knex: t.knex, sessionPool: pool, log: () => undefined });
      const res = await attempt(new ApiAgent(restarted), a.email, TEST_PASSWORD);
      expect(res.status).toBe(429);
      expect(res.message).toMatch(/for this account/);
    } finally {
      await pool.end();
    }
  });

  it('limits guessing the current password from a signed-in session per user', async () => {
    const user = await addUser(t.knex, 'workroom');
    const session = await signedIn(t.app, user.email);
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await session.post('/api/auth/password', { currentPassword: `guess ${i}`, newPassword: 'a fresh long password' })).status);
    expect(statuses).toEqual([400, 400, 400]);
    const limited = await session.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a fresh long password' });
    expect(limited.status).toBe(429);
    expect(limited.body.error.message).toMatch(/Too many wrong current passwords\. Please wait 1 minute/);
    // Another user's own changes are not held up.
    const other = await addUser(t.knex, 'workroom');
    const theirs = await signedIn(t.app, other.email);
    expect((await theirs.post('/api/auth/password', { currentPassword: TEST_PASSWORD, newPassword: 'a fresh long password' })).status).toBe(200);
  });
});
