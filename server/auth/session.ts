import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';

const PgStore = connectPgSimple(session);

export const SESSION_COOKIE = 'seepwise.sid';
const THIRTY_DAYS_MS = 30 * 24 * 3600 * 1000;

/**
 * Sessions live in PostgreSQL (table `session`, created by a migration), so a restart keeps
 * people signed in and several app instances share them.
 */
export function sessionMiddleware(opts: { pool: pg.Pool; secret: string; secureCookies: boolean }) {
  return session({
    name: SESSION_COOKIE,
    secret: opts.secret,
    store: new PgStore({ pool: opts.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: undefined,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: opts.secureCookies,
      maxAge: THIRTY_DAYS_MS,
    },
  });
}
