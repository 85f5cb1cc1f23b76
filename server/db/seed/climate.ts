/**
 * Weather for the demo gardens: one town-wide series of anomalies, storms and a heat wave, then
 * each garden's own days (elevation, microclimate, local showers). ET0 for every day is
 * computed with the same FAO-56 function the analysis uses, so the growers' watering in the
 * generator answers the same crop water need the Results tab will show.
 */
import { daylightHours, et0ForDay } from '@shared/agronomy/et0';
import { addDays, dayOfYear, daysBetween, eachDay, within } from './dates';
import { clamp, round, Rng } from './random';

/**
 * The climate of Saltbush Bend, an invented high-desert town (about 35°N, 1450 m): hot dry
 * early summer, a stormy late summer, cool nights. All numbers are invented for the demo,
 * shaped like a dryland climate but not taken from any station.
 */
export const CLIMATE = {
  townElevationM: 1450,
  /** Seasonal curve of daily maxima and minima: mean + amplitude·cos(2π(doy − warmest)/365). */
  tMax: { meanC: 20.5, amplitudeC: 13.5 },
  tMin: { meanC: 5.5, amplitudeC: 11.5 },
  warmestDayOfYear: 192,
  /** Cooling with height, °C per metre. */
  lapseRateCPerM: 0.0065,
  /** Day-to-day weather: AR(1) anomalies shared by the whole town. */
  anomaly: { persistence: 0.72, sdC: 1.5 },
  heatWave: { from: '2026-07-13', to: '2026-07-19', extraC: 4.5 },
  /** Late-summer storms: the chance of a storm day, and how likely each garden is to catch it. */
  stormSeason: { from: '2026-07-02', to: '2026-09-08', dailyChance: 0.14 },
  offSeasonStormChance: 0.025,
  gardenCatchesStorm: 0.7,
  stormRainMedianMm: 5,
  /** A storm day's effect on temperatures. */
  stormCoolingC: 5,
  stormNightWarmingC: 1.5,
} as const;

/** The span the town series covers (a little wider than any garden's season). */
export const CLIMATE_FROM = '2026-04-15';
export const CLIMATE_TO = '2026-10-10';

interface TownDay {
  tMaxAnomalyC: number;
  tMinAnomalyC: number;
  storm: boolean;
  heatWaveC: number;
}

export type TownSeries = Map<string, TownDay>;

export function townSeries(): TownSeries {
  const rng = new Rng('climate:town');
  const out: TownSeries = new Map();
  let anomaly = 0;
  for (const day of eachDay(CLIMATE_FROM, CLIMATE_TO)) {
    anomaly = CLIMATE.anomaly.persistence * anomaly + rng.normal(0, CLIMATE.anomaly.sdC);
    const stormChance = within(day, CLIMATE.stormSeason) ? CLIMATE.stormSeason.dailyChance : CLIMATE.offSeasonStormChance;
    out.set(day, {
      tMaxAnomalyC: anomaly,
      tMinAnomalyC: 0.6 * anomaly + rng.normal(0, 1),
      storm: rng.chance(stormChance),
      heatWaveC: within(day, CLIMATE.heatWave) ? CLIMATE.heatWave.extraC : 0,
    });
  }
  return out;
}

function seasonalC(curve: { meanC: number; amplitudeC: number }, day: string): number {
  return curve.meanC + curve.amplitudeC * Math.cos((2 * Math.PI * (dayOfYear(day) - CLIMATE.warmestDayOfYear)) / 365);
}

export interface GardenSite {
  key: string;
  latitudeDeg: number;
  elevationM: number;
  /** A sheltered courtyard runs warmer than an open lot (°C). */
  microclimateC: number;
  /** A small weather station (humidity, wind at 2 m, sunshine hours) or only a min/max thermometer. */
  station: boolean;
}

export interface WeatherDay {
  day: string;
  tMinC: number;
  tMaxC: number;
  rainMm: number;
  rhMinPct: number | null;
  rhMaxPct: number | null;
  windSpeedMs: number | null;
  sunshineHours: number | null;
  /** FAO-56 reference evapotranspiration from the values above (not stored; drives the watering). */
  et0Mm: number;
}

function stationReadings(rng: Rng, site: GardenSite, day: string, rainy: boolean, monsoon: boolean) {
  const rhMax = clamp(rng.normal(38 + (monsoon ? 14 : 0) + (rainy ? 25 : 0), 6), 20, 98);
  const rhMin = clamp(rng.normal(11 + (monsoon ? 7 : 0) + (rainy ? 22 : 0), 3), 4, rhMax - 8);
  const spring = day < '2026-06-01';
  const wind = clamp(Math.exp(rng.normal(Math.log(spring ? 3.3 : 2.4), 0.3)), 0.6, 7);
  const daylight = daylightHours(site.latitudeDeg, dayOfYear(day));
  const cloudless = rainy ? rng.uniform(0.3, 0.6) : monsoon ? rng.uniform(0.7, 0.92) : rng.uniform(0.86, 0.96);
  return { rhMinPct: Math.round(rhMin), rhMaxPct: Math.round(rhMax), windSpeedMs: round(wind, 1), sunshineHours: round(daylight * cloudless, 1) };
}

/** Observed weather at one garden, day by day from `from` to `to`. */
export function gardenWeather(town: TownSeries, site: GardenSite, from: string, to: string): WeatherDay[] {
  const rng = new Rng(`climate:garden:${site.key}`);
  const lapseC = CLIMATE.lapseRateCPerM * (site.elevationM - CLIMATE.townElevationM);
  return eachDay(from, to).map((day) => {
    const t = town.get(day);
    if (!t) throw new Error(`The demo climate does not cover ${day}.`);
    const rainy = t.storm && rng.chance(CLIMATE.gardenCatchesStorm);
    const rainMm = rainy ? round(clamp(Math.exp(rng.normal(Math.log(CLIMATE.stormRainMedianMm), 0.8)), 0.3, 38), 1) : 0;
    const local = site.microclimateC - lapseC;
    let tMax = seasonalC(CLIMATE.tMax, day) + t.tMaxAnomalyC + t.heatWaveC + local + rng.normal(0, 0.5) - (rainy ? CLIMATE.stormCoolingC : 0);
    let tMin = seasonalC(CLIMATE.tMin, day) + t.tMinAnomalyC + 0.6 * t.heatWaveC + local + rng.normal(0, 0.6) + (rainy ? CLIMATE.stormNightWarmingC : 0);
    if (tMax - tMin < 6) tMax = tMin + 6 + rng.uniform(0, 2);
    tMax = round(tMax, 1);
    tMin = round(tMin, 1);
    const station = site.station ? stationReadings(rng, site, day, rainy, within(day, CLIMATE.stormSeason)) : null;
    const et0 = et0ForDay(
      {
        date: day,
        tMinC: tMin,
        tMaxC: tMax,
        rhMinPct: station?.rhMinPct,
        rhMaxPct: station?.rhMaxPct,
        windSpeedMs: station?.windSpeedMs,
        windHeightM: 2,
        sunshineHours: station?.sunshineHours,
      },
      { latitudeDeg: site.latitudeDeg, elevationM: site.elevationM, coastal: false },
    );
    return {
      day,
      tMinC: tMin,
      tMaxC: tMax,
      rainMm,
      rhMinPct: station?.rhMinPct ?? null,
      rhMaxPct: station?.rhMaxPct ?? null,
      windSpeedMs: station?.windSpeedMs ?? null,
      sunshineHours: station?.sunshineHours ?? null,
      et0Mm: et0.et0Mm,
    };
  });
}

export interface ForecastDay {
  day: string;
  tMinC: number;
  tMaxC: number;
  rainMm: number;
}

/**
 * A few forecast days after the last observation. An optional cold front drops one night to
 * `coldest.tMinC` (a frost when ≤ 0 °C) and cools the days around it.
 */
export function forecastDays(site: GardenSite, afterDay: string, days: number, coldest?: { day: string; tMinC: number }): ForecastDay[] {
  const rng = new Rng(`climate:forecast:${site.key}`);
  const lapseC = CLIMATE.lapseRateCPerM * (site.elevationM - CLIMATE.townElevationM);
  return Array.from({ length: days }, (_, i) => {
    const day = addDays(afterDay, i + 1);
    let tMin = seasonalC(CLIMATE.tMin, day) - lapseC + rng.normal(0, 1);
    let tMax = seasonalC(CLIMATE.tMax, day) - lapseC + rng.normal(0, 1);
    if (coldest) {
      const distance = Math.abs(daysBetween(coldest.day, day));
      if (day === coldest.day) tMin = coldest.tMinC;
      else if (distance === 1) tMin = Math.min(tMin, coldest.tMinC + 4);
      if (distance <= 1) tMax -= 7 - 2 * distance;
    }
    return { day, tMinC: round(tMin, 1), tMaxC: round(Math.max(tMax, tMin + 6), 1), rainMm: 0 };
  });
}
