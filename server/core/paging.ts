import { raw, type Model, type QueryBuilder } from 'objection';

/**
 * One page of a query and the number of rows the whole query matches, read in
 * one round trip (a window count beside each row) instead of a second count
 * query. The query must already select its columns.
 */
export async function pageOf<M extends Model>(query: QueryBuilder<M, M[]>, page: number, pageSize: number): Promise<{ results: M[]; total: number }> {
  const rows = await query.clone().select(raw('count(*) OVER () AS page_total')).limit(pageSize).offset(page * pageSize);
  let total: number;
  if (rows.length > 0) {
    total = Number((rows[0] as unknown as { pageTotal: string }).pageTotal);
  } else {
    // Past the last page (or nothing matches): count on its own.
    total = page === 0 ? 0 : await query.clone().resultSize();
  }
  for (const row of rows) delete (row as unknown as { pageTotal?: string }).pageTotal;
  return { results: rows, total };
}
