import type { Knex } from 'knex';

/**
 * Reminders and the calendar feed. Each reminder kind can be switched off in
 * the settings (on by default); `reminders_sent` holds one row per reminder
 * mailed, keyed by kind, subject and due date, so a reminder goes once even
 * when two sweeps run together or the server restarts. The calendar feed's
 * address holds a secret of which only its SHA-256 is kept.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('studio_settings', (t) => {
    t.boolean('remind_quote_expiry').notNullable().defaultTo(true);
    t.boolean('remind_balance_due').notNullable().defaultTo(true);
    t.boolean('remind_garments_late').notNullable().defaultTo(true);
    t.integer('garments_late_days').notNullable().defaultTo(14);
    t.string('calendar_feed_hash', 64);
    t.timestamp('calendar_feed_made_at', { useTz: true });
  });
  await knex.raw(`ALTER TABLE studio_settings ADD CONSTRAINT studio_settings_garments_late_days_check CHECK (garments_late_days BETWEEN 1 AND 365)`);

  await knex.schema.createTable('reminders_sent', (t) => {
    t.increments('id').primary();
    t.string('kind', 30).notNullable();
    t.integer('subject_id').notNullable();
    t.date('due_on').notNullable();
    t.integer('outbox_mail_id').references('id').inTable('outbox_mails').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['kind', 'subject_id', 'due_on']);
  });
  await knex.raw(`ALTER TABLE reminders_sent ADD CONSTRAINT reminders_sent_kind_check CHECK (kind IN ('quote_expiry', 'balance_due', 'garments_late'))`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('reminders_sent');
  await knex.raw('ALTER TABLE studio_settings DROP CONSTRAINT studio_settings_garments_late_days_check');
  await knex.schema.alterTable('studio_settings', (t) => {
    t.dropColumn('remind_quote_expiry');
    t.dropColumn('remind_balance_due');
    t.dropColumn('remind_garments_late');
    t.dropColumn('garments_late_days');
    t.dropColumn('calendar_feed_hash');
    t.dropColumn('calendar_feed_made_at');
  });
}
