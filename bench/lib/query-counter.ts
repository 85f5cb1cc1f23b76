/**
 * Counts the SQL statements the app sends while one request runs (every pool in the process goes
 * through pg.Client#query): the round trips behind a route, next to its timings.
 */
import pg from 'pg';

export async function recordQueries(fn: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text?: string } | undefined;
    seen.push((typeof q === 'string' ? q : (q?.text ?? '(stream)')).replace(/\s+/g, ' ').trim().slice(0, 100));
    return original.apply(this, args);
  };
  try {
    await fn();
  } finally {
    proto.query = original;
  }
  return seen;
}
