import { Client } from 'pg';
import { createKnex, ensureDatabase } from '../core/database';

/** The migrated database each test file's own database is copied from. */
export const TEMPLATE_DB = 'keepstitch_template';

export function databaseUrl(name: string): string {
  const base = process.env['DATABASE_URL'];
  if (!base) throw new Error('DATABASE_URL is not set: run the tests with `npm test`, which starts PostgreSQL.');
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}

/** Jest global set-up: a fresh template database with every migration applied. */
export default async function globalSetup(): Promise<void> {
  const admin = new Client({ connectionString: databaseUrl('postgres') });
  await admin.connect();
  try {
    await admin.query(`DROP DATABASE IF EXISTS ${TEMPLATE_DB} WITH (FORCE)`);
  } finally {
    await admin.end();
  }
  const url = databaseUrl(TEMPLATE_DB);
  await ensureDatabase(url);
  const knex = createKnex(url);
  try {
    await knex.migrate.latest();
  } finally {
    await knex.destroy();
  }
}
