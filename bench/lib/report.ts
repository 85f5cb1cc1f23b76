/** The results table (figure, value, spread, target, pass/miss, ratio) and RESULTS.md. */
import { isSkipped, type BenchResults, type Skipped } from '../bench';
import type { RouteFigure } from '../figures/route-vs-sql';
import { r3 } from './stats';

export interface TableRow {
  id: string;
  figure: string;
  value: string;
  spread: string;
  target: string;
  status: 'pass' | 'miss' | 'info' | 'skipped';
  ratio: string;
}

/** Thresholds for the growth figures (7): what counts as flat, and as linear. */
export const GROWTH = { flatLatency: 1.3, flatMemory: 1.2, linearTolerance: 0.25 } as const;

const n = (v: number, digits = 0) => v.toLocaleString('en', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
const status = (ok: boolean): TableRow['status'] => (ok ? 'pass' : 'miss');

function routeRows(id: string, title: string, f: RouteFigure | Skipped, targetMs: number, trips?: { route: string[]; bare: number } | Skipped): TableRow[] {
  const tripText = trips && !isSkipped(trips) ? `; ${trips.route.length} SQL statements per request against ${trips.bare}` : '';
  if (isSkipped(f)) return [{ id, figure: title, value: '—', spread: '—', target: `median < ${targetMs} ms, ratio < 2`, status: 'skipped', ratio: f.skipped }];
  return [
    {
      id: `${id}a`,
      figure: `${title}: latency`,
      value: `median ${f.routeMs.median} ms`,
      spread: `p95 ${f.routeMs.p95} ms, IQR ${f.routeMs.q1}–${f.routeMs.q3} ms, n=${f.iterations}`,
      target: `median < ${targetMs} ms`,
      status: status(f.routeMs.median < targetMs),
      ratio: `${r3(f.ratio)}× bare SQL`,
    },
    {
      id: `${id}b`,
      figure: `${title}: route ÷ its bare SQL`,
      value: `${r3(f.ratio)}`,
      spread: `bare SQL median ${f.bareSqlMs.median} ms, p95 ${f.bareSqlMs.p95} ms${tripText}`,
      target: '< 2',
      status: status(f.ratio < 2),
      ratio: `${r3(f.ratio)}`,
    },
  ];
}

export function tableRows(r: BenchResults): TableRow[] {
  const { half, full, writes, client } = r.figures;
  const imp = r.figures.import;
  const rows: TableRow[] = [];
  const sc = isSkipped(r.scenario) ? null : r.scenario;
  const skippedRow = (id: string, figure: string, target: string, why: Skipped) => rows.push({ id, figure, value: '—', spread: '—', target, status: 'skipped', ratio: why.skipped });
  if (!sc) skippedRow('0', 'Scenario load', '—', r.scenario as Skipped);
  else {
  const load = sc.load;
  rows.push({
    id: '0',
    figure: `Scenario load: ${n(sc.full.trials)} trials, ${n(sc.full.cohorts)} cohorts, ${n(sc.full.logRows)} log rows (COPY + INSERT…SELECT generate_series)`,
    value: `${n(load.totalSeconds, 1)} s`,
    spread: `${load.phases.map((p) => `phase ${p.phase} ${n(p.seconds, 1)} s`).join(', ')}; ANALYZE ${load.analyzeSeconds.map((s) => `${s} s`).join(' + ')}`,
    target: '—',
    status: 'info',
    ratio: `${n(load.rowsPerSecond)} rows/s`,
  });
  }
  const sizeNote = (k: 'featuredTrialLogRows' | 'bigCohortTrials', unit: string) => (sc ? `, ${n(sc.full[k])} ${unit}` : '');
  rows.push(...routeRows('1', `1. GET /api/trials/:id/analysis, 20 plots${sizeNote('featuredTrialLogRows', 'log rows')} (full size)`, full.analysis, 50, r.roundTrips.analysis));
  rows.push(...routeRows('2', `2. GET /api/cohorts/:id/results${sizeNote('bigCohortTrials', 'trials')} (full size)`, full.cohort, 300, r.roundTrips.cohort));
  const cache = full.cohortCache;
  if (cache && !isSkipped(cache)) {
    rows.push({
      id: '2c',
      figure: '2. Cohort results route (log rollups) against the raw-row SQL it ran before them (full size, same run)',
      value: `${r3(cache.speedup)}× faster`,
      spread: `route median ${cache.routeMs.median} ms (n=${cache.routeMs.n}), raw-row SQL alone median ${cache.rawSqlMs.median} ms (${cache.rawSqlMs.min}–${cache.rawSqlMs.max} ms)`,
      target: '— (reported)',
      status: 'info',
      ratio: `${r3(cache.routeMs.median / cache.rawSqlMs.median)} of the raw-row SQL`,
    });
    rows.push({
      id: '2d',
      figure: '2. Cohort results route when rollups are stale: every trial (cold) / one trial changed',
      value: `cold median ${cache.coldMs.median} ms; one changed median ${cache.oneChangedMs.median} ms`,
      spread: `cold ${cache.coldMs.min}–${cache.coldMs.max} ms, n=${cache.coldMs.n}; one changed ${cache.oneChangedMs.min}–${cache.oneChangedMs.max} ms, n=${cache.oneChangedMs.n}`,
      target: '— (reported)',
      status: 'info',
      ratio: `cold ${r3(cache.coldMs.median / cache.rawSqlMs.median)} of the raw-row SQL`,
    });
  }
  for (const [label, e] of [
    ['full', full.export],
    ['half', half.export],
  ] as const) {
    if (isSkipped(e)) {
      skippedRow(label === 'full' ? '3a' : '3c', `3. Cohort water-events CSV export (${label} size)`, 'API ÷ COPY ≥ 0.5', e);
      continue;
    }
    rows.push({
      id: label === 'full' ? '3a' : '3c',
      figure: `3. Cohort water-events CSV export, ${n(e.rows)} rows (${label} size)`,
      value: `${n(e.apiRowsPerSecond)} rows/s`,
      spread: `${e.apiSeconds.median} s median (${e.apiSeconds.min}–${e.apiSeconds.max} s), n=${e.reps}, ${n(e.bytes / 1024 / 1024, 1)} MB`,
      target: 'API ÷ COPY ≥ 0.5',
      status: status(e.ratio >= 0.5),
      ratio: `${r3(e.ratio)} (COPY ${n(e.copyRowsPerSecond)} rows/s)`,
    });
    if (e.inProcessSeconds) {
      rows.push({
        id: label === 'full' ? '3a′' : '3c′',
        figure: `3. The same export and COPY both read in the benchmark process (fetch, pg-copy-streams: the method before session 4; ${label} size)`,
        value: `${n(Math.round(e.rows / e.inProcessSeconds.median))} rows/s`,
        spread: `API ${e.inProcessSeconds.median} s median (${e.inProcessSeconds.min}–${e.inProcessSeconds.max} s), COPY ${e.copyInProcessSeconds?.median ?? '—'} s, n=${e.reps}`,
        target: '— (reported)',
        status: 'info',
        ratio: `${r3(e.inProcessRatio)} (API ÷ COPY, both in process)`,
      });
    }
    rows.push({
      id: label === 'full' ? '3b' : '3d',
      figure: `3. Server process peak memory during that export (${label} size)`,
      value: `${e.memory.hwmMb} MB VmHWM`,
      spread: `VmRSS ${e.memory.rssBeforeMb} MB before, ${e.memory.peakRssMb} MB peak (${e.memory.samples} samples)`,
      target: '< 250 MB',
      status: status(e.memory.hwmMb < 250),
      ratio: '—',
    });
  }
  if (isSkipped(writes)) skippedRow('4a', '4. POST /api/trials/:id/water-events (autocannon)', '— (reported)', writes);
  else {
  rows.push({
    id: '4a',
    figure: `4. POST /api/trials/:id/water-events, autocannon ${writes.connections} connections, ${writes.durationS ? `${writes.durationS} s` : `${writes.amount} requests`}`,
    value: `${n(writes.api.requestsPerSecond.mean)} req/s`,
    spread: `per second median ${n(writes.api.requestsPerSecond.median)} (${n(writes.api.requestsPerSecond.p2_5)}–${n(writes.api.requestsPerSecond.p97_5)}); latency p50 ${writes.api.latencyMs.p50} ms, p99 ${writes.api.latencyMs.p99} ms`,
    target: '— (reported)',
    status: 'info',
    ratio: `${r3(writes.ratio)} of direct INSERTs (${n(writes.direct.rowsPerSecond)} rows/s, pool ${writes.poolSize})${isSkipped(r.roundTrips.write) ? '' : `; ${r.roundTrips.write.route.length} SQL statements per request against 1`}`,
  });
  const failures = writes.api.errors + writes.api.non2xx + writes.api.timeouts;
  rows.push({
    id: '4b',
    figure: '4. Write errors (errors + non-2xx + timeouts)',
    value: `${failures}`,
    spread: `${n(writes.api.ok)} of ${n(writes.api.requests)} answered requests 2xx; ${n(writes.api.rowsWritten)} rows in the table (requests in flight when the run stopped may add up to ${writes.connections})`,
    target: '0',
    status: status(failures === 0 && writes.api.rowsWritten >= writes.api.ok && writes.api.rowsWritten <= writes.api.sent),
    ratio: '—',
  });
  }
  if (isSkipped(imp)) skippedRow('5', '5. Import of a CSV, parse + normalise + POST /api/trials/:id/import', '< 15 s', imp);
  else
  rows.push({
    id: '5',
    figure: `5. Import of a ${n(imp.rows)}-row CSV (${imp.kind}), parse + normalise + POST /api/trials/:id/import`,
    value: `${imp.totalSeconds.median} s`,
    spread: `${imp.totalSeconds.min}–${imp.totalSeconds.max} s, n=${imp.runs}; parse ${imp.steps.parse} s, normalise ${imp.steps.normalise} s, JSON ${imp.steps.serialise} s, request ${imp.steps.request} s`,
    target: '< 15 s',
    status: status(imp.totalSeconds.median < 15),
    ratio: '—',
  });
  if (isSkipped(client)) {
    rows.push({ id: '6', figure: '6. First page (sign-in): JS + CSS gzipped, LCP', value: '—', spread: '—', target: '< 180 KB', status: 'skipped', ratio: client.skipped });
  } else {
    rows.push({
      id: '6a',
      figure: `6. First page (${client.page}): JavaScript + CSS, gzipped`,
      value: `${client.jsCssGzipKb} KB`,
      spread: `${client.files.length} files, ${client.jsCssRawKb} KB raw; ${client.jsCssTransferKb} KB actually sent (${[...new Set(client.files.map((f) => f.encoding))].join(', ')})`,
      target: '< 180 KB',
      status: status(client.jsCssGzipKb < 180),
      ratio: '—',
    });
    rows.push({
      id: '6b',
      figure: `6. Largest Contentful Paint of ${client.page}, production build, loopback, cold cache`,
      value: `median ${client.lcpMs.median} ms`,
      spread: `p95 ${client.lcpMs.p95} ms, ${client.lcpMs.min}–${client.lcpMs.max} ms, n=${client.loads}`,
      target: '— (reported)',
      status: 'info',
      ratio: client.lcpElement ? `element: ${client.lcpElement}` : '—',
    });
  }
  const logRatio = sc ? sc.full.logRows / sc.half.logRows : NaN;
  const growth = (id: string, title: string, h: RouteFigure | Skipped, f: RouteFigure | Skipped) => {
    if (isSkipped(h) || isSkipped(f)) return rows.push({ id, figure: title, value: '—', spread: '—', target: `≤ ${GROWTH.flatLatency} (flat)`, status: 'skipped', ratio: '—' });
    const g = f.routeMs.median / h.routeMs.median;
    rows.push({
      id,
      figure: title,
      value: `${r3(g)}×`,
      spread: `median ${h.routeMs.median} → ${f.routeMs.median} ms while log rows grew ${r3(logRatio)}×`,
      target: `≤ ${GROWTH.flatLatency} (flat)`,
      status: status(g <= GROWTH.flatLatency),
      ratio: `bare SQL ${r3(f.bareSqlMs.median / h.bareSqlMs.median)}×`,
    });
  };
  growth('7a', '7. Growth, half → full: trial analysis route', half.analysis, full.analysis);
  growth('7b', '7. Growth, half → full: cohort results route', half.cohort, full.cohort);
  const [he, fe] = [half.export, full.export];
  if (isSkipped(he) || isSkipped(fe)) {
    skippedRow('7c', '7. Growth, half → full: export cost per row', `within ±${GROWTH.linearTolerance * 100} % (linear)`, isSkipped(fe) ? fe : (he as Skipped));
    skippedRow('7d', '7. Growth, half → full: export peak memory', `≤ ${GROWTH.flatMemory} (flat)`, isSkipped(fe) ? fe : (he as Skipped));
  } else {
  const rowsRatio = fe.rows / he.rows;
  const timeRatio = fe.apiSeconds.median / he.apiSeconds.median;
  const copyRatio = fe.copySeconds.median / he.copySeconds.median;
  // The machine's speed drifts between the two phases; COPY of the same rows, interleaved with the API
  // runs in each phase, moves with it. API time ÷ COPY time staying put means the export grows like COPY:
  // linearly in the rows, with no per-row cost that builds up.
  const overheadRatio = timeRatio / copyRatio;
  rows.push({
    id: '7c',
    figure: '7. Growth, half → full: export cost per row (API time ÷ COPY time of the same rows, same phase)',
    value: `${r3(overheadRatio)}×`,
    spread: `API ${he.apiSeconds.median} → ${fe.apiSeconds.median} s (${r3(timeRatio)}×), COPY ${he.copySeconds.median} → ${fe.copySeconds.median} s (${r3(copyRatio)}×), for ${r3(rowsRatio)}× the rows`,
    target: `within ±${GROWTH.linearTolerance * 100} % (linear)`,
    status: status(Math.abs(overheadRatio - 1) <= GROWTH.linearTolerance),
    ratio: `raw time ${r3(timeRatio / rowsRatio)} of linear`,
  });
  const memRatio = fe.memory.hwmMb / he.memory.hwmMb;
  rows.push({
    id: '7d',
    figure: '7. Growth, half → full: export peak memory',
    value: `${r3(memRatio)}×`,
    spread: `${he.memory.hwmMb} → ${fe.memory.hwmMb} MB for ${r3(rowsRatio)}× the rows`,
    target: `≤ ${GROWTH.flatMemory} (flat)`,
    status: status(memRatio <= GROWTH.flatMemory),
    ratio: '—',
  });
  }
  const order = ['0', '1a', '1b', '1', '2a', '2b', '2', '2c', '2d', '3a', '3a′', '3b', '3c', '3c′', '3d', '4a', '4b', '5', '6', '6a', '6b', '7a', '7b', '7c', '7d'];
  return rows.sort((a, b) => order.indexOf(a.id) - order.indexOf(b.id));
}

const esc = (s: string) => s.replace(/\|/g, '\\|');

export function renderMarkdown(r: BenchResults): string {
  const e = r.environment;
  const s = r.scenario;
  const lines: string[] = [];
  lines.push('# Seepwise benchmark results', '');
  lines.push(
    `Generated by \`${r.command}\` on ${r.generatedAt.slice(0, 16).replace('T', ' ')} UTC in ${n(r.durationSeconds)} s. ` +
      `Commit ${e.commit}${Number(e.dirtyFiles) ? ` with ${e.dirtyFiles} uncommitted files in the tree` : ''}. ` +
      `Machine: ${e.cpus} × ${e.cpuModel}, ${e.memoryGb} GB, ${e.platform}; Node ${e.node}; PostgreSQL ${e.postgres} ` +
      `(fsync=${e.fsync}, synchronous_commit=${e.synchronousCommit}, shared_buffers=${e.sharedBuffers}, work_mem=${e.workMem}; one durable one-row commit takes ${e.commitFlushMs} ms on this disk); ` +
      `app pool ${e.appPoolSize}, session pool ${e.sessionPoolSize}; figures 1 and 2 served by ${e.readsServedBy ?? 'the bench process'}. ` +
      `The machine was shared: 1-minute load average ${e.loadAverageAtStart} at the start and ${e.loadAverageAtEnd} at the end, on 2 cores.`,
    '',
  );
  lines.push('Every value is a median over repeated runs with its spread; every ratio compares two measurements from the same run. How each figure is measured: [README.md](README.md). Causes of misses and the proposed fixes: [FINDINGS.md](FINDINGS.md).', '');
  lines.push('| # | Figure | Value | Spread | Target | Pass/miss | Ratio |', '|---|---|---|---|---|---|---|');
  for (const row of r.table) {
    lines.push(`| ${row.id} | ${esc(row.figure)} | ${esc(row.value)} | ${esc(row.spread)} | ${esc(row.target)} | ${row.status} | ${esc(row.ratio)} |`);
  }
  if (isSkipped(s)) lines.push('', `Scenario: ${s.skipped}.`, '');
  else {
  lines.push('', '## Scenario (invented data)', '');
  lines.push('| | half | full |', '|---|---|---|');
  for (const key of ['users', 'cohorts', 'trials', 'plots', 'trialShares', 'waterEvents', 'moistureReadings', 'harvests', 'weatherDays', 'logRows', 'bigCohortTrials', 'networkCohortWaterEvents', 'databaseMb'] as const) {
    lines.push(`| ${key} | ${n(s.half[key])} | ${n(s.full[key])} |`);
  }
  lines.push('', '| Load step | Method | Rows | Seconds | Rows/s |', '|---|---|---|---|---|');
  for (const p of s.load.phases) {
    for (const st of p.steps) lines.push(`| phase ${p.phase}: ${st.table} | ${st.method} | ${n(st.rows)} | ${n(st.ms / 1000, 2)} | ${n(st.rowsPerSecond)} |`);
  }
  }
  lines.push('', '## SQL statements per request (recorded once on the in-process app)', '');
  for (const [name, t] of Object.entries(r.roundTrips) as [string, { route: string[]; bare: number } | Skipped][]) {
    if (isSkipped(t)) continue;
    lines.push(`- **${name}** (${t.route.length}; the bare side sends ${t.bare}):`, ...t.route.map((q, i) => `  ${i + 1}. \`${q.replace(/`/g, "'")}\``));
  }
  lines.push('', '## Query plans at full size (EXPLAIN ANALYZE, one run)', '');
  lines.push('| Query | Execution ms | Sequential scans (table: rows) |', '|---|---|---|');
  for (const d of r.diagnostics) {
    lines.push(`| ${d.query} | ${d.executionMs} | ${d.seqScans.map((x) => `${x.table}: ${n(x.rows)}`).join(', ') || '—'} |`);
  }
  lines.push('');
  return lines.join('\n');
}
