import pg from 'pg';

/**
 * The SQL statements the app sends while `fn` runs, in order, whitespace collapsed. Every pool in
 * the process (TypeORM's and the session store's) sends through pg.Client#query, so wrapping it
 * sees each statement, BEGIN and COMMIT included. Run nothing else against the app meanwhile.
 */
export async function sqlStatements(fn: () => Promise<unknown>): Promise<string[]> {
  const seen: string[] = [];
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const q = args[0] as string | { text?: string } | undefined;
    seen.push((typeof q === 'string' ? q : (q?.text ?? '(stream)')).replace(/\s+/g, ' ').trim());
    return original.apply(this, args);
  };
  try {
    await fn();
  } finally {
    proto.query = original;
  }
  return seen;
}

/** A statement's first words, e.g. `INSERT INTO water_events` or `SELECT s.sess` (for readable assertions). */
export const statementHead = (sql: string) => {
  const withInsert = /^WITH\b.*?\bINSERT INTO (\w+)/i.exec(sql);
  if (withInsert) return `WITH … INSERT INTO ${withInsert[1]}`;
  return sql.split(' ').slice(0, 3).join(' ');
};
