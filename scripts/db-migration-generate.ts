/**
 * `npm run db:migration:generate -- <Name>`: compares the entities with a scratch database that
 * has every existing migration applied, and writes the difference as a new migration in
 * server/db/migrations/. Read the SQL, then add the class to server/db/migration-list.ts.
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { parseEnv } from '../server/config/env';
import { createDataSource } from '../server/db/data-source';
import { recreateDatabase, startCluster } from '../server/infra/postgres-cluster';

const name = process.argv[2];
if (!name || !/^[A-Z][A-Za-z0-9]+$/.test(name)) {
  console.error('Usage: npm run db:migration:generate -- <PascalCaseName>');
  process.exit(1);
}
const env = parseEnv();
const cluster = await startCluster({ dataDir: path.join(env.SEEPWISE_DATA_DIR, 'pg'), port: env.SEEPWISE_PG_PORT, database: 'seepwise', log: console.log });
const url = recreateDatabase(cluster, 'seepwise_migration_gen');
const ds = createDataSource(url);
await ds.initialize();
await ds.runMigrations();
await ds.destroy();
const r = spawnSync(
  process.execPath,
  ['--import', 'tsx/esm', 'node_modules/typeorm/cli.js', 'migration:generate', '-d', 'server/db/data-source.ts', '--pretty', `server/db/migrations/${name}`],
  { stdio: 'inherit', env: { ...process.env, DATABASE_URL: url, TSX_TSCONFIG_PATH: 'server/tsconfig.json' } },
);
cluster.stop();
process.exit(r.status ?? 1);
