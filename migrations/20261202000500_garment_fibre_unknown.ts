import type { Knex } from 'knex';

// A client announcing a garment may not know its fibre: keep "not known" rather than guess cotton.
export async function up(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE garments ALTER COLUMN fibre DROP NOT NULL, ALTER COLUMN fibre DROP DEFAULT');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw(`UPDATE garments SET fibre = 'other' WHERE fibre IS NULL`);
  await knex.raw(`ALTER TABLE garments ALTER COLUMN fibre SET DEFAULT 'cotton', ALTER COLUMN fibre SET NOT NULL`);
}
