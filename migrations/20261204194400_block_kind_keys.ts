import type { Knex } from 'knex';

/**
 * The studio's minutes per block kind were stored under keys of their own
 * ("rectangle", "flying_geese") beside the designs' kinds ("rectangles",
 * "flying-geese"). They now use the designs' kinds, so one spelling names a
 * kind everywhere. Designs already store these kinds and are left as they are.
 * Where a row holds both spellings, the old key was the one quotes read, so
 * its value is kept.
 */
const RENAMED: readonly [from: string, to: string][] = [
  ['rectangle', 'rectangles'],
  ['flying_geese', 'flying-geese'],
];

async function renameKeys(knex: Knex, pairs: readonly [string, string][]): Promise<void> {
  for (const [from, to] of pairs) {
    await knex.raw(
      `UPDATE studio_settings
          SET block_minutes = (block_minutes - ?::text) || jsonb_build_object(?::text, block_minutes -> ?::text)
        WHERE block_minutes -> ?::text IS NOT NULL`,
      [from, to, from, from],
    );
  }
}

export async function up(knex: Knex): Promise<void> {
  await renameKeys(knex, RENAMED);
}

export async function down(knex: Knex): Promise<void> {
  await renameKeys(
    knex,
    RENAMED.map(([from, to]) => [to, from]),
  );
}
