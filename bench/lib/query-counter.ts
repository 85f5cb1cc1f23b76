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

/**
 * The SQL statements the process sends while `fn` runs, in order, whitespace collapsed and passed
 * through `format`. Every pool in the process (TypeORM's and the session store's) sends through
 * pg.Client#query, so wrapping it sees each statement, BEGIN and COMMIT included. Run nothing else
 * against the app meanwhile. (tests/helpers/sql-statements.ts uses it too.)
 */
export async function recordStatements(fn: () => Promise<unknown>, format: (sql: string) => string = (sql) => sql): Promise<string[]> {
  const seen: string[] = [];
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text?: string } | undefined;
    seen.push(format((typeof q === 'string' ? q : (q?.text ?? '(stream)')).replace(/\s+/g, ' ').trim()));
    return original.apply(this, args);
  };
  try {
    await fn();
  } finally {
    proto.query = original;
  }
  return seen;
}

/** The statements one request sends, each as its summary (first 100 characters, plus what a WITH writes). */
export const recordQueries = (fn: () => Promise<unknown>): Promise<string[]> => recordStatements(fn, summary);
