import type { Knex } from 'knex';

const list = (values: readonly string[]) => values.map((v) => `'${v}'`).join(', ');
const BEFORE = ['announced', 'received', 'washed', 'stored', 'moved', 'cut', 'returned', 'withdrawn', 'correction'];
/** A garment's custody may also end as used in the piece, or with only its leftovers going back. */
const AFTER = [...BEFORE, 'used', 'leftovers_returned'];

export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE custody_events DROP CONSTRAINT custody_kind_check');
  await knex.raw(`ALTER TABLE custody_events ADD CONSTRAINT custody_kind_check CHECK (kind IN (${list(AFTER)}))`);
}

export async function down(knex: Knex): Promise<void> {
  // Custody is append-only, so the new entries are kept; rolling back refuses while any exist.
  await knex.raw('ALTER TABLE custody_events DROP CONSTRAINT custody_kind_check');
  await knex.raw(`ALTER TABLE custody_events ADD CONSTRAINT custody_kind_check CHECK (kind IN (${list(BEFORE)}))`);
}
