/**
 * Database chores for the scripts: `prepare` (create the database when missing,
 * migrate, seed the demo scenario when empty), `migrate`, `rollback`, `seed`.
 * DATABASE_URL says which database.
 */
import { createKnex, ensureDatabase } from '../server/core/database';

export { ensureDatabase };

async function main(command: string): Promise<void> {
  const url = process.env['DATABASE_URL'];
  if (!url) throw new Error('DATABASE_URL is not set.');
  if (command === 'prepare') await ensureDatabase(url);
  const knex = createKnex(url);
  try {
    if (command === 'prepare' || command === 'migrate') {
      const [, applied] = await knex.migrate.latest();
      if (applied.length) console.log(`keepstitch: applied ${applied.length} migration(s)`);
    }
    if (command === 'rollback') {
      const [, undone] = await knex.migrate.rollback();
      console.log(`keepstitch: rolled back ${undone.length} migration(s)`);
    }
    if (command === 'seed' || command === 'prepare') {
      const { count } = (await knex('users').count({ count: '*' }).first()) as { count: string };
      if (command === 'seed' || Number(count) === 0) {
        await knex.seed.run();
        console.log('keepstitch: demo scenario loaded');
      }
    }
  } finally {
    await knex.destroy();
  }
}

if (require.main === module) {
  main(process.argv[2] ?? 'prepare').catch((err) => {
    console.error(`keepstitch: ${(err as Error).message}`);
    process.exit(1);
  });
}
