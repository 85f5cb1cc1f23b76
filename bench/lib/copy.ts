/**
 * Bulk loading through PostgreSQL's COPY FROM STDIN (CSV), and draining a COPY TO STDOUT.
 * Rows are encoded in small string batches so memory stays flat whatever the row count.
 */
import { Readable, Writable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type pg from 'pg';
import { from as copyFrom, to as copyTo } from 'pg-copy-streams';

export type CopyValue = string | number | boolean | null | undefined | object;

function csvCell(v: CopyValue): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'boolean') return v ? 't' : 'f';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  const s = typeof v === 'string' ? v : JSON.stringify(v);
  // Quote every text cell: an empty quoted string is '', an unquoted empty cell is NULL.
  return `"${s.replace(/"/g, '""')}"`;
}

/** COPY table (columns) FROM STDIN for the given rows; returns the number of rows sent. */
export async function copyRows(client: pg.ClientBase, table: string, columns: readonly string[], rows: Iterable<readonly CopyValue[]>): Promise<number> {
  let count = 0;
  function* lines() {
    let batch = '';
    for (const row of rows) {
      batch += row.map(csvCell).join(',') + '\n';
      count++;
      if (batch.length > 256 * 1024) {
        yield batch;
        batch = '';
      }
    }
    if (batch) yield batch;
  }
  const stream = client.query(copyFrom(`COPY ${table} (${columns.join(', ')}) FROM STDIN WITH (FORMAT csv)`));
  await pipeline(Readable.from(lines()), stream);
  return count;
}

/** Counts bytes and newline characters of a byte stream without keeping it. */
export function lineCounter() {
  const stats = { bytes: 0, lines: 0 };
  const sink = new Writable({
    write(chunk: Buffer, _enc, cb) {
      stats.bytes += chunk.length;
      let i = -1;
      while ((i = chunk.indexOf(10, i + 1)) !== -1) stats.lines++;
      cb();
    },
  });
  return { stats, sink };
}

/** Runs COPY (select) TO STDOUT as CSV with a header and drains it: the database-side floor of an export. */
export async function copyOut(client: pg.ClientBase, select: string): Promise<{ bytes: number; rows: number }> {
  const { stats, sink } = lineCounter();
  await pipeline(client.query(copyTo(`COPY (${select}) TO STDOUT WITH (FORMAT csv, HEADER true)`)), sink);
  return { bytes: stats.bytes, rows: stats.lines - 1 };
}
