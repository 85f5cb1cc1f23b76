/**
 * Figure 3: the cohort CSV export of water events through the API (the app in a child process,
 * its memory read from /proc), against COPY (same SELECT) TO STDOUT of the same rows.
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ReadableStream as WebReadableStream } from 'node:stream/web';
import pg from 'pg';
import { exportSelect, findExportTable } from '../../server/services/export-tables';
import { sampleMemory, type ChildServer } from '../lib/child';
import { copyOut, lineCounter } from '../lib/copy';
import type { SessionClient } from '../lib/session-client';
import { r3, roundSummary, summarise, type Summary } from '../lib/stats';

export interface ExportFigure {
  rows: number;
  bytes: number;
  reps: number;
  apiSeconds: Summary;
  copySeconds: Summary;
  apiRowsPerSecond: number;
  copyRowsPerSecond: number;
  /** API rows/s ÷ COPY rows/s (medians). */
  ratio: number;
  memory: { rssBeforeMb: number; peakRssMb: number; hwmMb: number; samples: number };
}

export async function measureExport(o: { child: ChildServer; client: SessionClient; databaseUrl: string; cohortId: string; reps: number }): Promise<ExportFigure> {
  const path = `/api/cohorts/${o.cohortId}/export/water-events.csv`;
  const pgClient = new pg.Client({ connectionString: o.databaseUrl });
  await pgClient.connect();
  const select = exportSelect(findExportTable('water-events')!, { kind: 'cohort', cohortId: o.cohortId }, (v) => pgClient.escapeLiteral(v));

  const viaApi = async () => {
    const t0 = performance.now();
    const res = await fetch(o.client.baseUrl + path, { headers: o.client.headers() });
    if (res.status !== 200 || !res.body) throw new Error(`GET ${path}: ${res.status}`);
    const { stats, sink } = lineCounter();
    await pipeline(Readable.fromWeb(res.body as WebReadableStream<Uint8Array>), sink);
    return { s: (performance.now() - t0) / 1000, rows: stats.lines - 1, bytes: stats.bytes };
  };
  const viaCopy = async () => {
    const t0 = performance.now();
    const r = await copyOut(pgClient, select);
    return { s: (performance.now() - t0) / 1000, rows: r.rows, bytes: r.bytes };
  };

  const before = o.child.memory();
  const sampler = sampleMemory(o.child.pid, 20);
  const api: number[] = [];
  const copy: number[] = [];
  let rows = 0;
  let bytes = 0;
  try {
    for (let i = 0; i < o.reps; i++) {
      const a = i % 2 === 0 ? await viaApi() : null;
      const c = await viaCopy();
      const b = a ?? (await viaApi());
      if (b.rows !== c.rows) throw new Error(`export row counts differ: API ${b.rows}, COPY ${c.rows}`);
      api.push(b.s);
      copy.push(c.s);
      rows = b.rows;
      bytes = b.bytes;
    }
  } finally {
    await pgClient.end();
  }
  const peak = sampler.stop();
  const after = o.child.memory();
  const apiS = summarise(api);
  const copyS = summarise(copy);
  return {
    rows,
    bytes,
    reps: o.reps,
    apiSeconds: roundSummary(apiS),
    copySeconds: roundSummary(copyS),
    apiRowsPerSecond: Math.round(rows / apiS.median),
    copyRowsPerSecond: Math.round(rows / copyS.median),
    ratio: copyS.median / apiS.median,
    memory: { rssBeforeMb: r3(before.rssKb / 1024), peakRssMb: r3(Math.max(peak.peakRssKb, after.rssKb) / 1024), hwmMb: r3(after.hwmKb / 1024), samples: peak.samples },
  };
}
