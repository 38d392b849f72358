/**
 * What the fault runs (scripts/fault-*.ts) share: the real server as a process
 * of its own against the run's database (scripts/with-fault-db.sh makes it),
 * started, stopped or killed, and started again; and the verdict they print.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import type { Knex } from 'knex';
import { createKnex } from '../server/core/database';

export const ROOT = path.resolve(__dirname, '..');
export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * The server's environment: production mode on its own port, photos in the
 * run's folder, and no mail server or payment service unless `extra` names them.
 */
export function serverEnv(port: number, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return {
    ...process.env,
    PORT: String(port),
    NODE_ENV: 'production',
    SESSION_SECRET: 'fault-'.padEnd(48, 'f'),
    SIGN_IN_LIMIT: '100000',
    UPLOAD_DIR: path.join(process.env['FAULT_DIR'] ?? path.join(ROOT, '.data', 'fault'), 'uploads'),
    PAYMENTS_API_URL: 'http://127.0.0.1:9',
    SMTP_PORT: '9',
    ...extra,
  };
}

/** Migrates the run's database and returns a knex on it. */
export function migratedDatabase(env: NodeJS.ProcessEnv): Knex {
  execFileSync(process.execPath, ['--import', 'tsx', 'scripts/db.ts', 'migrate'], { cwd: ROOT, env, stdio: 'inherit' });
  return createKnex(env['DATABASE_URL']!, { min: 0, max: 2 });
}

export interface ServerProcess {
  child: ChildProcess;
  base: string;
  /** Lines the server printed on its standard output. */
  output: string[];
  /** Sends the signal and waits until the process has gone. */
  stop(signal?: NodeJS.Signals): Promise<void>;
}

/** Starts server/index.ts and waits until /api/health answers 200. */
export async function startServer(env: NodeJS.ProcessEnv): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'inherit'] });
  const output: string[] = [];
  child.stdout!.setEncoding('utf8').on('data', (chunk: string) => output.push(...chunk.split('\n').filter(Boolean)));
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  const server: ServerProcess = {
    child,
    base: `http://127.0.0.1:${env['PORT']}`,
    output,
    async stop(signal = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      await exited;
    },
  };
  for (let i = 0; i < 120; i++) {
    if (child.exitCode !== null) throw new Error(`The server exited with code ${child.exitCode} before answering.`);
    if (await fetch(`${server.base}/api/health`).then((r) => r.ok, () => false)) return server;
    await sleep(250);
  }
  await server.stop();
  throw new Error('The server did not answer /api/health within 30 s.');
}

/** Prints each check, then PASS or FAIL, and sets the exit code. */
export function verdict(checks: Array<[string, boolean]>): void {
  for (const [what, ok] of checks) console.log(`${ok ? 'ok  ' : 'FAIL'} ${what}`);
  const ok = checks.every(([, passed]) => passed);
  console.log(ok ? 'PASS' : 'FAIL');
  process.exitCode = ok ? 0 : 1;
}

/** Runs a fault script's main, ending the process on an unexpected error. */
export function run(main: () => Promise<void>): void {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
