import { raw, type Model, type QueryBuilder } from 'objection';

/**
 * One page of a query and the number of rows the whole query matches, read in
 * one round trip (a window count beside each row) instead of a second count
 * query. The query must already select its columns.
 */
export async function pageOf<M extends Model>(query: QueryBuilder<M, M[]>, page: number, pageSize: number): Promise<{ results: M[]; total: number }> {
  const rows: Array<M & { pageTotal?: string }> = await query.clone().select(raw('count(*) OVER () AS page_total')).limit(pageSize).offset(page * pageSize);
  let total: number;
  if (rows.length > 0) {
    total = Number(rows[0]!.pageTotal);
  } else {
    // Past the last page (or nothing matches): count on its own.
    total = page === 0 ? 0 : await query.clone().resultSize();
  }
  for (const row of rows) delete row.pageTotal;
  return { results: rows, total };
}

/** The next version number of the rows a query selects (1 for the first), read as `max(version) + 1`. */
export async function nextVersion<M extends Model>(query: QueryBuilder<M, M[]>): Promise<number> {
  const rows = await query.clone().max('version as last').castTo<Array<{ last: number | null }>>();
  return Number(rows[0]?.last ?? 0) + 1;
}
