/**
 * Starts the tests' own PostgreSQL cluster (never the demo one: its own data directory and
 * port) and builds a template database with every migration applied. Each test file then
 * clones the template into a fresh database of its own.
 */
import path from 'node:path';
import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { createDataSource } from '../../server/db/data-source';
import { ClusterSetupError, recreateDatabase, startCluster, type RunningCluster } from '../../server/infra/postgres-cluster';

declare module 'vitest' {
  export interface ProvidedContext {
    pgPort: number;
    templateDb: string;
  }
}

let cluster: RunningCluster | null = null;

export default async function setup(project: TestProject) {
  process.env.SEEPWISE_PG_FSYNC = 'off';
  const dataDir = path.resolve(process.env.SEEPWISE_DATA_DIR ?? '.data', 'pg-test');
  const wanted = Number(process.env.SEEPWISE_TEST_PG_PORT ?? 54339);
  // Another checkout's test cluster may hold the usual port: take the next free one.
  for (let attempt = 0; ; attempt++) {
    try {
      cluster = await startCluster({ dataDir, port: wanted + attempt, database: 'postgres' });
      break;
    } catch (err) {
      if (!(err instanceof ClusterSetupError) || !/is taken/.test(err.message) || attempt >= 20 || process.env.SEEPWISE_TEST_PG_PORT) throw err;
    }
  }
  const port = cluster.port;
  // One template per run and project, so two test runs on one machine never trip over each other.
  const templateDb = `seepwise_template_${project.name}_${process.pid}`;
  const url = recreateDatabase(cluster, templateDb);
  const ds = createDataSource(url, { poolSize: 1 });
  await ds.initialize();
  await ds.runMigrations();
  await ds.destroy();
  project.provide('pgPort', port);
  project.provide('templateDb', templateDb);
  return async () => {
    const admin = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${port}/postgres` });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS ${templateDb} WITH (FORCE)`);
    // Leave the cluster running while another run (another template) still uses it.
    const { rows } = await admin.query(`SELECT count(*)::int AS n FROM pg_database WHERE datname LIKE 'seepwise_template_%'`);
    await admin.end();
    if (rows[0].n === 0) cluster?.stop();
  };
}
