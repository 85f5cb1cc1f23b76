import 'reflect-metadata';
import pg from 'pg';
import { DataSource } from 'typeorm';
import { entities } from './entities';
import { migrations } from './migration-list';

// Calendar dates stay 'YYYY-MM-DD' strings: a JS Date would shift them by the server's time zone.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);

export function createDataSource(url: string, opts: { poolSize?: number } = {}) {
  return new DataSource({
    type: 'postgres',
    url,
    entities,
    migrations,
    synchronize: false,
    // gen_random_uuid() is built into PostgreSQL 13+.
    uuidExtension: 'pgcrypto',
    migrationsRun: false,
    logging: ['error'],
    extra: {
      max: opts.poolSize ?? 10,
      connectionTimeoutMillis: 5000,
      // Keep idle connections from pinning a restarted server's old backends.
      idleTimeoutMillis: 30000,
    },
  });
}

/**
 * The data source the TypeORM CLI uses (migration:generate). It reads DATABASE_URL, which
 * scripts/db-migration-generate.ts sets after starting the private cluster.
 */
export default createDataSource(process.env.DATABASE_URL ?? 'postgres://app@127.0.0.1:54329/seepwise');
