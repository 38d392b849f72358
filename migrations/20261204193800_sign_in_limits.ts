import type { Knex } from 'knex';

/**
 * Counters of failed sign-in attempts (per account, per address, per known
 * browser), in the layout rate-limiter-flexible's PostgreSQL store reads and
 * writes: key "<kind>:<who>", points used in the window, and the window's end
 * in milliseconds since 1970. Made here so the app never creates tables itself.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE TABLE sign_in_limits (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    )`);
  // The store deletes rows whose window ended an hour ago, every five minutes.
  await knex.raw('CREATE INDEX sign_in_limits_expire_idx ON sign_in_limits (expire)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sign_in_limits');
}
