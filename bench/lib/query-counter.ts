/**
 * Counts the SQL statements the app sends while one request runs (every pool in the process goes
 * through pg.Client#query): the round trips behind a route, next to its timings.
 */
import pg from 'pg';

/**
 * The statement's first 100 characters; a WITH statement that writes (its INSERT may come long after
 * the first 100 characters) also names what it writes: `WITH c AS (… … [INSERT INTO water_events]`.
 */
function summary(sql: string) {
  const writes = /^WITH\b/i.test(sql) ? [...sql.matchAll(/\b(INSERT INTO|DELETE FROM) ("?\w+"?)|\b(UPDATE) ("?\w+"?) SET\b/gi)].map((m) => m.slice(1).filter(Boolean).join(' ')) : [];
  return sql.slice(0, 100) + (writes.length ? ` … [${writes.join(', ')}]` : '');
}

export async function recordQueries(fn: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text?: string } | undefined;
    seen.push(summary((typeof q === 'string' ? q : (q?.text ?? '(stream)')).replace(/\s+/g, ' ').trim()));
    return original.apply(this, args);
  };
  try {
    await fn();
  } finally {
    proto.query = original;
  }
  return seen;
}
