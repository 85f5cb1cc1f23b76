import { analyseTrial, type PlotAggregate, type PlotDailyWater, type TrialAnalysis, type WeatherAggregate } from '@shared/analysis/trial-analysis';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';

/**
 * The trial analysis: SQL sums every log (one query per concern, no row-by-row JavaScript),
 * then the shared pure functions turn the aggregates into results.
 */
/** $1 trial: the zone of the trial's garden (an InitPlan, evaluated once per query). */
const gardenZone = `(SELECT g.time_zone FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1)`;

/** Days are the garden's days: timestamps are bucketed, and "today" is taken, in the garden's time zone. */
export const analysisQueries = {
  /** $1 trial, $2 the request's instant: also the garden's today. */
  trial: `SELECT t.crop, t.planting_date AS "plantingDate", t.end_date AS "endDate", t.treatments, t.kc_overrides AS "kcOverrides",
                 t.stress_thresholds AS "stressThresholds", g.id AS "gardenId", g.latitude_deg AS "latitudeDeg", g.elevation_m AS "elevationM", g.coastal,
                 g.time_zone AS "timeZone", to_char(($2::timestamptz AT TIME ZONE g.time_zone)::date, 'YYYY-MM-DD') AS today
            FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`,
  plots: `SELECT p.id, p.label, p.treatment, p.block_key AS "blockKey", p.area_m2 AS "areaM2", p.plant_count AS "plantCount",
                 COALESCE(w.total, 0) AS "waterL", COALESCE(w.olla, 0) AS "ollaL", COALESCE(w.surface, 0) AS "surfaceL", COALESCE(w.events, 0)::int AS "waterEvents",
                 COALESCE(h.fresh, 0) AS "harvestKg", COALESCE(h.marketable, 0) AS "marketableKg", COALESCE(h.picks, 0)::int AS harvests
            FROM plots p
            LEFT JOIN (SELECT plot_id, sum(volume_l) AS total, sum(volume_l) FILTER (WHERE kind = 'olla_refill') AS olla,
                              sum(volume_l) FILTER (WHERE kind = 'surface') AS surface, count(*) AS events
                         FROM water_events WHERE trial_id = $1 GROUP BY plot_id) w ON w.plot_id = p.id
            LEFT JOIN (SELECT plot_id, sum(fresh_kg) AS fresh, sum(COALESCE(marketable_kg, 0)) AS marketable, count(*) AS picks
                         FROM harvests WHERE trial_id = $1 GROUP BY plot_id) h ON h.plot_id = p.id
           WHERE p.trial_id = $1
           ORDER BY p.block_key, p.label`,
  /**
   * Water per plot and garden day, one row per plot in columns (PlotDailyWater): its first day, the
   * other days as offsets from it, and each day's litres (volume_l is float8; its array prints the
   * shortest exact text, so JavaScript gets the very sums PostgreSQL made). The daily rows never
   * reach JavaScript.
   */
  dailyWater: `SELECT "plotId", to_char(min(day), 'YYYY-MM-DD') AS "firstDay", array_agg(day - first ORDER BY day) AS "dayOffsets", array_agg(litres ORDER BY day) AS litres
                 FROM (SELECT "plotId", day, litres, min(day) OVER (PARTITION BY "plotId") AS first
                         FROM (SELECT plot_id AS "plotId", (occurred_at AT TIME ZONE ${gardenZone})::date AS day, sum(volume_l) AS litres
                                 FROM water_events WHERE trial_id = $1 GROUP BY 1, 2) g) d
                GROUP BY "plotId"`,
  /** $1 trial, $2 the request's instant: the garden's weather from planting to the trial's end or the garden's today, whichever is first (asOf). */
  weather: `SELECT to_char(w.day, 'YYYY-MM-DD') AS day, w.t_min_c AS "tMinC", w.t_max_c AS "tMaxC", w.rain_mm AS "rainMm", w.rh_min_pct AS "rhMinPct", w.rh_max_pct AS "rhMaxPct",
                   w.wind_speed_ms AS "windSpeedMs", w.wind_height_m AS "windHeightM", w.sunshine_hours AS "sunshineHours", w.solar_radiation_mj AS "solarRadiationMJ"
              FROM trials t JOIN gardens g ON g.id = t.garden_id JOIN weather_days w ON w.garden_id = t.garden_id
             CROSS JOIN LATERAL (SELECT ($2::timestamptz AT TIME ZONE g.time_zone)::date AS today) d
             WHERE t.id = $1 AND NOT w.forecast AND w.day BETWEEN t.planting_date AND LEAST(COALESCE(t.end_date, d.today), d.today)
             ORDER BY w.day`,
  moisture: `SELECT to_char(m.taken_at AT TIME ZONE ${gardenZone}, 'YYYY-MM-DD') AS day, p.treatment, m.method, avg(m.value) AS mean, count(*)::int AS n
               FROM moisture_readings m JOIN plots p ON p.id = m.plot_id AND p.trial_id = $1
              WHERE m.trial_id = $1 AND p.treatment IS NOT NULL
              GROUP BY 1, 2, 3 ORDER BY 1, 2, 3`,
};

interface TrialRow {
  crop: string;
  plantingDate: string;
  endDate: string | null;
  treatments: string[];
  kcOverrides: Record<string, number>;
  stressThresholds: Record<string, number>;
  gardenId: string;
  latitudeDeg: number;
  elevationM: number;
  coastal: boolean;
  timeZone: string;
  /** The garden's calendar day at the request's instant. */
  today: string;
}

export function analysisService(ctx: AppContext) {
  return {
    async forTrial(trialId: string): Promise<TrialAnalysis & { asOf: string }> {
      const now = ctx.now();
      // One round trip: the weather query finds the garden and the season from the trial itself.
      const [[trial], plots, dailyWater, weather, moisture] = await Promise.all([
        ctx.ds.query(analysisQueries.trial, [trialId, now]) as Promise<TrialRow[]>,
        ctx.ds.query(analysisQueries.plots, [trialId]) as Promise<PlotAggregate[]>,
        ctx.ds.query(analysisQueries.dailyWater, [trialId]) as Promise<PlotDailyWater[]>,
        ctx.ds.query(analysisQueries.weather, [trialId, now]) as Promise<WeatherAggregate[]>,
        ctx.ds.query(analysisQueries.moisture, [trialId]) as Promise<{ day: string; treatment: string; method: string; mean: number; n: number }[]>,
      ]);
      if (!trial) throw AppError.notFound('Trial');
      const { today } = trial;
      const asOf = trial.endDate && trial.endDate < today ? trial.endDate : today;
      const result = analyseTrial({
        trial: {
          crop: trial.crop,
          plantingDate: trial.plantingDate,
          endDate: trial.endDate,
          treatments: trial.treatments,
          kcOverrides: trial.kcOverrides,
          stressThresholds: trial.stressThresholds,
        },
        garden: { latitudeDeg: trial.latitudeDeg, elevationM: trial.elevationM, coastal: trial.coastal },
        plots,
        dailyWater,
        weather,
        moisture,
        asOf,
      });
      return { ...result, asOf };
    },
  };
}
