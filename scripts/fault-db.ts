/**
 * PostgreSQL stopped and started again under a steady stream of writes. The
 * real server runs as its own process against a cluster of this run's own
 * (scripts/fault-db.sh makes it). Prints what the API answered while the
 * database was down, how long it took to answer again once it was back
 * (target: within 5 s, without restarting the server), and checks that every
 * write the API acknowledged (201) is in the database afterwards.
 */
import { execFileSync } from 'node:child_process';
import { addUser, signedIn } from '../server/testing/test-app';
import { ROOT, migratedDatabase, run, serverEnv, sleep, startServer } from './fault-lib';

const pgData = process.env['FAULT_PG_DATA']!;
const pgCtl = (...args: string[]) => execFileSync('bash', ['-c', `source scripts/lib.sh >/dev/null && as_pg pg_ctl -D "${pgData}" ${args.join(' ')}`], { cwd: ROOT, stdio: 'pipe' });

async function main(): Promise<void> {
  const env = serverEnv(Number(process.env['FAULT_PORT'] ?? 4391));
  const knex = migratedDatabase(env);
  const { email } = await addUser(knex, 'owner');

  const server = await startServer(env);
  try {
    const BASE = server.base;
    const agent = await signedIn(BASE, email);

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
        const res = await agent.post('/api/clients', { name }).catch(() => null);
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

    const found = await knex('clients').whereIn('id', acknowledged);
    const recovery = firstOkAfterBack ? (firstOkAfterBack - backAt) / 1000 : NaN;
    console.log(`\nPostgreSQL stopped and started under 8 concurrent writers (${new Date().toISOString()})`);
    console.log(`answers: ${[...statuses].map(([s, c]) => `${s || 'no answer'} x${c}`).join(', ')}`);
    console.log(`health while down: ${health}`);
    console.log(`messages while down: ${[...downMessages].join(' | ') || 'none'}`);
    console.log(`first acknowledged write ${recovery.toFixed(2)} s after PostgreSQL was back (target <= 5 s, server not restarted)`);
    console.log(`acknowledged writes: ${acknowledged.length}; found in the database afterwards: ${found.length}`);
    const ok = recovery <= 5 && found.length === acknowledged.length && !statuses.has(500) && health.startsWith('503');
    console.log(ok ? 'PASS' : 'FAIL');
    process.exitCode = ok ? 0 : 1;
  } finally {
    await server.stop();
    await knex.destroy();
  }
}

run(main);
