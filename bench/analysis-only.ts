/**
 * `npm run bench -- --analysis-probe`: figure 1 alone, at full size, quickly and repeatably.
 *
 * Loads the whole scenario (both phases, so the featured trial sits among every other trial's rows,
 * as in the full run) unless `--reuse-db` finds it already loaded by an earlier `--keep-db` run;
 * then measures GET /api/trials/:id/analysis against its bare SQL exactly as the full run does
 * (compareRouteWithSql), records the statements one request sends and EXPLAIN (ANALYZE, BUFFERS)
 * of the aggregates. Writes bench/tmp/analysis-only.json (never results.json or RESULTS.md: those
 * are the full run's). `--iterations N` takes more pairs; `--label TEXT` names the run in the file,
 * so two runs of two checkouts against one kept database compare before and after.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { hashPassword } from '../server/auth/passwords';
import { parseEnv } from '../server/config/env';
import { recreateDatabase, startCluster, type RunningCluster } from '../server/infra/postgres-cluster';
import { createLogger } from '../server/lib/logger';
import { startRuntime, type Runtime } from '../server/runtime';
import { analysisQueries } from '../server/services/analysis.service';
import type { BenchOptions } from './bench';
import { bareAnalysis, compareRouteWithSql, explain } from './figures/route-vs-sql';
import { buildBenchApp, listenLoopback } from './lib/app';
import { recordQueries } from './lib/query-counter';
import { BENCH_PASSWORD, benchEmails, loadPhase, planScenario, scenarioIds } from './lib/scenario';
import { SessionClient } from './lib/session-client';
import { r3 } from './lib/stats';

export interface AnalysisOnlyOptions extends BenchOptions {
  reuseDatabase: boolean;
  iterations: number;
  label: string;
}

export async function runAnalysisOnly(o: AnalysisOnlyOptions) {
  const started = performance.now();
  const log = (m: string) => o.log(`[${((performance.now() - started) / 1000).toFixed(1).padStart(6)} s] ${m}`);
  fs.mkdirSync(o.tmpDir, { recursive: true });
  const plan = planScenario(o.scale);
  const today = () => new Date().toISOString().slice(0, 10);
  let cluster: RunningCluster | null = null;
  let runtime: Runtime | null = null;
  let loader: pg.Client | null = null;
  const cleanups: (() => Promise<void>)[] = [];
  try {
    let databaseUrl = o.databaseUrl;
    if (!databaseUrl) {
      cluster = await startCluster({ dataDir: o.pgDataDir, port: o.pgPort, database: 'postgres', log });
      databaseUrl = o.reuseDatabase ? `postgres://app@127.0.0.1:${cluster.port}/seepwise_bench` : recreateDatabase(cluster, 'seepwise_bench');
    }
    loader = new pg.Client({ connectionString: databaseUrl });
    const loaded = await loader.connect().then(
      async () =>
        Number(((await loader!.query(`SELECT count(*) AS n FROM information_schema.tables WHERE table_name = 'trials'`)).rows[0] as { n: string }).n) > 0 &&
        Number(((await loader!.query('SELECT count(*) AS n FROM trials')).rows[0] as { n: string }).n) > 0,
      async (err: unknown) => {
        if (!o.reuseDatabase || !cluster) throw err;
        // No database to reuse yet: make a fresh one.
        loader = new pg.Client({ connectionString: (databaseUrl = recreateDatabase(cluster, 'seepwise_bench')) });
        await loader.connect();
        return false;
      },
    );
    const env = parseEnv({ NODE_ENV: 'production', DATABASE_URL: databaseUrl, SEEPWISE_DATA_DIR: o.tmpDir, LOG_LEVEL: 'error' });
    runtime = await startRuntime(env, createLogger('error'));
    const ds = runtime.dataSource;
    let ids = scenarioIds(plan);
    if (o.reuseDatabase && loaded) {
      log('reusing the loaded scenario in seepwise_bench');
    } else {
      const passwordHash = await hashPassword(BENCH_PASSWORD);
      for (const phase of [0, 1]) {
        const r = await loadPhase(loader, plan, phase, passwordHash, log);
        if (phase === 0) ids = r.ids;
        await loader.query('ANALYZE');
        log(`phase ${phase} loaded in ${(r.ms / 1000).toFixed(1)} s`);
      }
    }
    const app = buildBenchApp({ dataSource: ds, databaseUrl: databaseUrl!, smtpUrl: runtime.smtpUrl, s3Endpoint: runtime.s3Endpoint });
    const server = await listenLoopback(app);
    cleanups.push(async () => {
      await server.close();
      await (app.locals.closeExtras as () => Promise<void>)();
    });
    const grower = new SessionClient(server.url);
    await grower.signIn(benchEmails.grower, BENCH_PASSWORD);
    const loadAverageAtStart = r3(os.loadavg()[0]!);
    const path_ = `/api/trials/${ids.featuredTrialId}/analysis`;
    log(`figure 1, GET ${path_} ×${o.iterations} against its bare SQL`);
    const analysis = await compareRouteWithSql({
      client: grower,
      path: path_,
      bare: bareAnalysis(ds, ids.featuredTrialId, today),
      iterations: o.iterations,
      warmup: 5,
      budgetMs: Math.max(30_000, o.iterations * 1_000),
      minIterations: Math.min(o.iterations, 20),
    });
    log(
      `analysis median ${analysis.routeMs.median} ms (p95 ${analysis.routeMs.p95}), bare SQL ${analysis.bareSqlMs.median} ms, ratio ${r3(analysis.ratio)}, ${analysis.responseBytes.toLocaleString('en')} bytes`,
    );
    const statements = await recordQueries(async () => {
      const res = await grower.get(path_);
      await res.arrayBuffer();
    });
    log(`${statements.length} SQL statements per request:\n  ${statements.join('\n  ')}`);
    const plans = [];
    for (const [name, sql, params] of [
      ['analysis.trial', analysisQueries.trial, [ids.featuredTrialId, today()]],
      ['analysis.plots', analysisQueries.plots, [ids.featuredTrialId]],
      ['analysis.dailyWater', analysisQueries.dailyWater, [ids.featuredTrialId]],
      ['analysis.weather', analysisQueries.weather, [ids.featuredTrialId, today()]],
      ['analysis.moisture', analysisQueries.moisture, [ids.featuredTrialId]],
    ] as const) {
      plans.push(await explain(ds, name, sql, [...params]));
    }
    log(
      `EXPLAIN ANALYZE: ${plans.map((p) => `${p.name} ${p.executionMs} ms${p.seqScans.length ? ` (seq scans: ${p.seqScans.map((s) => `${s.table} ${s.rows}`).join(', ')})` : ''}`).join('; ')}`,
    );
    const result = {
      label: o.label,
      generatedAt: new Date().toISOString(),
      loadAverage: { start: loadAverageAtStart, end: r3(os.loadavg()[0]!) },
      analysis,
      statements,
      plans: plans.map((p) => ({ query: p.name, executionMs: p.executionMs, planningMs: p.planningMs, seqScans: p.seqScans })),
    };
    const file = path.join(o.tmpDir, 'analysis-only.json');
    const previous = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as unknown[]) : [];
    fs.writeFileSync(file, JSON.stringify([...(Array.isArray(previous) ? previous : []), result], null, 2) + '\n');
    fs.writeFileSync(path.join(o.tmpDir, 'analysis-plans.txt'), plans.map((p) => `=== ${p.name}\n${p.text}\n`).join('\n'));
    log(`appended to ${path.relative(process.cwd(), file)}; plans in analysis-plans.txt`);
    return result;
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
