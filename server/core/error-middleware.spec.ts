import express from 'express';
import request from 'supertest';
import { errorMiddleware } from './error-middleware';
import { startTestApp, type TestApp } from '../testing/test-app';

/**
 * The last net under validation: a value PostgreSQL itself refuses (a real
 * error from a real database, not a made-up one) is answered 400 with what to
 * do, not 500, and is not logged as a fault of ours.
 */
describe('the error middleware', () => {
  let t: TestApp;
  const logged: unknown[] = [];
  let app: express.Express;

  beforeAll(async () => {
    t = await startTestApp();
    app = express();
    const sql: Record<string, string> = {
      'int-overflow': 'select 2147483648::int',
      'year-zero': "select '0000-01-01'::date",
      'bad-date': "select 'yesterday-ish'::date",
      'nul-byte': `select convert_from('\\x00'::bytea, 'UTF8')`,
    };
    app.get('/sql/:name', async (req) => {
      await t.knex.raw(sql[req.params['name']!]!);
      throw new Error('the statement should have failed');
    });
    app.use(errorMiddleware((err) => logged.push(err)));
  });
  afterAll(() => t.close());

  it.each([
    ['int-overflow', /too large to keep/],
    ['year-zero', /date .* out of range|date .* could not be read/],
    ['bad-date', /Enter dates as YYYY-MM-DD/],
    ['nul-byte', /cannot be kept \(such as a NUL byte\)/],
  ])('answers PostgreSQL refusing %s with a 400 saying what to check', async (name, message) => {
    logged.length = 0;
    const res = await request(app).get(`/sql/${name}`);
    expect({ status: res.status, code: res.body.error.code }).toEqual({ status: 400, code: 'out_of_range' });
    expect(res.body.error.message).toMatch(message);
    expect(logged).toEqual([]);
  });
});
