import type { Knex } from 'knex';
import { securedRouter } from '../core/secured-router';

/** 200 when the database answers within two seconds, 503 otherwise. */
export function healthRouter(knex: Knex) {
  const r = securedRouter('/api/health');
  r.get('/', async (_req, res) => {
    try {
      await Promise.race([
        knex.raw('select 1'),
        new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2000).unref()),
      ]);
      res.json({ status: 'ok', database: 'up' });
    } catch {
      res.status(503).json({
        status: 'unavailable',
        database: 'down',
        error: { code: 'unavailable', message: 'The workroom database is not answering.' },
      });
    }
  });
  return r.router;
}
