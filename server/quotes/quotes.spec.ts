import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';

describe('quotes', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let clientA: ApiAgent;
  let clientB: ApiAgent;
  let clientAId: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const a = await addUser(t.knex, 'client');
    clientAId = a.clientId!;
    await t.knex('clients').where('id', clientAId).update({ email: 'alma@post.test', name: 'Alma Rowntree' });
    clientA = await signedIn(t.app, a.email);
    clientB = await signedIn(t.app, (await addUser(t.knex, 'client')).email);
  });
  afterAll(() => t.close());

  it('prices a draft from its lines with the studio VAT settings (hand-worked)', async () => {
    const commission = await addCommission(t.knex, clientAId);
    await owner.patch('/api/settings', { vatRegistered: true, vatRate: '20', vatMode: 'line', depositPercent: 25 });
    const res = await owner.post(`/api/commissions/${commission}/quotes`, {
      lines: [
        { kind: 'labour', description: 'Cutting', quantity: 3.25, unit: 'hours', unitPricePence: 2800 },
        { kind: 'extra', description: 'Embroidered label', quantity: 1, unitPricePence: 1500 },
        { kind: 'discount', description: 'Returning client', quantity: 1, unitPricePence: -500 },
      ],
    });
    expect(res.status).toBe(201);
    // Hand-worked: 3.25 x 28.00 = 91.00; + 15.00 - 5.00 = 101.00 net; VAT per line 18.20 + 3.00 - 1.00 = 20.20;
    // total 121.20; deposit 25% = 30.30; balance 90.90.
    expect(res.body).toMatchObject({ version: 1, status: 'draft', vatRate: '20' });
    expect(res.body.totals).toEqual({ netPence: 10100, vatPence: 2020, totalPence: 12120, depositPence: 3030, balancePence: 9090 });
    const bad = await owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'material', description: '', quantity: '-1', unitPricePence: -5 }] });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['lines.0.description', 'lines.0.quantity', 'lines.0.unitPricePence']);
  });

  it('freezes a sent quote: no edits through the API or in the database, and a new version supersedes it', async () => {
    const commission = await addCommission(t.knex, clientAId);
    const v1 = await sendQuote(owner, commission);
    const edit = await owner.send('put', `/api/quotes/${v1.id}`, { lines: [{ kind: 'extra', description: 'Changed', quantity: 1, unitPricePence: 1 }] });
    expect(edit.status).toBe(409);
    await expect(t.knex('quoteLines').where('quoteId', v1.id).update({ unitPricePence: 1 })).rejects.toThrow(/frozen/);
    const v2 = await owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'extra', description: 'Label', quantity: 1, unitPricePence: 1000 }] });
    expect(v2.body.version).toBe(2);
    await owner.post(`/api/quotes/${v2.body.id}/send`);
    expect((await owner.get(`/api/quotes/${v1.id}`)).body.status).toBe('superseded');
    expect((await clientA.post(`/api/quotes/${v1.id}/accept`, { name: 'Alma Rowntree' })).status).toBe(409);
    const accepted = await clientA.post(`/api/quotes/${v2.body.id}/accept`, { name: 'Alma Rowntree' });
    expect(accepted.body).toMatchObject({ status: 'accepted', version: 2, acceptedName: 'Alma Rowntree' });
    expect(accepted.body.totals.totalPence).toBe(1200);
  });

  it('queues the e-mail with its PDF in the same transaction as the send, and moves an enquiry to quoted', async () => {
    const commission = await addCommission(t.knex, clientAId);
    const q = await sendQuote(owner, commission);
    const mails = await t.knex('outboxMails').where({ commissionId: commission, kind: 'quote' });
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ toAddress: 'alma@post.test', status: 'pending' });
    expect(mails[0].textBody).toContain(`/portal/${commission}?quote=${q.id}`);
    const pdf = Buffer.from(mails[0].attachments[0].content, 'base64');
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect((await owner.get(`/api/commissions/${commission}`)).body.stage).toBe('quoted');
  });

  it('will not send a quote to a client without an e-mail address, and sends nothing', async () => {
    const [c] = await t.knex('clients').insert({ name: 'No Mail' }).returning('id');
    const commission = await addCommission(t.knex, c.id);
    const draft = await owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'extra', description: 'X', quantity: 1, unitPricePence: 100 }] });
    const res = await owner.post(`/api/quotes/${draft.body.id}/send`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('Add an e-mail address for No Mail before sending the quote.');
    expect((await owner.get(`/api/quotes/${draft.body.id}`)).body.status).toBe('draft');
    expect(await t.knex('outboxMails').where('commissionId', commission)).toHaveLength(0);
  });

  it('shows clients only their own sent quotes, never drafts, and never to the workroom', async () => {
    const commission = await addCommission(t.knex, clientAId);
    const draft = await owner.post(`/api/commissions/${commission}/quotes`, { lines: [{ kind: 'extra', description: 'X', quantity: 1, unitPricePence: 100 }] });
    expect((await clientA.get(`/api/quotes/${draft.body.id}`)).status).toBe(404);
    expect((await clientA.get(`/api/commissions/${commission}/quotes`)).body.items).toEqual([]);
    await owner.post(`/api/quotes/${draft.body.id}/send`);
    expect((await clientA.get(`/api/quotes/${draft.body.id}`)).status).toBe(200);
    expect((await clientB.get(`/api/quotes/${draft.body.id}`)).status).toBe(404);
    expect((await clientB.get(`/api/quotes/${draft.body.id}/pdf`)).status).toBe(404);
    expect((await workroom.get(`/api/quotes/${draft.body.id}`)).status).toBe(403);
    const pdf = await clientA.agent.get(`/api/quotes/${draft.body.id}/pdf`);
    expect(pdf.headers['content-type']).toBe('application/pdf');
  });

  it('records a decline with its note', async () => {
    const commission = await addCommission(t.knex, clientAId);
    const q = await sendQuote(owner, commission);
    const res = await clientA.post(`/api/quotes/${q.id}/decline`, { note: 'A little over budget' });
    expect(res.body).toMatchObject({ status: 'declined', declineNote: 'A little over budget' });
    expect((await clientA.post(`/api/quotes/${q.id}/accept`, { name: 'Alma' })).status).toBe(409);
  });

  it('refuses an expired quote', async () => {
    const commission = await addCommission(t.knex, clientAId);
    const q = await sendQuote(owner, commission);
    await t.knex('quotes').where('id', q.id).update({ validUntil: '2020-01-01' });
    const res = await clientA.post(`/api/quotes/${q.id}/accept`, { name: 'Alma Rowntree' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/expired/);
  });
});

describe('quote lines from the design', () => {
  let t: TestApp;
  let owner: ApiAgent;
  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
  });
  afterAll(() => t.close());

  it('has nothing to suggest before there is a design', async () => {
    const c = await addUser(t.knex, 'client');
    const commission = await addCommission(t.knex, c.clientId!);
    const res = await owner.get(`/api/commissions/${commission}/quote-suggestion`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ designVersion: null, lines: [], notes: [], learned: [] });
  });

  it('prices labour by stage at the hourly rate from a saved design, as lines the quote accepts', async () => {
    const c = await addUser(t.knex, 'client');
    const commission = await addCommission(t.knex, c.clientId!);
    await owner.patch('/api/settings', { hourlyRatePence: 3200, blockMinutes: { square: 6 } });
    const inch = (n: number) => String(n * 25.4);
    const saved = await owner.post(`/api/commissions/${commission}/design`, {
      body: {
        units: 'imperial',
        target: { preset: null, dropMm: null, widthMm: inch(40), lengthMm: inch(50) },
        layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(10), sashing: null, borders: [] },
        blocks: [{ id: 'A', name: 'Square', kind: 'square' }],
        pattern: ['A'],
        assignments: [],
        finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
        rules: { minimumPerGarment: 0 },
      },
    });
    expect(saved.status).toBe(201);
    const res = await owner.get(`/api/commissions/${commission}/quote-suggestion`);
    expect(res.body.designVersion).toBe(1);
    const piecing = res.body.lines.find((l: { stage: string }) => l.stage === 'piecing');
    // Hand-worked: 20 squares x 6 min = 120 min = 2 h at the studio's £32.00.
    expect(piecing).toMatchObject({ kind: 'labour', quantity: '2.00', unitPricePence: 3200 });
    const quote = await owner.post(`/api/commissions/${commission}/quotes`, { lines: res.body.lines });
    expect(quote.status).toBe(201);
  });

  it("prices piecing from the studio's minutes saved under the block kind's own key", async () => {
    const c = await addUser(t.knex, 'client');
    const commission = await addCommission(t.knex, c.clientId!);
    await owner.patch('/api/settings', { hourlyRatePence: 3200, blockMinutes: { 'flying-geese': 30 } });
    const inch = (n: number) => String(n * 25.4);
    const saved = await owner.post(`/api/commissions/${commission}/design`, {
      body: {
        units: 'imperial',
        target: { preset: null, dropMm: null, widthMm: inch(40), lengthMm: inch(50) },
        layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(10), sashing: null, borders: [] },
        blocks: [{ id: 'A', name: 'Geese', kind: 'flying-geese', units: 2 }],
        pattern: ['A'],
        assignments: [],
        finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
        rules: { minimumPerGarment: 0 },
      },
    });
    expect(saved.status).toBe(201);
    const res = await owner.get(`/api/commissions/${commission}/quote-suggestion`);
    const piecing = res.body.lines.find((l: { stage: string }) => l.stage === 'piecing');
    // Hand-worked: 20 blocks x 30 min = 600 min = 10 h (the 15-minute default would give 5 h).
    expect(piecing).toMatchObject({ kind: 'labour', quantity: '10.00' });
  });

  const inch = (n: number) => String(n * 25.4);
  const squares = (finishing: Record<string, unknown>) => ({
    units: 'imperial',
    target: { preset: null, dropMm: null, widthMm: inch(40), lengthMm: inch(50) },
    layout: { setting: 'straight', rows: 5, columns: 4, blockMm: inch(10), sashing: null, borders: ['76.2'] },
    blocks: [{ id: 'A', name: 'Square', kind: 'square' }],
    pattern: ['A'],
    assignments: [] as unknown[],
    finishing: { bindingStockId: null, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0', ...finishing },
    rules: { minimumPerGarment: 0 },
  });

  it('prices every studio fabric the plan uses from stock at its cost in shop steps, on hand or not, and notes what it leaves unpriced', async () => {
    const c = await addUser(t.knex, 'client');
    const commission = await addCommission(t.knex, c.clientId!);
    const stock = (name: string, widthIn: number, costPence: number | null, costUnit: string) =>
      t.knex('stockFabrics').insert({ name, fibre: 'cotton', widthMm: inch(widthIn), lengthMm: '20000', costPence, costUnit }).returning('id').then((r) => r[0].id as number);
    const backing = await stock('Oat wide back', 108, 1800, 'metre');
    const binding = await stock('Rust solid', 44, 1200, 'yard');
    const border = await stock('Sage print', 44, null, 'metre');
    const body = squares({ backingStockId: backing, bindingStockId: binding });
    body.assignments = [{ target: { kind: 'piece', key: 'border:1' }, fabric: { kind: 'stock', stockId: border } }];
    expect((await owner.post(`/api/commissions/${commission}/design`, { body })).status).toBe(201);
    const res = await owner.get(`/api/commissions/${commission}/quote-suggestion`);
    const design = await t.knex('designVersions').where({ commissionId: commission }).first();
    const need = (id: number) => design.plan.shopping.find((s: { stockId: number }) => s.stockId === id).needMm as string;
    // 20 m of each is on hand: nothing is to buy, yet the piece uses them and the client pays for that.
    expect(design.plan.shopping.every((s: { buyMm: string }) => s.buyMm === '0')).toBe(true);
    const back = res.body.lines.find((l: { description: string }) => l.description.startsWith('Oat wide back'));
    // Derived: the length used up to whole 10 cm steps, in metres, at £18.00 a metre.
    expect(back).toMatchObject({ kind: 'material', unit: 'm', unitPricePence: 1800, quantity: String(Math.ceil(Number(need(backing)) / 100) / 10) });
    const bind = res.body.lines.find((l: { description: string }) => l.description.startsWith('Rust solid'));
    // Derived: up to whole quarter yards (228.6 mm, 1 yd = 914.4 mm exactly), at £12.00 a yard.
    expect(bind).toMatchObject({ unit: 'yd', unitPricePence: 1200, quantity: String(Math.ceil(Number(need(binding)) / 228.6) / 4) });
    expect(res.body.lines.filter((l: { unitPricePence: number }) => l.unitPricePence === 0)).toEqual([]);
    expect(res.body.notes).toEqual(expect.arrayContaining([expect.stringMatching(/^Sage print is not priced/), expect.stringMatching(/^The wadding \(/), expect.stringMatching(/^Not priced: thread, a sewn-in label\./)]));
    expect((await owner.post(`/api/commissions/${commission}/quotes`, { lines: res.body.lines })).status).toBe(201);
  });

  it('learns the labour estimate from finished commissions and says on how many it rests', async () => {
    const c = await addUser(t.knex, 'client');
    const ratios = [1.1, 1.2, 1.3];
    for (const [i, ratio] of ratios.entries()) {
      const done = await addCommission(t.knex, c.clientId!, { stage: 'delivered' });
      await t.knex('stageMoves').insert({ commissionId: done, fromStage: 'ready', toStage: 'delivered', movedAt: new Date(Date.UTC(2026, 10, i + 1)) });
      const quote = await owner.post(`/api/commissions/${done}/quotes`, { lines: [{ kind: 'labour', description: 'Piecing', quantity: '10', unit: 'hours', unitPricePence: 3000, stage: 'piecing' }] });
      await t.knex('quotes').where('id', quote.body.id).update({ status: 'accepted' });
      await t.knex('hoursLogged').insert([
        { commissionId: done, stage: 'piecing', hours: String(ratio * 10 - 4), workedOn: '2026-11-01' },
        { commissionId: done, stage: 'piecing', hours: '4', workedOn: '2026-11-02' },
      ]);
    }
    const commission = await addCommission(t.knex, c.clientId!);
    const saved = await owner.post(`/api/commissions/${commission}/design`, { body: squares({}) });
    expect(saved.status).toBe(201);
    const res = await owner.get(`/api/commissions/${commission}/quote-suggestion`);
    // Hand-worked: logged 11, 12, 13 h against 10 h quoted: ratios 1.1, 1.2, 1.3, median 1.2. Other stages have no history.
    // These three have no design, so no block kind to match: any kind is used.
    expect(res.body.learned).toEqual([{ stage: 'piecing', ratio: '1.20', commissions: 3, blockKind: null, basis: 'from 3 finished commissions: logged 1.20\u00d7 quoted for piecing' }]);
  });
});
