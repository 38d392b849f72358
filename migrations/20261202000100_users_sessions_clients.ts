import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('clients', (t) => {
    t.increments('id').primary();
    t.string('name', 200).notNullable();
    t.string('email', 254);
    t.string('phone', 40);
    t.text('address');
    t.text('notes');
    t.boolean('portfolio_consent').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('CREATE INDEX clients_name_lower_idx ON clients (lower(name))');

  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable();
    t.string('name', 200).notNullable();
    t.string('role', 16).notNullable();
    t.integer('client_id').references('id').inTable('clients').onDelete('RESTRICT');
    t.string('password_hash', 100).notNullable();
    t.timestamp('password_changed_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('CREATE UNIQUE INDEX users_email_lower_key ON users (lower(email))');
  await knex.raw(`ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('owner', 'workroom', 'client'))`);
  await knex.raw(
    `ALTER TABLE users ADD CONSTRAINT users_client_link_check CHECK ((role = 'client') = (client_id IS NOT NULL))`,
  );

  // The session store's table (connect-pg-simple's schema).
  await knex.raw(`
    CREATE TABLE session (
      sid varchar NOT NULL COLLATE "default" PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    )`);
  await knex.raw('CREATE INDEX session_expire_idx ON session (expire)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('session');
  await knex.schema.dropTable('users');
  await knex.schema.dropTable('clients');
}
