import * as fc from 'fast-check';
import type { z } from 'zod';
import { AGE_GROUP, COLOUR_RUN, COMMISSION_KIND, CONSTRUCTION, FEATURE, FIBRE, GRAIN, PREWASH, PRINT, STUDIO_LOCALES, VAT_RATES } from '@keepstitch/shared';
import { ROUTE_POLICY } from './route-policy';
import { updateClientSchema } from '../clients/clients-schemas';
import { updateCommissionSchema } from '../commissions/commissions-schemas';
import { updateGarmentSchema, updatePanelSchema } from '../garments/garments-schemas';
import { updateStockSchema } from '../stock/stock-router';
import { settingsSchema } from '../settings/settings-router';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';

/**
 * Every PATCH route the policy declares, sent random subsets of valid fields:
 * the row read straight from PostgreSQL before and after differs only in the
 * columns the sent fields write (and `updated_at`). A PATCH route without a
 * fixture here, or a field its schema accepts that the fixture does not
 * generate, fails the suite.
 */

interface FieldCase {
  arb: fc.Arbitrary<unknown>;
  /** The columns this field writes (default: the field's own name in snake_case). */
  columns?: string[];
  /** The stored value equals the value sent. */
  same?: boolean;
  /** Only changes how other fields are read (a unit): never sent alone. */
  modifier?: boolean;
}

interface PatchFixture {
  schema: z.ZodType;
  table: string;
  /** Makes the record to patch and answers its id. */
  make(t: TestApp, owner: ApiAgent): Promise<number>;
  url(id: number): string;
  fields: Record<string, FieldCase>;
}

const snake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const word = fc.stringMatching(/^[A-Za-z][A-Za-z ]{0,18}[a-z]$/);
const text = { arb: fc.option(word, { nil: null }), same: true };
const oneOf = (values: readonly string[]) => ({ arb: fc.constantFrom(...values), same: true });
const size = (column: string) => ({ arb: fc.integer({ min: 5, max: 90 }).map(String), columns: [column] });
const unit = { arb: fc.constantFrom('in', 'cm', 'mm'), modifier: true, columns: [] };

const FIXTURES: Record<string, PatchFixture> = {
  'PATCH /api/clients/:id': {
    schema: updateClientSchema,
    table: 'clients',
    make: async (t) => (await t.knex('clients').insert({ name: 'Patchable Client', email: 'keep@post.test', phone: '07700 900111', address: 'Here', notes: 'Keep', portfolioConsent: true }).returning('id'))[0].id,
    url: (id) => `/api/clients/${id}`,
    fields: {
      name: { arb: word, same: true },
      email: { arb: fc.option(fc.integer({ min: 1, max: 9999 }).map((n) => `someone${n}@post.test`), { nil: null }), same: true },
      phone: { arb: fc.option(fc.integer({ min: 10000, max: 99999 }).map((n) => `07700 9${n}`), { nil: null }), same: true },
      address: text,
      notes: text,
      portfolioConsent: { arb: fc.boolean(), same: true },
    },
  },
  'PATCH /api/commissions/:id': {
    schema: updateCommissionSchema,
    table: 'commissions',
    make: async (t) => {
      const [client] = await t.knex('clients').insert({ name: 'Commissioning Client' }).returning('id');
      return addCommission(t.knex, client.id, { kind: 'cushion', ageGroup: 'child', recipient: 'Kit', occasion: 'Birthday', sizePreset: 'Lap', widthMm: '1000', lengthMm: '1200', deadline: '2027-03-01', budgetPence: 45000, notes: 'Keep', stage: 'booked' });
    },
    url: (id) => `/api/commissions/${id}`,
    fields: {
      title: { arb: word, same: true },
      kind: oneOf(COMMISSION_KIND.values),
      recipient: text,
      ageGroup: oneOf(AGE_GROUP.values),
      occasion: text,
      sizePreset: text,
      width: size('width_mm'),
      length: size('length_mm'),
      unit,
      deadline: { arb: fc.option(fc.constantFrom('2027-01-31', '2028-02-29', '2027-12-01'), { nil: null }) },
      budgetPence: { arb: fc.option(fc.integer({ min: 0, max: 500000 }), { nil: null }), same: true },
      notes: text,
    },
  },
  'PATCH /api/garments/:id': {
    schema: updateGarmentSchema,
    table: 'garments',
    make: async (t) => {
      const [client] = await t.knex('clients').insert({ name: 'Garment Client' }).returning('id');
      const commission = await addCommission(t.knex, client.id);
      const [g] = await t.knex('garments')
        .insert({ commissionId: commission, description: 'Shirt', whose: 'Dad', story: 'Long', fibre: 'linen', construction: 'knit', colour: 'Blue', print: 'directional', condition: 'Worn', features: JSON.stringify([{ kind: 'pocket', position: 'left' }]), prewash: 'washed', colourRun: 'passed', returnsToClient: 'Buttons' })
        .returning('id');
      return g.id;
    },
    url: (id) => `/api/garments/${id}`,
    fields: {
      description: { arb: word, same: true },
      whose: text,
      story: text,
      fibre: { arb: fc.option(fc.constantFrom(...FIBRE.values), { nil: null }), same: true },
      construction: oneOf(CONSTRUCTION.values),
      colour: text,
      print: oneOf(PRINT.values),
      condition: text,
      features: { arb: fc.array(fc.record({ kind: fc.constantFrom(...FEATURE.values), position: word }), { maxLength: 3 }), same: true },
      prewash: oneOf(PREWASH.values),
      colourRun: oneOf(COLOUR_RUN.values),
      returnsToClient: text,
    },
  },
  'PATCH /api/panels/:id': {
    schema: updatePanelSchema,
    table: 'panels',
    make: async (t) => {
      const [client] = await t.knex('clients').insert({ name: 'Panel Client' }).returning('id');
      const commission = await addCommission(t.knex, client.id);
      const [g] = await t.knex('garments').insert({ commissionId: commission, description: 'Shirt' }).returning('id');
      const [p] = await t.knex('panels').insert({ garmentId: g.id, name: 'back', widthMm: '500', heightMm: '600', grain: 'horizontal', features: JSON.stringify([]) }).returning('id');
      return p.id;
    },
    url: (id) => `/api/panels/${id}`,
    fields: {
      name: { arb: word, same: true },
      // At least 10 cm, so the kept feature (3 in or 3 cm to its far corner) always fits.
      width: { arb: fc.integer({ min: 10, max: 90 }).map(String), columns: ['width_mm'] },
      height: { arb: fc.integer({ min: 10, max: 90 }).map(String), columns: ['height_mm'] },
      unit: { ...unit, arb: fc.constantFrom('in', 'cm') },
      grain: oneOf(GRAIN.values),
      features: { arb: fc.constantFrom([], [{ name: 'pocket', x: '1', y: '1', width: '2', height: '2' }]), columns: ['features'] },
    },
  },
  'PATCH /api/stock/:id': {
    schema: updateStockSchema,
    table: 'stock_fabrics',
    make: async (t) => (await t.knex('stockFabrics').insert({ name: 'Linen', colour: 'Oat', fibre: 'linen', widthMm: '1400', lengthMm: '2743.2', costPence: 1800, costUnit: 'yard', supplier: 'Mill', notes: 'Keep' }).returning('id'))[0].id,
    url: (id) => `/api/stock/${id}`,
    fields: {
      name: { arb: word, same: true },
      colour: text,
      fibre: oneOf(FIBRE.values),
      width: size('width_mm'),
      length: size('length_mm'),
      unit,
      costPence: { arb: fc.option(fc.integer({ min: 0, max: 100000 }), { nil: null }), same: true },
      costUnit: oneOf(['metre', 'yard']),
      supplier: text,
      notes: text,
    },
  },
  'PATCH /api/settings': {
    schema: settingsSchema,
    table: 'studio_settings',
    make: async () => 1,
    url: () => '/api/settings',
    fields: {
      studioName: { arb: word, same: true },
      makerName: { arb: word, same: true },
      address: { arb: word, same: true },
      email: { arb: fc.option(fc.integer({ min: 1, max: 9999 }).map((n) => `studio${n}@post.test`), { nil: null }), same: true },
      hourlyRatePence: { arb: fc.integer({ min: 0, max: 100000 }), same: true },
      vatRegistered: { arb: fc.boolean(), same: true },
      vatRate: oneOf(VAT_RATES),
      vatMode: oneOf(['line', 'invoice']),
      vatNumber: text,
      depositPercent: { arb: fc.integer({ min: 0, max: 100 }) },
      validityDays: { arb: fc.integer({ min: 1, max: 365 }), same: true },
      paymentTerms: { arb: word, same: true },
      blockMinutes: { arb: fc.dictionary(fc.constantFrom('hst', 'square', 'wedge'), fc.integer({ min: 0, max: 600 })), same: true },
      remindQuoteExpiry: { arb: fc.boolean(), same: true },
      remindBalanceDue: { arb: fc.boolean(), same: true },
      remindGarmentsLate: { arb: fc.boolean(), same: true },
      garmentsLateDays: { arb: fc.integer({ min: 1, max: 365 }), same: true },
      locale: oneOf(STUDIO_LOCALES),
    },
  },
};

/** The fields an object schema accepts, through refinements and transforms. */
function acceptedFields(schema: z.ZodType): string[] {
  let s = schema as unknown as { shape?: Record<string, unknown>; _zod: { def: { in?: unknown; schema?: unknown } } };
  while (!s.shape) s = (s._zod.def.in ?? s._zod.def.schema) as typeof s;
  return Object.keys(s.shape);
}

describe('a PATCH changes only the fields sent', () => {
  let t: TestApp;
  let owner: ApiAgent;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
  });
  afterAll(() => t.close());

  it('has a fixture for every PATCH route in the policy, and no other', () => {
    const patches = Object.keys(ROUTE_POLICY).filter((route) => route.startsWith('PATCH '));
    expect(Object.keys(FIXTURES).sort()).toEqual(patches.sort());
  });

  it.each(Object.entries(FIXTURES))('%s: the fixture generates every field the schema accepts', (_route, fixture) => {
    expect(Object.keys(fixture.fields).sort()).toEqual(acceptedFields(fixture.schema).sort());
  });

  it.each(Object.entries(FIXTURES))('%s leaves every column it was not sent unchanged', async (_route, fixture) => {
    const id = await fixture.make(t, owner);
    const row = () => t.knex.raw(`SELECT * FROM ${fixture.table} WHERE id = ?`, [id]).then((r) => r.rows[0] as Record<string, unknown>);
    const names = Object.keys(fixture.fields);
    const stored = names.filter((n) => !fixture.fields[n]!.modifier);
    const bodies = fc
      .tuple(fc.subarray(stored, { minLength: 1 }), fc.subarray(names.filter((n) => fixture.fields[n]!.modifier)))
      .chain(([some, modifiers]) => fc.record(Object.fromEntries([...some, ...modifiers].map((n) => [n, fixture.fields[n]!.arb]))));
    await fc.assert(
      fc.asyncProperty(bodies, async (body) => {
        const before = await row();
        const res = await owner.patch(fixture.url(id), body);
        expect({ status: res.status, body: res.status === 200 ? undefined : res.body }).toEqual({ status: 200, body: undefined });
        const after = await row();
        const written = new Set(['updated_at', ...Object.keys(body).flatMap((n) => fixture.fields[n]!.columns ?? [snake(n)])]);
        const untouched = (r: Record<string, unknown>) => Object.fromEntries(Object.entries(r).filter(([c]) => !written.has(c)));
        expect(untouched(after)).toEqual(untouched(before));
        for (const [n, value] of Object.entries(body)) {
          if (fixture.fields[n]!.same) expect({ [n]: after[snake(n)] }).toEqual({ [n]: value });
        }
      }),
      { numRuns: Number(process.env['PATCH_RUNS'] ?? 25) },
    );
  }, 60_000);
});
