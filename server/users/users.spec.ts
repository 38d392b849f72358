import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';

describe('users API', () => {
  let t: TestApp;
  let owner: ApiAgent;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
  });
  afterAll(() => t.close());

  it('creates a workroom sign-in that can then sign in', async () => {
    const res = await owner.post('/api/users', { email: 'New.Helper@Example.test', name: 'New Helper', role: 'workroom', password: 'long enough pass' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ id: expect.any(Number), email: 'new.helper@example.test', name: 'New Helper', role: 'workroom', clientId: null });
    const agent = new ApiAgent(t.app);
    expect((await agent.signIn('new.helper@example.test', 'long enough pass')).status).toBe(200);
    const list = await owner.get('/api/users');
    expect(list.body.items.map((u: { email: string }) => u.email)).toContain('new.helper@example.test');
    expect(JSON.stringify(list.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('creates a client sign-in linked to a client record', async () => {
    const [client] = await t.knex('clients').insert({ name: 'Hattie Loom' }).returning('id');
    const res = await owner.post('/api/users', { email: 'hattie@example.test', name: 'Hattie Loom', role: 'client', clientId: client.id, password: 'long enough pass' });
    expect(res.status).toBe(201);
    expect(res.body.clientId).toBe(client.id);
  });

  it('requires passwords of at least 10 characters, a client record for a client, and a unique e-mail', async () => {
    const short = await owner.post('/api/users', { email: 'x@example.test', name: 'X', role: 'workroom', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe('Use at least 10 characters for a password.');
    const noClient = await owner.post('/api/users', { email: 'y@example.test', name: 'Y', role: 'client', password: 'long enough pass' });
    expect(noClient.body.error.fields.clientId).toBe('Choose the client record this sign-in belongs to.');
    const missingClient = await owner.post('/api/users', { email: 'y@example.test', name: 'Y', role: 'client', clientId: 999999, password: 'long enough pass' });
    expect(missingClient.status).toBe(400);
    const ownerRole = await owner.post('/api/users', { email: 'z@example.test', name: 'Z', role: 'owner', password: 'long enough pass' });
    expect(ownerRole.body.error.fields.role).toBe('Role must be workroom or client.');
    await owner.post('/api/users', { email: 'twice@example.test', name: 'Twice', role: 'workroom', password: 'long enough pass' });
    const dup = await owner.post('/api/users', { email: 'TWICE@example.test', name: 'Twice', role: 'workroom', password: 'long enough pass' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toBe('That e-mail address already has a sign-in.');
  });

  it('resets a password: the old one stops working, the new one works', async () => {
    const user = await addUser(t.knex, 'workroom');
    expect((await owner.post(`/api/users/${user.id}/password`, { password: 'tiny' })).status).toBe(400);
    expect((await owner.post(`/api/users/${user.id}/password`, { password: 'fresh password 1' })).status).toBe(204);
    expect((await new ApiAgent(t.app).signIn(user.email)).status).toBe(401);
    expect((await new ApiAgent(t.app).signIn(user.email, 'fresh password 1')).status).toBe(200);
    expect((await owner.post('/api/users/999999/password', { password: 'fresh password 1' })).status).toBe(404);
  });
});
