import Knex, { type Knex as KnexType } from 'knex';
import { knexSnakeCaseMappers } from 'objection';
import path from 'node:path';
import { types } from 'pg';

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
