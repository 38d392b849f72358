import { Client } from 'pg';

/**
 * A fingerprint of every table of a database: its row count and a hash of its
 * rows in a fixed order. Two databases (or one, before and after) hold the
 * same data exactly when their fingerprints are equal.
 */
export async function tableFingerprints(url: string, except: readonly string[] = []): Promise<Record<string, string>> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    const tables = await client.query<{ table_name: string }>(
      `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name`,
    );
    const out: Record<string, string> = {};
    for (const { table_name } of tables.rows) {
      if (except.includes(table_name)) continue;
      const r = await client.query<{ rows: string; hash: string }>(
        `SELECT count(*)::text AS rows, md5(coalesce(string_agg(t::text, '|' ORDER BY t::text), '')) AS hash FROM "${table_name}" t`,
      );
      out[table_name] = `${r.rows[0]!.rows}:${r.rows[0]!.hash}`;
    }
    return out;
  } finally {
    await client.end();
  }
}
