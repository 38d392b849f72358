import { createTestDatabase, type TestDatabase } from '../testing/test-database';
import * as migration from '../../migrations/20261204194400_block_kind_keys';

// The studio's minutes per block kind move from their own keys to the designs' kinds, and back on rollback.
describe('the block kind keys migration', () => {
  let db: TestDatabase;
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  const minutes = async () => (await db.knex('studio_settings').where({ id: 1 }).first()).blockMinutes as Record<string, number>;
  const store = (value: Record<string, number>) => db.knex('studio_settings').where({ id: 1 }).update({ blockMinutes: JSON.stringify(value) });

  it('renames rails and flying geese to the kinds designs use, keeping every other minute, and reverses on the way down', async () => {
    await store({ square: 6, rectangle: 7, hst: 12, flying_geese: 14, fan: 45 });
    await migration.up(db.knex);
    expect(await minutes()).toEqual({ square: 6, rectangles: 7, hst: 12, 'flying-geese': 14, fan: 45 });
    await migration.down(db.knex);
    expect(await minutes()).toEqual({ square: 6, rectangle: 7, hst: 12, flying_geese: 14, fan: 45 });
  });

  it('keeps the value quotes read (the old key) when a row holds both spellings, and leaves a row without them alone', async () => {
    await store({ rectangle: 7, rectangles: 99 });
    await migration.up(db.knex);
    expect(await minutes()).toEqual({ rectangles: 7 });
    await store({ square: 6 });
    await migration.up(db.knex);
    expect(await minutes()).toEqual({ square: 6 });
  });
});
