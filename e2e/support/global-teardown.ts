/** Stops the server the set-up started. */
export default async function globalTeardown(): Promise<void> {
  const server = globalThis.__keepstitchServer;
  if (!server || server.exitCode !== null) return;
  const exited = new Promise((r) => server.once('exit', r));
  server.kill('SIGTERM');
  await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
  if (server.exitCode === null) server.kill('SIGKILL');
}
