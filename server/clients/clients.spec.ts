import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';

describe('clients API', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let clientA: ApiAgent;
  let clientAId: number;
  let clientBId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const a = await addUser(t.knex, 'client');
    const b = await addUser(t.knex, 'client');
    clientAId = a.clientId!;
    clientBId = b.clientId!;
    clientA = await signedIn(t.app, a.email);
    await t.knex('clients').where('id', clientAId).update({ name: 'Alma Rowntree', email: 'alma@post.test', phone: '07700 900001' });
    await t.knex('clients').where('id', clientBId).update({ name: 'Bertie Crane', email: 'bertie@post.test', phone: '07700 900002' });
  });
  afterAll(() => t.close());

  it('creates a client with every field and reads it back', async () => {
    const res = await owner.post('/api/clients', {
      name: '  Cora Lindqvist ',
      email: 'Cora@Post.Test',
      phone: '+44 (0)7700 900003',
      address: '1 Quill Street\nThistlecombe',
      notes: 'Cushions from school shirts.',
      portfolioConsent: true,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: 'Cora Lindqvist',
      email: 'cora@post.test',
      phone: '+44 (0)7700 900003',
      address: '1 Quill Street\nThistlecombe',
      portfolioConsent: true,
    });
    const read = await owner.get(`/api/clients/${res.body.id}`);
    expect(read.body).toEqual(res.body);
  });

  it('stores empty optional text as nothing and defaults consent to no', async () => {
    const res = await owner.post('/api/clients', { name: 'Dot Empty', email: '', phone: '  ', notes: '' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: null, phone: null, notes: null, address: null, portfolioConsent: false });
  });

  it('rejects bad input with a 400 and a message for every bad field', async () => {
    const res = await owner.post('/api/clients', { name: '', email: 'not-an-email', phone: 'call me', portfolioConsent: 'yes' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(res.body.error.fields).toEqual({
      name: 'Name is required.',
      email: 'Enter an e-mail address like name@example.org.',
      phone: 'Enter a phone number with digits, spaces and + - ( ) only.',
      portfolioConsent: 'Portfolio consent must be yes or no.',
    });
  });

  it('rejects unknown fields', async () => {
    const res = await owner.post('/api/clients', { name: 'Eve', role: 'owner' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ role: 'This field is not accepted here.' });
    const patch = await owner.patch(`/api/clients/${clientAId}`, { id: 1 });
    expect(patch.status).toBe(400);
  });

  it('answers malformed JSON with a 400, not a crash', async () => {
    const res = await owner.agent.post('/api/clients').set('X-XSRF-TOKEN', owner.csrf).set('Content-Type', 'application/json').send('{"name":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_json');
  });

  it('pages, sorts and filters on the server', async () => {
    for (const name of ['Fen Abbot', 'fen zed', 'Fen Marsh']) await owner.post('/api/clients', { name });
    const page0 = await owner.get('/api/clients?q=fen&pageSize=2&sort=name&dir=asc');
    expect(page0.body.total).toBe(3);
    expect(page0.body.items.map((c: { name: string }) => c.name)).toEqual(['Fen Abbot', 'Fen Marsh']);
    const page1 = await owner.get('/api/clients?q=fen&pageSize=2&page=1&sort=name&dir=asc');
    expect(page1.body.items.map((c: { name: string }) => c.name)).toEqual(['fen zed']);
    expect(page1.body.total).toBe(3);
    expect(Object.keys(page1.body.items[0])).not.toContain('pageTotal');
    // A page past the end is empty but still tells how many there are.
    const past = await owner.get('/api/clients?q=fen&pageSize=2&page=5');
    expect(past.body).toEqual({ items: [], total: 3 });
    const desc = await owner.get('/api/clients?q=FEN&sort=name&dir=desc');
    expect(desc.body.items[0].name).toBe('fen zed');
    const byPhone = await owner.get('/api/clients?q=900002');
    expect(byPhone.body.items.map((c: { name: string }) => c.name)).toEqual(['Bertie Crane']);
    const wildcard = await owner.get('/api/clients?q=%25');
    expect(wildcard.body.total).toBe(0);
  });

  it('rejects bad list parameters with field messages', async () => {
    const res = await owner.get('/api/clients?page=-1&pageSize=500&sort=password&dir=up&x=1');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['dir', 'page', 'pageSize', 'sort', 'x']);
  });

  it('shows the workroom names only, no contact details', async () => {
    const list = await workroom.get('/api/clients?q=Alma');
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([{ id: clientAId, name: 'Alma Rowntree' }]);
    const one = await workroom.get(`/api/clients/${clientAId}`);
    expect(one.body).toEqual({ id: clientAId, name: 'Alma Rowntree' });
  });

  it('never shows a client the studio\u2019s notes about them', async () => {
    await t.knex('clients').where('id', clientAId).update({ notes: 'For the studio only: slow to reply.' });
    const list = await clientA.get('/api/clients');
    const one = await clientA.get(`/api/clients/${clientAId}`);
    expect(list.body.items[0]).not.toHaveProperty('notes');
    expect(one.body).not.toHaveProperty('notes');
    expect((await owner.get(`/api/clients/${clientAId}`)).body.notes).toBe('For the studio only: slow to reply.');
  });

  it('does not let the workroom find clients by the e-mail or phone it may not see', async () => {
    for (const q of ['alma@', 'post.test', '900001']) expect((await workroom.get(`/api/clients?q=${encodeURIComponent(q)}`)).body.total).toBe(0);
    expect((await owner.get('/api/clients?q=alma%40')).body.total).toBe(1);
  });

  it('shows a client only their own record', async () => {
    const list = await clientA.get('/api/clients');
    expect(list.body.total).toBe(1);
    expect(list.body.items[0]).toMatchObject({ id: clientAId, email: 'alma@post.test' });
    expect((await clientA.get(`/api/clients/${clientAId}`)).status).toBe(200);
  });

  it("answers 404 to a client reading or filtering for another client's record", async () => {
    const read = await clientA.get(`/api/clients/${clientBId}`);
    expect(read.status).toBe(404);
    expect(read.body.error.code).toBe('not_found');
    const filtered = await clientA.get('/api/clients?q=Bertie');
    expect(filtered.body).toEqual({ items: [], total: 0 });
  });

  it('refuses a client changing or deleting any record, and leaves it unchanged', async () => {
    expect((await clientA.patch(`/api/clients/${clientBId}`, { name: 'Hacked' })).status).toBe(403);
    expect((await clientA.patch(`/api/clients/${clientAId}`, { name: 'Hacked' })).status).toBe(403);
    expect((await clientA.delete(`/api/clients/${clientBId}`)).status).toBe(403);
    const rows = await t.knex('clients').whereIn('id', [clientAId, clientBId]).orderBy('id');
    expect(rows.map((r) => r.name)).toEqual(['Alma Rowntree', 'Bertie Crane']);
  });

  it('updates a field and keeps the rest', async () => {
    const created = (await owner.post('/api/clients', { name: 'Gil Patch', phone: '07700 900004' })).body;
    const res = await owner.patch(`/api/clients/${created.id}`, { notes: 'Prefers phone calls.' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'Gil Patch', phone: '07700 900004', notes: 'Prefers phone calls.' });
    expect(new Date(res.body.updatedAt).getTime()).toBeGreaterThanOrEqual(new Date(created.updatedAt).getTime());
    expect((await owner.patch(`/api/clients/${created.id}`, {})).status).toBe(400);
  });

  it('deletes a client with their portal sign-in, and 404s after', async () => {
    const user = await addUser(t.knex, 'client');
    const theirs = await signedIn(t.app, user.email);
    const res = await owner.delete(`/api/clients/${user.clientId}`);
    expect(res.status).toBe(204);
    expect(await t.knex('users').where('id', user.id)).toHaveLength(0);
    expect((await theirs.get('/api/clients')).status).toBe(401);
    expect((await owner.get(`/api/clients/${user.clientId}`)).status).toBe(404);
    expect((await owner.delete(`/api/clients/${user.clientId}`)).status).toBe(404);
  });

  it('treats a malformed id as not found', async () => {
    for (const id of ['abc', '0', '1.5', '99999999999', '1;drop']) {
      expect((await owner.get(`/api/clients/${id}`)).status).toBe(404);
    }
  });
});
