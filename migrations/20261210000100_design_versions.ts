import type { Knex } from 'knex';

/**
 * A commission's design, versioned: every save is a new row (earlier versions
 * are kept), holding the design as the maker set it, what was derived from it
 * and the cut plan made for it. The client's answer to a shared version is
 * kept on that version.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('design_versions', (t) => {
    t.increments('id').primary();
    t.integer('commission_id').notNullable().references('id').inTable('commissions').onDelete('CASCADE');
    t.integer('version').notNullable();
    t.jsonb('body').notNullable();
    t.jsonb('derived').notNullable();
    t.jsonb('plan').notNullable();
    t.text('note');
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('shared_at', { useTz: true });
    t.string('client_response', 20);
    t.text('client_note');
    t.timestamp('responded_at', { useTz: true });
    t.unique(['commission_id', 'version']);
  });
  await knex.raw("ALTER TABLE design_versions ADD CONSTRAINT design_versions_response_check CHECK (client_response IS NULL OR client_response IN ('approved', 'changes_requested'))");
  await knex.raw('ALTER TABLE design_versions ADD CONSTRAINT design_versions_version_check CHECK (version > 0)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('design_versions');
}
