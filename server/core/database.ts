import Knex, { type Knex as KnexType } from 'knex';
import { knexSnakeCaseMappers } from 'objection';
import path from 'node:path';
import { Client, types } from 'pg';

// A date column is a calendar day, not an instant: keep it as 'YYYY-MM-DD' so a deadline never moves by a day.
types.setTypeParser(1082, (value) => value);

export const MIGRATIONS_DIR = path.resolve(__dirname, '..', '..', 'migrations');
export const SEEDS_DIR = path.resolve(__dirname, '..', '..', 'seeds');

/**
 * One knex instance per process. snake_case in PostgreSQL, camelCase in code.
 * Migrations are TypeScript, always loaded through the same TypeScript loader.
 */
export function createKnex(databaseUrl: string, pool: { min: number; max: number } = { min: 0, max: 10 }): KnexType {
  return Knex({
    client: 'pg',
    connection: { connectionString: databaseUrl, application_name: 'keepstitch' },
    pool: { ...pool, acquireTimeoutMillis: 5000 },
    acquireConnectionTimeout: 5000,
    migrations: { directory: MIGRATIONS_DIR, loadExtensions: ['.ts'], tableName: 'knex_migrations' },
    seeds: { directory: SEEDS_DIR, loadExtensions: ['.ts'] },
    ...knexSnakeCaseMappers(),
  });
}

/** Creates the database named in the URL when it does not exist yet. */
export async function ensureDatabase(url: string): Promise<void> {
  const target = new URL(url);
  const name = decodeURIComponent(target.pathname.replace(/^\//, ''));
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`Unexpected database name "${name}"`);
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const client = new Client({ connectionString: admin.toString() });
  await client.connect();
  try {
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
}
