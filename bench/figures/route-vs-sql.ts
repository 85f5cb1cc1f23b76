/**
 * Figures 1 and 2: a read route measured over HTTP (signed in, loopback) against the bare SQL
 * aggregates it runs, with the same parameters on the same pool, interleaved so drift on a noisy
 * machine hits both sides alike.
 */
import type { DataSource } from 'typeorm';
import { analysisQueries } from '../../server/services/analysis.service';
import type { SessionClient } from '../lib/session-client';
import { roundSummary, summarise, type Summary } from '../lib/stats';

export interface RouteFigure {
  path: string;
  /** Measured pairs (route + bare SQL); fewer than asked when the time budget ran out. */
  iterations: number;
  warmup: number;
  routeMs: Summary;
  bareSqlMs: Summary;
  /** median(route) / median(bare SQL). */
  ratio: number;
  responseBytes: number;
}

export async function compareRouteWithSql(o: {
  client: SessionClient;
  path: string;
  bare: () => Promise<unknown>;
  iterations: number;
  warmup: number;
  /** Stop early (after at least minIterations) once this much time has gone: a slow route cannot stall the run. */
  budgetMs: number;
  minIterations: number;
}): Promise<RouteFigure> {
  let responseBytes = 0;
  const route = async () => {
    const res = await o.client.get(o.path);
    const body = await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`GET ${o.path}: ${res.status} ${Buffer.from(body).toString('utf8').slice(0, 300)}`);
    responseBytes = body.byteLength;
  };
  for (let i = 0; i < o.warmup; i++) {
    await route();
    await o.bare();
  }
  const routeMs: number[] = [];
  const bareMs: number[] = [];
  const time = async (fn: () => Promise<unknown>, into: number[]) => {
    const t0 = performance.now();
    await fn();
    into.push(performance.now() - t0);
  };
  const started = performance.now();
  for (let i = 0; i < o.iterations; i++) {
    if (i >= o.minIterations && performance.now() - started > o.budgetMs) break;
    // Alternate which side goes first, so neither always runs on a warmer cache.
    if (i % 2 === 0) {
      await time(route, routeMs);
      await time(o.bare, bareMs);
    } else {
      await time(o.bare, bareMs);
      await time(route, routeMs);
    }
  }
  const r = summarise(routeMs);
  const b = summarise(bareMs);
  return { path: o.path, iterations: routeMs.length, warmup: o.warmup, routeMs: roundSummary(r), bareSqlMs: roundSummary(b), ratio: r.median / b.median, responseBytes };
}

/** The analysis route's SQL exactly as analysis.service.ts runs it: the trial row and four aggregates at once. */
export function bareAnalysis(ds: DataSource, trialId: string, today: () => string) {
  return async () => {
    const [trial] = (await Promise.all([
      ds.query(analysisQueries.trial, [trialId, today()]),
      ds.query(analysisQueries.plots, [trialId]),
      ds.query(analysisQueries.dailyWater, [trialId]),
      ds.query(analysisQueries.weather, [trialId, today()]),
      ds.query(analysisQueries.moisture, [trialId]),
    ])) as unknown[][];
    if (!trial?.length) throw new Error('analysis trial not found');
  };
}

/** The four aggregates, and (with the log rollups) the staleness check the route runs before them. */
export type CohortQueries = { stale?: string; trials: string; blocks: string; water: string; progress: string };

/**
 * The cohort results service, if this checkout has it (another engineer is building it). Loaded by
 * a computed path so the benchmark still compiles and runs without it.
 */
export async function loadCohortResultsQueries(): Promise<CohortQueries | null> {
  const modulePath = '../../server/services/cohort-results.service';
  try {
    const mod = (await import(/* @vite-ignore */ modulePath)) as { cohortResultsQueries?: CohortQueries };
    return mod.cohortResultsQueries ?? null;
  } catch {
    return null;
  }
}

/** The cohort results route's SQL as cohort-results.service.ts runs it: the staleness check if any, then four aggregates at once. */
export function bareCohortResults(ds: DataSource, q: CohortQueries, cohortId: string, userId: string, today: () => string) {
  return async () => {
    const t = today();
    if (q.stale) await ds.query(q.stale, [cohortId]);
    await Promise.all([
      ds.query(q.trials, [cohortId, userId, t]),
      ds.query(q.blocks, [cohortId]),
      ds.query(q.water, [cohortId, t]),
      ds.query(q.progress, [cohortId]),
    ]);
  };
}

/** EXPLAIN (ANALYZE, BUFFERS) of one query: its timings and the plan text (for the diagnostics file). */
export async function explain(ds: DataSource, name: string, sql: string, params: unknown[]) {
  const rows = (await ds.query(`EXPLAIN (ANALYZE, BUFFERS, FORMAT TEXT) ${sql}`, params)) as { 'QUERY PLAN': string }[];
  const text = rows.map((r) => r['QUERY PLAN']).join('\n');
  const ms = (label: string) => Number(new RegExp(`${label} Time: ([\\d.]+) ms`).exec(text)?.[1] ?? NaN);
  const seqScans = [...text.matchAll(/Seq Scan on (\w+)[^\n]*actual time=[\d.]+\.\.[\d.]+ rows=(\d+)/g)].map((m) => ({ table: m[1]!, rows: Number(m[2]) }));
  return { name, planningMs: ms('Planning'), executionMs: ms('Execution'), seqScans, text };
}
