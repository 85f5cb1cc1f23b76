/**
 * `npm run bench`: starts its own PostgreSQL (as the tests do), loads the invented scenario in two
 * halves, measures every figure at half and at full size, and writes results.json and RESULTS.md.
 * See bench/README.md for what each figure means and how it is measured.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import type { RouteSpec } from '../server/http/route';
import { hashPassword } from '../server/auth/passwords';
import { parseEnv } from '../server/config/env';
import { recreateDatabase, startCluster, type RunningCluster } from '../server/infra/postgres-cluster';
import { createLogger } from '../server/lib/logger';
import { startRuntime, type Runtime } from '../server/runtime';
import { analysisQueries } from '../server/services/analysis.service';
import { measureClient, CHROMIUM, type ClientFigure } from './figures/client';
import { loadCohortResultsRawQueries, measureCohortCache, type CohortCacheFigure } from './figures/cohort-cache';
import { measureExport, type ExportFigure } from './figures/export';
import { measureImport, type ImportFigure } from './figures/import';
import { bareAnalysis, bareCohortResults, compareRouteWithSql, explain, loadCohortResultsQueries, type RouteFigure } from './figures/route-vs-sql';
import { measureWrites, type WritesFigure } from './figures/writes';
import { buildBenchApp, listenLoopback } from './lib/app';
import { REPO_ROOT, startChildServer } from './lib/child';
import { recordQueries } from './lib/query-counter';
import { renderMarkdown, tableRows, type TableRow } from './lib/report';
import { SessionClient } from './lib/session-client';
import { BENCH_PASSWORD, benchEmails, loadPhase, planScenario, type LoadStep, type ScenarioIds, type ScenarioPlan } from './lib/scenario';
import { r3, summarise } from './lib/stats';

/** The figures `--only` can select; figure 7 (growth) follows from analysis, cohort and export. */
export const FIGURE_NAMES = ['analysis', 'cohort', 'export', 'writes', 'import', 'client'] as const;
export type FigureName = (typeof FIGURE_NAMES)[number];
/** The figures that need the invented scenario in the database (all but the client). */
const SCENARIO_FIGURES: readonly FigureName[] = ['analysis', 'cohort', 'export', 'writes', 'import'];

export interface BenchOptions {
  scale: number;
  skipBrowser: boolean;
  /** Measure only these figures (the others are reported as skipped); the scenario is loaded only when one of them needs it. */
  only?: FigureName[];
  /** Where results.json and RESULTS.md go. */
  outDir: string;
  /** Scratch space (built client, Chromium profile, S3 fake, query plans); git-ignored. */
  tmpDir: string;
  /** Use this database instead of starting the private benchmark cluster (the smoke test). */
  databaseUrl?: string;
  pgPort: number;
  pgDataDir: string;
  keepDatabase: boolean;
  /**
   * Serve figures 1 and 2 from the bench's own process, as runs up to session 3 did, instead of
   * the app in a child process (the default): the bench's client, its scenario plan and the bare
   * SQL then share the server's event loop and heap.
   */
  readsInProcess?: boolean;
  log: (m: string) => void;
}

export const defaultOptions = (): BenchOptions => ({
  scale: 1,
  skipBrowser: false,
  outDir: path.join(REPO_ROOT, 'bench'),
  tmpDir: path.join(REPO_ROOT, 'bench', 'tmp'),
  pgPort: 54349,
  pgDataDir: path.join(REPO_ROOT, '.data', 'pg-bench'),
  keepDatabase: false,
  log: (m) => console.log(m),
});

export interface PhaseCounts {
  users: number;
  cohorts: number;
  trials: number;
  plots: number;
  trialShares: number;
  waterEvents: number;
  moistureReadings: number;
  harvests: number;
  weatherDays: number;
  logRows: number;
  featuredTrialLogRows: number;
  bigCohortTrials: number;
  networkCohortWaterEvents: number;
  databaseMb: number;
}

export interface Skipped {
  skipped: string;
}

export interface PhaseFigures {
  analysis: RouteFigure | Skipped;
  cohort: RouteFigure | Skipped;
  /** Figure 2, continued: the route against its old raw-row SQL, cold and one-trial-changed requests. */
  cohortCache?: CohortCacheFigure | Skipped;
  export: ExportFigure | Skipped;
}

/** The SQL statements one request sends (recorded on the in-process app), against what the bare side sends. */
export interface RoundTrips {
  analysis: { route: string[]; bare: number } | Skipped;
  cohort: { route: string[]; bare: number } | Skipped;
  write: { route: string[]; bare: number } | Skipped;
}

export interface ScenarioSummary {
  plan: ScenarioPlan;
  half: PhaseCounts;
  full: PhaseCounts;
  load: { phases: { phase: number; seconds: number; steps: (LoadStep & { rowsPerSecond: number })[] }[]; analyzeSeconds: number[]; totalRows: number; totalSeconds: number; rowsPerSecond: number };
}

export const isSkipped = (v: unknown): v is Skipped => typeof v === 'object' && v !== null && 'skipped' in v;

/** The command line that reproduces a run with these options. */
export function benchCommand(o: Pick<BenchOptions, 'scale' | 'skipBrowser' | 'only' | 'readsInProcess'>): string {
  const args = [o.scale !== 1 ? `--scale ${o.scale}` : '', o.skipBrowser ? '--skip-browser' : '', o.only ? `--only ${o.only.join(',')}` : '', o.readsInProcess ? '--reads-in-process' : ''].filter(Boolean);
  return `npm run bench${args.length ? ` -- ${args.join(' ')}` : ''}`;
}

export interface BenchResults {
  generatedAt: string;
  command: string;
  durationSeconds: number;
  environment: Record<string, string | number | boolean>;
  scenario: ScenarioSummary | Skipped;
  figures: {
    half: PhaseFigures;
    full: PhaseFigures;
    writes: WritesFigure | Skipped;
    import: ImportFigure | Skipped;
    client: ClientFigure | Skipped;
  };
  roundTrips: RoundTrips;
  diagnostics: { query: string; executionMs: number; planningMs: number; seqScans: { table: string; rows: number }[] }[];
  table: TableRow[];
}

async function counts(client: pg.ClientBase, ids: ScenarioIds): Promise<PhaseCounts> {
  const q = async (sql: string, params: unknown[] = []) => Number(Object.values((await client.query(sql, params)).rows[0] as Record<string, unknown>)[0]);
  const waterEvents = await q('SELECT count(*) FROM water_events');
  const moistureReadings = await q('SELECT count(*) FROM moisture_readings');
  const harvests = await q('SELECT count(*) FROM harvests');
  const weatherDays = await q('SELECT count(*) FROM weather_days');
  return {
    users: await q('SELECT count(*) FROM users'),
    cohorts: await q('SELECT count(*) FROM cohorts'),
    trials: await q('SELECT count(*) FROM trials'),
    plots: await q('SELECT count(*) FROM plots'),
    trialShares: await q('SELECT count(*) FROM trial_shares'),
    waterEvents,
    moistureReadings,
    harvests,
    weatherDays,
    logRows: waterEvents + moistureReadings + harvests + weatherDays,
    featuredTrialLogRows: await q(
      `SELECT (SELECT count(*) FROM water_events WHERE trial_id = $1) + (SELECT count(*) FROM moisture_readings WHERE trial_id = $1) + (SELECT count(*) FROM harvests WHERE trial_id = $1)`,
      [ids.featuredTrialId],
    ),
    bigCohortTrials: await q('SELECT count(*) FROM trial_shares WHERE cohort_id = $1 AND withdrawn_at IS NULL', [ids.bigCohortId]),
    networkCohortWaterEvents: await q('SELECT count(*) FROM water_events e JOIN trial_shares s ON s.trial_id = e.trial_id WHERE s.cohort_id = $1 AND s.withdrawn_at IS NULL', [ids.networkCohortId]),
    databaseMb: r3((await q('SELECT pg_database_size(current_database())')) / 1024 / 1024),
  };
}

/** Median latency of a one-row UPDATE in its own transaction: what one durable commit (a WAL flush) costs on this disk. */
async function commitLatency(client: pg.ClientBase): Promise<number> {
  await client.query('CREATE TABLE IF NOT EXISTS bench_commit_probe (id int PRIMARY KEY, at timestamptz NOT NULL)');
  await client.query('INSERT INTO bench_commit_probe VALUES (1, now()) ON CONFLICT (id) DO NOTHING');
  const ms: number[] = [];
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now();
    await client.query('UPDATE bench_commit_probe SET at = now() WHERE id = 1');
    ms.push(performance.now() - t0);
  }
  return r3(summarise(ms).median);
}

function gitInfo(): { commit: string; dirtyFiles: number } {
  const head = spawnSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: REPO_ROOT, encoding: 'utf8' });
  const status = spawnSync('git', ['status', '--porcelain'], { cwd: REPO_ROOT, encoding: 'utf8' });
  return { commit: head.stdout?.trim() || 'unknown', dirtyFiles: status.stdout ? status.stdout.split('\n').filter(Boolean).length : 0 };
}

export async function runBench(options: Partial<BenchOptions> = {}): Promise<BenchResults> {
  const o: BenchOptions = { ...defaultOptions(), ...options };
  const started = performance.now();
  const stamp = () => `[${((performance.now() - started) / 1000).toFixed(1).padStart(6)} s]`;
  const log = (m: string) => o.log(`${stamp()} ${m}`);
  fs.mkdirSync(o.tmpDir, { recursive: true });
  fs.mkdirSync(o.outDir, { recursive: true });
  const plan = planScenario(o.scale);
  const iterations = o.scale >= 0.1 ? 50 : 5;
  const warmup = o.scale >= 0.1 ? 5 : 1;
  // Half-size exports are quick, so they get more runs (their medians feed the growth figure).
  const exportReps = { half: o.scale >= 0.1 ? 5 : 1, full: o.scale >= 0.1 ? 3 : 1 };
  const today = () => new Date().toISOString().slice(0, 10);
  const want = (f: FigureName) => !o.only || o.only.includes(f);
  const notSelected: Skipped = { skipped: `not selected (--only ${o.only?.join(',')})` };
  const needsScenario = SCENARIO_FIGURES.some(want);

  let cluster: RunningCluster | null = null;
  let runtime: Runtime | null = null;
  let loader: pg.Client | null = null;
  const cleanups: (() => Promise<void>)[] = [];
  try {
    // 1. The database: the benchmark's own private cluster and a fresh database, unless one is given.
    let databaseUrl = o.databaseUrl;
    if (!databaseUrl) {
      log(`starting the benchmark's PostgreSQL (${o.pgDataDir}, 127.0.0.1:${o.pgPort}, fsync=${process.env.SEEPWISE_PG_FSYNC ?? 'on'})`);
      cluster = await startCluster({ dataDir: o.pgDataDir, port: o.pgPort, database: 'postgres', log });
      databaseUrl = recreateDatabase(cluster, 'seepwise_bench');
    }
    const env = parseEnv({ NODE_ENV: 'production', DATABASE_URL: databaseUrl, SEEPWISE_DATA_DIR: o.tmpDir, LOG_LEVEL: 'error' });
    runtime = await startRuntime(env, createLogger('error'));
    const rt = runtime;
    const ds = rt.dataSource;
    loader = new pg.Client({ connectionString: databaseUrl });
    await loader.connect();
    const setting = async (name: string) => String(((await loader!.query(`SELECT current_setting($1) AS v`, [name])).rows[0] as { v: string }).v);
    const environment: BenchResults['environment'] = {
      node: process.version,
      platform: `${os.type()} ${os.release()} ${os.arch()}`,
      cpus: os.cpus().length,
      cpuModel: os.cpus()[0]?.model ?? 'unknown',
      memoryGb: r3(os.totalmem() / 1024 ** 3),
      postgres: (await setting('server_version')).split(' ')[0]!,
      fsync: await setting('fsync'),
      synchronousCommit: await setting('synchronous_commit'),
      sharedBuffers: await setting('shared_buffers'),
      workMem: await setting('work_mem'),
      loadAverageAtStart: r3(os.loadavg()[0]!),
      appPoolSize: 10,
      sessionPoolSize: 4,
      readsServedBy: o.readsInProcess ? 'the bench process' : 'a child process',
      ...gitInfo(),
    };
    environment.commitFlushMs = await commitLatency(loader);
    log(`PostgreSQL ${environment.postgres}, fsync=${environment.fsync}, shared_buffers=${environment.sharedBuffers}, one-row commit ${environment.commitFlushMs} ms; scale ${o.scale}`);

    // 2. Phase 0: half the scenario (unless no selected figure needs it).
    const passwordHash = needsScenario ? await hashPassword(BENCH_PASSWORD) : '';
    const loads: ScenarioSummary['load']['phases'] = [];
    const analyzeSeconds: number[] = [];
    const load = async (phase: number) => {
      const r = await loadPhase(loader!, plan, phase, passwordHash, log);
      const t0 = performance.now();
      await loader!.query('ANALYZE');
      analyzeSeconds.push(r3((performance.now() - t0) / 1000));
      loads.push({ phase, seconds: r3(r.ms / 1000), steps: r.steps.map((s) => ({ ...s, ms: Math.round(s.ms), rowsPerSecond: Math.round(s.rows / Math.max(s.ms / 1000, 1e-3)) })) });
      log(`phase ${phase} loaded in ${(r.ms / 1000).toFixed(1)} s; ANALYZE ${analyzeSeconds.at(-1)} s`);
      return r.ids;
    };

    let scenario: ScenarioSummary | Skipped = { skipped: 'no selected figure needs the scenario' };
    let halfFigures: PhaseFigures = { analysis: notSelected, cohort: notSelected, export: notSelected };
    let fullFigures: PhaseFigures = { analysis: notSelected, cohort: notSelected, export: notSelected };
    let writes: WritesFigure | Skipped = notSelected;
    let imported: ImportFigure | Skipped = notSelected;
    let roundTrips: RoundTrips = { analysis: notSelected, cohort: notSelected, write: notSelected };
    const plans: Awaited<ReturnType<typeof explain>>[] = [];

    if (needsScenario) {
      const ids = await load(0);
      const half = await counts(loader, ids);
      log(`half scenario: ${half.trials} trials, ${half.cohorts} cohorts, ${half.logRows.toLocaleString('en')} log rows`);

      // The in-process app (figures 1 and 2 share its pool with the bare SQL).
      const app = buildBenchApp({ dataSource: ds, databaseUrl, smtpUrl: rt.smtpUrl, s3Endpoint: rt.s3Endpoint });
      const server = await listenLoopback(app);
      cleanups.push(async () => {
        await server.close();
        await (app.locals.closeExtras as () => Promise<void>)();
      });
      const hasCohortRoute = (app.locals.routeSpecs as RouteSpec[]).some((s) => s.method === 'get' && s.path === '/cohorts/:cohortId/results');
      const cohortQueries = hasCohortRoute && want('cohort') ? await loadCohortResultsQueries() : null;
      // Statement counts (recordQueries) need the in-process app: it patches this process's pg client.
      const grower = new SessionClient(server.url);
      const growerUser = await grower.signIn(benchEmails.grower, BENCH_PASSWORD);
      const lead = new SessionClient(server.url);
      const leadUser = await lead.signIn(benchEmails.lead, BENCH_PASSWORD);
      const childEnv = { databaseUrl, smtpUrl: rt.smtpUrl, s3Endpoint: rt.s3Endpoint };
      // Figures 1 and 2 time the app in its own process, as a browser would reach it: the bench's
      // client, its scenario plan (~70 MB of heap) and the bare SQL's rows stay out of the server's
      // event loop and garbage collector. The bare SQL runs here, on a pool of the same size.
      const readsChild = want('analysis') || want('cohort') ? (o.readsInProcess ? null : await startChildServer(childEnv)) : null;
      if (readsChild) cleanups.push(() => readsChild.stop());
      const readsUrl = readsChild?.url ?? server.url;
      const readGrower = new SessionClient(readsUrl);
      await readGrower.signIn(benchEmails.grower, BENCH_PASSWORD);
      const readLead = new SessionClient(readsUrl);
      await readLead.signIn(benchEmails.lead, BENCH_PASSWORD);
      log(`figures 1 and 2 served by ${readsChild ? `the app in a child process (pid ${readsChild.pid})` : 'the app in the bench process (--reads-in-process)'}`);

      const cohortRawQueries = cohortQueries ? await loadCohortResultsRawQueries() : null;
      const measureReads = async (label: string) => {
        let analysis: RouteFigure | Skipped = notSelected;
        if (want('analysis')) {
          log(`${label}: figure 1, GET /api/trials/:id/analysis ×${iterations} against its bare SQL`);
          const a = await compareRouteWithSql({ client: readGrower, path: `/api/trials/${ids.featuredTrialId}/analysis`, bare: bareAnalysis(ds, ids.featuredTrialId, today), iterations, warmup, budgetMs: 30_000, minIterations: Math.min(iterations, 20) });
          log(`${label}: analysis median ${a.routeMs.median} ms (p95 ${a.routeMs.p95}), bare SQL ${a.bareSqlMs.median} ms, ratio ${r3(a.ratio)}`);
          analysis = a;
        }
        let cohort: RouteFigure | Skipped = notSelected;
        if (!want('cohort')) cohort = notSelected;
        else if (!hasCohortRoute || !cohortQueries) {
          cohort = { skipped: hasCohortRoute ? 'cohortResultsQueries not found in server/services/cohort-results.service.ts' : 'GET /api/cohorts/:cohortId/results is not in buildRouteSpecs() in this checkout' };
          log(`${label}: figure 2 skipped (${cohort.skipped})`);
        } else {
          log(`${label}: figure 2, GET /api/cohorts/:id/results (${plan.bigCohortTrials} trials) ×${iterations} against its bare SQL`);
          const c = await compareRouteWithSql({ client: readLead, path: `/api/cohorts/${ids.bigCohortId}/results`, bare: bareCohortResults(ds, cohortQueries, ids.bigCohortId, leadUser.id, today), iterations, warmup: Math.min(warmup, 2), budgetMs: 30_000, minIterations: Math.min(iterations, 10) });
          log(`${label}: cohort results median ${c.routeMs.median} ms (p95 ${c.routeMs.p95}), bare SQL ${c.bareSqlMs.median} ms, ratio ${r3(c.ratio)}`);
          cohort = c;
          if (cohortRawQueries) {
            const reps = o.scale >= 0.1 ? { pairs: 6, coldReps: 3, changedReps: 5 } : { pairs: 2, coldReps: 1, changedReps: 1 };
            log(`${label}: figure 2, route against the raw-row SQL ×${reps.pairs}, cold ×${reps.coldReps}, one trial changed ×${reps.changedReps}`);
            const cache = await measureCohortCache({ ds, client: readLead, raw: cohortRawQueries, cohortId: ids.bigCohortId, userId: leadUser.id, today, ...reps });
            log(`${label}: route ${cache.routeMs.median} ms against raw-row SQL ${cache.rawSqlMs.median} ms (${cache.speedup}× faster); cold ${cache.coldMs.median} ms; one trial changed ${cache.oneChangedMs.median} ms`);
            return { analysis, cohort, cohortCache: cache };
          }
        }
        return { analysis, cohort };
      };
      const measureExportIn = async (label: 'half' | 'full', child: Awaited<ReturnType<typeof startChildServer>>) => {
        const network = new SessionClient(child.url);
        await network.signIn(benchEmails.network, BENCH_PASSWORD);
        const reps = label === 'half' ? exportReps.half : exportReps.full;
        log(`${label}: figure 3, cohort water-events CSV export ×${reps} against COPY TO STDOUT`);
        const fig = await measureExport({ child, client: network, databaseUrl: databaseUrl!, cohortId: ids.networkCohortId, reps });
        log(`${label}: export ${fig.rows.toLocaleString('en')} rows at ${fig.apiRowsPerSecond.toLocaleString('en')} rows/s (COPY ${fig.copyRowsPerSecond.toLocaleString('en')}), ratio ${r3(fig.ratio)}, peak RSS ${fig.memory.peakRssMb} MB`);
        return fig;
      };
      const bounded = o.scale >= 0.1 ? { durationS: 10, amount: null } : { durationS: null, amount: 40 };

      const halfReads = await measureReads('half');
      let halfExport: ExportFigure | Skipped = notSelected;
      if (want('export')) {
        const childA = await startChildServer(childEnv);
        try {
          halfExport = await measureExportIn('half', childA);
        } finally {
          await childA.stop();
        }
      }
      halfFigures = { analysis: halfReads.analysis, cohort: halfReads.cohort, cohortCache: halfReads.cohortCache, export: halfExport };

      // 3. Phase 1: the other half.
      await load(1);
      const full = await counts(loader, ids);
      log(`full scenario: ${full.trials} trials, ${full.cohorts} cohorts, ${full.logRows.toLocaleString('en')} log rows`);
      const fullReads = await measureReads('full');

      // Round trips per request, recorded once on the in-process app.
      const drain = async (r: Promise<Response>) => {
        const res = await r;
        await res.arrayBuffer();
        if (res.status >= 300) throw new Error(`round-trip probe: ${res.status}`);
      };
      // One request each first: a session's first request also rolls its stored expiry (one UPDATE, then at
      // most once per 5 minutes, server/auth/session.ts), which is not a cost of every request.
      await drain(grower.get('/api/auth/session'));
      await drain(lead.get('/api/auth/session'));
      roundTrips = {
        analysis: want('analysis') ? { route: await recordQueries(() => drain(grower.get(`/api/trials/${ids.featuredTrialId}/analysis`))), bare: 5 } : notSelected,
        cohort: cohortQueries ? { route: await recordQueries(() => drain(lead.get(`/api/cohorts/${ids.bigCohortId}/results`))), bare: cohortQueries.stale ? 5 : 4 } : want('cohort') ? { skipped: 'no cohort results route' } : notSelected,
        write: want('writes')
          ? {
              route: await recordQueries(() =>
                drain(grower.post(`/api/trials/${ids.writeTrialId}/water-events`, { plotId: ids.writePlotIds[0], occurredAt: '2026-11-30T07:00:00Z', kind: 'olla_refill', volumeL: 6 })),
              ),
              bare: 1,
            }
          : notSelected,
      };
      log(`round trips per request: ${Object.entries(roundTrips).filter(([, t]) => !isSkipped(t)).map(([k, t]) => `${k} ${(t as { route: string[] }).route.length}`).join(', ') || 'none selected'}`);

      // Query plans at full size, for the diagnostics.
      if (want('analysis')) {
        for (const [name, sql, params] of [
          ['analysis.plots', analysisQueries.plots, [ids.featuredTrialId]],
          ['analysis.dailyWater', analysisQueries.dailyWater, [ids.featuredTrialId]],
          ['analysis.weather', analysisQueries.weather, [ids.featuredTrialId, today()]],
          ['analysis.moisture', analysisQueries.moisture, [ids.featuredTrialId]],
        ] as const) {
          plans.push(await explain(ds, name, sql, [...params]));
        }
      }
      if (cohortQueries) {
        plans.push(await explain(ds, 'cohort.trials', cohortQueries.trials, [ids.bigCohortId, leadUser.id, today()]));
        plans.push(await explain(ds, 'cohort.blocks', cohortQueries.blocks, [ids.bigCohortId]));
        plans.push(await explain(ds, 'cohort.water', cohortQueries.water, [ids.bigCohortId, today()]));
        plans.push(await explain(ds, 'cohort.progress', cohortQueries.progress, [ids.bigCohortId]));
      }
      if (plans.length) fs.writeFileSync(path.join(o.tmpDir, 'plans-full.txt'), plans.map((p) => `=== ${p.name}\n${p.text}\n`).join('\n'));

      // 4. The child app at full size: export, then writes, then imports.
      let fullExport: ExportFigure | Skipped = notSelected;
      if (want('export') || want('writes') || want('import')) {
        const childB = await startChildServer(childEnv);
        try {
          if (want('export')) fullExport = await measureExportIn('full', childB);
          const writer = new SessionClient(childB.url);
          await writer.signIn(benchEmails.grower, BENCH_PASSWORD);
          if (want('writes')) {
            log(`figure 4: POST water events with autocannon, 20 connections, ${bounded.durationS ? `${bounded.durationS} s` : `${bounded.amount} requests`}`);
            const w = await measureWrites({ client: writer, databaseUrl, trialId: ids.writeTrialId, plotIds: ids.writePlotIds, userId: growerUser.id, connections: 20, poolSize: 10, ...bounded });
            log(`writes: ${w.api.requestsPerSecond.mean} req/s, p99 ${w.api.latencyMs.p99} ms, ${w.api.errors} errors, ${w.api.non2xx} non-2xx; direct ${w.direct.rowsPerSecond} rows/s, ratio ${r3(w.ratio)}`);
            writes = w;
          }
          if (want('import')) {
            log(`figure 5: import ${plan.importRows.toLocaleString('en')} CSV rows ×${ids.importTrialIds.length}`);
            const imp = await measureImport({ child: childB, client: writer, trialIds: ids.importTrialIds, plotLabels: ids.importPlotLabels, rows: plan.importRows });
            log(`import: median ${imp.totalSeconds.median} s (parse ${imp.steps.parse}, normalise ${imp.steps.normalise}, serialise ${imp.steps.serialise}, request ${imp.steps.request})`);
            imported = imp;
          }
        } finally {
          await childB.stop();
        }
      }
      fullFigures = { analysis: fullReads.analysis, cohort: fullReads.cohort, cohortCache: fullReads.cohortCache, export: fullExport };

      const totalRows = loads.flatMap((l) => l.steps).reduce((s, x) => s + x.rows, 0);
      const totalSeconds = loads.reduce((s, l) => s + l.seconds, 0);
      scenario = { plan, half, full, load: { phases: loads, analyzeSeconds, totalRows, totalSeconds: r3(totalSeconds), rowsPerSecond: Math.round(totalRows / totalSeconds) } };
    }

    // 5. The client.
    let client: ClientFigure | Skipped;
    if (!want('client')) client = notSelected;
    else if (o.skipBrowser) client = { skipped: 'browser step skipped (--skip-browser)' };
    else if (!fs.existsSync(CHROMIUM)) client = { skipped: `Chromium not found at ${CHROMIUM} (apt-get install -y chromium)` };
    else {
      log('figure 6: vite build, then the sign-in page in headless Chromium');
      client = await measureClient({ tmpDir: o.tmpDir, dataSource: ds, databaseUrl, smtpUrl: rt.smtpUrl, s3Endpoint: rt.s3Endpoint, loads: 5, log });
      log(`client: ${client.jsCssGzipKb} KB JS+CSS gzipped (${client.jsCssTransferKb} KB sent), LCP median ${client.lcpMs.median} ms`);
    }

    const results: BenchResults = {
      generatedAt: new Date().toISOString(),
      command: benchCommand(o),
      durationSeconds: r3((performance.now() - started) / 1000),
      environment,
      scenario,
      figures: { half: halfFigures, full: fullFigures, writes, import: imported, client },
      roundTrips,
      diagnostics: plans.map((p) => ({ query: p.name, executionMs: p.executionMs, planningMs: p.planningMs, seqScans: p.seqScans })),
      table: [],
    };
    results.environment.loadAverageAtEnd = r3(os.loadavg()[0]!);
    results.table = tableRows(results);
    fs.writeFileSync(path.join(o.outDir, 'results.json'), JSON.stringify(results, null, 2) + '\n');
    fs.writeFileSync(path.join(o.outDir, 'RESULTS.md'), renderMarkdown(results));
    log(`wrote ${path.relative(REPO_ROOT, path.join(o.outDir, 'results.json'))} and RESULTS.md`);
    return results;
  } finally {
    for (const c of cleanups.reverse()) await c().catch(() => {});
    await loader?.end().catch(() => {});
    await runtime?.shutdown();
    if (cluster) {
      if (!o.keepDatabase) {
        const admin = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${cluster.port}/postgres` });
        await admin.connect();
        await admin.query('DROP DATABASE IF EXISTS seepwise_bench WITH (FORCE)').catch(() => {});
        await admin.end();
      }
      cluster.stop();
    }
  }
}
