import type { Knex } from 'knex';

/**
 * One-time links to set a password: an invitation to the client portal or a
 * "forgot password" reset. Only the SHA-256 of the link's token is kept, so a
 * copy of the database cannot be used to sign in. A sign-in made by an
 * invitation has no password of its own until the link is used
 * (`users.awaiting_password`), and a client remembers when it was last invited.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('password_links', (t) => {
    t.increments('id').primary();
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('purpose').notNullable().checkIn(['invitation', 'reset'], 'password_links_purpose_check');
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id', 'purpose']);
  });
  await knex.schema.alterTable('users', (t) => {
    t.boolean('awaiting_password').notNullable().defaultTo(false);
  });
  await knex.schema.alterTable('clients', (t) => {
    t.timestamp('invitation_sent_at', { useTz: true });
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('clients', (t) => t.dropColumn('invitation_sent_at'));
  await knex.schema.alterTable('users', (t) => t.dropColumn('awaiting_password'));
  await knex.schema.dropTable('password_links');
}
