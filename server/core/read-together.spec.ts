import { GarmentModel } from '../models/garment-model';
import { ClientModel } from '../models/client-model';
import { CommissionModel } from '../models/commission-model';
import { addUser, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { readTogether } from './read-together';

describe('readTogether', () => {
  let t: TestApp;
  let commissionId: number;
  let clientId: number;

  beforeAll(async () => {
    t = await startTestApp();
    clientId = (await addUser(t.knex, 'client')).clientId!;
    commissionId = await addCommission(t.knex, clientId);
    await t.knex('garments').insert([
      { commissionId, description: `Dad's "best" shirt? \\ with a backslash; DROP TABLE garments; --`, colour: 'blue' },
      { commissionId, description: 'Second shirt', colour: 'grey' },
    ]);
  });
  afterAll(() => t.close());

  it('gives each query the same models it gives alone, in one round trip', async () => {
    const garments = () => GarmentModel.query().where('commissionId', commissionId).orderBy('id');
    // A value holding a quote, a question mark and a backslash is quoted by knex, not read as SQL or as a binding.
    const byText = () => GarmentModel.query().where('description', `Dad's "best" shirt? \\ with a backslash; DROP TABLE garments; --`);
    const client = () => ClientModel.query().where('id', clientId);
    const none = () => CommissionModel.query().where('id', -1);

    const statements: string[] = [];
    const count = (q: { sql: string }) => statements.push(q.sql);
    t.knex.on('query', count);
    const [g, text, c, empty] = await readTogether([garments(), byText(), client(), none()]);
    t.knex.off('query', count);

    expect(statements.length).toBe(1);
    expect(g.map((m) => m.toJSON())).toEqual((await garments()).map((m) => m.toJSON()));
    expect(g[0]).toBeInstanceOf(GarmentModel);
    expect(g[0]!.createdAt).toBeInstanceOf(Date);
    expect(g.map((m) => m.description)).toEqual([`Dad's "best" shirt? \\ with a backslash; DROP TABLE garments; --`, 'Second shirt']);
    expect(text.map((m) => m.id)).toEqual([g[0]!.id]);
    expect(c.map((m) => m.toJSON())).toEqual((await client()).map((m) => m.toJSON()));
    expect(empty).toEqual([]);
    expect(await t.knex('garments').where({ commissionId }).count()).toEqual([{ count: '2' }]);
  });

  it('works with one query as with several', async () => {
    const [c] = await readTogether([ClientModel.query().where('id', clientId)]);
    expect(c.map((m) => m.id)).toEqual([clientId]);
  });
});
