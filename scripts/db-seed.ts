/** `npm run db:seed`: loads the demo scenario into an empty database. */
import { parseEnv } from '../server/config/env';
import { createDataSource } from '../server/db/data-source';
import { seedDemoIfEmpty } from '../server/db/seed/demo';
import { createLogger } from '../server/lib/logger';
import { ensureDatabase } from '../server/runtime';

const env = parseEnv();
const logger = createLogger(env.LOG_LEVEL);
const { url, cluster } = await ensureDatabase(env, console.log);
const ds = createDataSource(url);
await ds.initialize();
await ds.runMigrations({ transaction: 'each' });
const seeded = await seedDemoIfEmpty(ds, logger);
console.log(seeded ? 'Demo scenario loaded.' : 'The database already has accounts: nothing seeded (demo data loads only into an empty database).');
await ds.destroy();
cluster?.stop();
