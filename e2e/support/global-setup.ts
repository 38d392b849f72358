import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, openSync } from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { E2E_DB, E2E_PORT, FAKE_MAIL_API, FAKE_MAIL_API_PORT, FAKE_PAYMENTS_PORT, FAKE_PAYMENTS_URL, FAKE_SMTP_PORT, ROOT } from './e2e-env';

declare global {
  // eslint-disable-next-line no-var
  var __keepstitchServer: ChildProcess | undefined;
  // eslint-disable-next-line no-var
  var __keepstitchFakes: ChildProcess[] | undefined;
}

function databaseUrl(name: string): string {
  const base = process.env['DATABASE_URL'];
  if (!base) throw new Error('DATABASE_URL is not set: run the end-to-end tests through `npm test`.');
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}

async function waitForHealth(url: string, server: ChildProcess): Promise<void> {
  for (let i = 0; i < 120; i++) {
    if (server.exitCode !== null) throw new Error(`The server exited with code ${server.exitCode}; see test-output/e2e-server.log`);
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('The server did not answer /api/health within 30 s.');
}

/** A fresh database with the demo scenario, and the real server serving the production build. */
export default async function globalSetup(): Promise<void> {
  if (!existsSync(path.join(ROOT, 'dist', 'keepstitch', 'browser', 'index.html'))) {
    throw new Error('No production build in dist/keepstitch: run `npx ng build` first (npm test does).');
  }
  const admin = new Client({ connectionString: databaseUrl('postgres') });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS ${E2E_DB} WITH (FORCE)`);
  await admin.end();

  const env = { ...process.env, DATABASE_URL: databaseUrl(E2E_DB), PORT: String(E2E_PORT), NODE_ENV: 'production', SESSION_SECRET: 'e2e-session-secret-'.padEnd(48, 'e'), UPLOAD_DIR: path.join(ROOT, 'test-output', 'e2e-uploads'),
    APP_URL: `http://127.0.0.1:${E2E_PORT}`,
    SMTP_HOST: '127.0.0.1', SMTP_PORT: String(FAKE_SMTP_PORT), FAKE_MAIL_API,
    FAKE_SMTP_PORT: String(FAKE_SMTP_PORT), FAKE_MAIL_API_PORT: String(FAKE_MAIL_API_PORT),
    FAKE_PAYMENTS_PORT: String(FAKE_PAYMENTS_PORT), PAYMENTS_API_URL: FAKE_PAYMENTS_URL };
  const prepare = spawn(process.execPath, ['--import', 'tsx', 'scripts/db.ts', 'prepare'], { cwd: ROOT, env, stdio: 'inherit' });
  const code = await new Promise<number | null>((r) => prepare.on('exit', r));
  if (code !== 0) throw new Error('Preparing the end-to-end database failed.');

  const stale = await fetch(`http://127.0.0.1:${E2E_PORT}/api/health`).then(() => true, () => false);
  if (stale) throw new Error(`Something already answers on port ${E2E_PORT}; stop it (or set E2E_PORT) before the end-to-end tests.`);
  mkdirSync(path.join(ROOT, 'test-output'), { recursive: true });
  const log = openSync(path.join(ROOT, 'test-output', 'e2e-server.log'), 'w');
  globalThis.__keepstitchFakes = ['scripts/fakes/fake-smtp.ts', 'scripts/fakes/fake-payments.ts'].map((script) =>
    spawn(process.execPath, ['--import', 'tsx', script], { cwd: ROOT, env, stdio: ['ignore', log, log] }),
  );
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: ['ignore', log, log] });
  globalThis.__keepstitchServer = server;
  await waitForHealth(`http://127.0.0.1:${E2E_PORT}/api/health`, server);
}
