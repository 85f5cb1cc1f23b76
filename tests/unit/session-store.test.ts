import { describe, expect, it } from 'vitest';
import type pg from 'pg';
import type session from 'express-session';
import { SessionWithUserStore, takeUserReadWithSession, ThrottledTouchStore } from '../../server/auth/session';

/** Records what connect-pg-simple sends; answers like PostgreSQL would for a live session row. */
function recordingPool() {
  const sent: { text: string; params: unknown[] }[] = [];
  const pool = {
    query: async (text: string, params: unknown[] = []) => {
      sent.push({ text, params });
      return { rows: [{ sid: params[1] }] };
    },
  } as unknown as pg.Pool;
  return { pool, sent };
}

const sess = (expires: Date) => ({ cookie: { expires, originalMaxAge: 1000 } }) as unknown as session.SessionData;
const touch = (store: ThrottledTouchStore, sid: string, s: session.SessionData) =>
  new Promise<void>((resolve, reject) => store.touch(sid, s, (err?: unknown) => (err ? reject(err as Error) : resolve())));

describe('ThrottledTouchStore (express-session rolling touch, at most once per interval per session)', () => {
  it('writes the first touch, skips touches within the interval, writes again once it has passed', async () => {
    const { pool, sent } = recordingPool();
    let now = 1_000_000;
    const store = new ThrottledTouchStore({ pool, tableName: 'session', pruneSessionInterval: false }, 60_000, () => now);
    const updates = () => sent.filter((q) => q.text.startsWith('UPDATE')).map((q) => q.params);

    await touch(store, 'a', sess(new Date(now + 1000)));
    expect(updates()).toHaveLength(1);
    now += 59_999;
    await touch(store, 'a', sess(new Date(now + 1000)));
    expect(updates()).toHaveLength(1); // within the interval: no UPDATE
    await touch(store, 'b', sess(new Date(now + 1000)));
    expect(updates()).toHaveLength(2); // another session is touched on its own
    now += 1;
    await touch(store, 'a', sess(new Date(now + 1000)));
    // The stored expiry moves forward to the latest cookie expiry (seconds since the epoch).
    expect(updates()).toEqual([
      [Math.ceil((1_000_000 + 1000) / 1000), 'a'],
      [Math.ceil((1_059_999 + 1000) / 1000), 'b'],
      [Math.ceil((1_060_000 + 1000) / 1000), 'a'],
    ]);
  });

  it('forgets a destroyed session, so a reused id would be touched at once', async () => {
    const { pool, sent } = recordingPool();
    const store = new ThrottledTouchStore({ pool, tableName: 'session', pruneSessionInterval: false }, 60_000, () => 5_000_000);
    await touch(store, 'a', sess(new Date(5_001_000)));
    await new Promise<void>((resolve) => store.destroy('a', () => resolve()));
    await touch(store, 'a', sess(new Date(5_001_000)));
    expect(sent.map((q) => q.text.split(' ')[0])).toEqual(['UPDATE', 'DELETE', 'UPDATE']);
  });
});

describe('SessionWithUserStore (the session row and the signed-in user row in one statement)', () => {
  const join = { usersTable: '"users"', select: 'u."id" AS "user.id", u."role" AS "user.role"' };
  function answering(row: Record<string, unknown> | undefined) {
    const sent: { text: string; params: unknown[] }[] = [];
    const pool = {
      query: async (text: string, params: unknown[] = []) => {
        sent.push({ text, params });
        return { rows: row ? [row] : [] };
      },
    } as unknown as pg.Pool;
    return { store: new SessionWithUserStore({ pool, tableName: 'session', pruneSessionInterval: false }, join), sent };
  }
  const get = (store: SessionWithUserStore, sid: string) =>
    new Promise<(session.SessionData & { passport?: { user?: unknown } }) | null | undefined>((resolve, reject) =>
      store.get(sid, (err, s) => (err ? reject(err as Error) : resolve(s))),
    );
  const stored = { cookie: { expires: '2027-01-01T00:00:00.000Z', originalMaxAge: 1000 }, passport: { user: { id: 'a1b2c3d4-0000-4000-8000-000000000001', at: 5 } } };

  it('reads an unexpired session with its user in one query, and hands the user row over once', async () => {
    const userRow = { sess: structuredClone(stored), userFound: true, 'user.id': 'a1b2c3d4-0000-4000-8000-000000000001', 'user.role': 'grower' };
    const { store, sent } = answering(userRow);
    const before = Math.ceil(Date.now() / 1000);
    const sess = await get(store, 'sid-1');
    expect(sess).toEqual(stored);
    expect(sent).toHaveLength(1);
    expect(sent[0]!.text).toMatch(/FROM "session" s\s+LEFT JOIN "users" u/);
    expect(sent[0]!.text).toMatch(/s\.expire >= to_timestamp\(\$2\)/);
    expect(sent[0]!.params[0]).toBe('sid-1');
    expect(sent[0]!.params[1]).toBeGreaterThanOrEqual(before);
    expect(takeUserReadWithSession(sess!.passport!.user)).toBe(userRow);
    // Taken once: a second deserialisation of the same value looks the user up itself.
    expect(takeUserReadWithSession(sess!.passport!.user)).toBeUndefined();
  });

  it('hands over null when the session names a user who is gone, and nothing for an anonymous session', async () => {
    const gone = answering({ sess: structuredClone(stored), userFound: false, 'user.id': null, 'user.role': null });
    const sess = await get(gone.store, 'sid-2');
    expect(takeUserReadWithSession(sess!.passport!.user)).toBeNull();
    const anonymous = answering({ sess: { cookie: stored.cookie, csrf: 'x' }, userFound: false, 'user.id': null, 'user.role': null });
    expect(await get(anonymous.store, 'sid-3')).toEqual({ cookie: stored.cookie, csrf: 'x' });
  });

  it('answers no session for a missing or expired row, and destroys a session it cannot parse', async () => {
    expect(await get(answering(undefined).store, 'sid-4')).toBeUndefined(); // no session: express-session starts a new one
    const broken = answering({ sess: '{not json', userFound: false });
    expect(await get(broken.store, 'sid-5')).toBeUndefined();
    expect(broken.sent.map((q) => q.text.trim().split(/\s+/)[0])).toEqual(['SELECT', 'DELETE']);
  });
});
