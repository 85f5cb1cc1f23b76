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
 * The users row each session read brought along, keyed by the session's `passport.user` value
 * (the object passport hands to deserializeUser), taken once. A WeakMap: nothing outlives the
 * request's session object. `null`: the session names a user who does not exist.
 */
const usersReadWithSession = new WeakMap<object, Record<string, unknown> | null>();

/** The users row read in the same statement as this session value, if the store read one (then forgets it). */
export function takeUserReadWithSession(sessionUser: unknown): Record<string, unknown> | null | undefined {
  if (typeof sessionUser !== 'object' || sessionUser === null) return undefined;
  const row = usersReadWithSession.get(sessionUser);
  usersReadWithSession.delete(sessionUser);
  return row;
}

/** How the store joins the signed-in user's row: the users table and the select list for it (table alias `u`). */
export interface SessionUserJoin {
  usersTable: string;
  /** Select expressions over `u`, e.g. `u."id" AS "user.id"`; read back by the caller. */
  select: string;
}

const UUID_RE_SQL = `'^[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12}$'`;

/**
 * ThrottledTouchStore whose `get` also reads the signed-in user's row, in the same statement, so a
 * signed-in request costs one round trip before the route instead of two (session row, then
 * passport's deserializeUser looking up the user; benchmark, bench/FINDINGS.md §1). The row is
 * read fresh with every request's session, as before: a disabled account, a password change or a
 * role change shows on the next request. passport's deserializeUser takes it with
 * `takeUserReadWithSession` and falls back to its own query when there is none.
 *
 * Otherwise `get` behaves as connect-pg-simple's: expired rows are not returned, an unparseable
 * session is destroyed. (Its prune timer starts on the first touch or save rather than the first
 * read: connect-pg-simple keeps that timer private.)
 */
export class SessionWithUserStore extends ThrottledTouchStore {
  private readonly getSql: string;
  private readonly pool: pg.Pool;

  constructor(options: ConstructorParameters<typeof PgStore>[0] & { pool: pg.Pool }, join: SessionUserJoin, intervalMs = TOUCH_INTERVAL_MS, now: () => number = Date.now) {
    super(options, intervalMs, now);
    this.pool = options.pool;
    const table = `"${(options.tableName ?? 'session').replace(/"/g, '""')}"`;
    const userId = `s.sess #>> '{passport,user,id}'`;
    this.getSql = `SELECT s.sess, u.id IS NOT NULL AS "userFound", ${join.select}
                     FROM ${table} s
                     LEFT JOIN ${join.usersTable} u ON u.id = CASE WHEN ${userId} ~ ${UUID_RE_SQL} THEN (${userId})::uuid END
                    WHERE s.sid = $1 AND s.expire >= to_timestamp($2)`;
  }

  override get(sid: string, fn: (err: unknown, session?: session.SessionData | null) => void): void {
    const onRow = (row: Record<string, unknown> | undefined) => {
      if (!row) return fn(null);
      let sess: session.SessionData & { passport?: { user?: unknown } };
      try {
        sess = (typeof row.sess === 'string' ? JSON.parse(row.sess) : row.sess) as typeof sess;
      } catch {
        return this.destroy(sid, fn);
      }
      const sessionUser = sess?.passport?.user;
      if (typeof sessionUser === 'object' && sessionUser !== null) usersReadWithSession.set(sessionUser, row.userFound ? row : null);
      fn(null, sess);
    };
    // Callbacks run outside the promise (as connect-pg-simple does), so a throw in them is not swallowed.
    this.pool.query<Record<string, unknown>>(this.getSql, [sid, Math.ceil(Date.now() / 1000)]).then(
      (res) => process.nextTick(onRow, res.rows[0]),
      (err: unknown) => process.nextTick(fn, err),
    );
  }
}

/**
 * Sessions live in PostgreSQL (table `session`, created by a migration), so a restart keeps
 * people signed in and several app instances share them.
 */
export function sessionMiddleware(opts: { pool: pg.Pool; secret: string; secureCookies: boolean; user?: SessionUserJoin }) {
  const storeOptions = { pool: opts.pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 };
  return session({
    name: SESSION_COOKIE,
    secret: opts.secret,
    store: opts.user ? new SessionWithUserStore(storeOptions, opts.user) : new ThrottledTouchStore(storeOptions),
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
