import { snakeCaseMappers, type Model, type QueryBuilder } from 'objection';

// The same snake_case -> camelCase mapping knex applies to every other query (server/core/database.ts).
const { parse } = snakeCaseMappers();

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyQuery = QueryBuilder<Model, any>;
type ModelsOf<Q> = Q extends QueryBuilder<infer M, unknown> ? M[] : never;

/**
 * Runs reads that do not depend on one another in one round trip: the
 * statements go to PostgreSQL as one simple-protocol query and each comes back
 * as the models its builder would have made. A page that needs eight small
 * reads then waits for PostgreSQL once instead of eight times.
 *
 * The simple protocol takes no parameters, so knex writes each value into the
 * SQL with its own quoting (`toQuery()`). Meant for ids, keys and constants the
 * server chose, not for free text.
 */
export async function readTogether<const Q extends readonly AnyQuery[]>(queries: Q): Promise<{ -readonly [K in keyof Q]: ModelsOf<Q[K]> }> {
  // Each query's rows become its own models, in order; the tuple type says which are which.
  const answers: Model[][] = queries.length ? await readAll(queries) : [];
  return answers as { -readonly [K in keyof Q]: ModelsOf<Q[K]> };
}

async function readAll(queries: readonly AnyQuery[]): Promise<Model[][]> {
  const knex = queries[0]!.modelClass().knex();
  // knex.raw reads `?` as a binding; every `?` in the written SQL is meant literally.
  const sql = queries.map((q) => q.toKnexQuery().toQuery()).join(';\n').replace(/\?/g, '\\?');
  const answer: unknown = await knex.raw(sql);
  // One statement gives one result, several an array of them.
  const results = (queries.length === 1 ? [answer] : answer) as Array<{ rows: Record<string, unknown>[] }>;
  if (!Array.isArray(results) || results.length !== queries.length) throw new Error(`readTogether: ${queries.length} statements, ${Array.isArray(results) ? results.length : 'no'} results`);
  return queries.map((q, i) => {
    const modelClass = q.modelClass();
    return results[i]!.rows.map((row) => modelClass.fromDatabaseJson(parse(row)));
  });
}
