/**
 * PostgreSQL clusters of the resilience tests' own: a data directory under
 * .data/pg-resilience-<pid>-<name>, a port from 54359 up, stopped and deleted at the end. The
 * global setup starts one shared cluster with a migrated template; the restart test starts its
 * own, since it stops and starts the server under the app.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { createDataSource } from '../../server/db/data-source';
import { portIsFree, recreateDatabase, startCluster, type RunningCluster } from '../../server/infra/postgres-cluster';

const isRoot = () => process.getuid?.() === 0;

/** Runs a PostgreSQL binary without blocking the event loop (as `postgres` when we are root). */
export function pgRun(cluster: RunningCluster, name: string, args: string[]): Promise<string> {
  const file = cluster.bin(name);
  const [cmd, cmdArgs] = isRoot() ? ['runuser', ['-u', 'postgres', '--', file, ...args]] : [file, args];
  return new Promise((resolve, reject) => {
    execFile(cmd, cmdArgs, { cwd: '/', timeout: 60_000 }, (err, stdout, stderr) =>
      err ? reject(new Error(`${name}: ${err.message}\n${stderr}`)) : resolve(stdout),
    );
  });
}

export interface OwnCluster {
  cluster: RunningCluster;
  /** Stops the server (fast mode) without blocking the event loop. */
  stopServer: () => Promise<void>;
  /** Starts it again with the same port, socket directory and settings. */
  startServer: () => Promise<void>;
  /** `pg_ctl restart`: stop (fast) and start again with the same options. */
  restartServer: () => Promise<void>;
  /** A fresh empty database; returns its URL. */
  createDatabase: (name: string) => string;
  /** Stops the cluster and deletes its files. */
  destroy: () => void;
}

/** Starts a private cluster for one test file, on the first free port from `preferredPort`. */
export async function startOwnCluster(name: string, preferredPort: number): Promise<OwnCluster> {
  let port = preferredPort;
  for (let i = 0; i < 20 && !(await portIsFree(port)); i++) port += 7;
  const dataDir = path.resolve('.data', `pg-resilience-${process.pid}-${name}`);
  fs.rmSync(dataDir, { recursive: true, force: true });
  const cluster = await startCluster({ dataDir, port, database: 'postgres' });
  const socketDir = cluster.dataDir;
  const fsync = process.env.SEEPWISE_PG_FSYNC ?? 'on';
  return {
    cluster,
    stopServer: async () => {
      await pgRun(cluster, 'pg_ctl', ['-D', cluster.dataDir, '-m', 'fast', '-w', 'stop']);
    },
    startServer: async () => {
      await pgRun(cluster, 'pg_ctl', [
        '-D',
        cluster.dataDir,
        '-l',
        path.join(cluster.dataDir, 'server.log'),
        '-w',
        '-t',
        '60',
        '-o',
        `-h 127.0.0.1 -p ${cluster.port} -k ${socketDir} -c fsync=${fsync}`,
        'start',
      ]);
    },
    restartServer: async () => {
      await pgRun(cluster, 'pg_ctl', ['-D', cluster.dataDir, '-l', path.join(cluster.dataDir, 'server.log'), '-m', 'fast', '-w', '-t', '60', 'restart']);
    },
    createDatabase: (db) => recreateDatabase(cluster, db),
    destroy: () => {
      cluster.stop();
      fs.rmSync(cluster.dataDir, { recursive: true, force: true });
    },
  };
}

/** Applies every migration to a database. */
export async function migrate(url: string): Promise<void> {
  const ds = createDataSource(url, { poolSize: 1 });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
}
