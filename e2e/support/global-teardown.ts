import type { ChildProcess } from 'node:child_process';

/** Stops the server and the fakes the set-up started. */
export default async function globalTeardown(): Promise<void> {
  await Promise.all([globalThis.__keepstitchServer, ...(globalThis.__keepstitchFakes ?? [])].map(stop));
}

async function stop(server: ChildProcess | undefined): Promise<void> {
  if (!server || server.exitCode !== null) return;
  const exited = new Promise((r) => server.once('exit', r));
  server.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
  if (server.exitCode === null) server.kill('SIGKILL');
}
