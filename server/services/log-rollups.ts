import type { DataSource, EntityManager } from 'typeorm';

/**
 * Per-trial rollups of the raw logs (server/entities/log-rollups.entity.ts), recomputed per trial
 * from the raw rows when the trial's `data_version` has moved since they were computed.
 *
 * Correctness does not depend on any service remembering to update them: database triggers bump
 * `trials.data_version` in the same transaction as every write to a trial's water events, moisture
 * readings, harvests or plot treatments (migration CohortLogRollups), whichever code path writes.
 *
 * Races: the version is read *before* the rollups are recomputed (each statement of a READ
 * COMMITTED transaction sees every commit before it starts), so the rollups always contain at least
 * every write up to the stored version; a write that commits in between leaves the stored version
 * behind the trial's and the trial is recomputed on the next read. Two refreshers of the same trial
 * are serialised by a transaction-level advisory lock per trial, taken in one sorted order.
 */

/** Advisory-lock namespace of the rollup refresh (first key of pg_advisory_xact_lock(int, int)). */
const LOCK_SPACE = 7_310_521;

/** $1 = trial ids. The trials among them whose rollups are missing or older than their data_version. */
const staleAmong = `
  SELECT t.id, t.data_version::text AS version
    FROM trials t LEFT JOIN trial_log_summaries s ON s.trial_id = t.id
   WHERE t.id = ANY($1::uuid[]) AND (s.trial_id IS NULL OR s.data_version <> t.data_version)`;

/**
 * The week of an event: its date in the garden's time zone minus the days since Monday, counted from
 * a known Monday (1970-01-05); the same expression gives the weekday bit. A garden's zone change
 * bumps its trials' data_version (migration GardenTimeZone), so the weeks follow it.
 */
const refreshSql = {
  clearWeeks: `DELETE FROM trial_week_water WHERE trial_id = ANY($1::uuid[])`,
  clearPlots: `DELETE FROM plot_log_totals WHERE trial_id = ANY($1::uuid[])`,
  weeks: `
    INSERT INTO trial_week_water (trial_id, kind, treatment, week_start, litres, events, day_mask)
    SELECT trial_id, kind, treatment, day - dow, sum(volume_l), count(*), bit_or(1 << dow)
      FROM (SELECT e.trial_id, e.kind, COALESCE(p.treatment, '') AS treatment, e.volume_l, d.day, (d.day - DATE '1970-01-05') % 7 AS dow
              FROM water_events e
              JOIN plots p ON p.id = e.plot_id
              JOIN trials t ON t.id = e.trial_id JOIN gardens g ON g.id = t.garden_id
              CROSS JOIN LATERAL (SELECT (e.occurred_at AT TIME ZONE g.time_zone)::date AS day) d
             WHERE e.trial_id = ANY($1::uuid[])) ev
     GROUP BY trial_id, kind, treatment, day - dow`,
  plots: `
    INSERT INTO plot_log_totals (plot_id, trial_id, water_l, harvest_kg, harvest_records)
    SELECT p.id, p.trial_id, COALESCE(w.litres, 0), COALESCE(h.kg, 0), COALESCE(h.n, 0)
      FROM plots p
      LEFT JOIN (SELECT plot_id, sum(volume_l) AS litres FROM water_events WHERE trial_id = ANY($1::uuid[]) GROUP BY plot_id) w ON w.plot_id = p.id
      LEFT JOIN (SELECT plot_id, sum(fresh_kg) AS kg, count(*)::int AS n FROM harvests WHERE trial_id = ANY($1::uuid[]) GROUP BY plot_id) h ON h.plot_id = p.id
     WHERE p.trial_id = ANY($1::uuid[]) AND (w.plot_id IS NOT NULL OR h.plot_id IS NOT NULL)`,
  /** $1 = trial ids, $2 = their versions as read before the recomputation. */
  summaries: `
    INSERT INTO trial_log_summaries AS s (trial_id, data_version, harvest_records, moisture_methods, computed_at)
    SELECT v.id, v.version,
           (SELECT count(*)::int FROM harvests h WHERE h.trial_id = v.id),
           COALESCE((SELECT array_agg(method ORDER BY method)
                       FROM (SELECT DISTINCT r.method::text AS method FROM moisture_readings r WHERE r.trial_id = v.id) m), '{}'),
           now()
      FROM unnest($1::uuid[], $2::bigint[]) AS v(id, version)
      JOIN trials t ON t.id = v.id
    ON CONFLICT (trial_id) DO UPDATE
       SET data_version = excluded.data_version, harvest_records = excluded.harvest_records,
           moisture_methods = excluded.moisture_methods, computed_at = excluded.computed_at`,
};

/**
 * Recomputes the rollups of those of `trialIds` that are stale; returns how many were. Cheap when
 * none is (one indexed query). A trial or plot deleted while this runs makes an insert fail its
 * foreign key; the refresh is then retried (the deleted rows are no longer candidates).
 */
export async function refreshTrialRollups(ds: DataSource, trialIds: string[]): Promise<number> {
  if (trialIds.length === 0) return 0;
  const stale = (await ds.query(staleAmong, [trialIds])) as { id: string }[];
  if (stale.length === 0) return 0;
  for (let attempt = 1; ; attempt++) {
    try {
      return await ds.transaction((em) => recompute(em, stale.map((s) => s.id)));
    } catch (err) {
      if (attempt >= 3 || (err as { code?: string }).code !== '23503') throw err;
    }
  }
}

async function recompute(em: EntityManager, candidates: string[]): Promise<number> {
  await em.query(
    `SELECT pg_advisory_xact_lock(${LOCK_SPACE}, k) FROM (SELECT DISTINCT hashtext(id::text) AS k FROM unnest($1::uuid[]) AS id ORDER BY 1) keys`,
    [candidates],
  );
  // Under the locks, with a fresh snapshot: another request may have refreshed some meanwhile.
  const stale = (await em.query(staleAmong, [candidates])) as { id: string; version: string }[];
  if (stale.length === 0) return 0;
  const ids = stale.map((s) => s.id);
  await em.query(refreshSql.clearWeeks, [ids]);
  await em.query(refreshSql.clearPlots, [ids]);
  await em.query(refreshSql.weeks, [ids]);
  await em.query(refreshSql.plots, [ids]);
  await em.query(refreshSql.summaries, [ids, stale.map((s) => s.version)]);
  return stale.length;
}
