/**
 * Reference evapotranspiration (ET0) after FAO Irrigation and Drainage Paper 56
 * (Allen, Pereira, Raes & Smith, 1998). Equation numbers in comments refer to FAO-56.
 *
 * Units: temperatures °C, pressures kPa, radiation MJ m⁻² d⁻¹, wind m s⁻¹, ET0 mm d⁻¹.
 * Latitude in decimal degrees, north positive, south negative. Day of year J = 1..366.
 */
import { AnalysisInputError, assertFinite, assertNonNegative, assertPositive } from '../analysis/input-error';

/** Solar constant Gsc, MJ m⁻² min⁻¹ (FAO-56 eq. 21). */
export const SOLAR_CONSTANT = 0.082;
/** Stefan-Boltzmann constant σ, MJ K⁻⁴ m⁻² d⁻¹ (FAO-56 eq. 39). */
export const STEFAN_BOLTZMANN = 4.903e-9;
/** 1 MJ m⁻² d⁻¹ of radiation evaporates 0.408 mm d⁻¹ of water (FAO-56 eq. 20). */
export const MJ_TO_MM = 0.408;
/** Albedo of the grass reference crop (FAO-56 eq. 38). */
export const REFERENCE_ALBEDO = 0.23;
/** Ångström coefficients when no local calibration exists (FAO-56 eq. 35). */
export const ANGSTROM_A = 0.25;
export const ANGSTROM_B = 0.5;
/** Adjustment coefficient kRs of the Hargreaves radiation formula (FAO-56 eq. 50). */
export const KRS_INTERIOR = 0.16;
export const KRS_COASTAL = 0.19;
/**
 * Wind speed used when none was measured. FAO-56 (chapter 3, missing wind speed data)
 * suggests about 2 m/s at 2 m as a temporary estimate, the global average over 2000
 * stations (recalled from the text, not re-read).
 */
export const DEFAULT_WIND_SPEED_MS = 2;
/** Dew point below Tmin assumed in arid places when humidity is missing (FAO-56 allows 2-3 °C). */
export const ARID_DEW_POINT_OFFSET_C = 2;

function assertLatitude(latitudeDeg: number): void {
  assertFinite('latitudeDeg', latitudeDeg);
  if (Math.abs(latitudeDeg) > 90) throw new AnalysisInputError(`latitudeDeg must be between -90 and 90 (got ${latitudeDeg}).`);
}

function assertDayOfYear(dayOfYear: number): void {
  if (!Number.isInteger(dayOfYear) || dayOfYear < 1 || dayOfYear > 366) {
    throw new AnalysisInputError(`dayOfYear must be a whole number from 1 to 366 (got ${dayOfYear}).`);
  }
}

function assertTemperatures(tMinC: number, tMaxC: number): void {
  assertFinite('tMinC', tMinC);
  assertFinite('tMaxC', tMaxC);
  if (tMaxC < tMinC) throw new AnalysisInputError(`tMaxC (${tMaxC}) must not be below tMinC (${tMinC}).`);
}

function assertPercent(name: string, value: number): void {
  assertFinite(name, value);
  if (value < 0 || value > 100) throw new AnalysisInputError(`${name} must be between 0 and 100 (got ${value}).`);
}

/** Atmospheric pressure P, kPa, from elevation z in m (eq. 7). */
export function atmosphericPressure(elevationM: number): number {
  assertFinite('elevationM', elevationM);
  return 101.3 * ((293 - 0.0065 * elevationM) / 293) ** 5.26;
}

/** Psychrometric constant γ, kPa °C⁻¹ (eq. 8). */
export function psychrometricConstant(pressureKPa: number): number {
  assertPositive('pressureKPa', pressureKPa);
  return 0.665e-3 * pressureKPa;
}

/** Saturation vapour pressure e°(T), kPa (eq. 11). */
export function saturationVapourPressure(tC: number): number {
  assertFinite('tC', tC);
  return 0.6108 * Math.exp((17.27 * tC) / (tC + 237.3));
}

/** Mean saturation vapour pressure es = [e°(Tmax) + e°(Tmin)] / 2, kPa (eq. 12). */
export function meanSaturationVapourPressure(tMinC: number, tMaxC: number): number {
  return (saturationVapourPressure(tMaxC) + saturationVapourPressure(tMinC)) / 2;
}

/** Slope of the saturation vapour pressure curve Δ at temperature T, kPa °C⁻¹ (eq. 13). */
export function saturationSlope(tC: number): number {
  return (4098 * saturationVapourPressure(tC)) / (tC + 237.3) ** 2;
}

/** Actual vapour pressure from dew point temperature, kPa (eq. 14). */
export function actualVapourPressureFromDewPoint(dewPointC: number): number {
  return saturationVapourPressure(dewPointC);
}

/**
 * Actual vapour pressure from relative humidity, kPa: eq. 17 when RHmax and RHmin are
 * known, eq. 18 with RHmax only, eq. 19 with RHmean only. Returns undefined when none fits.
 */
export function actualVapourPressureFromHumidity(input: {
  tMinC: number;
  tMaxC: number;
  rhMinPct?: number;
  rhMaxPct?: number;
  rhMeanPct?: number;
}): number | undefined {
  const { tMinC, tMaxC, rhMinPct, rhMaxPct, rhMeanPct } = input;
  assertTemperatures(tMinC, tMaxC);
  if (rhMaxPct !== undefined) assertPercent('rhMaxPct', rhMaxPct);
  if (rhMinPct !== undefined) assertPercent('rhMinPct', rhMinPct);
  if (rhMeanPct !== undefined) assertPercent('rhMeanPct', rhMeanPct);
  const eMin = saturationVapourPressure(tMinC);
  const eMax = saturationVapourPressure(tMaxC);
  if (rhMaxPct !== undefined && rhMinPct !== undefined) return (eMin * (rhMaxPct / 100) + eMax * (rhMinPct / 100)) / 2;
  if (rhMaxPct !== undefined) return eMin * (rhMaxPct / 100);
  if (rhMeanPct !== undefined) return (rhMeanPct / 100) * ((eMax + eMin) / 2);
  return undefined;
}

/** Inverse relative distance Earth-Sun dr (eq. 23). */
export function inverseRelativeDistance(dayOfYear: number): number {
  assertDayOfYear(dayOfYear);
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365);
}

/** Solar declination δ, rad (eq. 24). */
export function solarDeclination(dayOfYear: number): number {
  assertDayOfYear(dayOfYear);
  return 0.409 * Math.sin((2 * Math.PI * dayOfYear) / 365 - 1.39);
}

/**
 * Sunset hour angle ωs, rad (eq. 25). Beyond the polar circles the argument of arccos
 * leaves [−1, 1]; it is clamped, giving 0 (polar night) or π (midnight sun).
 */
export function sunsetHourAngle(latitudeDeg: number, dayOfYear: number): number {
  assertLatitude(latitudeDeg);
  const phi = (latitudeDeg * Math.PI) / 180;
  const x = -Math.tan(phi) * Math.tan(solarDeclination(dayOfYear));
  return Math.acos(Math.min(1, Math.max(-1, x)));
}

/** Extraterrestrial radiation Ra for daily periods, MJ m⁻² d⁻¹ (eq. 21). */
export function extraterrestrialRadiation(latitudeDeg: number, dayOfYear: number): number {
  const phi = (latitudeDeg * Math.PI) / 180;
  const ws = sunsetHourAngle(latitudeDeg, dayOfYear);
  const dr = inverseRelativeDistance(dayOfYear);
  const delta = solarDeclination(dayOfYear);
  const value = ((24 * 60) / Math.PI) * SOLAR_CONSTANT * dr * (ws * Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.sin(ws));
  return Math.max(0, value);
}

/** Daylight hours N (eq. 34). */
export function daylightHours(latitudeDeg: number, dayOfYear: number): number {
  return (24 / Math.PI) * sunsetHourAngle(latitudeDeg, dayOfYear);
}

/** Solar radiation from sunshine duration, Rs = (as + bs·n/N)·Ra (eq. 35). */
export function solarRadiationFromSunshine(extraterrestrialMJ: number, sunshineHours: number, daylight: number, a = ANGSTROM_A, b = ANGSTROM_B): number {
  assertNonNegative('sunshineHours', sunshineHours);
  if (daylight <= 0) return a * extraterrestrialMJ;
  return (a + (b * Math.min(sunshineHours, daylight)) / daylight) * extraterrestrialMJ;
}

/** Solar radiation from the temperature range, Rs = kRs·√(Tmax − Tmin)·Ra (eq. 50). */
export function solarRadiationFromTemperature(extraterrestrialMJ: number, tMinC: number, tMaxC: number, kRs = KRS_INTERIOR): number {
  assertTemperatures(tMinC, tMaxC);
  return kRs * Math.sqrt(tMaxC - tMinC) * extraterrestrialMJ;
}

/** Clear-sky solar radiation Rso = (0.75 + 2·10⁻⁵ z)·Ra (eq. 37). */
export function clearSkySolarRadiation(extraterrestrialMJ: number, elevationM: number): number {
  return (0.75 + 2e-5 * elevationM) * extraterrestrialMJ;
}

/** Net shortwave radiation Rns = (1 − α)·Rs (eq. 38). */
export function netShortwaveRadiation(solarMJ: number, albedo = REFERENCE_ALBEDO): number {
  return (1 - albedo) * solarMJ;
}

/**
 * Net longwave radiation Rnl (eq. 39), with K = °C + 273.16 and Rs/Rso limited to 1.
 * When Rso is 0 (polar night) the cloudiness factor uses Rs/Rso = 1.
 */
export function netLongwaveRadiation(input: { tMinC: number; tMaxC: number; actualVapourPressureKPa: number; solarMJ: number; clearSkyMJ: number }): number {
  const { tMinC, tMaxC, actualVapourPressureKPa, solarMJ, clearSkyMJ } = input;
  assertTemperatures(tMinC, tMaxC);
  assertNonNegative('actualVapourPressureKPa', actualVapourPressureKPa);
  const tMaxK = tMaxC + 273.16;
  const tMinK = tMinC + 273.16;
  const relative = clearSkyMJ > 0 ? Math.min(1, solarMJ / clearSkyMJ) : 1;
  return STEFAN_BOLTZMANN * ((tMaxK ** 4 + tMinK ** 4) / 2) * (0.34 - 0.14 * Math.sqrt(actualVapourPressureKPa)) * (1.35 * relative - 0.35);
}

/** Net radiation Rn = Rns − Rnl (eq. 40). */
export function netRadiation(netShortwaveMJ: number, netLongwaveMJ: number): number {
  return netShortwaveMJ - netLongwaveMJ;
}

/**
 * Wind speed at 2 m from a measurement at height z m (eq. 47). A reading taken at 2 m is
 * returned as it is (eq. 47 itself gives a factor of 1.0002 at z = 2).
 */
export function windSpeedAt2m(windSpeedMs: number, heightM: number): number {
  assertNonNegative('windSpeedMs', windSpeedMs);
  assertFinite('heightM', heightM);
  if (heightM <= 0.1) throw new AnalysisInputError(`windHeightM must be above 0.1 m (got ${heightM}).`);
  if (heightM === 2) return windSpeedMs;
  return (windSpeedMs * 4.87) / Math.log(67.8 * heightM - 5.42);
}

/** Monthly soil heat flux G = 0.14·(T_month − T_previous month), MJ m⁻² d⁻¹ (eq. 43). */
export function monthlySoilHeatFlux(previousMonthMeanC: number, thisMonthMeanC: number): number {
  assertFinite('previousMonthMeanC', previousMonthMeanC);
  assertFinite('thisMonthMeanC', thisMonthMeanC);
  return 0.14 * (thisMonthMeanC - previousMonthMeanC);
}

export interface HargreavesInput {
  latitudeDeg: number;
  dayOfYear: number;
  tMinC: number;
  tMaxC: number;
}

/** Hargreaves ET0 = 0.0023·(Tmean + 17.8)·√(Tmax − Tmin)·0.408·Ra, mm d⁻¹ (eq. 52). */
export function et0Hargreaves({ latitudeDeg, dayOfYear, tMinC, tMaxC }: HargreavesInput): number {
  assertTemperatures(tMinC, tMaxC);
  const ra = extraterrestrialRadiation(latitudeDeg, dayOfYear);
  const tMean = (tMaxC + tMinC) / 2;
  return Math.max(0, 0.0023 * (tMean + 17.8) * Math.sqrt(tMaxC - tMinC) * MJ_TO_MM * ra);
}

export interface PenmanMonteithInput {
  latitudeDeg: number;
  elevationM: number;
  dayOfYear: number;
  tMinC: number;
  tMaxC: number;
  rhMinPct?: number;
  rhMaxPct?: number;
  rhMeanPct?: number;
  dewPointC?: number;
  actualVapourPressureKPa?: number;
  windSpeedMs: number;
  /** Height of the wind measurement, default 2 m; other heights use eq. 47. */
  windHeightM?: number;
  sunshineHours?: number;
  solarRadiationMJ?: number;
  /** Coastal site: kRs 0.19 instead of 0.16 when radiation must be estimated. */
  coastal?: boolean;
  /** Arid site: dew point taken 2 °C below Tmin when humidity must be estimated. */
  arid?: boolean;
  /** Soil heat flux G, default 0 (daily periods, eq. 42). */
  soilHeatFluxMJ?: number;
}

export interface PenmanMonteithDetail {
  et0Mm: number;
  /** Radiation term 0.408·Δ·(Rn − G) / [Δ + γ(1 + 0.34u2)], mm d⁻¹. */
  radiationTermMm: number;
  /** Aerodynamic term γ·900/(T + 273)·u2·(es − ea) / [Δ + γ(1 + 0.34u2)], mm d⁻¹. */
  aerodynamicTermMm: number;
  pressureKPa: number;
  gamma: number;
  delta: number;
  es: number;
  ea: number;
  u2: number;
  ra: number;
  daylightHours: number;
  rs: number;
  rso: number;
  rns: number;
  rnl: number;
  rn: number;
  /** Which inputs were estimated by FAO-56's rules for missing data. */
  estimated: { humidity: boolean; radiation: boolean };
}

/**
 * FAO Penman-Monteith reference evapotranspiration for a day (eq. 6), with every
 * intermediate. Missing humidity: dew point ≈ Tmin (minus 2 °C in arid places).
 * Missing radiation and sunshine: Rs = kRs·√(Tmax − Tmin)·Ra, kRs 0.16 interior, 0.19 coastal.
 */
export function penmanMonteithDetail(input: PenmanMonteithInput): PenmanMonteithDetail {
  const { latitudeDeg, elevationM, dayOfYear, tMinC, tMaxC } = input;
  assertTemperatures(tMinC, tMaxC);
  assertFinite('elevationM', elevationM);
  const soilHeatFlux = input.soilHeatFluxMJ ?? 0;
  assertFinite('soilHeatFluxMJ', soilHeatFlux);

  const pressureKPa = atmosphericPressure(elevationM);
  const gamma = psychrometricConstant(pressureKPa);
  const tMean = (tMaxC + tMinC) / 2;
  const delta = saturationSlope(tMean);
  const es = meanSaturationVapourPressure(tMinC, tMaxC);

  let ea: number | undefined = input.actualVapourPressureKPa;
  if (ea !== undefined) assertNonNegative('actualVapourPressureKPa', ea);
  if (ea === undefined && input.dewPointC !== undefined) ea = actualVapourPressureFromDewPoint(input.dewPointC);
  if (ea === undefined) ea = actualVapourPressureFromHumidity(input);
  const humidityEstimated = ea === undefined;
  if (ea === undefined) {
    ea = actualVapourPressureFromDewPoint(tMinC - (input.arid ? ARID_DEW_POINT_OFFSET_C : 0));
  }

  const u2 = windSpeedAt2m(input.windSpeedMs, input.windHeightM ?? 2);
  const ra = extraterrestrialRadiation(latitudeDeg, dayOfYear);
  const daylight = daylightHours(latitudeDeg, dayOfYear);
  let rs: number;
  let radiationEstimated = false;
  if (input.solarRadiationMJ !== undefined) {
    assertNonNegative('solarRadiationMJ', input.solarRadiationMJ);
    rs = input.solarRadiationMJ;
  } else if (input.sunshineHours !== undefined) {
    rs = solarRadiationFromSunshine(ra, input.sunshineHours, daylight);
  } else {
    rs = solarRadiationFromTemperature(ra, tMinC, tMaxC, input.coastal ? KRS_COASTAL : KRS_INTERIOR);
    radiationEstimated = true;
  }
  const rso = clearSkySolarRadiation(ra, elevationM);
  const rns = netShortwaveRadiation(rs);
  const rnl = netLongwaveRadiation({ tMinC, tMaxC, actualVapourPressureKPa: ea, solarMJ: rs, clearSkyMJ: rso });
  const rn = netRadiation(rns, rnl);

  const denominator = delta + gamma * (1 + 0.34 * u2);
  const radiationTermMm = (MJ_TO_MM * delta * (rn - soilHeatFlux)) / denominator;
  const aerodynamicTermMm = (gamma * (900 / (tMean + 273)) * u2 * (es - ea)) / denominator;
  return {
    et0Mm: Math.max(0, radiationTermMm + aerodynamicTermMm),
    radiationTermMm,
    aerodynamicTermMm,
    pressureKPa,
    gamma,
    delta,
    es,
    ea,
    u2,
    ra,
    daylightHours: daylight,
    rs,
    rso,
    rns,
    rnl,
    rn,
    estimated: { humidity: humidityEstimated, radiation: radiationEstimated },
  };
}

/** FAO Penman-Monteith ET0, mm d⁻¹ (eq. 6). See penmanMonteithDetail. Negative results are reported as 0. */
export function et0PenmanMonteith(input: PenmanMonteithInput): number {
  return penmanMonteithDetail(input).et0Mm;
}

/** Day of the year (1..366) of an ISO calendar date 'YYYY-MM-DD'. */
export function dayOfYearFromDate(isoDate: string): number {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(isoDate);
  if (!match) throw new AnalysisInputError(`Date must look like YYYY-MM-DD (got "${isoDate}").`);
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  const time = Date.UTC(year, month - 1, day);
  const check = new Date(time);
  if (check.getUTCMonth() !== month - 1 || check.getUTCDate() !== day) {
    throw new AnalysisInputError(`"${isoDate}" is not a real calendar date.`);
  }
  return Math.round((time - Date.UTC(year, 0, 1)) / 86_400_000) + 1;
}

/**
 * One day of weather as entered or imported. Plain interface until the shared weather
 * schema exists; a zod-inferred type with the same fields fits it structurally.
 */
export interface WeatherDay {
  /** ISO date 'YYYY-MM-DD'; used when dayOfYear is not given. */
  date?: string;
  dayOfYear?: number;
  tMinC: number;
  tMaxC: number;
  rhMinPct?: number;
  rhMaxPct?: number;
  rhMeanPct?: number;
  dewPointC?: number;
  actualVapourPressureKPa?: number;
  windSpeedMs?: number;
  windHeightM?: number;
  sunshineHours?: number;
  solarRadiationMJ?: number;
}

export interface GardenSite {
  latitudeDeg: number;
  elevationM: number;
  coastal?: boolean;
  arid?: boolean;
}

export type Et0Method = 'penman-monteith' | 'hargreaves';

export interface Et0ForDay {
  et0Mm: number;
  method: Et0Method;
  /** Inputs filled by FAO-56's missing-data rules (empty for Hargreaves, which needs none). */
  estimated: Array<'humidity' | 'radiation' | 'wind'>;
}

/**
 * ET0 for one day, choosing the method:
 * - Penman-Monteith when at least one of humidity (ea, dew point, RHmax or RHmean),
 *   wind, or sunshine/solar radiation was measured. The missing ones are filled by
 *   FAO-56's rules (dew point ≈ Tmin, Rs from the temperature range, wind 2 m/s), because
 *   FAO-56 prefers Penman-Monteith with estimated data to another equation.
 * - Hargreaves (eq. 52) when only Tmin and Tmax are known.
 * RHmin alone does not count as humidity: no FAO-56 equation gives ea from it.
 */
export function et0ForDay(weatherDay: WeatherDay, garden: GardenSite): Et0ForDay {
  let dayOfYear = weatherDay.dayOfYear;
  if (dayOfYear === undefined) {
    if (weatherDay.date === undefined) throw new AnalysisInputError('A weather day needs a date or a dayOfYear.');
    dayOfYear = dayOfYearFromDate(weatherDay.date);
  }
  const hasHumidity =
    weatherDay.actualVapourPressureKPa !== undefined ||
    weatherDay.dewPointC !== undefined ||
    weatherDay.rhMaxPct !== undefined ||
    weatherDay.rhMeanPct !== undefined;
  const hasWind = weatherDay.windSpeedMs !== undefined;
  const hasRadiation = weatherDay.sunshineHours !== undefined || weatherDay.solarRadiationMJ !== undefined;

  if (!hasHumidity && !hasWind && !hasRadiation) {
    return {
      et0Mm: et0Hargreaves({ latitudeDeg: garden.latitudeDeg, dayOfYear, tMinC: weatherDay.tMinC, tMaxC: weatherDay.tMaxC }),
      method: 'hargreaves',
      estimated: [],
    };
  }
  // Object.assign, not an object spread: the same object, but V8 (Node 20) took ~20 µs per spread
  // here against ~0.2 µs, most of the ET0 time of a season's analysis (benchmark, bench/FINDINGS.md §1).
  const detail = penmanMonteithDetail(
    Object.assign({}, weatherDay, {
      latitudeDeg: garden.latitudeDeg,
      elevationM: garden.elevationM,
      coastal: garden.coastal,
      arid: garden.arid,
      dayOfYear,
      windSpeedMs: weatherDay.windSpeedMs ?? DEFAULT_WIND_SPEED_MS,
      windHeightM: hasWind ? weatherDay.windHeightM : 2,
    }),
  );
  const estimated: Et0ForDay['estimated'] = [];
  if (detail.estimated.humidity) estimated.push('humidity');
  if (detail.estimated.radiation) estimated.push('radiation');
  if (!hasWind) estimated.push('wind');
  return { et0Mm: detail.et0Mm, method: 'penman-monteith', estimated };
}
