import { Pool } from 'pg';
import { createServer } from 'node:http';
import { loadConfig } from './core/config';
import { createKnex } from './core/database';
import { createApp } from './app';
import { startOutboxWorker } from './mail/mailer';
import { removeOrphanFiles } from './photos/photos-service';
import { startReminderSweeps } from './due/reminders';

/** Starts the server; SIGINT/SIGTERM close the listener and the database pools. */
async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    console.error((err as Error).message);
    process.exit(1);
  }
  const knex = createKnex(config.databaseUrl);
  const sessionPool = new Pool({ connectionString: config.databaseUrl, max: 5 });
  sessionPool.on('error', (err) => console.error('Session pool:', err.message));
  const outbox = startOutboxWorker(knex, config);
  const app = createApp({ config, knex, sessionPool, kickMail: outbox.kick });
  // Reminders are worked out from the data on every sweep, the first one now.
  const reminders = startReminderSweeps(config.appUrl, outbox.kick);
  // An upload cut short by a crash leaves files without rows: clear them before serving.
  const tidy = await removeOrphanFiles(config.uploadDir).catch((err: Error) => {
    console.error(`Photo folder check failed: ${err.message}`);
    return { removed: [], unclaimed: [] };
  });
  if (tidy.removed.length) console.log(`Keepstitch: removed ${tidy.removed.length} half-written upload file(s).`);
  if (tidy.unclaimed.length) console.log(`Keepstitch: moved ${tidy.unclaimed.length} photo file(s) no record names to ${config.uploadDir}/unclaimed.`);
  const server = createServer(app);

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\nKeepstitch: ${signal} received, stopping.`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    outbox.stop();
    reminders.stop();
    server.close(async () => {
      await Promise.allSettled([knex.destroy(), sessionPool.end()]);
      console.log('Keepstitch: stopped.');
      process.exit(0);
    });
    server.closeAllConnections?.();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));

  server.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    console.log(`Keepstitch is serving on http://${config.host}:${port}`);
  });
}

void main();
