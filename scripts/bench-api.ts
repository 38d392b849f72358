/**
 * npm run bench:api — the commission detail route (50 garments, 500 panels)
 * and the commissions list (a page of 25 of 2,000, with filters) under 64
 * concurrent connections, against a bare Express route that runs one
 * equivalent pg query, in the same run: after a warm-up of each, app and bare
 * take turns for BENCH_ROUNDS rounds of BENCH_SECONDS, so a passing spell of
 * load on the machine falls on both. Prints requests/s and p50/p99 latency
 * of every round, their medians and ratios, and EXPLAIN ANALYZE of the list
 * query. Figures, not a test.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import autocannon from 'autocannon';
import express from 'express';
import bcrypt from 'bcryptjs';
import { Pool } from 'pg';
import request from 'supertest';
import { createApp } from '../server/app';
import { loadConfig } from '../server/core/config';
import { createKnex } from '../server/core/database';
import { createTestDatabase } from '../server/testing/test-database';
import migrateTemplate from '../server/testing/global-setup';

const SECONDS = Number(process.env['BENCH_SECONDS'] ?? 10);
/** Rounds per route, app and bare taking turns, after a warm-up of each that is not counted. */
const ROUNDS = Number(process.env['BENCH_ROUNDS'] ?? 3);
const WARM_UP_SECONDS = 2;
const CONNECTIONS = 64;

async function listen(app: express.Express): Promise<{ server: Server; url: string }> {
  const server = createServer(app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

function run(url: string, cookie: string, seconds = SECONDS): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    // The load comes from a worker thread, so it does not wait its turn on the server's event loop.
    autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: { cookie }, workers: 1 }, (err, result) => (err ? reject(err) : resolve(result)));
  });
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function figures(r: { rps: number; p50: number; p99: number }): string {
  return String(Math.round(r.rps)).padStart(10) + `${r.p50}`.padStart(7) + `${r.p99}`.padStart(7);
}

async function main(): Promise<void> {
  await migrateTemplate();
  const db = await createTestDatabase();
  const knex = db.knex;
  console.log(`Seeding: 500 clients, 2,000 commissions, one with 50 garments of 10 panels each...`);
  const clientIds = (await knex('clients').insert(Array.from({ length: 500 }, (_, i) => ({ name: `Bench client ${i}`, email: `c${i}@bench.test` }))).returning('id')).map((r) => r.id as number);
  const stages = ['enquiry', 'quoted', 'booked', 'garments_in', 'preparation', 'cutting', 'piecing', 'quilting', 'binding', 'ready'];
  const rows = Array.from({ length: 2000 }, (_, i) => ({
    clientId: clientIds[i % clientIds.length],
    title: `Bench quilt ${i}`,
    kind: 'memory_quilt',
    ageGroup: 'adult',
    stage: stages[i % stages.length],
    deadline: new Date(Date.now() + ((i % 120) - 20) * 86_400_000).toISOString().slice(0, 10),
  }));
  for (let i = 0; i < rows.length; i += 500) await knex('commissions').insert(rows.slice(i, i + 500));
  const [big] = await knex('commissions').select('id').orderBy('id').limit(1);
  const garments = (await knex('garments').insert(Array.from({ length: 50 }, (_, i) => ({ commissionId: big.id, description: `Shirt ${i}`, colour: 'blue' }))).returning('id')).map((r) => r.id as number);
  await knex('custodyEvents').insert(garments.flatMap((g) => [{ garmentId: g, kind: 'announced' }, { garmentId: g, kind: 'received' }, { garmentId: g, kind: 'stored', place: 'Box 1' }]));
  await knex('panels').insert(garments.flatMap((g) => Array.from({ length: 10 }, (_, j) => ({ garmentId: g, name: `panel ${j}`, widthMm: '300', heightMm: '400' }))));
  await knex('users').insert({ email: 'bench-owner@bench.test', name: 'Bench', role: 'owner', passwordHash: bcrypt.hashSync('bench password', 4) });
  await knex.raw('ANALYZE');

  const config = { ...loadConfig({ NODE_ENV: 'test', DATABASE_URL: db.url, SESSION_SECRET: 'bench-'.padEnd(48, 'b'), WEB_ROOT: '/nonexistent', SIGN_IN_LIMIT: '100000' }) };
  // The pools the server itself runs with (server/index.ts), not the small ones of the test helpers.
  const appKnex = createKnex(db.url);
  const sessionPool = new Pool({ connectionString: db.url, max: 5 });
  const app = createApp({ config, knex: appKnex, sessionPool, log: () => undefined });
  const real = await listen(app);

  // Sign in once; every bench request carries that session.
  const agent = request.agent(real.url);
  const me = await agent.get('/api/auth/me');
  const token = /XSRF-TOKEN=([^;]+)/.exec(String(me.headers['set-cookie']))![1]!;
  const signIn = await agent.post('/api/auth/sign-in').set('X-XSRF-TOKEN', decodeURIComponent(token)).send({ email: 'bench-owner@bench.test', password: 'bench password' });
  const cookie = (signIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');

  // The bare peers: one pg query each, no sessions, no validation.
  const pool = new Pool({ connectionString: db.url, max: 10 });
  const bare = express();
  bare.get('/detail', async (_req, res) => {
    const r = await pool.query(
      `SELECT c.*, (SELECT json_agg(json_build_object('g', g.*, 'panels', (SELECT json_agg(p.*) FROM panels p WHERE p.garment_id = g.id))) FROM garments g WHERE g.commission_id = c.id) AS garments FROM commissions c WHERE c.id = $1`,
      [big.id],
    );
    res.json(r.rows[0]);
  });
  bare.get('/list', async (_req, res) => {
    const r = await pool.query(
      `SELECT c.*, cl.name AS client_name, count(*) OVER () AS total FROM commissions c JOIN clients cl ON cl.id = c.client_id WHERE c.stage = ANY($1) AND c.deadline <= current_date + 30 ORDER BY c.deadline ASC NULLS LAST, c.id LIMIT 25 OFFSET 25`,
      [['piecing', 'quilting', 'binding']],
    );
    res.json({ items: r.rows });
  });
  const peer = await listen(bare);

  const listQuery = '/api/commissions?stage=piecing,quilting,binding&dueWithinDays=30&sort=deadline&dir=asc&page=1&pageSize=25';
  const cases = [
    { name: 'commission detail (50 garments, 500 panels)', app: `${real.url}/api/commissions/${big.id}`, bare: `${peer.url}/detail` },
    { name: 'commissions list (page 2 of 25, filtered)', app: `${real.url}${listQuery}`, bare: `${peer.url}/list` },
  ];
  const check = await agent.get(listQuery);
  if (check.status !== 200) throw new Error(`list answered ${check.status}`);

  console.log(`\n${new Date().toISOString()}, ${os.cpus().length} cores, load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')}, ${CONNECTIONS} connections, ${ROUNDS} rounds of ${SECONDS} s each for app and bare in turn after a ${WARM_UP_SECONDS} s warm-up of each, Node ${process.version}\n`);
  const header = 'req/s'.padStart(10) + 'p50'.padStart(7) + 'p99'.padStart(7);
  const summary: string[] = [];
  for (const c of cases) {
    console.log(c.name);
    console.log('  round' + ' '.repeat(3) + 'app' + header.slice(3) + ' | bare' + header.slice(4) + ' | p99 ratio  errors');
    // Warm-up: JIT, pool connections and PostgreSQL's caches, for both, not counted.
    await run(c.app, cookie, WARM_UP_SECONDS);
    await run(c.bare, '', WARM_UP_SECONDS);
    const app: Array<{ rps: number; p50: number; p99: number }> = [];
    const bare: typeof app = [];
    let errors = 0;
    for (let round = 1; round <= ROUNDS; round++) {
      const a = await run(c.app, cookie);
      const b = await run(c.bare, '');
      errors += a.errors + a.non2xx + b.errors + b.non2xx;
      app.push({ rps: a.requests.average, p50: a.latency.p50, p99: a.latency.p99 });
      bare.push({ rps: b.requests.average, p50: b.latency.p50, p99: b.latency.p99 });
      console.log(`  ${round}`.padEnd(8) + figures(app.at(-1)!) + ' | ' + figures(bare.at(-1)!) + ' | ' + (a.latency.p99 / Math.max(b.latency.p99, 1)).toFixed(2).padStart(9) + `  ${a.errors + a.non2xx}/${b.errors + b.non2xx}`);
    }
    const mid = (list: typeof app) => ({ rps: median(list.map((r) => r.rps)), p50: median(list.map((r) => r.p50)), p99: median(list.map((r) => r.p99)) });
    const [ma, mb] = [mid(app), mid(bare)];
    const ratio = ma.p99 / Math.max(mb.p99, 1);
    summary.push(
      c.name.padEnd(46) + figures(ma) + ' | ' + figures(mb) + ' | ' + ratio.toFixed(2).padStart(9) + (mb.rps / ma.rps).toFixed(2).padStart(11) + `  ${errors}  ${ratio <= 3 ? 'PASS (p99 at most 3x the bare route)' : 'OVER 3x'}`,
    );
  }
  console.log('\nMedians of the rounds:');
  console.log('route'.padEnd(46) + 'app' + header.slice(3) + ' | bare' + header.slice(4) + ' | p99 ratio  rps ratio  errors');
  for (const line of summary) console.log(line);
  console.log('(latencies in ms; rps ratio is bare over app; the bare routes skip sessions, access checks, validation and the derived garment state)\n');

  const sql = knex('commissions')
    .join('clients', 'clients.id', 'commissions.client_id')
    .whereIn('commissions.stage', ['piecing', 'quilting', 'binding'])
    .whereRaw('commissions.deadline <= current_date + 30')
    .orderBy('commissions.deadline')
    .limit(25)
    .offset(25)
    .toQuery();
  const plan = await knex.raw(`EXPLAIN ANALYZE ${sql}`);
  console.log('EXPLAIN ANALYZE of the list query:');
  for (const row of plan.rows as Array<Record<string, string>>) console.log('  ' + Object.values(row)[0]);

  await new Promise((r) => real.server.close(r));
  await new Promise((r) => peer.server.close(r));
  await pool.end();
  await sessionPool.end();
  await appKnex.destroy();
  await db.drop();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
