import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type pg from 'pg';

const PgStore = connectPgSimple(session);

export const SESSION_COOKIE = 'seepwise.sid';
const THIRTY_DAYS_MS = 30 * 24 * 3600 * 1000;
/** How long a session's expiry may lag behind its last request: at most this much earlier than 30 idle days. */
export const TOUCH_INTERVAL_MS = 5 * 60 * 1000;

/**
 * The PostgreSQL store, but a session this process touched less than `intervalMs` ago is not
 * touched again. With `rolling`, express-session touches the store at the end of every response
 * it did not otherwise save, and holds back the response until that UPDATE returns (benchmark,
 * bench/FINDINGS.md §1). The idle timeout still holds: the stored expiry is at most `intervalMs`
 * behind the last request, so an idle session ends that much early, never late. Saves (sign-in,
 * CSRF token, changed data) always write.
 */
export class ThrottledTouchStore extends PgStore {
  private readonly touched = new Map<string, number>();

  constructor(
    options: ConstructorParameters<typeof PgStore>[0],
    private readonly intervalMs = TOUCH_INTERVAL_MS,
    private readonly now: () => number = Date.now,
  ) {
    super(options);
  }

  override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
    const t = this.now();
    const last = this.touched.get(sid);
    if (last !== undefined && t - last < this.intervalMs) {
      fn?.();
      return;
    }
    super.touch(sid, sess, (err?: unknown) => {
      if (!err) this.remember(sid, t);
      fn?.(err);
    });
  }

  override destroy(sid: string, fn?: (err?: unknown) => void): void {
    this.touched.delete(sid);
    super.destroy(sid, fn);
  }

  /** Map order is insertion order, so the oldest touches sit at the front: drop them once stale. */
  private remember(sid: string, t: number) {
    this.touched.delete(sid);
    this.touched.set(sid, t);
    for (const [key, at] of this.touched) {
      if (t - at < this.intervalMs) break;
      this.touched.delete(key);
    }
  }
}

/**
 * Sessions live in PostgreSQL (table `session`, created by a migration), so a restart keeps
 * people signed in and several app instances share them.
 */
export function sessionMiddleware(opts: { pool: pg.Pool; secret: string; secureCookies: boolean }) {
  return session({
    name: SESSION_COOKIE,
    secret: opts.secret,
    store: new ThrottledTouchStore({ pool: opts.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
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
