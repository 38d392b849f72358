import sharp from 'sharp';
import type { z } from 'zod';
import { squaresDesign } from '../../shared/src/testing/design-fixtures';
import { FIELD_POLICY, mayUse, type FieldRule, type ModelName } from './field-policy';
import { ROUTE_POLICY } from './route-policy';
import type { Caller, Role } from './roles';
import { listClientsQuerySchema } from '../clients/clients-schemas';
import { listCommissionsQuerySchema } from '../commissions/commissions-schemas';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { sendQuote } from '../testing/money-fixtures';

/**
 * The field x role matrix, generated from FIELD_POLICY: every text column a
 * role may not see is filled with a marker naming it, then every JSON body of
 * every GET route is walked (nested objects and arrays) for each principal
 * (the owner, the workroom, a client on its own records) and must carry
 * neither a marker of a field hidden from it nor a key that no model shows it.
 * The oracle part: a search, filter or sort on a field the role may not use
 * answers exactly what a search matching nothing, no filter, or the default
 * sort answers.
 */

const PRINCIPALS: readonly Role[] = ['owner', 'workroom', 'client'];
const MODELS = Object.keys(FIELD_POLICY) as ModelName[];
const rules = (model: ModelName) => Object.entries(FIELD_POLICY[model].fields) as [string, FieldRule][];
const snake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const marker = (model: ModelName, field: string) => `zq-${model}-${field}-zq`;

/**
 * Text columns holding a value from a fixed list that the app reads as such:
 * a marker there would break the page rather than test it. A hidden one is
 * still caught by its key (see `neverShown`).
 */
const CODED = new Set(['quote.status', 'quote.vatRate', 'quote.vatMode', 'quoteLine.kind', 'quoteLine.unit', 'quoteLine.stage', 'stock.costUnit', 'garment.prewash', 'garment.colourRun', 'designVersion.clientResponse', 'user.passwordHash']);

/**
 * GET routes that read the mail server's own list, which these tests do not start, and the calendar
 * feed, which answers only its secret address and sends iCalendar text (its spec checks what it holds).
 */
const NOT_IN_SCENARIO = new Set(['GET /api/mail/sent', 'GET /api/mail/sent/:id/attachments/:n', 'GET /api/calendar/:secret']);

/**
 * Fields holding a design document in its own vocabulary (`totals`, `unit`,
 * `prewash` there are the design's words, not model fields): inside them only
 * the markers are looked for, not the keys.
 */
const DOCUMENTS = new Set(['body', 'derived', 'plan']);

/** Keys that no declared model shows this role: finding one anywhere is a leak. */
function neverShown(role: Role): Set<string> {
  const hidden = new Set<string>();
  const shown = new Set<string>();
  for (const model of MODELS) for (const [field, rule] of rules(model)) (rule.see.includes(role) ? shown : hidden).add(field);
  return new Set([...hidden].filter((k) => !shown.has(k)));
}

/** Every key (outside design documents) and every string value in a JSON body, with where it is. */
function* walk(value: unknown, path = '$', inDocument = false): Generator<{ path: string; key?: string; text?: string }> {
  if (typeof value === 'string') yield { path, text: value };
  else if (Array.isArray(value)) for (const [i, v] of value.entries()) yield* walk(v, `${path}[${i}]`, inDocument);
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (!inDocument) yield { path: `${path}.${k}`, key: k };
      yield* walk(v, `${path}.${k}`, inDocument || DOCUMENTS.has(k));
    }
  }
}

describe('field x role matrix', () => {
  let t: TestApp;
  const agents = {} as Record<Role, ApiAgent>;
  let ids: Record<string, number>;
  /** The markers actually stored: model.field -> marker. */
  const markers = new Map<string, { model: ModelName; field: string; value: string }>();

  beforeAll(async () => {
    t = await startTestApp();
    agents.owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    agents.workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const a = await addUser(t.knex, 'client');
    const b = await addUser(t.knex, 'client');
    agents.client = await signedIn(t.app, a.email);
    await t.knex('clients').where('id', a.clientId!).update({ name: 'Ada Client', email: 'ada@post.test' });
    await t.knex('clients').where('id', b.clientId!).update({ name: 'Bea Other', email: 'bea@post.test' });
    const owner = agents.owner;
    const commission = await addCommission(t.knex, a.clientId!, { title: 'Ada quilt', deadline: '2030-01-01', budgetPence: 50000 });
    await addCommission(t.knex, b.clientId!, { title: 'Bea quilt', deadline: '2029-01-01' });
    const garment = (await owner.post(`/api/commissions/${commission}/garments`, { description: 'Ada shirt', fibre: 'cotton', colour: 'Blue', condition: 'Worn' })).body;
    await owner.post(`/api/garments/${garment.id}/events`, { kind: 'received', place: 'Shelf' });
    await owner.post(`/api/garments/${garment.id}/panels`, { name: 'back', width: '20', height: '24' });
    const jpeg = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#123456' } }).jpeg().toBuffer();
    const photo = (await owner.agent.post(`/api/garments/${garment.id}/photos`).set('X-XSRF-TOKEN', owner.csrf).attach('photos', jpeg, 'a.jpg')).body.items[0];
    const stock = (await owner.post('/api/stock', { name: 'Navy lawn', colour: 'Navy', fibre: 'cotton', width: '42', length: '36', costPence: 1200, supplier: 'A mill' })).body;
    await owner.post(`/api/commissions/${commission}/hours`, { stage: 'piecing', hours: 1.5, workedOn: '2026-11-30', note: 'Pinned' });
    await owner.post(`/api/commissions/${commission}/stage`, { to: 'quoted' });
    const design = await owner.post(`/api/commissions/${commission}/design`, {
      body: squaresDesign(8, 2, 2, {
        assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: garment.id } }],
        finishing: { bindingStockId: stock.id, bindingStripMm: '63.5', backingStockId: null, waddingStockId: null, prewash: false, shrinkPercent: '0' },
      }),
      note: 'First go',
    });
    if (design.status !== 201) throw new Error(`design not saved: ${JSON.stringify(design.body)}`);
    await owner.post(`/api/commissions/${commission}/design/share`);
    await agents.client.post(`/api/commissions/${commission}/design/response`, { response: 'approved' });
    const quote = await sendQuote(owner, commission);
    await agents.client.post(`/api/quotes/${quote.id}/accept`, { name: 'Ada Client' });
    const payment = await owner.post(`/api/commissions/${commission}/payments/manual`, { kind: 'deposit', amountPence: quote.totals.depositPence, method: 'bank_transfer', receivedOn: '2026-11-30', reference: 'ADA DEPOSIT' });
    if (payment.status !== 201) throw new Error(`payment not recorded: ${JSON.stringify(payment.body)}`);
    ids = { clients: a.clientId!, commissions: commission, garments: garment.id, photos: photo.id, quotes: quote.id, stock: stock.id, paymentId: payment.body.id };

    // Every text column some principal may not see gets its marker (a coded or constrained one is skipped).
    for (const model of MODELS) {
      const { table } = FIELD_POLICY[model];
      // The knex of the app turns result keys to camelCase.
      const columns: { columnName: string; dataType: string }[] = await t.knex('information_schema.columns').select('column_name', 'data_type').where({ table_name: table, table_schema: 'public' });
      const text = new Set(columns.filter((c) => ['text', 'character varying'].includes(c.dataType)).map((c) => c.columnName));
      for (const [field, rule] of rules(model)) {
        if (rule.see.length === PRINCIPALS.length || !text.has(snake(field)) || CODED.has(`${model}.${field}`)) continue;
        const value = marker(model, field);
        try {
          await t.knex.raw(`UPDATE ${table} SET ${snake(field)} = ?`, [value]);
          markers.set(`${model}.${field}`, { model, field, value });
        } catch {
          // A check constraint keeps it to its coded values.
        }
      }
    }
  }, 60_000);
  afterAll(() => t.close());

  it.each(MODELS)('declares every column of the %s table', async (model) => {
    const columns = await t.knex('information_schema.columns').pluck('column_name').where({ table_name: FIELD_POLICY[model].table, table_schema: 'public' });
    expect(columns.length).toBeGreaterThan(0);
    const declared = new Set(Object.keys(FIELD_POLICY[model].fields).map(snake));
    expect(columns.filter((c: string) => !declared.has(c))).toEqual([]);
  });

  it('has hidden text fields filled with markers to look for', () => {
    for (const key of ['client.notes', 'client.email', 'client.phone', 'commission.notes', 'garment.condition', 'stock.supplier']) expect([...markers.keys()]).toContain(key);
  });

  const gets = Object.entries(ROUTE_POLICY)
    .filter(([route]) => route.startsWith('GET ') && !NOT_IN_SCENARIO.has(route))
    .flatMap(([route, callers]) => PRINCIPALS.filter((p) => (callers as readonly Caller[]).includes(p)).map((p) => [route, p] as const));

  it('covers the GET routes of every model declared', () => expect(gets.length).toBeGreaterThan(30));

  function url(route: string): string {
    const pattern = route.split(' ')[1]!;
    const area = pattern.split('/')[2]!;
    return pattern.replace(':id', String(ids[area] ?? 0)).replace(':paymentId', String(ids['paymentId'])).replace(':version', '1').replace(':n', '0');
  }

  it.each(gets)('%s as %s sends no field that role may not see', async (route, role) => {
    const res = await agents[role].get(url(route));
    expect(res.status).toBe(200);
    if (!/json/.test(String(res.headers['content-type']))) return;
    const keys = neverShown(role);
    const hiddenMarkers = [...markers.values()].filter((m) => !mayUse(m.model, role, 'see', m.field));
    const leaks: string[] = [];
    for (const { path, key, text } of walk(res.body)) {
      if (key !== undefined && keys.has(key)) leaks.push(`${path} (a key ${role} is never shown)`);
      for (const m of hiddenMarkers) if (text?.includes(m.value)) leaks.push(`${path} holds ${m.model}.${m.field}`);
    }
    expect(leaks).toEqual([]);
  });

  /** The list routes and the models whose fields their q=, filters and sorts work on. */
  const LISTS: Record<string, { models: ModelName[]; schema: z.ZodObject; filters: Record<string, [string, string]> }> = {
    'GET /api/clients': { models: ['client'], schema: listClientsQuerySchema, filters: {} },
    'GET /api/commissions': {
      models: ['commission', 'client'],
      schema: listCommissionsQuerySchema,
      // parameter -> [a value that narrows the scenario's list, the field it filters on]
      filters: { stage: ['quoted', 'stage'], clientId: ['', 'clientId'], dueWithinDays: ['2000', 'deadline'] },
    },
  };

  function sortOptions(schema: z.ZodObject): string[] {
    const sort = schema.shape['sort'] as unknown as { _zod: { def: { innerType: { options: string[] } } } };
    return sort._zod.def.innerType.options;
  }

  const oracle = Object.entries(LISTS).flatMap(([route, list]) => {
    const callers = ROUTE_POLICY[route as keyof typeof ROUTE_POLICY] as readonly Caller[];
    return PRINCIPALS.filter((p) => callers.includes(p)).map((role) => ({ route, role, list }));
  });

  /** Each request a role may not make use of, beside the request that must answer the same. */
  function hiddenUses(role: Role, list: (typeof LISTS)[string]): { what: string; asked: string; baseline: string }[] {
    const main = list.models[0]!;
    return [
      ...list.models.flatMap((model) =>
        [...markers.values()]
          .filter((m) => m.model === model && !mayUse(model, role, 'search', m.field))
          .map((m) => ({ what: `q= on ${model}.${m.field}`, asked: `q=${m.value}`, baseline: 'q=zq-matches-nothing-zq' })),
      ),
      ...sortOptions(list.schema)
        .filter((option) => !mayUse(main, role, 'sort', option))
        .map((option) => ({ what: `sort=${option}`, asked: `sort=${option}&dir=desc`, baseline: 'dir=desc' })),
      ...Object.entries(list.filters)
        .filter(([, [, field]]) => !mayUse(main, role, 'filter', field))
        .map(([param, [value]]) => ({ what: `${param}=`, asked: `${param}=${value || ids['clients']}`, baseline: '' })),
    ];
  }

  it('has hidden searches and sorts to try', () => {
    expect(hiddenUses('workroom', LISTS['GET /api/clients']!).map((u) => u.what)).toEqual(expect.arrayContaining(['q= on client.email', 'q= on client.phone', 'q= on client.notes', 'sort=email']));
    expect(hiddenUses('workroom', LISTS['GET /api/commissions']!).map((u) => u.what)).toEqual(expect.arrayContaining(['q= on commission.notes', 'q= on client.email']));
    expect(hiddenUses('client', LISTS['GET /api/commissions']!).map((u) => u.what)).toContain('q= on commission.notes');
  });

  it.each(oracle)('$route as $role: a search, filter or sort on a field it may not use changes nothing', async ({ route, role, list }) => {
    const path = route.split(' ')[1]!;
    const changed: string[] = [];
    for (const use of hiddenUses(role, list)) {
      const asked = await agents[role].get(`${path}?${use.asked}`);
      const plain = await agents[role].get(`${path}?${use.baseline}`);
      if (asked.status !== 200 || JSON.stringify(asked.body) !== JSON.stringify(plain.body)) changed.push(`${use.what}: ${asked.status} ${JSON.stringify(asked.body).slice(0, 200)}`);
    }
    expect(changed).toEqual([]);
  });

  it('finds records by the fields each role may search', async () => {
    for (const role of PRINCIPALS) {
      expect((await agents[role].get('/api/clients?q=Ada')).body.items.map((c: { name: string }) => c.name)).toEqual(['Ada Client']);
      expect((await agents[role].get('/api/commissions?q=Ada')).body.total).toBe(1);
    }
    expect((await agents.owner.get(`/api/clients?q=${marker('client', 'email')}`)).body.total).toBeGreaterThan(0);
  });
});
