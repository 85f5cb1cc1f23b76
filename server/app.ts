import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import pg from 'pg';
import { pinoHttp } from 'pino-http';
import type { DataSource } from 'typeorm';
import { requireCsrf } from './auth/csrf';
import { configurePassport, sessionUserJoin } from './auth/passport';
import { sessionMiddleware } from './auth/session';
import type { Env } from './config/env';
import type { AppContext } from './context';
import type { ResourceResolver } from './http/access';
import { compressResponses } from './http/compression';
import { mountRoutes, type RouteSpec } from './http/route';
import type { SmtpSink } from './infra/smtp-sink';
import type { Logger } from './lib/logger';
import { createMailer, type Mailer } from './lib/mailer';
import { createObjectStorage } from './lib/object-storage';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { adminRoutes } from './routes/admin.routes';
import { authRoutes, defaultAuthLimits, type AuthLimits } from './routes/auth.routes';
import { cohortResultRoutes } from './routes/cohort-results.routes';
import { cohortRoutes } from './routes/cohorts.routes';
import { exportRoutes } from './routes/export.routes';
import { gardenRoutes } from './routes/gardens.routes';
import { importRoutes } from './routes/import.routes';
import { logRoutes } from './routes/logs.routes';
import { notificationRoutes } from './routes/notifications.routes';
import { potRoutes } from './routes/pots.routes';
import { trialRoutes } from './routes/trials.routes';
import { notebookResolvers } from './http/resolvers';
import { healthRoutes } from './routes/health.routes';

export interface AppDeps {
  dataSource: DataSource;
  env: Env;
  logger: Logger;
  /** Serves the client: Vite's dev middleware, or the built files in production. */
  client?: RequestHandler[];
  mail: { smtpUrl: string; from: string; outbox?: SmtpSink | null };
  storage: { endpoint?: string };
  /** Base URL for links in e-mails. */
  publicUrl: string;
  /** Replaces the SMTP mailer (tests that want to observe or fail sends). */
  mailer?: Mailer;
  authLimits?: AuthLimits;
  now?: () => Date;
}

/** Every API route spec, in mount order (the permission-matrix test reads this list). */
export function buildRouteSpecs(ctx: AppContext, authLimits: AuthLimits = defaultAuthLimits): RouteSpec[] {
  return [
    ...authRoutes(ctx, authLimits),
    ...cohortRoutes(ctx),
    ...cohortResultRoutes(ctx),
    ...adminRoutes(ctx),
    ...gardenRoutes(ctx),
    ...trialRoutes(ctx),
    ...potRoutes(ctx),
    ...logRoutes(ctx),
    ...notificationRoutes(ctx),
    ...exportRoutes(ctx),
    ...importRoutes(ctx),
  ];
}

/** Resource ownership checks, registered by the features that own the tables. */
export const resourceResolvers: Record<string, ResourceResolver> = { ...notebookResolvers };

/** Builds the Express app without listening, so tests and benchmarks use the same app. */
export function createApp(deps: AppDeps) {
  const { dataSource, env, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  if (env.TRUST_PROXY) app.set('trust proxy', 1);

  const ctx: AppContext = {
    ds: dataSource,
    env,
    logger,
    mailer: deps.mailer ?? createMailer(deps.mail.smtpUrl, deps.mail.from),
    outbox: deps.mail.outbox ?? null,
    storage: createObjectStorage({
      endpoint: deps.storage.endpoint,
      bucket: env.S3_BUCKET,
      region: env.S3_REGION,
      accessKeyId: env.S3_ACCESS_KEY_ID,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    }),
    passport: configurePassport(dataSource),
    publicUrl: deps.publicUrl,
    now: deps.now ?? (() => new Date()),
  };

  const isDev = env.NODE_ENV === 'development';
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          // Vite's dev server injects an inline preamble for React refresh and talks over a websocket.
          'script-src': isDev ? ["'self'", "'unsafe-inline'"] : ["'self'"],
          'connect-src': isDev ? ["'self'", 'ws://localhost:*', 'ws://127.0.0.1:*'] : ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'worker-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(compressResponses());
  if (env.NODE_ENV !== 'test') {
    app.use('/api', pinoHttp({ logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  }

  const api = express.Router();
  api.use(healthRoutes(dataSource));
  // Imports carry a whole parsed file (up to ~60 MB of JSON); every other request stays small.
  const smallJson = express.json({ limit: '1mb' });
  const largeJson = express.json({ limit: '80mb' });
  api.use((req, res, next) => (req.method === 'POST' && /^\/trials\/[^/]+\/import$/.test(req.path) ? largeJson : smallJson)(req, res, next));
  // Sessions get their own small pool so a burst of API queries cannot starve sign-in checks. Its writes commit
  // asynchronously: a crash can lose the last ~0.6 s of them (someone signs in again), none waits for a WAL flush.
  const sessionPool = new pg.Pool({ connectionString: dataSource.options.type === 'postgres' ? (dataSource.options.url as string) : undefined, max: 4, options: '-c synchronous_commit=off' });
  sessionPool.on('error', (err) => logger.warn({ err: err.message }, 'session pool error'));
  // The store reads the signed-in user's row with the session row (one statement); passport takes it from there.
  api.use(
    sessionMiddleware({ pool: sessionPool, secret: env.SESSION_SECRET, secureCookies: env.NODE_ENV === 'production' && env.TRUST_PROXY, user: sessionUserJoin(dataSource) }),
  );
  api.use(ctx.passport.session());
  api.use(requireCsrf);
  const specs = buildRouteSpecs(ctx, deps.authLimits);
  api.use(mountRoutes(specs, dataSource, resourceResolvers));
  api.use(notFoundHandler);
  app.use('/api', api);
  app.locals.routeSpecs = specs;
  app.locals.closeExtras = () => sessionPool.end();

  for (const handler of deps.client ?? []) app.use(handler);
  app.use(errorHandler(logger));
  return app;
}
