/**
 * One Seepwise app instance as the resilience tests run it: createApp on its own data source,
 * listening on a loopback port. No vitest imports: app-server.ts runs this in a child process.
 */
import http from 'node:http';
import { Writable } from 'node:stream';
import pino from 'pino';
import type { AddressInfo } from 'node:net';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/config/env';
import { createDataSource } from '../../server/db/data-source';
import type { Mailer } from '../../server/lib/mailer';

export const SESSION_SECRET = 'resilience-tests-session-secret-0123456789';

/** A mailer that sends nothing (sign-up mails a verification link). */
export const nullMailer: Mailer = { send: async () => {} };

export interface ServedApp {
  url: string;
  ds: DataSource;
  /** What the app logged at level error (JSON lines): why a request became a 500, for a failing test's message. */
  errorLog: string[];
  close: () => Promise<void>;
}

/** createApp on its own data source and a loopback port, as one app instance would run. */
export async function serveApp(databaseUrl: string, opts: { poolSize?: number; port?: number } = {}): Promise<ServedApp> {
  const ds = createDataSource(databaseUrl, { poolSize: opts.poolSize ?? 5 });
  await ds.initialize();
  const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: databaseUrl, LOG_LEVEL: 'silent', SESSION_SECRET });
  const errorLog: string[] = [];
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      errorLog.push(chunk.toString('utf8').trim());
      done();
    },
  });
  const app = createApp({
    dataSource: ds,
    env,
    logger: pino({ level: 'error', base: { app: 'seepwise' } }, sink),
    mail: { smtpUrl: 'smtp://127.0.0.1:9', from: 'Seepwise <test@seepwise.invalid>' },
    mailer: nullMailer,
    storage: {},
    publicUrl: 'http://seepwise.test',
  });
  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(opts.port ?? 0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    ds,
    errorLog,
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await (app.locals.closeExtras as () => Promise<void>)();
      if (ds.isInitialized) await ds.destroy();
    },
  };
}
