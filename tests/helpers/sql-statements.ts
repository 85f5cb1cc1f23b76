import { recordStatements } from '../../bench/lib/query-counter';

/** The SQL statements the app sends while `fn` runs, in order, whitespace collapsed (whole, not cut). */
export const sqlStatements = (fn: () => Promise<unknown>): Promise<string[]> => recordStatements(fn);

/** A statement's first words, e.g. `INSERT INTO water_events` or `SELECT s.sess` (for readable assertions). */
export const statementHead = (sql: string) => {
  const withInsert = /^WITH\b.*?\bINSERT INTO (\w+)/i.exec(sql);
  if (withInsert) return `WITH … INSERT INTO ${withInsert[1]}`;
  return sql.split(' ').slice(0, 3).join(' ');
};
