import type { Knex } from 'knex';

/** Inserts a commission for a client straight into the database. */
export async function addCommission(knex: Knex, clientId: number, extra: Record<string, unknown> = {}): Promise<number> {
  const [row] = await knex('commissions').insert({ clientId, title: 'Test quilt', kind: 'memory_quilt', ageGroup: 'adult', ...extra }).returning('id');
  return row.id as number;
}
