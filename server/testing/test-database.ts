import { randomBytes } from 'node:crypto';
import { Client } from 'pg';
import type { Knex } from 'knex';
import { createKnex } from '../core/database';
import { databaseUrl, TEMPLATE_DB } from './global-setup';

export interface TestDatabase {
  url: string;
  knex: Knex;
  drop(): Promise<void>;
}

async function admin<T>(fn: (c: Client) => Promise<T>): Promise<T> {
  const client = new Client({ connectionString: databaseUrl('postgres') });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

/** A real PostgreSQL database of this test file's own, copied from the migrated template. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const name = `ks_test_${randomBytes(6).toString('hex')}`;
  await admin((c) => c.query(`CREATE DATABASE ${name} TEMPLATE ${TEMPLATE_DB}`));
  const url = databaseUrl(name);
  const knex = createKnex(url, { min: 0, max: 5 });
  return {
    url,
    knex,
    async drop() {
      await knex.destroy();
      await admin((c) => c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`));
    },
  };
}
