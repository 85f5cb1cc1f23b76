/** `npm run db:migrate`: applies pending migrations to DATABASE_URL or the private cluster. */
import { parseEnv } from '../server/config/env';
import { createDataSource } from '../server/db/data-source';
import { ensureDatabase } from '../server/runtime';

const env = parseEnv();
const { url, cluster } = await ensureDatabase(env, console.log);
const ds = createDataSource(url);
await ds.initialize();
const ran = await ds.runMigrations({ transaction: 'each' });
console.log(ran.length ? `Applied: ${ran.map((m) => m.name).join(', ')}` : 'Database is up to date.');
await ds.destroy();
cluster?.stop();
