import { createHmac } from 'node:crypto';
import request from 'supertest';
import { Pool } from 'pg';
import { createApp } from '../app';
import { loadConfig } from '../core/config';
import { createKnex } from '../core/database';
import { startTestApp } from '../testing/test-app';

describe('GET /api/health', () => {
  it('answers 200 with the database up', async () => {
    const t = await startTestApp();
    try {
      const res = await request(t.app).get('/api/health');
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ status: 'ok', database: 'up' });
    } finally {
      await t.close();
    }
  });

  it('answers 503 with a clear message when the database is stopped', async () => {
    // A PostgreSQL address where no server is running: what the app sees when the database is stopped.
    const url = 'postgres://postgres@127.0.0.1:9/keepstitch';
    const knex = createKnex(url, { min: 0, max: 1 });
    const sessionPool = new Pool({ connectionString: url, max: 1 });
    const config = loadConfig({ NODE_ENV: 'test', DATABASE_URL: url, SESSION_SECRET: 'x'.repeat(40), WEB_ROOT: '/nonexistent' });
    const app = createApp({ config, knex, sessionPool, log: () => undefined });
    try {
      const res = await request(app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({
        status: 'unavailable',
        database: 'down',
        error: { code: 'unavailable', message: 'The workroom database is not answering.' },
      });
      // Other routes say the same in the API's error shape, never a stack trace.
      // A correctly signed session cookie makes the app read the session store.
      const signature = createHmac('sha256', config.sessionSecret).update('some-session').digest('base64').replace(/=+$/, '');
      const cookie = `ks.sid=${encodeURIComponent(`s:some-session.${signature}`)}`;
      const other = await request(app).get('/api/auth/me').set('Cookie', cookie);
      expect(other.status).toBe(503);
      expect(other.body.error.code).toBe('unavailable');
      expect(JSON.stringify(other.body)).not.toMatch(/ECONNREFUSED|at .*\.ts/);
    } finally {
      await knex.destroy();
      await sessionPool.end();
    }
  });
});
