import type { EntityManager } from 'typeorm';

/** PostgreSQL array element types the demo tables need. */
export type ColumnType = 'uuid' | 'text' | 'float8' | 'int4' | 'bool' | 'date' | 'timestamptz' | 'jsonb';

/**
 * Inserts many rows in one statement: each column travels as one array parameter and
 * `unnest` zips them back into rows, so 10,000 rows cost one round trip and 1 + n parameters.
 * Missing values become NULL (and so take no column default: list only the columns you fill).
 */
export async function insertRows<K extends string>(
  tx: EntityManager,
  table: string,
  columns: Record<K, ColumnType>,
  rows: readonly Record<K, unknown>[],
): Promise<void> {
  if (rows.length === 0) return;
  const names = Object.keys(columns) as K[];
  const params = names.map((name) => rows.map((row) => row[name] ?? null));
  const arrays = names.map((name, i) => `$${i + 1}::${columns[name]}[]`).join(', ');
  await tx.query(`INSERT INTO ${table} (${names.join(', ')}) SELECT * FROM unnest(${arrays})`, params);
}
