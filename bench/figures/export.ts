/**
 * Figure 3: the cohort CSV export of water events through the API (the app in a child process,
 * its memory read from /proc), against COPY (same SELECT) TO STDOUT of the same rows.
 *
 * Both sides are read outside the benchmark process, each counted by wc: the download by curl
 * (`--compressed`, as a browser asks) and the COPY by psql. The benchmark process holds the
 * scenario plan (its heap doubles from half to full size), and reading ~100 MB there (fetch's web
 * streams, pg-copy-streams) made the reader, not the server or the database, the slow side, and
 * more so at full size. Both reads in this process, the method of runs before session 4, are still
 * measured and reported beside them.
 */
import { spawn } from 'node:child_process';
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
  /** The same download read in the benchmark process through fetch (the method before session 4). */
  inProcessSeconds: Summary;
  /** The COPY read in the benchmark process (pg-copy-streams, the method before session 4). */
  copyInProcessSeconds: Summary;
  /** Both read in the benchmark process: COPY ÷ API (medians), the ratio as runs before session 4 measured it. */
  inProcessRatio: number;
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

  const viaApi = () =>
    new Promise<{ s: number; rows: number; bytes: number }>((resolve, reject) => {
      const t0 = performance.now();
      const headerArgs = Object.entries(o.client.headers({ accept: 'text/csv' })).flatMap(([k, v]) => ['-H', `${k}: ${v}`]);
      const sh = spawn('bash', ['-c', 'set -o pipefail; curl -sS --fail --compressed "$@" | wc -lc', 'bash', ...headerArgs, o.client.baseUrl + path], { stdio: ['ignore', 'pipe', 'inherit'] });
      let out = '';
      sh.stdout.on('data', (d: Buffer) => (out += d.toString()));
      sh.on('error', reject);
      sh.on('close', (code) => {
        const [lines, bytes] = out.trim().split(/\s+/).map(Number);
        if (code !== 0 || lines === undefined || bytes === undefined) reject(new Error(`curl GET ${path}: exit ${code}, output ${JSON.stringify(out)}`));
        else resolve({ s: (performance.now() - t0) / 1000, rows: lines - 1, bytes });
      });
    });
  const viaFetch = async () => {
    const t0 = performance.now();
    const res = await fetch(o.client.baseUrl + path, { headers: o.client.headers() });
    if (res.status !== 200 || !res.body) throw new Error(`GET ${path}: ${res.status}`);
    const { stats, sink } = lineCounter();
    await pipeline(Readable.fromWeb(res.body as WebReadableStream<Uint8Array>), sink);
    return { s: (performance.now() - t0) / 1000, rows: stats.lines - 1, bytes: stats.bytes };
  };
  const copySql = `COPY (${select}) TO STDOUT WITH (FORMAT csv, HEADER true)`;
  const viaCopy = () =>
    new Promise<{ s: number; rows: number; bytes: number }>((resolve, reject) => {
      const t0 = performance.now();
      const sh = spawn('bash', ['-c', 'set -o pipefail; psql -X -q -v ON_ERROR_STOP=1 "$1" -c "$2" | wc -lc', 'bash', o.databaseUrl, copySql], { stdio: ['ignore', 'pipe', 'inherit'] });
      let out = '';
      sh.stdout.on('data', (d: Buffer) => (out += d.toString()));
      sh.on('error', reject);
      sh.on('close', (code) => {
        const [lines, bytes] = out.trim().split(/\s+/).map(Number);
        if (code !== 0 || lines === undefined || bytes === undefined) reject(new Error(`psql COPY: exit ${code}, output ${JSON.stringify(out)}`));
        // psql adds nothing to COPY TO STDOUT; the API's answer starts with a 3-byte byte order mark.
        else resolve({ s: (performance.now() - t0) / 1000, rows: lines - 1, bytes });
      });
    });
  const viaCopyInProcess = async () => {
    const t0 = performance.now();
    const r = await copyOut(pgClient, select);
    return { s: (performance.now() - t0) / 1000, rows: r.rows, bytes: r.bytes };
  };

  const before = o.child.memory();
  const sampler = sampleMemory(o.child.pid, 20);
  const api: number[] = [];
  const copy: number[] = [];
  const inProcess: number[] = [];
  const copyInProcess: number[] = [];
  let rows = 0;
  let bytes = 0;
  try {
    for (let i = 0; i < o.reps; i++) {
      // The order rotates each repetition, so no reader always runs first (or on a warmer cache).
      const readers = [viaApi, viaCopy, viaFetch, viaCopyInProcess];
      const order = [...readers.slice(i % readers.length), ...readers.slice(0, i % readers.length)];
      const got = new Map<unknown, { s: number; rows: number; bytes: number }>();
      for (const read of order) got.set(read, await read());
      const b = got.get(viaApi)!;
      const c = got.get(viaCopy)!;
      const f = got.get(viaFetch)!;
      const ci = got.get(viaCopyInProcess)!;
      if (b.rows !== c.rows || f.rows !== c.rows || ci.rows !== c.rows) throw new Error(`export row counts differ: API ${b.rows} (in process ${f.rows}), COPY ${c.rows} (in process ${ci.rows})`);
      copyInProcess.push(ci.s);
      api.push(b.s);
      copy.push(c.s);
      inProcess.push(f.s);
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
  const inProcessS = summarise(inProcess);
  const copyInProcessS = summarise(copyInProcess);
  return {
    rows,
    bytes,
    reps: o.reps,
    apiSeconds: roundSummary(apiS),
    copySeconds: roundSummary(copyS),
    apiRowsPerSecond: Math.round(rows / apiS.median),
    copyRowsPerSecond: Math.round(rows / copyS.median),
    ratio: copyS.median / apiS.median,
    inProcessSeconds: roundSummary(inProcessS),
    copyInProcessSeconds: roundSummary(copyInProcessS),
    inProcessRatio: copyInProcessS.median / inProcessS.median,
    memory: { rssBeforeMb: r3(before.rssKb / 1024), peakRssMb: r3(Math.max(peak.peakRssKb, after.rssKb) / 1024), hwmMb: r3(after.hwmKb / 1024), samples: peak.samples },
  };
}
