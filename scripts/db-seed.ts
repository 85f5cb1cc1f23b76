/**
 * `npm run db:seed`: loads the demo scenario into an empty database.
 * `npm run demo:reset` (`db:seed -- --reset`): throws away everything in the project's private
 * demo database (accounts, gardens, logs, sessions) and loads the demo scenario afresh, e.g. after
 * the scenario changed or a walkthrough left the demo in a state no one wants. It refuses to touch
 * a database given by DATABASE_URL unless `--yes-wipe-database-url` is passed too.
 */
import { parseEnv } from '../server/config/env';
import { createDataSource } from '../server/db/data-source';
import { seedDemoIfEmpty } from '../server/db/seed/demo';
import { createLogger } from '../server/lib/logger';
import { ensureDatabase } from '../server/runtime';

const reset = process.argv.includes('--reset');
const env = parseEnv();
if (reset && env.DATABASE_URL && !process.argv.includes('--yes-wipe-database-url')) {
  console.error('DATABASE_URL points at a database this script did not create. Refusing to wipe it.\nPass --yes-wipe-database-url as well if that is really what you want.');
  process.exit(1);
}
const logger = createLogger(env.LOG_LEVEL);
const { url, cluster } = await ensureDatabase(env, console.log);
const ds = createDataSource(url);
await ds.initialize();
try {
  if (reset) {
    // One transaction: a failure leaves the old data as it was.
    await ds.transaction(async (tx) => {
      await tx.query('DROP SCHEMA public CASCADE');
      await tx.query('CREATE SCHEMA public');
    });
    console.log('Emptied the demo database.');
  }
  await ds.runMigrations({ transaction: 'each' });
  const seeded = await seedDemoIfEmpty(ds, logger);
  console.log(seeded ? 'Demo scenario loaded.' : 'The database already has accounts: nothing seeded (demo data loads only into an empty database; `npm run demo:reset` starts it afresh).');
} finally {
  await ds.destroy();
  cluster?.stop();
}
