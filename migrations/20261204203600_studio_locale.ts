import type { Knex } from 'knex';

/**
 * The studio's locale: the order dates are typed and shown in on the forms
 * (en-GB: 31/12/2026), and later how numbers are written. British English
 * unless the owner picks another of the offered locales.
 */

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studio_settings', (t) => {
    t.string('locale', 10).notNullable().defaultTo('en-GB');
  });
  await knex.raw(`ALTER TABLE studio_settings ADD CONSTRAINT studio_settings_locale_check CHECK (locale IN ('en-GB', 'en-US', 'en-IE', 'en-CA', 'ja-JP'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('ALTER TABLE studio_settings DROP CONSTRAINT studio_settings_locale_check');
  await knex.schema.alterTable('studio_settings', (t) => {
    t.dropColumn('locale');
  });
}
