/**
 * PostgreSQL stopped and started again under a steady stream of writes. The
 * real server runs as its own process against a cluster of this run's own
 * (scripts/fault-db.sh makes it). Prints what the API answered while the
 * database was down, how long it took to answer again once it was back
 * (target: within 5 s, without restarting the server), and checks that every
 * write the API acknowledged (201) is in the database afterwards.
 */
import { spawn, execFileSync } from 'node:child_process';
import path from 'node:path';
import { Client } from 'pg';
import bcrypt from 'bcryptjs';
import request from 'supertest';

const ROOT = path.resolve(__dirname, '..');
const PORT = Number(process.env['FAULT_PORT'] ?? 4391);
const BASE = `http://127.0.0.1:${PORT}`;
const url = process.env['DATABASE_URL']!;
const pgData = process.env['FAULT_PG_DATA']!;
const pgCtl = (...args: string[]) => execFileSync('bash', ['-c', `source scripts/lib.sh >/dev/null && as_pg pg_ctl -D "${pgData}" ${args.join(' ')}`], { cwd: ROOT, stdio: 'pipe' });
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main(): Promise<void> {
  const env = { ...process.env, PORT: String(PORT), NODE_ENV: 'production', SESSION_SECRET: 'fault-'.padEnd(48, 'f'), SIGN_IN_LIMIT: '100000', UPLOAD_DIR: path.join(ROOT, '.data', 'fault', 'uploads'), PAYMENTS_API_URL: 'http://127.0.0.1:9', SMTP_PORT: '9' };
  execFileSync(process.execPath, ['--import', 'tsx', 'scripts/db.ts', 'migrate'], { cwd: ROOT, env, stdio: 'inherit' });
  const db = new Client({ connectionString: url });
  await db.connect();
  await db.query(`INSERT INTO users (email, name, role, password_hash) VALUES ('fault@x.test', 'Fault', 'owner', $1) ON CONFLICT DO NOTHING`, [bcrypt.hashSync('fault password', 4)]);
  await db.end();

  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'inherit'] });
  try {
    for (let i = 0; i < 80 && !(await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false)); i++) await sleep(250);
    const agent = request.agent(BASE);
    const me = await agent.get('/api/auth/me');
    let token = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(String(me.headers['set-cookie']))![1]!);
    const signIn = await agent.post('/api/auth/sign-in').set('X-XSRF-TOKEN', token).send({ email: 'fault@x.test', password: 'fault password' });
    token = decodeURIComponent(/XSRF-TOKEN=([^;]+)/.exec(String(signIn.headers['set-cookie']))![1]!);

    const acknowledged: number[] = [];
    const statuses = new Map<number, number>();
    const downMessages = new Set<string>();
    let running = true;
    let phase: 'up' | 'down' | 'back' = 'up';
    let backAt = 0;
    let firstOkAfterBack = 0;
    let n = 0;
    const worker = async () => {
      while (running) {
        const name = `Fault client ${++n}`;
        const res = await agent.post('/api/clients').set('X-XSRF-TOKEN', token).send({ name }).catch(() => null);
        const status = res?.status ?? 0;
        statuses.set(status, (statuses.get(status) ?? 0) + 1);
        if (status === 201) {
          acknowledged.push(res!.body.id);
          if (phase === 'back' && !firstOkAfterBack) firstOkAfterBack = Date.now();
        } else if (phase === 'down' && res?.body?.error?.message) downMessages.add(`${status} ${res.body.error.message}`);
        if (status !== 201) await sleep(50);
      }
    };
    const workers = Array.from({ length: 8 }, worker);
    await sleep(3000);
    phase = 'down';
    pgCtl('-m', 'fast', '-w', 'stop');
    const health = await fetch(`${BASE}/api/health`).then(async (r) => `${r.status} ${JSON.stringify(await r.json())}`, (e: Error) => e.message);
    await sleep(3000);
    pgCtl('-l', `"${pgData}/../server.log"`, '-w', 'start', '-o', `"${process.env['FAULT_PG_OPTS']}"`);
    phase = 'back';
    backAt = Date.now();
    for (let i = 0; i < 100 && !firstOkAfterBack; i++) await sleep(100);
    await sleep(2000);
    running = false;
    await Promise.all(workers);

    const check = new Client({ connectionString: url });
    await check.connect();
    const found = await check.query<{ id: number }>('SELECT id FROM clients WHERE id = ANY($1)', [acknowledged]);
    await check.end();
    const recovery = firstOkAfterBack ? (firstOkAfterBack - backAt) / 1000 : NaN;
    console.log(`\nPostgreSQL stopped and started under 8 concurrent writers (${new Date().toISOString()})`);
    console.log(`answers: ${[...statuses].map(([s, c]) => `${s || 'no answer'} x${c}`).join(', ')}`);
    console.log(`health while down: ${health}`);
    console.log(`messages while down: ${[...downMessages].join(' | ') || 'none'}`);
    console.log(`first acknowledged write ${recovery.toFixed(2)} s after PostgreSQL was back (target <= 5 s, server not restarted)`);
    console.log(`acknowledged writes: ${acknowledged.length}; found in the database afterwards: ${found.rowCount}`);
    const ok = recovery <= 5 && found.rowCount === acknowledged.length && !statuses.has(500) && health.startsWith('503');
    console.log(ok ? 'PASS' : 'FAIL');
    process.exitCode = ok ? 0 : 1;
  } finally {
    server.kill('SIGTERM');
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
