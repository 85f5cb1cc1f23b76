/**
 * Figure 5: a logger CSV imported end to end, the way the browser does it: parse the text with
 * Papa Parse (as src/features/import/worker/parse-csv.worker.ts), map the columns and detect the
 * date format, normalise with the shared code, then POST the records to /api/trials/:id/import.
 */
import Papa from 'papaparse';
import { detectDateFormat, guessMapping, normaliseRows, type ImportKind } from '@shared/import/csv-import';
import type { ChildServer } from '../lib/child';
import type { SessionClient } from '../lib/session-client';
import { BenchRng } from '../lib/names';
import { r3, roundSummary, summarise, type Summary } from '../lib/stats';

export interface ImportFigure {
  kind: ImportKind;
  rows: number;
  csvBytes: number;
  requestBytes: number;
  runs: number;
  totalSeconds: Summary;
  /** Medians of each step, seconds. */
  steps: { parse: number; normalise: number; serialise: number; request: number };
  peakRssMb: number;
}

/** An hourly soil-moisture logger: every plot at two depths, local time (UTC−7), from planting on. */
export function loggerCsv(rows: number, plotLabels: string[], seed: string): string {
  const rng = new BenchRng(`import:${seed}`);
  const lines = ['plot,taken_at,method,depth_cm,value'];
  const perHour = plotLabels.length * 2;
  const start = Date.parse('2026-08-01T06:00:00Z');
  for (let i = 0; i < rows; i++) {
    const hour = Math.floor(i / perHour);
    const plot = plotLabels[Math.floor(i / 2) % plotLabels.length]!;
    const t = new Date(start + hour * 3_600_000).toISOString();
    const local = `${t.slice(0, 10)} ${t.slice(11, 16)}`;
    const olla = plot.endsWith('-O');
    const value = (olla ? 22 : 16) + rng.uniform(0, 8) - (i % 2 ? 2 : 0);
    lines.push(`${plot},${local},vwc,${i % 2 ? 30 : 15},${value.toFixed(1)}`);
  }
  return lines.join('\r\n') + '\r\n';
}

export async function measureImport(o: { child: ChildServer; client: SessionClient; trialIds: string[]; plotLabels: string[]; rows: number }): Promise<ImportFigure> {
  const kind: ImportKind = 'moisture-readings';
  const totals: number[] = [];
  const parts = { parse: [] as number[], normalise: [] as number[], serialise: [] as number[], request: [] as number[] };
  let csvBytes = 0;
  let requestBytes = 0;
  let peakKb = 0;
  for (const [run, trialId] of o.trialIds.entries()) {
    const csv = loggerCsv(o.rows, o.plotLabels, String(run));
    csvBytes = Buffer.byteLength(csv);
    const t0 = performance.now();
    const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: 'greedy' });
    const [headerRow, ...data] = parsed.data;
    const headers = (headerRow ?? []).map((h) => h.trim());
    const t1 = performance.now();
    const mapping = guessMapping(headers, kind);
    const dateColumn = mapping.takenAt!;
    const detection = detectDateFormat(data.slice(0, 200).map((r) => r[dateColumn] ?? ''));
    if (!detection.format) throw new Error(`date format not detected: ${JSON.stringify(detection)}`);
    const { records, errors } = normaliseRows(data, { kind, mapping, units: {}, dateFormat: detection.format, timeZone: 'America/Phoenix' /* UTC−7 all year, as the old fixed offset */, headers });
    if (errors.length) throw new Error(`normalise: ${errors.length} errors, first ${JSON.stringify(errors[0])}`);
    const t2 = performance.now();
    const payload = JSON.stringify({ kind, fileName: `logger-${run + 1}.csv`, rows: records });
    requestBytes = Buffer.byteLength(payload);
    const t3 = performance.now();
    const res = await o.client.post(`/api/trials/${trialId}/import`, payload);
    const body = (await res.json()) as { data?: { inserted: number; received: number }; error?: unknown };
    const t4 = performance.now();
    peakKb = Math.max(peakKb, o.child.memory().hwmKb);
    if (res.status !== 201 || body.data?.inserted !== o.rows) throw new Error(`import: ${res.status} ${JSON.stringify(body).slice(0, 500)}`);
    totals.push((t4 - t0) / 1000);
    parts.parse.push((t1 - t0) / 1000);
    parts.normalise.push((t2 - t1) / 1000);
    parts.serialise.push((t3 - t2) / 1000);
    parts.request.push((t4 - t3) / 1000);
  }
  const med = (v: number[]) => r3(summarise(v).median);
  return {
    kind,
    rows: o.rows,
    csvBytes,
    requestBytes,
    runs: o.trialIds.length,
    totalSeconds: roundSummary(summarise(totals)),
    steps: { parse: med(parts.parse), normalise: med(parts.normalise), serialise: med(parts.serialise), request: med(parts.request) },
    peakRssMb: r3(peakKb / 1024),
  };
}
