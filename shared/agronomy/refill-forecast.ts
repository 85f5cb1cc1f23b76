/**
 * Refill forecast for one olla: how much water is left now, when it crosses the grower's
 * reminder threshold and when it runs dry.
 *
 * Model (straight-line draw from the last refill):
 * - Level at the last refill: every refill is taken to top the pot up to its capacity. Growers
 *   fill an olla to the neck; the volume they log is what the pot took, which is less than the
 *   capacity whenever water was left in it, so a small volume does not mean a part-filled pot.
 *   The one exception is the pot's first refill ever (`firstFill`): a new pot started empty,
 *   so the level is the volume poured in (at most the capacity). A volume above the capacity
 *   (spill, a wrong unit) still counts as full.
 * - Daily draw: the pot's latest measured seepage (seep test, litres lost × 24 / hours) when
 *   there is one; otherwise the crop's water need over the pot's wetted area
 *   (ETc mm/day × m² = L/day, through refillIntervalDays in olla-layout.ts). The draw is held
 *   constant between refills: rain, soil moisture and heat change a real pot's release, so
 *   the forecast is a prompt to look, not a measurement.
 * - Level now = max(0, level at refill − draw × days since). Reminder due when the level is
 *   strictly below the threshold share of the capacity.
 *
 * Without any refill logged the level is unknown (null) and nothing is due.
 */
import { AnalysisInputError, assertFinite, assertNonNegative, assertPositive } from '../analysis/input-error';
import { CROP_COEFFICIENTS, etc, kcForDay, type CropCoefficients, type CropId } from './crop-coefficients';
import { et0ForDay, type GardenSite, type WeatherDay } from './et0';
import { refillIntervalDays } from './olla-layout';
import { addDays as addCalendarDays } from '../time-zone';

const DAY_MS = 86_400_000;

/** Reminder threshold when the grower has not chosen one: 25 % of capacity (common practice, no source). */
export const DEFAULT_REFILL_THRESHOLD_PCT = 25;

/**
 * ET0 used for the crop-need draw when the garden has no observed weather in the last week:
 * 5 mm/day, a mid-summer value for a warm, dry garden (common practice, no source). Log
 * weather days (at least Tmin and Tmax) to replace it with the garden's own FAO-56 ET0.
 */
export const DEFAULT_ET0_MM_PER_DAY = 5;

/** How many days of observed weather, ending today, feed the garden's ET0 for the crop-need draw. */
export const ET0_WINDOW_DAYS = 7;

export type ForecastBasis = 'seep-test' | 'crop-need';

export interface RefillForecastInput {
  /** Water the pot holds when full, L. */
  capacityL: number;
  /** The last olla refill of this pot, or null when none was logged. */
  lastRefill: { at: Date | string; volumeL: number; firstFill?: boolean } | null;
  /** Latest seep test of the pot, L/day; null before any test. */
  seepLPerDay: number | null;
  /** Crop need for the crop-need basis: ETc mm/day and the pot's wetted area m². */
  cropNeed?: { etcMmPerDay: number; wettedAreaM2: number } | null;
  /** Reminder threshold, % of capacity (default 25). */
  thresholdPct?: number;
  now: Date | string;
}

export interface RefillForecast {
  /** Where the daily draw comes from; null when neither a seep test nor a crop need is known. */
  basis: ForecastBasis | null;
  dailyDrawL: number | null;
  /** Level at the last refill, L (the capacity except for a pot's first, partial fill). */
  startL: number | null;
  levelL: number | null;
  levelPct: number | null;
  /** ISO instant the level falls below the threshold (may be in the past); null when unknown or never. */
  thresholdAt: string | null;
  /** ISO instant the pot runs dry (may be in the past); null when unknown or never. */
  dryAt: string | null;
  /** True when the level now is strictly below the threshold. */
  belowThreshold: boolean;
  dry: boolean;
}

function instant(name: string, v: Date | string): number {
  const t = v instanceof Date ? v.getTime() : Date.parse(v);
  if (!Number.isFinite(t)) throw new AnalysisInputError(`${name} must be a date and time (got ${String(v)}).`);
  return t;
}

export function assertThresholdPct(thresholdPct: number): void {
  assertFinite('thresholdPct', thresholdPct);
  if (thresholdPct <= 0 || thresholdPct >= 100) throw new AnalysisInputError(`thresholdPct must be between 0 and 100, exclusive (got ${thresholdPct}).`);
}

/** The forecast for one pot (see the module note for the model). */
export function forecastRefill(input: RefillForecastInput): RefillForecast {
  assertPositive('capacityL', input.capacityL);
  const thresholdPct = input.thresholdPct ?? DEFAULT_REFILL_THRESHOLD_PCT;
  assertThresholdPct(thresholdPct);
  const now = instant('now', input.now);

  let basis: ForecastBasis | null = null;
  let dailyDrawL: number | null = null;
  if (input.seepLPerDay !== null) {
    dailyDrawL = refillIntervalDays({ capacityL: input.capacityL, seepageLPerDay: input.seepLPerDay }).dailyDrawL;
    basis = 'seep-test';
  } else if (input.cropNeed) {
    dailyDrawL = refillIntervalDays({ capacityL: input.capacityL, cropNeedMmPerDay: input.cropNeed.etcMmPerDay, wettedAreaM2: input.cropNeed.wettedAreaM2 }).dailyDrawL;
    basis = 'crop-need';
  }

  const none: RefillForecast = { basis, dailyDrawL, startL: null, levelL: null, levelPct: null, thresholdAt: null, dryAt: null, belowThreshold: false, dry: false };
  if (!input.lastRefill || dailyDrawL === null) return none;

  assertNonNegative('lastRefill.volumeL', input.lastRefill.volumeL);
  const filledAt = instant('lastRefill.at', input.lastRefill.at);
  const startL = input.lastRefill.firstFill ? Math.min(input.lastRefill.volumeL, input.capacityL) : input.capacityL;
  // A refill logged after `now` (the clock is behind the entry) counts as just filled.
  const days = Math.max(0, (now - filledAt) / DAY_MS);
  const levelL = Math.max(0, startL - dailyDrawL * days);
  const thresholdL = (thresholdPct / 100) * input.capacityL;
  const at = (litresDrawn: number) => (dailyDrawL! > 0 ? new Date(filledAt + (Math.max(0, litresDrawn) / dailyDrawL!) * DAY_MS).toISOString() : null);
  return {
    basis,
    dailyDrawL,
    startL,
    levelL,
    levelPct: (levelL / input.capacityL) * 100,
    thresholdAt: startL < thresholdL ? new Date(filledAt).toISOString() : at(startL - thresholdL),
    dryAt: at(startL),
    belowThreshold: levelL < thresholdL,
    dry: levelL <= 0,
  };
}

/** Where a suggested top-up comes from: the seep-test estimate, the last refill's volume, or a full pot. */
export type TopUpBasis = 'seep-test' | 'last-refill' | 'capacity';

export interface TopUpInput {
  /** Water the pot holds when full, L. */
  capacityL: number;
  /** Latest seep test of the pot, L/day; null before any test. */
  seepLPerDay: number | null;
  /** The last olla refill of this pot (instant and litres poured), or null when none was logged. */
  lastRefill: { at: Date | string; volumeL: number } | null;
  now: Date | string | number;
}

export interface TopUpSuggestion {
  basis: TopUpBasis;
  /** Litres estimated to be left now (basis 'seep-test' only; otherwise null: unknown). */
  levelL: number | null;
  /** Litres suggested for this refill, not rounded (the screen rounds to its own step). */
  topUpL: number;
}

/**
 * What to pour into a pot today. A grower tops an olla up to the neck, so with a seep test and a
 * logged refill the suggestion is what it takes to fill it: capacity − the level forecastRefill
 * estimates (the pot full at the last refill, drawn down in a straight line at the seep rate —
 * a simplification, common practice, no source), clamped to [0, capacity]; a refill logged after
 * `now` counts as just filled (nothing to add). Without a seep test or a refill the level is
 * unknown: the last refill's volume (as logged), else a full pot.
 */
export function suggestTopUp(input: TopUpInput): TopUpSuggestion {
  assertPositive('capacityL', input.capacityL);
  if (input.seepLPerDay !== null && input.lastRefill) {
    // No `firstFill`: the pot is taken as full after its last refill, as the Round has always shown it.
    const { levelL } = forecastRefill({ capacityL: input.capacityL, lastRefill: input.lastRefill, seepLPerDay: input.seepLPerDay, now: typeof input.now === 'number' ? new Date(input.now) : input.now });
    const left = Math.min(input.capacityL, Math.max(0, levelL!));
    return { basis: 'seep-test', levelL: left, topUpL: input.capacityL - left };
  }
  if (input.lastRefill) {
    assertNonNegative('lastRefill.volumeL', input.lastRefill.volumeL);
    return { basis: 'last-refill', levelL: null, topUpL: input.lastRefill.volumeL };
  }
  return { basis: 'capacity', levelL: null, topUpL: input.capacityL };
}

/**
 * A suggested volume on a stepper (in the screen's unit): the nearest multiple of `step` (0 when
 * under half a step), at most the whole steps the pot holds, so rounding never offers more than
 * the pot's capacity (a 2.6 gal pot is offered 2.5 gal, not 2.75).
 */
export function onStepper(value: number, step: number, capacity: number): number {
  assertPositive('step', step);
  assertNonNegative('value', value);
  const wholeSteps = Math.floor(capacity / step + 1e-9) * step;
  return Math.min(Math.round(value / step) * step, wholeSteps);
}

/** Crop coefficients with a trial's Kc overrides applied; null for crops without FAO-56 values. */
export function cropWithOverrides(crop: string, overrides: { ini?: number; mid?: number; end?: number } = {}): CropCoefficients | null {
  const base = CROP_COEFFICIENTS[crop as CropId];
  if (!base) return null;
  return {
    ...base,
    kcIni: overrides.ini ?? base.kcIni,
    kcMid: overrides.mid ?? base.kcMid,
    kcEnd: overrides.end !== undefined ? { min: overrides.end, max: overrides.end } : base.kcEnd,
  };
}

/**
 * ETc on a day: Kc for the days since planting (FAO-56 eq. 66; 0 before planting) × ET0.
 * Null when the crop has no FAO-56 coefficients (a seep test is then the only basis).
 */
export function cropNeedMmPerDay(input: { crop: string; kcOverrides?: { ini?: number; mid?: number; end?: number }; plantingDate: string; onDate: string; et0MmPerDay: number }): { etcMmPerDay: number; kc: number } | null {
  const coefficients = cropWithOverrides(input.crop, input.kcOverrides);
  if (!coefficients) return null;
  const days = Math.max(0, (Date.parse(`${input.onDate}T00:00:00Z`) - Date.parse(`${input.plantingDate}T00:00:00Z`)) / DAY_MS);
  if (!Number.isFinite(days)) throw new AnalysisInputError(`Dates must look like YYYY-MM-DD (got ${input.plantingDate}, ${input.onDate}).`);
  const { kc } = kcForDay(coefficients, days);
  return { etcMmPerDay: etc(input.et0MmPerDay, kc), kc };
}

/**
 * The garden's ET0 for the crop-need draw: the mean FAO-56 ET0 of its observed weather days
 * (not forecasts) in the ET0_WINDOW_DAYS days ending `today` (today − 6 … today), or
 * DEFAULT_ET0_MM_PER_DAY when there are none.
 */
export function gardenEt0(days: readonly (WeatherDay & { date: string })[], garden: GardenSite, today: string): { et0MmPerDay: number; source: 'weather' | 'default'; days: number } {
  const from = addDays(today, -(ET0_WINDOW_DAYS - 1));
  const recent = days.filter((d) => d.date >= from && d.date <= today);
  if (recent.length === 0) return { et0MmPerDay: DEFAULT_ET0_MM_PER_DAY, source: 'default', days: 0 };
  const total = recent.reduce((s, d) => s + et0ForDay(d, garden).et0Mm, 0);
  return { et0MmPerDay: total / recent.length, source: 'weather', days: recent.length };
}

/** Adds whole days to an ISO date (shared/time-zone.ts), refusing one that is not YYYY-MM-DD with an AnalysisInputError. */
export function addDays(isoDate: string, days: number): string {
  if (!Number.isFinite(Date.parse(`${isoDate}T00:00:00Z`))) throw new AnalysisInputError(`Date must look like YYYY-MM-DD (got "${isoDate}").`);
  return addCalendarDays(isoDate, days);
}

/** Frost at or below 0 °C (meteorological convention; common practice, no source). */
export const FROST_THRESHOLD_C = 0;
/** Days ahead, after today, that a frost warning looks at. */
export const FROST_LOOKAHEAD_DAYS = 2;

export function isFrost(tMinC: number): boolean {
  assertFinite('tMinC', tMinC);
  return tMinC <= FROST_THRESHOLD_C;
}

export interface FrostNight {
  day: string;
  /** The lower of the logged and the forecast minimum for the day, °C. */
  tMinC: number;
  /** True when that lower value is a forecast. */
  forecast: boolean;
}

/**
 * Frost nights at a garden: days from `today` to today + FROST_LOOKAHEAD_DAYS whose logged or
 * forecast minimum temperature is at or below 0 °C, in date order. When a day has both, the
 * lower value counts (a warning errs on the side of the pots).
 */
export function frostNights(days: readonly { day: string; tMinC: number; forecast: boolean }[], today: string): FrostNight[] {
  const last = addDays(today, FROST_LOOKAHEAD_DAYS);
  const lowest = new Map<string, FrostNight>();
  for (const d of days) {
    if (d.day < today || d.day > last) continue;
    assertFinite('tMinC', d.tMinC);
    const seen = lowest.get(d.day);
    if (!seen || d.tMinC < seen.tMinC) lowest.set(d.day, { day: d.day, tMinC: d.tMinC, forecast: d.forecast });
  }
  return [...lowest.values()].filter((n) => isFrost(n.tMinC)).sort((a, b) => (a.day < b.day ? -1 : 1));
}

/** Sort key for "most urgent first": soonest dry first, never-dry next, unknown last. */
export function urgencyOrder(a: Pick<RefillForecast, 'dryAt' | 'levelPct'>, b: Pick<RefillForecast, 'dryAt' | 'levelPct'>): number {
  const rank = (f: Pick<RefillForecast, 'dryAt' | 'levelPct'>) => (f.levelPct === null ? 2 : f.dryAt === null ? 1 : 0);
  const ra = rank(a);
  const rb = rank(b);
  if (ra !== rb) return ra - rb;
  if (ra === 0) return Date.parse(a.dryAt!) - Date.parse(b.dryAt!);
  return (a.levelPct ?? 0) - (b.levelPct ?? 0);
}
