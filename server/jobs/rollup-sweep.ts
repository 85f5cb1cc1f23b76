import type { DataSource } from 'typeorm';
import { refreshTrialRollups } from '../services/log-rollups';

/**
 * Background refresh of the cohort log rollups (server/services/log-rollups.ts).
 *
 * The cohort results route refreshes the rollups of its stale trials before reading them, so the
 * page is always right; but a cohort whose trials all changed (after an import, a migration or a
 * busy weekend of logging) paid for every recomputation on its first request (bench figure 2d:
 * 1.3–2.3 s for 500 trials). This sweep, run every minute by the job runner and once at start,
 * recomputes the stale rollups of every trial shared into a cohort, in small transactions, so
 * the page usually finds nothing to do. Trials shared nowhere are left alone: nothing reads theirs.
 */

/** $1 = how many. Stale trials shared (not withdrawn) into at least one cohort, oldest summary first. */
const staleSharedTrials = `
  SELECT t.id
    FROM trials t LEFT JOIN trial_log_summaries s ON s.trial_id = t.id
   WHERE (s.trial_id IS NULL OR s.data_version <> t.data_version)
     AND EXISTS (SELECT 1 FROM trial_shares sh WHERE sh.trial_id = t.id AND sh.withdrawn_at IS NULL)
   ORDER BY s.computed_at NULLS FIRST, t.id
   LIMIT $1`;

export interface RollupSweepOptions {
  /** Trials recomputed per transaction (default 50): short transactions, short advisory locks. */
  batchSize?: number;
  /** Stop after this many trials in one run (default 5,000); the next run takes the rest. */
  maxTrials?: number;
}

/** Refreshes stale rollups of shared trials; returns how many trials were recomputed. */
export async function runRollupSweep(ds: DataSource, opts: RollupSweepOptions = {}): Promise<number> {
  const batchSize = opts.batchSize ?? 50;
  const maxTrials = opts.maxTrials ?? 5_000;
  let done = 0;
  while (done < maxTrials) {
    const ids = ((await ds.query(staleSharedTrials, [Math.min(batchSize, maxTrials - done)])) as { id: string }[]).map((r) => r.id);
    if (ids.length === 0) break;
    const refreshed = await refreshTrialRollups(ds, ids);
    done += refreshed;
    // Nothing refreshed although the query found stale trials: another process got there in
    // between, or a trial keeps changing under us; leave it to the next run instead of spinning.
    if (refreshed === 0) break;
  }
  return done;
}
