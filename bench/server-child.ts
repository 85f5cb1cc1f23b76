/**
 * The app in a child process, so the benchmark can read its memory from /proc/<pid>/status and
 * load it from another process. Started by bench/lib/child.ts; reports its port over IPC and
 * stops when asked (or when the parent goes away).
 */
import { createDataSource } from '../server/db/data-source';
import { buildBenchApp, listenLoopback } from './lib/app';

async function main() {
  const databaseUrl = process.env.BENCH_DATABASE_URL;
  if (!databaseUrl || !process.send) throw new Error('server-child.ts is started by bench/lib/child.ts');
  const dataSource = createDataSource(databaseUrl);
  await dataSource.initialize();
  const app = buildBenchApp({ dataSource, databaseUrl, smtpUrl: process.env.BENCH_SMTP_URL ?? 'smtp://127.0.0.1:2525', s3Endpoint: process.env.BENCH_S3_ENDPOINT });
  const server = await listenLoopback(app);
  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    await server.close();
    await (app.locals.closeExtras as () => Promise<void>)().catch(() => {});
    await dataSource.destroy().catch(() => {});
    process.exit(0);
  };
  process.on('message', (m: { type?: string }) => {
    if (m?.type === 'stop') void stop();
  });
  process.on('disconnect', () => void stop());
  process.send({ type: 'ready', url: server.url });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
