import {
  analyseCohort,
  type BlockAggregate,
  type CohortTrialAggregate,
  type ProgressAggregate,
  type TrialWaterWeeks,
} from '@shared/analysis/cohort-effects';
import type { CohortResults, CohortResultsQuery, CreateExclusionInput, Exclusion } from '@shared/schemas/cohort-results';
import type { DataSource } from 'typeorm';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { refreshTrialRollups } from './log-rollups';

/**
 * A cohort's pooled results. SQL sums every log per trial, block and week (one query per
 * concern, every trial at once, no log rows in JavaScript); shared/analysis/cohort-effects.ts
 * turns the aggregates into effects, flags and pooled estimates.
 *
 * The log sums come from per-trial rollups (server/services/log-rollups.ts): each request first
 * recomputes, from the raw rows, the rollups of the shared trials whose logs changed since
 * (`trials.data_version`, bumped by triggers on every log write), then reads the rollups; a page
 * of 500 trials no longer re-aggregates ~265,000 water events per request. Everything else (shares,
 * pseudonyms, exclusions, trial dates, plots, pots, gardens) is read live.
 *
 * The trials are those shared into the cohort and not withdrawn, whose owner is still a member
 * (the pseudonym comes from that membership; a trial whose owner left has no pseudonym and is
 * left out). Real names, e-mails, garden names and trial titles are never selected.
 */

/** $1 = cohort id. */
const sharedTrials = `
  shared AS (
    SELECT t.id, t.owner_id, t.garden_id, t.crop, t.status, t.planting_date, t.end_date, m.pseudonym
      FROM trial_shares s
      JOIN trials t ON t.id = s.trial_id
      JOIN cohort_memberships m ON m.cohort_id = s.cohort_id AND m.user_id = t.owner_id
     WHERE s.cohort_id = $1 AND s.withdrawn_at IS NULL
  )`;

/**
 * Each shared trial's season so far: planting to its end or today, whichever is first, where today
 * is the request's instant (`param`, a timestamptz) as a day in the trial's garden's time zone.
 */
const spansAt = (param: string) => `
    SELECT sh.id, sh.planting_date, LEAST(COALESCE(sh.end_date, d.today), d.today) AS as_of, g.time_zone
      FROM shared sh JOIN gardens g ON g.id = sh.garden_id
      CROSS JOIN LATERAL (SELECT (${param}::timestamptz AT TIME ZONE g.time_zone)::date AS today) d`;

/**
 * The end of both water queries: from `wk` (trial_id, week, mask = weekdays with water inside the
 * season, olla / surface = mean litres per event of that kind, NULL without one), one row per trial
 * with each kind's weeks and means as arrays in week order, and the days with water (bit_count of
 * each week's mask as bit(7), the low 7 bits, summed).
 */
const waterArrays = `
    SELECT trial_id AS "trialId", sum(bit_count(mask::bit(7)))::int AS "daysWithWater",
           COALESCE(array_agg(to_char(week, 'YYYY-MM-DD') ORDER BY week) FILTER (WHERE olla IS NOT NULL), '{}') AS "ollaWeekStarts",
           COALESCE(array_agg(olla::float8 ORDER BY week) FILTER (WHERE olla IS NOT NULL), '{}') AS "ollaLitresPerEvent",
           COALESCE(array_agg(to_char(week, 'YYYY-MM-DD') ORDER BY week) FILTER (WHERE surface IS NOT NULL), '{}') AS "surfaceWeekStarts",
           COALESCE(array_agg(surface::float8 ORDER BY week) FILTER (WHERE surface IS NOT NULL), '{}') AS "surfaceLitresPerEvent"
      FROM wk
     GROUP BY trial_id`;

/**
 * The same four aggregates computed from the raw log rows on every call: the definition the rollups
 * must reproduce. Not used by the route (it reads the rollups through `cohortResultsQueries`); kept
 * for the API test that compares both after a sequence of writes and for the benchmark's before/after.
 */
export const cohortResultsRawQueries = {
  /** One row per shared trial: description, season length, harvest and moisture counts, pot and plot features, exclusion. $2 = caller, $3 = the request's instant (each trial's today is its garden's). */
  trials: `
    WITH ${sharedTrials},
    spans AS (${spansAt('$3')}),
    harvest_counts AS (SELECT h.trial_id, count(*)::int AS n FROM harvests h JOIN shared sh ON sh.id = h.trial_id GROUP BY h.trial_id),
    moisture AS (
      SELECT trial_id, array_agg(method ORDER BY method) AS methods
        FROM (SELECT r.trial_id, r.method::text AS method FROM moisture_readings r JOIN shared sh ON sh.id = r.trial_id GROUP BY 1, 2) m
       GROUP BY trial_id),
    plot_features AS (
      SELECT p.trial_id, array_agg(DISTINCT p.setting::text) AS settings, array_agg(DISTINCT p.mulch) AS mulch,
             array_agg(DISTINCT p.lid) FILTER (WHERE p.treatment = 'olla') AS lids
        FROM plots p JOIN shared sh ON sh.id = p.trial_id
       WHERE p.treatment IN ('olla', 'surface')
       GROUP BY p.trial_id),
    pot_features AS (
      SELECT p.trial_id, count(*)::int AS pot_count, avg(po.capacity_l)::float8 AS mean_capacity,
             array_agg(DISTINCT po.capacity_l) AS capacities, array_agg(DISTINCT po.shape::text) AS shapes,
             array_agg(DISTINCT po.clay_body::text) AS clay_bodies, array_agg(DISTINCT po.make::text) AS makes
        FROM pots po JOIN plots p ON p.id = po.plot_id JOIN shared sh ON sh.id = p.trial_id
       WHERE p.treatment = 'olla'
       GROUP BY p.trial_id)
    SELECT sh.id AS "trialId", sh.pseudonym, sh.owner_id = $2 AS mine, sh.crop, sh.status,
           sh.planting_date AS "plantingDate", sh.end_date AS "endDate",
           round(g.latitude_deg)::int AS "latitudeDeg", round(g.longitude_deg)::int AS "longitudeDeg", g.soil_texture AS "soilTexture",
           GREATEST(sp.as_of - sp.planting_date + 1, 0)::int AS "expectedDays",
           COALESCE(hc.n, 0) AS "harvestRecords",
           COALESCE(mo.methods, '{}') AS "moistureMethods",
           COALESCE(pf.settings, '{}') AS settings, COALESCE(pf.mulch, '{}') AS mulch, COALESCE(pf.lids, '{}') AS lids,
           COALESCE(pt.pot_count, 0) AS "potCount", pt.mean_capacity AS "meanPotCapacityL", COALESCE(pt.capacities, '{}') AS "potCapacitiesL",
           COALESCE(pt.shapes, '{}') AS "potShapes", COALESCE(pt.clay_bodies, '{}') AS "clayBodies", COALESCE(pt.makes, '{}') AS "potMakes",
           x.reason AS "exclusionReason", x.created_at AS "exclusionCreatedAt", COALESCE(x.excluded_by = $2, false) AS "excludedByMe"
      FROM shared sh
      JOIN spans sp ON sp.id = sh.id
      JOIN gardens g ON g.id = sh.garden_id
      LEFT JOIN harvest_counts hc ON hc.trial_id = sh.id
      LEFT JOIN moisture mo ON mo.trial_id = sh.id
      LEFT JOIN plot_features pf ON pf.trial_id = sh.id
      LEFT JOIN pot_features pt ON pt.trial_id = sh.id
      LEFT JOIN trial_exclusions x ON x.cohort_id = $1 AND x.trial_id = sh.id
     ORDER BY sh.pseudonym, sh.planting_date, sh.id`,

  /** One row per block of every shared trial: water, area, plants and harvest summed per treatment. */
  blocks: `
    WITH ${sharedTrials},
    water AS (SELECT e.plot_id, sum(e.volume_l) AS litres FROM water_events e JOIN shared sh ON sh.id = e.trial_id GROUP BY e.plot_id),
    harvest AS (SELECT h.plot_id, sum(h.fresh_kg) AS kg FROM harvests h JOIN shared sh ON sh.id = h.trial_id GROUP BY h.plot_id),
    plot AS (
      SELECT p.trial_id, p.block_key, p.treatment, p.area_m2, p.plant_count,
             COALESCE(w.litres, 0) AS litres, COALESCE(h.kg, 0) AS kg, h.plot_id IS NULL AS no_harvest
        FROM plots p JOIN shared sh ON sh.id = p.trial_id
        LEFT JOIN water w ON w.plot_id = p.id
        LEFT JOIN harvest h ON h.plot_id = p.id
       WHERE p.treatment IN ('olla', 'surface'))
    SELECT trial_id AS "trialId", block_key AS "blockKey",
           count(*) FILTER (WHERE treatment = 'olla')::int AS "ollaPlots",
           COALESCE(sum(area_m2) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaAreaM2",
           COALESCE(sum(plant_count) FILTER (WHERE treatment = 'olla'), 0)::int AS "ollaPlants",
           COALESCE(sum(litres) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaL",
           COALESCE(sum(kg) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaHarvestKg",
           count(*) FILTER (WHERE treatment = 'olla' AND no_harvest)::int AS "ollaPlotsWithoutHarvest",
           count(*) FILTER (WHERE treatment = 'surface')::int AS "surfacePlots",
           COALESCE(sum(area_m2) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceAreaM2",
           COALESCE(sum(plant_count) FILTER (WHERE treatment = 'surface'), 0)::int AS "surfacePlants",
           COALESCE(sum(litres) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceL",
           COALESCE(sum(kg) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceHarvestKg",
           count(*) FILTER (WHERE treatment = 'surface' AND no_harvest)::int AS "surfacePlotsWithoutHarvest"
      FROM plot
     GROUP BY trial_id, block_key
     ORDER BY trial_id, block_key`,

  /**
   * One row per trial with water events: per kind, its ISO weeks (Mondays) in order and each week's
   * mean litres per event (the wrong-unit check), and the days inside the season, planting to end
   * or the garden's today, with any water (completeness). $2 = the request's instant; days and weeks are the garden's.
   */
  water: `
    WITH ${sharedTrials},
    spans AS (${spansAt('$2')}),
    -- Day of the week by date arithmetic from a known Monday (1970-01-05): no time-zone work per row.
    ev AS (
      SELECT trial_id, kind, volume_l, day, (day - DATE '1970-01-05') % 7 AS dow, day BETWEEN planting_date AND as_of AS in_season
        FROM (SELECT e.trial_id, e.kind, e.volume_l, (e.occurred_at AT TIME ZONE sp.time_zone)::date AS day, sp.planting_date, sp.as_of
                FROM water_events e JOIN spans sp ON sp.id = e.trial_id) d),
    wk AS (
      SELECT trial_id, day - dow AS week, COALESCE(bit_or(1 << dow) FILTER (WHERE in_season), 0) AS mask,
             sum(volume_l) FILTER (WHERE kind = 'olla_refill') / count(*) FILTER (WHERE kind = 'olla_refill') AS olla,
             sum(volume_l) FILTER (WHERE kind = 'surface') / count(*) FILTER (WHERE kind = 'surface') AS surface
        FROM ev GROUP BY 1, 2)
    ${waterArrays}`,

  /**
   * Cohort litres per plot treatment and ISO week with the running total, over every shared trial
   * the lead has not excluded (flagged trials included: progress describes what was logged).
   */
  progress: `
    WITH ${sharedTrials},
    counted AS (SELECT sh.id, g.time_zone FROM shared sh JOIN gardens g ON g.id = sh.garden_id LEFT JOIN trial_exclusions x ON x.cohort_id = $1 AND x.trial_id = sh.id WHERE x.id IS NULL),
    per_trial AS (
      SELECT trial_id, day - (day - DATE '1970-01-05') % 7 AS week, treatment, sum(volume_l) AS litres
        FROM (SELECT e.trial_id, (e.occurred_at AT TIME ZONE c.time_zone)::date AS day, p.treatment, e.volume_l
                FROM water_events e JOIN counted c ON c.id = e.trial_id JOIN plots p ON p.id = e.plot_id
               WHERE p.treatment IN ('olla', 'surface')) d
       GROUP BY 1, 2, 3),
    weekly AS (SELECT week, treatment, sum(litres) AS litres, count(*)::int AS trials FROM per_trial GROUP BY 1, 2)
    SELECT week AS "weekStart", to_char(week, 'IYYY-"W"IW') AS "isoWeek", treatment,
           litres::float8 AS litres, (sum(litres) OVER (PARTITION BY treatment ORDER BY week))::float8 AS "cumulativeLitres", trials
      FROM weekly
     ORDER BY week, treatment`,
};

/**
 * $1 = cohort id. The shared trials whose log rollups exist (refreshed just before by
 * `refreshTrialRollups`; a trial shared after that refresh waits for the next request).
 */
const summarisedTrials = `
  shared AS (
    SELECT t.id, t.owner_id, t.garden_id, t.crop, t.status, t.planting_date, t.end_date, m.pseudonym,
           ls.harvest_records, ls.moisture_methods
      FROM trial_shares s
      JOIN trials t ON t.id = s.trial_id
      JOIN cohort_memberships m ON m.cohort_id = s.cohort_id AND m.user_id = t.owner_id
      JOIN trial_log_summaries ls ON ls.trial_id = t.id
     WHERE s.cohort_id = $1 AND s.withdrawn_at IS NULL
  )`;

/**
 * What the route runs: the aggregates of `cohortResultsRawQueries`, read from the per-trial log
 * rollups (server/services/log-rollups.ts) instead of the raw logs. Same parameters, same rows.
 */
export const cohortResultsQueries = {
  /** Run first: the shared trials whose rollups are missing or older than their logs (recomputed before the four reads). */
  stale: `
    WITH ${sharedTrials}
    SELECT sh.id FROM shared sh JOIN trials t ON t.id = sh.id LEFT JOIN trial_log_summaries ls ON ls.trial_id = sh.id
     WHERE ls.trial_id IS NULL OR ls.data_version <> t.data_version`,

  /** As `cohortResultsRawQueries.trials`; harvest counts and moisture methods from the trial summaries. $2 = caller, $3 = the request's instant. */
  trials: `
    WITH ${summarisedTrials},
    spans AS (${spansAt('$3')}),
    plot_features AS (
      SELECT p.trial_id, array_agg(DISTINCT p.setting::text) AS settings, array_agg(DISTINCT p.mulch) AS mulch,
             array_agg(DISTINCT p.lid) FILTER (WHERE p.treatment = 'olla') AS lids
        FROM plots p JOIN shared sh ON sh.id = p.trial_id
       WHERE p.treatment IN ('olla', 'surface')
       GROUP BY p.trial_id),
    pot_features AS (
      SELECT p.trial_id, count(*)::int AS pot_count, avg(po.capacity_l)::float8 AS mean_capacity,
             array_agg(DISTINCT po.capacity_l) AS capacities, array_agg(DISTINCT po.shape::text) AS shapes,
             array_agg(DISTINCT po.clay_body::text) AS clay_bodies, array_agg(DISTINCT po.make::text) AS makes
        FROM pots po JOIN plots p ON p.id = po.plot_id JOIN shared sh ON sh.id = p.trial_id
       WHERE p.treatment = 'olla'
       GROUP BY p.trial_id)
    SELECT sh.id AS "trialId", sh.pseudonym, sh.owner_id = $2 AS mine, sh.crop, sh.status,
           sh.planting_date AS "plantingDate", sh.end_date AS "endDate",
           round(g.latitude_deg)::int AS "latitudeDeg", round(g.longitude_deg)::int AS "longitudeDeg", g.soil_texture AS "soilTexture",
           GREATEST(sp.as_of - sp.planting_date + 1, 0)::int AS "expectedDays",
           sh.harvest_records AS "harvestRecords",
           sh.moisture_methods AS "moistureMethods",
           COALESCE(pf.settings, '{}') AS settings, COALESCE(pf.mulch, '{}') AS mulch, COALESCE(pf.lids, '{}') AS lids,
           COALESCE(pt.pot_count, 0) AS "potCount", pt.mean_capacity AS "meanPotCapacityL", COALESCE(pt.capacities, '{}') AS "potCapacitiesL",
           COALESCE(pt.shapes, '{}') AS "potShapes", COALESCE(pt.clay_bodies, '{}') AS "clayBodies", COALESCE(pt.makes, '{}') AS "potMakes",
           x.reason AS "exclusionReason", x.created_at AS "exclusionCreatedAt", COALESCE(x.excluded_by = $2, false) AS "excludedByMe"
      FROM shared sh
      JOIN spans sp ON sp.id = sh.id
      JOIN gardens g ON g.id = sh.garden_id
      LEFT JOIN plot_features pf ON pf.trial_id = sh.id
      LEFT JOIN pot_features pt ON pt.trial_id = sh.id
      LEFT JOIN trial_exclusions x ON x.cohort_id = $1 AND x.trial_id = sh.id
     ORDER BY sh.pseudonym, sh.planting_date, sh.id`,

  /** As `cohortResultsRawQueries.blocks`; water and harvest per plot from `plot_log_totals`. */
  blocks: `
    WITH ${summarisedTrials},
    plot AS (
      SELECT p.trial_id, p.block_key, p.treatment, p.area_m2, p.plant_count,
             COALESCE(lt.water_l, 0) AS litres, COALESCE(lt.harvest_kg, 0) AS kg, COALESCE(lt.harvest_records, 0) = 0 AS no_harvest
        FROM plots p JOIN shared sh ON sh.id = p.trial_id
        LEFT JOIN plot_log_totals lt ON lt.plot_id = p.id
       WHERE p.treatment IN ('olla', 'surface'))
    SELECT trial_id AS "trialId", block_key AS "blockKey",
           count(*) FILTER (WHERE treatment = 'olla')::int AS "ollaPlots",
           COALESCE(sum(area_m2) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaAreaM2",
           COALESCE(sum(plant_count) FILTER (WHERE treatment = 'olla'), 0)::int AS "ollaPlants",
           COALESCE(sum(litres) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaL",
           COALESCE(sum(kg) FILTER (WHERE treatment = 'olla'), 0)::float8 AS "ollaHarvestKg",
           count(*) FILTER (WHERE treatment = 'olla' AND no_harvest)::int AS "ollaPlotsWithoutHarvest",
           count(*) FILTER (WHERE treatment = 'surface')::int AS "surfacePlots",
           COALESCE(sum(area_m2) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceAreaM2",
           COALESCE(sum(plant_count) FILTER (WHERE treatment = 'surface'), 0)::int AS "surfacePlants",
           COALESCE(sum(litres) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceL",
           COALESCE(sum(kg) FILTER (WHERE treatment = 'surface'), 0)::float8 AS "surfaceHarvestKg",
           count(*) FILTER (WHERE treatment = 'surface' AND no_harvest)::int AS "surfacePlotsWithoutHarvest"
      FROM plot
     GROUP BY trial_id, block_key
     ORDER BY trial_id, block_key`,

  /**
   * As `cohortResultsRawQueries.water`, from `trial_week_water`: the week's weekday mask is cut to
   * the season (planting to end or the garden's today) here, bit i standing for week_start + i days. $2 = the request's instant.
   */
  water: `
    WITH ${summarisedTrials},
    spans AS (${spansAt('$2')}),
    cut AS (
      SELECT ww.trial_id, ww.week_start AS week, bit_or(ww.day_mask) AS mask,
             sum(ww.litres) FILTER (WHERE ww.kind = 'olla_refill') / sum(ww.events) FILTER (WHERE ww.kind = 'olla_refill') AS olla,
             sum(ww.litres) FILTER (WHERE ww.kind = 'surface') / sum(ww.events) FILTER (WHERE ww.kind = 'surface') AS surface,
             GREATEST(min(sp.planting_date) - ww.week_start, 0) AS lo, LEAST(min(sp.as_of) - ww.week_start, 6) AS hi
        FROM trial_week_water ww JOIN spans sp ON sp.id = ww.trial_id
       GROUP BY ww.trial_id, ww.week_start),
    wk AS (
      SELECT trial_id, week, olla, surface,
             CASE WHEN hi < lo THEN 0 ELSE mask & (((1 << (hi + 1)) - 1) - ((1 << lo) - 1)) END AS mask
        FROM cut)
    ${waterArrays}`,

  /** As `cohortResultsRawQueries.progress`, from `trial_week_water` (kinds summed per plot treatment). */
  progress: `
    WITH ${summarisedTrials},
    counted AS (SELECT sh.id FROM shared sh LEFT JOIN trial_exclusions x ON x.cohort_id = $1 AND x.trial_id = sh.id WHERE x.id IS NULL),
    per_trial AS (
      SELECT ww.trial_id, ww.week_start AS week, ww.treatment, sum(ww.litres) AS litres
        FROM trial_week_water ww JOIN counted c ON c.id = ww.trial_id
       WHERE ww.treatment IN ('olla', 'surface')
       GROUP BY 1, 2, 3),
    weekly AS (SELECT week, treatment, sum(litres) AS litres, count(*)::int AS trials FROM per_trial GROUP BY 1, 2)
    SELECT week AS "weekStart", to_char(week, 'IYYY-"W"IW') AS "isoWeek", treatment,
           litres::float8 AS litres, (sum(litres) OVER (PARTITION BY treatment ORDER BY week))::float8 AS "cumulativeLitres", trials
      FROM weekly
     ORDER BY week, treatment`,
};

export type CohortResultsQueries = typeof cohortResultsRawQueries;

type TrialRow = Omit<CohortTrialAggregate, 'exclusion'> & { exclusionReason: string | null; exclusionCreatedAt: Date | null; excludedByMe: boolean };

interface ResultsRequest {
  cohortId: string;
  userId: string;
  /** The request's instant; each trial's today is this instant's day in its garden's time zone. */
  now: Date;
  query: CohortResultsQuery;
}

/**
 * The cohort's results recomputed from the raw log rows, ignoring the rollups: what the route's
 * answer must equal (the API test compares them after every kind of write; the benchmark times both).
 */
export function recomputeCohortResultsFromRawRows(ds: DataSource, r: ResultsRequest): Promise<CohortResults> {
  return cohortResultsFrom(ds, cohortResultsRawQueries, r);
}

async function cohortResultsFrom(ds: DataSource, q: CohortResultsQueries, { cohortId, userId, now, query }: ResultsRequest): Promise<CohortResults> {
  const [trialRows, blocks, water, progress] = await Promise.all([
    ds.query(q.trials, [cohortId, userId, now]) as Promise<TrialRow[]>,
    ds.query(q.blocks, [cohortId]) as Promise<BlockAggregate[]>,
    ds.query(q.water, [cohortId, now]) as Promise<TrialWaterWeeks[]>,
    ds.query(q.progress, [cohortId]) as Promise<ProgressAggregate[]>,
  ]);
  const trials: CohortTrialAggregate[] = trialRows.map(({ exclusionReason, exclusionCreatedAt, excludedByMe, ...t }) => ({
    ...t,
    exclusion:
      exclusionReason !== null && exclusionCreatedAt !== null
        ? { reason: exclusionReason, createdAt: exclusionCreatedAt.toISOString(), excludedByMe }
        : null,
  }));
  const options = {
    method: query.method,
    confidence: query.confidence,
    includeSinglePairs: query.includeSinglePairs,
    excludeFlagged: query.excludeFlagged,
  };
  // The cohort's own as-of date (trials in several zones): the request's UTC day.
  return analyseCohort({ cohortId, asOf: now.toISOString().slice(0, 10), trials, blocks, water, progress, options });
}

export function cohortResultsService(ctx: AppContext) {
  return {
    async results(cohortId: string, userId: string, query: CohortResultsQuery): Promise<CohortResults> {
      const stale = (await ctx.ds.query(cohortResultsQueries.stale, [cohortId])) as { id: string }[];
      if (stale.length > 0) await refreshTrialRollups(ctx.ds, stale.map((t) => t.id));
      return cohortResultsFrom(ctx.ds, cohortResultsQueries, { cohortId, userId, now: ctx.now(), query });
    },

    /** Leaves a shared trial out of the cohort's pooled results, with the reason. */
    async exclude(cohortId: string, userId: string, input: CreateExclusionInput): Promise<Exclusion> {
      const [share] = (await ctx.ds.query(`WITH ${sharedTrials} SELECT pseudonym FROM shared WHERE id = $2`, [cohortId, input.trialId])) as {
        pseudonym: string;
      }[];
      if (!share) {
        throw AppError.validation('That trial is not shared with this cohort.', [{ path: 'trialId', message: 'Not a trial shared with this cohort.', reason: 'trial_not_shared' }]).because(
          'trial_not_shared',
        );
      }
      const rows = (await ctx.ds.query(
        `INSERT INTO trial_exclusions (cohort_id, trial_id, reason, excluded_by) VALUES ($1, $2, $3, $4)
         ON CONFLICT (cohort_id, trial_id) DO NOTHING RETURNING created_at`,
        [cohortId, input.trialId, input.reason, userId],
      )) as { created_at: Date }[];
      if (!rows[0]) throw new AppError('conflict', 'This trial is already excluded. Remove the exclusion first to record a different reason.').because('already_excluded');
      return { trialId: input.trialId, pseudonym: share.pseudonym, reason: input.reason, createdAt: rows[0].created_at.toISOString(), excludedByMe: true };
    },

    /** Puts a trial back into the pooled results. Idempotent: removing an absent exclusion is not an error. */
    async include(cohortId: string, trialId: string): Promise<void> {
      await ctx.ds.query(`DELETE FROM trial_exclusions WHERE cohort_id = $1 AND trial_id = $2`, [cohortId, trialId]);
    },
  };
}
