/**
 * Starts everything a running Seepwise needs on one machine: PostgreSQL (a private cluster
 * unless DATABASE_URL is set), the SMTP sink (unless SMTP_URL is set), the S3 fake (unless
 * S3_ENDPOINT is set), then migrations. Used by `npm start`, the scripts and the benchmark.
 */
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { Env } from './config/env';
import { createDataSource } from './db/data-source';
import { startCluster, type RunningCluster } from './infra/postgres-cluster';
import { startS3Fake, type S3Fake } from './infra/s3-fake';
import { startSmtpSink, type SmtpSink } from './infra/smtp-sink';
import type { Logger } from './lib/logger';

export interface Runtime {
  dataSource: DataSource;
  databaseUrl: string;
  cluster: RunningCluster | null;
  smtpSink: SmtpSink | null;
  smtpUrl: string;
  s3Fake: S3Fake | null;
  s3Endpoint: string | undefined;
  shutdown: () => Promise<void>;
}

/** Resolves the database: DATABASE_URL as given, or the project's private cluster. */
export async function ensureDatabase(env: Env, log: (m: string) => void) {
  if (env.DATABASE_URL) return { url: env.DATABASE_URL, cluster: null };
  const cluster = await startCluster({
    dataDir: path.join(env.SEEPWISE_DATA_DIR, 'pg'),
    port: env.SEEPWISE_PG_PORT,
    database: 'seepwise',
    log,
  });
  return { url: cluster.url, cluster };
}

export async function startRuntime(env: Env, logger: Logger, opts: { services?: boolean } = {}): Promise<Runtime> {
  const log = (m: string) => logger.info(m);
  const { url, cluster } = await ensureDatabase(env, log);
  const dataSource = createDataSource(url);
  try {
    await dataSource.initialize();
    const ran = await dataSource.runMigrations({ transaction: 'each' });
    if (ran.length) log(`Applied ${ran.length} migration(s): ${ran.map((m) => m.name).join(', ')}`);
  } catch (err) {
    cluster?.stop();
    throw err;
  }

  let smtpSink: SmtpSink | null = null;
  let s3Fake: S3Fake | null = null;
  if (opts.services !== false) {
    if (!env.SMTP_URL) smtpSink = await startSmtpSink();
    if (!env.S3_ENDPOINT) {
      s3Fake = await startS3Fake({ directory: path.join(env.SEEPWISE_DATA_DIR, 's3'), bucket: env.S3_BUCKET });
    }
  }

  return {
    dataSource,
    databaseUrl: url,
    cluster,
    smtpSink,
    smtpUrl: env.SMTP_URL ?? smtpSink?.url ?? 'smtp://127.0.0.1:2525',
    s3Fake,
    s3Endpoint: env.S3_ENDPOINT ?? s3Fake?.endpoint,
    async shutdown() {
      await smtpSink?.close().catch(() => {});
      await s3Fake?.close().catch(() => {});
      if (dataSource.isInitialized) await dataSource.destroy().catch(() => {});
      cluster?.stop();
    },
  };
}
