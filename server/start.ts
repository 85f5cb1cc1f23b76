/**
 * `npm start`: the private database, local mail and storage fakes, migrations, demo data on
 * first start, then the app on http://localhost:PORT (Vite with hot reload in development,
 * the built client in production). Ctrl-C stops the app and the database cleanly.
 */
import express from 'express';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { createApp } from './app';
import { parseEnv } from './config/env';
import { serveBuiltClient } from './http/built-client';
import { ClusterSetupError } from './infra/postgres-cluster';
import { startJobRunner } from './jobs/runner';
import { createLogger } from './lib/logger';
import { createMailer } from './lib/mailer';
import { startRuntime } from './runtime';
import { DEMO_PASSWORD, seedDemoIfEmpty } from './db/seed/demo';

async function main() {
  const env = parseEnv();
  const logger = createLogger(env.LOG_LEVEL);
  const httpServer = http.createServer();

  // Fail fast, before starting anything, when the app's port is taken.
  await new Promise<void>((resolve, reject) => {
    httpServer.once('error', reject);
    httpServer.listen(env.PORT, env.HOST, () => {
      httpServer.off('error', reject);
      resolve();
    });
  }).catch((err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') {
      console.error(`\nPort ${env.PORT} is already in use on ${env.HOST}.\nStart Seepwise on another port with:  PORT=${env.PORT + 1} npm start\n`);
      process.exit(1);
    }
    throw err;
  });

  const runtime = await startRuntime(env, logger);
  const seedDemo = env.SEED_DEMO ?? env.NODE_ENV !== 'production';
  if (seedDemo) await seedDemoIfEmpty(runtime.dataSource, logger);

  const client: express.RequestHandler[] = [];
  let closeVite: (() => Promise<void>) | undefined;
  if (env.NODE_ENV === 'production') {
    const dist = path.resolve('dist');
    if (!fs.existsSync(path.join(dist, 'index.html'))) throw new Error('No built client in dist/: run `npm run build` first.');
    client.push(...serveBuiltClient(dist));
  } else {
    const { createServer } = await import('vite');
    const vite = await createServer({ server: { middlewareMode: true, hmr: { server: httpServer } }, appType: 'spa' });
    client.push(vite.middlewares);
    closeVite = () => vite.close();
  }

  const publicUrl = env.PUBLIC_URL ?? `http://localhost:${env.PORT}`;
  const app = createApp({
    dataSource: runtime.dataSource,
    env,
    logger,
    client,
    mail: { smtpUrl: runtime.smtpUrl, from: env.MAIL_FROM, outbox: runtime.smtpSink },
    storage: { endpoint: runtime.s3Endpoint },
    publicUrl,
  });
  httpServer.on('request', app);

  // Reminders, frost warnings and the weekly digest: pg-boss on the same database, after the migrations.
  const jobs = await startJobRunner(
    { ds: runtime.dataSource, env, logger, mailer: createMailer(runtime.smtpUrl, env.MAIL_FROM), publicUrl, now: () => new Date() },
    { connectionString: runtime.databaseUrl },
  ).catch(async (err: unknown) => {
    await closeVite?.();
    await runtime.shutdown();
    throw err;
  });

  console.log(`\n  Seepwise is running at ${publicUrl}\n`);
  if (runtime.smtpSink) console.log(`  Development mail is caught locally; an admin sees it under Admin → Outbox.`);
  if (seedDemo) console.log(`  Demo accounts: see README.md (e.g. ruth@saltbush.example, password ${DEMO_PASSWORD}).\n`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info(`${signal} received: stopping Seepwise and its database.`);
    httpServer.closeAllConnections?.();
    await new Promise((r) => httpServer.close(r));
    await closeVite?.();
    await jobs.stop().catch((err: unknown) => logger.warn({ err }, 'job queue did not stop cleanly'));
    await runtime.shutdown();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((err) => {
  if (err instanceof ClusterSetupError) console.error(`\n${err.message}\n`);
  else console.error(err);
  process.exit(1);
});
