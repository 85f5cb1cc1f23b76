import type { Express } from 'express';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp, type AppDeps } from '../../server/app';
import { parseEnv } from '../../server/config/env';
import { createDataSource } from '../../server/db/data-source';
import { startS3Fake, type S3Fake } from '../../server/infra/s3-fake';
import { startSmtpSink, type SmtpSink } from '../../server/infra/smtp-sink';
import { createLogger } from '../../server/lib/logger';
import { createTestDatabase } from './test-db';

export interface TestApp {
  app: Express;
  ds: DataSource;
  sink: SmtpSink;
  s3: S3Fake;
  databaseUrl: string;
  /** Moves the app's clock (reset links, invitations, reminders). */
  clock: { now: Date | null };
  close: () => Promise<void>;
}

/** A complete app on its own fresh database, with its own SMTP sink and S3 fake. */
export async function startTestApp(overrides: Partial<AppDeps> = {}): Promise<TestApp> {
  const db = await createTestDatabase();
  const ds = createDataSource(db.url, { poolSize: 5 });
  await ds.initialize();
  const sink = await startSmtpSink();
  const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-s3-'));
  const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: db.url, S3_BUCKET: 'test-photos', LOG_LEVEL: 'silent' });
  const s3 = await startS3Fake({ directory: s3Dir, bucket: env.S3_BUCKET });
  const clock: { now: Date | null } = { now: null };
  const app = createApp({
    dataSource: ds,
    env,
    logger: createLogger('silent'),
    mail: { smtpUrl: sink.url, from: 'Seepwise <test@seepwise.invalid>', outbox: sink },
    storage: { endpoint: s3.endpoint },
    publicUrl: 'http://seepwise.test',
    now: () => clock.now ?? new Date(),
    ...overrides,
  });
  return {
    app,
    ds,
    sink,
    s3,
    databaseUrl: db.url,
    clock,
    async close() {
      await (app.locals.closeExtras as () => Promise<void>)();
      await ds.destroy();
      await sink.close();
      await s3.close();
      fs.rmSync(s3Dir, { recursive: true, force: true });
      await db.drop();
    },
  };
}

/**
 * Requests the server drops unanswered, as if the phone had no signal: the socket is closed before
 * the app sees them, so nothing is stored and the browser's fetch fails the way it does on a dead
 * connection. Browser emulation (`context.setOffline`, `context.route`) does not cover requests a
 * service-worker-controlled page sends, so a test that must be sure nothing arrived gates here.
 */
export interface SignalGate {
  /** Drop every request whose method and path match, until `restore()`. */
  cut: (match: { method: string; path: RegExp }) => void;
  restore: () => void;
}

/** Listens on a free loopback port (browser tests). */
export async function listen(app: Express): Promise<{ url: string; signal: SignalGate; close: () => Promise<void> }> {
  let cut: { method: string; path: RegExp } | null = null;
  const signal: SignalGate = {
    cut: (match) => {
      cut = match;
    },
    restore: () => {
      cut = null;
    },
  };
  const server = http.createServer((req, res) => {
    const pathname = (req.url ?? '').split('?')[0]!;
    if (cut && req.method === cut.method && cut.path.test(pathname)) {
      req.socket.destroy();
      return;
    }
    app(req, res);
  });
  // Longer than any client here keeps an idle connection: with Node's 5 s default the server can
  // close a kept-alive socket just as the test's HTTP client reuses it (read ECONNRESET, seen
  // once under load in the offline Round test).
  server.keepAliveTimeout = 65_000;
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    signal,
    close: () =>
      new Promise((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

/** A supertest agent that keeps cookies and sends the session's CSRF token. */
export class ApiAgent {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';
  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  async refreshCsrf() {
    const res = await this.agent.get('/api/auth/session');
    this.csrf = res.body.data.csrfToken;
    return res.body.data as { user: { id: string; email: string } | null; csrfToken: string };
  }

  get(url: string) {
    return this.agent.get(url);
  }
  post(url: string, body: object = {}) {
    return this.agent.post(url).set('X-CSRF-Token', this.csrf).send(body);
  }
  patch(url: string, body: object = {}) {
    return this.agent.patch(url).set('X-CSRF-Token', this.csrf).send(body);
  }
  put(url: string, body: object = {}) {
    return this.agent.put(url).set('X-CSRF-Token', this.csrf).send(body);
  }
  delete(url: string) {
    return this.agent.delete(url).set('X-CSRF-Token', this.csrf);
  }

  async signUp(input: { email: string; password?: string; displayName?: string; role?: 'grower' | 'educator' }) {
    await this.refreshCsrf();
    const res = await this.post('/api/auth/sign-up', {
      email: input.email,
      password: input.password ?? 'tomato-basin-clay-42',
      displayName: input.displayName ?? input.email.split('@')[0],
      role: input.role ?? 'grower',
    });
    if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
    this.csrf = res.body.data.csrfToken;
    return res.body.data.user as { id: string; email: string; role: string };
  }

  async signIn(email: string, password = 'tomato-basin-clay-42') {
    await this.refreshCsrf();
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status === 200) this.csrf = res.body.data.csrfToken;
    return res;
  }
}

let counter = 0;
/** A unique e-mail address for a test. */
export function uniqueEmail(prefix = 'grower') {
  counter += 1;
  return `${prefix}.${Date.now().toString(36)}.${counter}@example.test`;
}
