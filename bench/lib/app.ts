/**
 * The app as the benchmark runs it: createApp() with production settings (strict CSP, request
 * logging at error level only), listening on a loopback port.
 */
import type { Express, RequestHandler } from 'express';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/config/env';
import { createLogger } from '../../server/lib/logger';

export interface BenchAppOptions {
  dataSource: DataSource;
  databaseUrl: string;
  smtpUrl: string;
  s3Endpoint?: string;
  client?: RequestHandler[];
}

export function buildBenchApp(o: BenchAppOptions): Express {
  const env = parseEnv({ NODE_ENV: 'production', DATABASE_URL: o.databaseUrl, LOG_LEVEL: 'error', SESSION_SECRET: 'bench-only-session-secret-not-for-use' });
  return createApp({
    dataSource: o.dataSource,
    env,
    logger: createLogger('error'),
    client: o.client,
    mail: { smtpUrl: o.smtpUrl, from: env.MAIL_FROM },
    storage: { endpoint: o.s3Endpoint },
    publicUrl: 'http://127.0.0.1',
  });
}

export interface Listening {
  url: string;
  close: () => Promise<void>;
}

export async function listenLoopback(app: Express): Promise<Listening> {
  const server = http.createServer(app);
  server.keepAliveTimeout = 30_000;
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
