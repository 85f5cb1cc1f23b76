import { describe, expect, it } from 'vitest';
import type pg from 'pg';
import type session from 'express-session';
import { ThrottledTouchStore } from '../../server/auth/session';

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
