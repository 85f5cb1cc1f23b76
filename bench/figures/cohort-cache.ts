/**
 * Figure 2, continued: what the per-trial log rollups (server/services/log-rollups.ts) buy and
 * cost, measured in the same run as figure 2 so the ratios hold on a drifting machine.
 *
 * - before/after: the route (reading the rollups) alternated with the bare SQL of the raw-row
 *   recomputation (`cohortResultsRawQueries`, what the route ran before the rollups);
 * - cold: one request after every trial's rollups were dropped (all recomputed in that request);
 * - one trial changed: one request after one water event of one cohort trial was touched (its
 *   trigger moves the trial's data_version; that trial alone is recomputed).
 */
import type { DataSource } from 'typeorm';
import type { SessionClient } from '../lib/session-client';
import { r3, roundSummary, summarise, type Summary } from '../lib/stats';
import { bareCohortResults, type CohortQueries } from './route-vs-sql';

export interface CohortCacheFigure {
  /** Route (rollups, warm) and raw-row SQL, alternated. */
  routeMs: Summary;
  rawSqlMs: Summary;
  /** median(raw-row SQL) ÷ median(route): how many times faster the page is than its old SQL alone. */
  speedup: number;
  /** One request with every trial's rollups missing. */
  coldMs: Summary;
  /** One request after one trial's logs changed. */
  oneChangedMs: Summary;
}

export async function loadCohortResultsRawQueries(): Promise<CohortQueries | null> {
  const modulePath = '../../server/services/cohort-results.service';
  try {
    const mod = (await import(/* @vite-ignore */ modulePath)) as { cohortResultsRawQueries?: CohortQueries };
    return mod.cohortResultsRawQueries ?? null;
  } catch {
    return null;
  }
}

export async function measureCohortCache(o: {
  ds: DataSource;
  client: SessionClient;
  raw: CohortQueries;
  cohortId: string;
  userId: string;
  today: () => string;
  /** Pairs of route + raw SQL. */
  pairs: number;
  coldReps: number;
  changedReps: number;
}): Promise<CohortCacheFigure> {
  const path = `/api/cohorts/${o.cohortId}/results`;
  const route = async () => {
    const res = await o.client.get(path);
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`GET ${path}: ${res.status}`);
  };
  const time = async (fn: () => Promise<unknown>, into: number[]) => {
    const t0 = performance.now();
    await fn();
    into.push(performance.now() - t0);
  };
  const rawSql = bareCohortResults(o.ds, o.raw, o.cohortId, o.userId, o.today);
  await route();
  const routeMs: number[] = [];
  const rawMs: number[] = [];
  for (let i = 0; i < o.pairs; i++) {
    if (i % 2 === 0) {
      await time(route, routeMs);
      await time(rawSql, rawMs);
    } else {
      await time(rawSql, rawMs);
      await time(route, routeMs);
    }
  }
  const coldMs: number[] = [];
  for (let i = 0; i < o.coldReps; i++) {
    await o.ds.query(`DELETE FROM trial_log_summaries WHERE trial_id IN (SELECT trial_id FROM trial_shares WHERE cohort_id = $1)`, [o.cohortId]);
    await time(route, coldMs);
  }
  const changedMs: number[] = [];
  for (let i = 0; i < o.changedReps; i++) {
    // A no-op update still fires the statement trigger: the trial's data_version moves, its rollups go stale.
    await o.ds.query(
      `UPDATE water_events SET volume_l = volume_l
        WHERE id = (SELECT e.id FROM water_events e JOIN trial_shares s ON s.trial_id = e.trial_id
                     WHERE s.cohort_id = $1 AND s.withdrawn_at IS NULL ORDER BY e.trial_id, e.id OFFSET $2 LIMIT 1)`,
      [o.cohortId, i * 997],
    );
    await time(route, changedMs);
  }
  const r = summarise(routeMs);
  const b = summarise(rawMs);
  return {
    routeMs: roundSummary(r),
    rawSqlMs: roundSummary(b),
    speedup: r3(b.median / r.median),
    coldMs: roundSummary(summarise(coldMs)),
    oneChangedMs: roundSummary(summarise(changedMs)),
  };
}
