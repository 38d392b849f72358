import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';
import { ApiAgent, addUser, signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../testing/test-app';
import { hashToken } from '../users/password-links';
import { RESET_REQUESTED } from './auth-router';
import { RESET_REQUEST_MIN_MS } from './invitations';

// Each case hashes several passwords with bcrypt (an invitation's unknown one, the chosen one, sign-ins).
jest.setTimeout(15_000);

/** The one-time link in the newest mail to this address, and the mail itself. */
async function linkIn(t: TestApp, to: string, kind?: string) {
  const q = t.knex('outbox_mails').where('to_address', to).orderBy('id', 'desc');
  if (kind) q.where('kind', kind);
  const mail = await q.first();
  if (!mail) throw new Error(`no mail to ${to}`);
  const match = /\/set-password\?token=([A-Za-z0-9_-]+)/.exec(mail.textBody as string);
  return { mail, token: match?.[1] };
}

describe('password links: invitations and "forgot password"', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let counter = 0;

  async function newClient(email: string | null = `invitee${++counter}@example.test`) {
    const res = await owner.post('/api/clients', { name: `Ada Thimble ${++counter}`, ...(email ? { email } : {}) });
    expect(res.status).toBe(201);
    return res.body as { id: number; email: string };
  }

  beforeAll(async () => {
    // Limits high enough for the many links this suite uses from one address; the suite below checks them.
    t = await startTestApp({ signInLimit: 100, signInAddressLimit: 100 });
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
  });
  afterAll(() => t.close());

  it('invites a client: the mail carries a link whose token is stored only as its SHA-256, and the owner sees "sent"', async () => {
    const client = await newClient();
    expect((await owner.get(`/api/clients/${client.id}`)).body.invitationState).toBe('not_sent');
    const res = await owner.post(`/api/clients/${client.id}/invitation`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: client.id, invitationState: 'sent', invitationSentAt: expect.any(String) });
    const { mail, token } = await linkIn(t, client.email);
    expect(mail.kind).toBe('invitation');
    expect(token).toHaveLength(43); // 32 bytes in base64url
    const links = await t.knex('password_links').join('users', 'users.id', 'password_links.user_id').where('users.client_id', client.id).select('password_links.*');
    expect(links).toHaveLength(1);
    expect(links[0].tokenHash).toBe(hashToken(token!));
    expect(JSON.stringify(links)).not.toContain(token);
    expect(links[0].expiresAt.getTime() - Date.now()).toBeGreaterThan(6.9 * 24 * 3600 * 1000);
    // The sign-in waits for its password: no password signs in to it yet.
    expect((await new ApiAgent(t.app).signIn(client.email)).status).toBe(401);
  });

  it('sets the password with the link, signs the client in to their own page, and the link works only once', async () => {
    const client = await newClient();
    await owner.post(`/api/clients/${client.id}/invitation`);
    const { token } = await linkIn(t, client.email);
    const agent = await new ApiAgent(t.app).start();
    const set = await agent.post('/api/auth/set-password', { token, password: 'a new long password' });
    expect(set.status).toBe(200);
    expect(set.body.user).toMatchObject({ email: client.email, role: 'client', clientId: client.id });
    expect((await agent.get('/api/auth/me')).body.user.clientId).toBe(client.id);
    expect((await agent.get(`/api/clients/${client.id}`)).status).toBe(200);
    expect((await owner.get(`/api/clients/${client.id}`)).body.invitationState).toBe('accepted');
    expect((await new ApiAgent(t.app).signIn(client.email, 'a new long password')).status).toBe(200);

    const again = await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token, password: 'another long password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('bad_link');
    expect((await new ApiAgent(t.app).signIn(client.email, 'another long password')).status).toBe(401);
    // Once they can sign in, inviting again is refused with what to do instead.
    const reinvite = await owner.post(`/api/clients/${client.id}/invitation`);
    expect(reinvite.status).toBe(409);
    expect(reinvite.body.error.message).toMatch(/can already sign in/);
  });

  it('refuses a link that has run out', async () => {
    const client = await newClient();
    await owner.post(`/api/clients/${client.id}/invitation`);
    const { token } = await linkIn(t, client.email);
    await t.knex('password_links').where('token_hash', hashToken(token!)).update({ expires_at: new Date(Date.now() - 1000) });
    const res = await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token, password: 'a new long password' });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/expired or has already been used/);
  });

  it('sending the invitation again makes the earlier link stop working', async () => {
    const client = await newClient();
    await owner.post(`/api/clients/${client.id}/invitation`);
    const first = (await linkIn(t, client.email)).token;
    expect((await owner.post(`/api/clients/${client.id}/invitation`)).status).toBe(200);
    const second = (await linkIn(t, client.email)).token;
    expect(second).not.toBe(first);
    expect((await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token: first, password: 'a new long password' })).status).toBe(400);
    expect((await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token: second, password: 'a new long password' })).status).toBe(200);
  });

  it('refuses to invite a client without an e-mail address, saying what to do', async () => {
    const client = await newClient(null);
    const res = await owner.post(`/api/clients/${client.id}/invitation`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'no_email', message: expect.stringMatching(/^Add an e-mail address for .* before inviting them/) });
    expect(await t.knex('users').where('client_id', client.id)).toHaveLength(0);
  });

  it('shows the invitation state to the owner only: never to the workroom, nor to the client', async () => {
    const client = await newClient();
    await owner.post(`/api/clients/${client.id}/invitation`);
    const forWorkroom = await workroom.get(`/api/clients/${client.id}`);
    expect(forWorkroom.status).toBe(200);
    expect(forWorkroom.body).not.toHaveProperty('invitationState');
    expect(forWorkroom.body).not.toHaveProperty('invitationSentAt');
    const list = await workroom.get(`/api/clients?q=${encodeURIComponent('Ada Thimble')}`);
    expect(JSON.stringify(list.body)).not.toMatch(/invitation/);
    expect((await workroom.post(`/api/clients/${client.id}/invitation`)).status).toBe(403);
    const { token } = await linkIn(t, client.email);
    const asClient = await new ApiAgent(t.app).start();
    await asClient.post('/api/auth/set-password', { token, password: 'a new long password' });
    expect((await asClient.get(`/api/clients/${client.id}`)).body).not.toHaveProperty('invitationState');
  });

  it('a quote to a client without a sign-in carries an invitation link; to a client with one it does not', async () => {
    const without = await newClient();
    await sendQuote(owner, await addCommission(t.knex, without.id));
    const first = await linkIn(t, without.email, 'quote');
    expect(first.token).toBeDefined();
    expect(first.mail.textBody).toMatch(/You do not have a sign-in yet/);
    expect((await owner.get(`/api/clients/${without.id}`)).body.invitationState).toBe('sent');
    const set = await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token: first.token, password: 'a new long password' });
    expect(set.status).toBe(200);

    // Now that they can sign in, the next quote only asks them to.
    await sendQuote(owner, await addCommission(t.knex, without.id));
    const next = await linkIn(t, without.email, 'quote');
    expect(next.mail.id).not.toBe(first.mail.id);
    expect(next.token).toBeUndefined();
    expect(next.mail.textBody).toMatch(/when signed in to your page/);

    const signedUp = await addUser(t.knex, 'client');
    await t.knex('clients').where('id', signedUp.clientId).update({ email: signedUp.email });
    await sendQuote(owner, await addCommission(t.knex, signedUp.clientId!));
    expect((await linkIn(t, signedUp.email, 'quote')).token).toBeUndefined();
    expect(await t.knex('password_links').where('user_id', signedUp.id)).toHaveLength(0);
  });

  it('"forgot password" answers an unknown address exactly as a known one, after about as long, and mails only the known one', async () => {
    const known = await addUser(t.knex, 'workroom');
    const timed = async (email: string) => {
      const started = Date.now();
      const res = await (await new ApiAgent(t.app).start()).post('/api/auth/forgot-password', { email });
      return { res, ms: Date.now() - started };
    };
    const a = await timed(known.email);
    const b = await timed('nobody-here@example.test');
    for (const { res, ms } of [a, b]) {
      expect(res.status).toBe(202);
      expect(res.body).toEqual({ message: RESET_REQUESTED });
      expect(ms).toBeGreaterThanOrEqual(RESET_REQUEST_MIN_MS - 5);
    }
    expect(Math.abs(a.ms - b.ms)).toBeLessThan(RESET_REQUEST_MIN_MS);
    expect(await t.knex('outbox_mails').where('to_address', 'nobody-here@example.test')).toHaveLength(0);
    const { mail, token } = await linkIn(t, known.email);
    expect(mail.kind).toBe('password-reset');
    const link = await t.knex('password_links').where('token_hash', hashToken(token!)).first();
    expect(link.purpose).toBe('reset');
    const hour = link.expiresAt.getTime() - link.createdAt.getTime();
    expect(hour).toBe(3600_000);
  });

  it('a reset ends every other session of the person, and an earlier reset link stops working', async () => {
    const user = await addUser(t.knex, 'workroom');
    const elsewhere = await signedIn(t.app, user.email);
    await (await new ApiAgent(t.app).start()).post('/api/auth/forgot-password', { email: user.email });
    const older = (await linkIn(t, user.email)).token;
    await (await new ApiAgent(t.app).start()).post('/api/auth/forgot-password', { email: user.email.toUpperCase() });
    const newer = (await linkIn(t, user.email)).token;
    expect((await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token: older, password: 'a new long password' })).status).toBe(400);
    const here = await new ApiAgent(t.app).start();
    expect((await here.post('/api/auth/set-password', { token: newer, password: 'a new long password' })).status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).body.user).toBeNull();
    expect((await here.get('/api/auth/me')).body.user.id).toBe(user.id);
    expect((await new ApiAgent(t.app).signIn(user.email, TEST_PASSWORD)).status).toBe(401);
  });

  it('checks the new password and the link with clear messages', async () => {
    const short = await (await new ApiAgent(t.app).start()).post('/api/auth/set-password', { token: 'x', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe('Use at least 10 characters for a password.');
    const empty = await (await new ApiAgent(t.app).start()).post('/api/auth/forgot-password', { email: '' });
    expect(empty.body.error.fields.email).toBe('Enter your e-mail address.');
  });
});

describe('password links are rate-limited like sign-in', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ signInLimit: 3, signInAddressLimit: 3 });
  });
  afterAll(() => t.close());
  beforeEach(() => t.knex('sign_in_limits').delete());

  it('refuses guessing at tokens from one address once its limit is used', async () => {
    const agent = await new ApiAgent(t.app).start();
    for (let i = 0; i < 3; i++) expect((await agent.post('/api/auth/set-password', { token: `guess-${i}`, password: 'a new long password' })).status).toBe(400);
    const refused = await agent.post('/api/auth/set-password', { token: 'guess-4', password: 'a new long password' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.message).toMatch(/Please wait \d+ minutes? and try again/);
  });

  it('refuses more "forgot password" requests for one address than the limit, known or not alike', async () => {
    const agent = await new ApiAgent(t.app).start();
    const email = 'someone-unknown@example.test';
    for (let i = 0; i < 3; i++) expect((await agent.post('/api/auth/forgot-password', { email })).status).toBe(202);
    expect((await agent.post('/api/auth/forgot-password', { email })).status).toBe(429);
  });
});
