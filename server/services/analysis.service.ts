import { analyseTrial, type PlotAggregate, type TrialAnalysis, type WeatherAggregate } from '@shared/analysis/trial-analysis';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';

/**
 * The trial analysis: SQL sums every log (one query per concern, no row-by-row JavaScript),
 * then the shared pure functions turn the aggregates into results.
 */
export const analysisQueries = {
  trial: `SELECT t.crop, t.planting_date AS "plantingDate", t.end_date AS "endDate", t.treatments, t.kc_overrides AS "kcOverrides",
                 t.stress_thresholds AS "stressThresholds", g.id AS "gardenId", g.latitude_deg AS "latitudeDeg", g.elevation_m AS "elevationM", g.coastal
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
  dailyWater: `SELECT plot_id AS "plotId", to_char(occurred_at AT TIME ZONE 'UTC', 'YYYY-MM-DD') AS day, sum(volume_l) AS litres
                 FROM water_events WHERE trial_id = $1 GROUP BY 1, 2 ORDER BY 2, 1`,
  weather: `SELECT to_char(day, 'YYYY-MM-DD') AS day, t_min_c AS "tMinC", t_max_c AS "tMaxC", rain_mm AS "rainMm", rh_min_pct AS "rhMinPct", rh_max_pct AS "rhMaxPct",
                   wind_speed_ms AS "windSpeedMs", wind_height_m AS "windHeightM", sunshine_hours AS "sunshineHours", solar_radiation_mj AS "solarRadiationMJ"
              FROM weather_days WHERE garden_id = $1 AND NOT forecast AND day BETWEEN $2 AND $3 ORDER BY day`,
  moisture: `SELECT to_char(m.taken_at AT TIME ZONE 'UTC', 'YYYY-MM-DD') AS day, p.treatment, m.method, avg(m.value) AS mean, count(*)::int AS n
               FROM moisture_readings m JOIN plots p ON p.id = m.plot_id
              WHERE m.trial_id = $1 AND p.treatment IS NOT NULL
              GROUP BY 1, 2, 3 ORDER BY 1, 2, 3`,
};

export function analysisService(ctx: AppContext) {
  return {
    async forTrial(trialId: string): Promise<TrialAnalysis & { asOf: string }> {
      const [trial] = (await ctx.ds.query(analysisQueries.trial, [trialId])) as {
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
      }[];
      if (!trial) throw AppError.notFound('Trial');
      const today = ctx.now().toISOString().slice(0, 10);
      const asOf = trial.endDate && trial.endDate < today ? trial.endDate : today;
      const [plots, dailyWater, weather, moisture] = await Promise.all([
        ctx.ds.query(analysisQueries.plots, [trialId]) as Promise<PlotAggregate[]>,
        ctx.ds.query(analysisQueries.dailyWater, [trialId]) as Promise<{ plotId: string; day: string; litres: number }[]>,
        ctx.ds.query(analysisQueries.weather, [trial.gardenId, trial.plantingDate, asOf]) as Promise<WeatherAggregate[]>,
        ctx.ds.query(analysisQueries.moisture, [trialId]) as Promise<{ day: string; treatment: string; method: string; mean: number; n: number }[]>,
      ]);
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
