import type { Knex } from 'knex';

/**
 * Kept features measured on a panel (a pocket, a label, embroidery): each a
 * name and a rectangle in exact millimetres from the panel's top-left corner,
 * { name, xMm, yMm, widthMm, heightMm }, for the planner to keep whole inside one piece.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('panels', (t) => {
    t.jsonb('features').notNullable().defaultTo(knex.raw("'[]'::jsonb"));
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('panels', (t) => {
    t.dropColumn('features');
  });
}
