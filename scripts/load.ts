/**
 * npm run load — 200 concurrent signed-in users for 60 s (LOAD_SECONDS) on a
 * mix of commission lists, commission pages, garment changes and photo
 * uploads, against the real server (its own process) and demo data scaled up
 * to 500 clients, 2,000 commissions and 30,000 garments. Loopback only.
 * Prints requests, errors and latency percentiles. Figures, not a test.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import os from 'node:os';
import autocannon from 'autocannon';
import bcrypt from 'bcryptjs';
import sharp from 'sharp';
import { Client } from 'pg';
import { ensureDatabase } from './db';

const ROOT = path.resolve(__dirname, '..');
const PORT = Number(process.env['LOAD_PORT'] ?? 4392);
const BASE = `http://127.0.0.1:${PORT}`;
const SECONDS = Number(process.env['LOAD_SECONDS'] ?? 60);
const USERS = Number(process.env['LOAD_USERS'] ?? 200);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main(): Promise<void> {
  const base = new URL(process.env['DATABASE_URL']!);
  base.pathname = '/keepstitch_load';
  const url = base.toString();
  const admin = new URL(url);
  admin.pathname = '/postgres';
  const a = new Client({ connectionString: admin.toString() });
  await a.connect();
  await a.query('DROP DATABASE IF EXISTS keepstitch_load WITH (FORCE)');
  await a.end();
  await ensureDatabase(url);
  const env = { ...process.env, DATABASE_URL: url, PORT: String(PORT), NODE_ENV: 'production', SESSION_SECRET: 'load-'.padEnd(48, 'l'), SIGN_IN_LIMIT: '100000', UPLOAD_DIR: path.join(ROOT, '.data', 'load-uploads'), PAYMENTS_API_URL: 'http://127.0.0.1:9', SMTP_PORT: '9' };
  await new Promise<void>((resolve, reject) => spawn(process.execPath, ['--import', 'tsx', 'scripts/db.ts', 'migrate'], { cwd: ROOT, env, stdio: 'inherit' }).on('exit', (c) => (c === 0 ? resolve() : reject(new Error('migrate failed')))));

  console.log('Seeding 500 clients, 2,000 commissions, 30,000 garments...');
  const db = new Client({ connectionString: url });
  await db.connect();
  await db.query(`INSERT INTO clients (name, email) SELECT 'Load client ' || i, 'c' || i || '@load.test' FROM generate_series(1, 500) i`);
  await db.query(`INSERT INTO commissions (client_id, title, kind, age_group, stage, deadline)
    SELECT 1 + (i % 500), 'Load quilt ' || i, 'memory_quilt', 'adult', (ARRAY['enquiry','quoted','booked','garments_in','preparation','cutting','piecing','quilting','binding','ready'])[1 + i % 10], current_date + (i % 120) - 20
    FROM generate_series(1, 2000) i`);
  await db.query(`INSERT INTO garments (commission_id, description, colour) SELECT 1 + (i % 2000), 'Load shirt ' || i, 'blue' FROM generate_series(1, 30000) i`);
  await db.query(`INSERT INTO custody_events (garment_id, kind) SELECT id, 'announced' FROM garments`);
  await db.query(`INSERT INTO custody_events (garment_id, kind) SELECT id, 'received' FROM garments`);
  const hash = bcrypt.hashSync('load password', 4);
  await db.query(`INSERT INTO users (email, name, role, password_hash) SELECT 'owner' || i || '@load.test', 'Owner ' || i, 'owner', $1 FROM generate_series(1, $2::int) i`, [hash, USERS]);
  await db.query('ANALYZE');
  await db.end();

  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
  try {
    for (let i = 0; i < 80 && !(await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false)); i++) await sleep(250);
    console.log(`Signing in ${USERS} users...`);
    const sessions: Array<{ cookie: string; token: string }> = [];
    for (let i = 1; i <= USERS; i++) {
      const me = await fetch(`${BASE}/api/auth/me`);
      // The session is stored before the last byte of the answer: read it all before using the cookies.
      await me.text();
      const jar = me.headers.getSetCookie().map((c) => c.split(';')[0]!);
      const token = decodeURIComponent(jar.find((c) => c.startsWith('XSRF-TOKEN='))!.split('=')[1]!);
      const res = await fetch(`${BASE}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json', Cookie: jar.join('; '), 'X-XSRF-TOKEN': token }, body: JSON.stringify({ email: `owner${i}@load.test`, password: 'load password' }) });
      if (res.status !== 200) throw new Error(`sign-in ${i} answered ${res.status}: ${await res.text()} (cookies ${jar.join('; ')})`);
      const after = res.headers.getSetCookie().map((c) => c.split(';')[0]!);
      sessions.push({ cookie: after.join('; '), token: decodeURIComponent(after.find((c) => c.startsWith('XSRF-TOKEN='))!.split('=')[1]!) });
    }

    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#336699' } }).jpeg().toBuffer();
    const boundary = 'keepstitchload';
    const multipart = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="load.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`),
      jpeg,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    let next = 0;
    const rnd = (n: number) => 1 + Math.floor(Math.random() * n);
    const withSession = (extra: Record<string, string> = {}) => (req: { headers?: Record<string, string> }, context: Record<string, unknown>) => {
      const s = (context['s'] as (typeof sessions)[number] | undefined) ?? sessions[next++ % sessions.length]!;
      context['s'] = s;
      req.headers = { ...(req.headers ?? {}), cookie: s.cookie, 'x-xsrf-token': s.token, ...extra };
      return req;
    };
    // Every answer's time, so p95 can be read exactly (autocannon's summary has p90 and p97.5).
    const times: number[] = [];
    const result = await new Promise<autocannon.Result>((resolve, reject) => {
      const instance = autocannon(
        {
          url: BASE,
          connections: USERS,
          duration: SECONDS,
          requests: [
            { method: 'GET', setupRequest: (req: any, ctx: any) => ({ ...withSession()(req, ctx), path: `/api/commissions?page=${rnd(20) - 1}&pageSize=25&stage=piecing,quilting&sort=deadline` }) },
            { method: 'GET', setupRequest: (req: any, ctx: any) => ({ ...withSession()(req, ctx), path: `/api/commissions/${rnd(2000)}` }) },
            { method: 'PATCH', body: JSON.stringify({ colour: 'indigo' }), setupRequest: (req: any, ctx: any) => ({ ...withSession({ 'content-type': 'application/json' })(req, ctx), path: `/api/garments/${rnd(30000)}` }) },
            { method: 'POST', body: multipart, setupRequest: (req: any, ctx: any) => ({ ...withSession({ 'content-type': `multipart/form-data; boundary=${boundary}` })(req, ctx), path: `/api/garments/${rnd(30000)}/photos` }) },
          ],
        } as autocannon.Options,
        (err, res) => (err ? reject(err) : resolve(res)),
      );
      instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => times.push(ms));
    });
    const l = result.latency;
    times.sort((a, b) => a - b);
    const at = (q: number) => Math.round(times[Math.min(times.length - 1, Math.floor(q * times.length))] ?? NaN);
    console.log(`\n${new Date().toISOString()}, ${os.cpus().length} cores, ${USERS} signed-in users, ${SECONDS} s, mix: list / commission page / garment change / photo upload`);
    console.log(`requests: ${result.requests.total} (${Math.round(result.requests.average)}/s), errors: ${result.errors}, timeouts: ${result.timeouts}, non-2xx: ${result.non2xx}`);
    console.log(`latency ms: p50 ${at(0.5)}, p95 ${at(0.95)}, p99 ${at(0.99)}, max ${l.max} (of ${times.length} answers)`);
    console.log(result.errors + result.non2xx + result.timeouts === 0 ? 'PASS: no errors' : 'FAIL: some requests failed');
    process.exitCode = result.errors + result.non2xx + result.timeouts === 0 ? 0 : 1;
  } finally {
    server.kill('SIGTERM');
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
