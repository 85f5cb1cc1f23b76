/**
 * The toy garden physics behind the demo season: how fast pots seep, how soils hold water,
 * how much each crop yields. Every constant here is INVENTED for the demo (round numbers shaped
 * like common garden experience), not measured, and never used by the analysis itself.
 */
import type { SoilTexture } from '@shared/schemas/gardens';
import type { PlotSetting } from '@shared/schemas/plots';
import type { PotMake, PotShape } from '@shared/schemas/pots';
import type { Crop } from '@shared/schemas/trials';
import { clamp, roundTo, type Rng } from './random';

/** Soil water at 15 cm (volumetric %, field capacity and wilting point) and how it speeds or slows a pot's seepage. Invented. */
export const SOILS: Record<SoilTexture, { fieldCapacityPct: number; wiltingPct: number; seepFactor: number }> = {
  sand: { fieldCapacityPct: 10, wiltingPct: 4, seepFactor: 1.25 },
  loamy_sand: { fieldCapacityPct: 14, wiltingPct: 6, seepFactor: 1.2 },
  sandy_loam: { fieldCapacityPct: 20, wiltingPct: 9, seepFactor: 1.1 },
  loam: { fieldCapacityPct: 28, wiltingPct: 12, seepFactor: 1.0 },
  silt_loam: { fieldCapacityPct: 31, wiltingPct: 13, seepFactor: 0.95 },
  silt: { fieldCapacityPct: 32, wiltingPct: 12, seepFactor: 0.95 },
  sandy_clay_loam: { fieldCapacityPct: 27, wiltingPct: 16, seepFactor: 0.95 },
  clay_loam: { fieldCapacityPct: 33, wiltingPct: 19, seepFactor: 0.9 },
  silty_clay_loam: { fieldCapacityPct: 36, wiltingPct: 20, seepFactor: 0.88 },
  sandy_clay: { fieldCapacityPct: 33, wiltingPct: 22, seepFactor: 0.85 },
  silty_clay: { fieldCapacityPct: 40, wiltingPct: 25, seepFactor: 0.82 },
  clay: { fieldCapacityPct: 42, wiltingPct: 27, seepFactor: 0.8 },
};

/** Containers and raised beds dry faster around a pot than open ground. Invented. */
export const SETTING_SEEP_FACTOR: Record<PlotSetting, number> = { in_ground: 1, raised_bed: 1.1, container: 1.4 };

/**
 * Pot seepage in air, L/day, for a 1 L pot; larger pots scale with wall area (capacity^(2/3)).
 * Lower firing (cone 06) leaves the wall more porous than cone 04. Invented.
 */
export const AIR_SEEP_L_PER_DAY_1L = 0.14;
export const CONE_POROSITY: Record<string, number> = { '06': 1.1, '05': 1.0, '04': 0.85, unknown: 1.0 };
export const MAKE_POROSITY: Record<PotMake, number> = { wheel_thrown: 1, coil_built: 1.1, slip_cast: 0.9, joined_terracotta: 1.15 };

/**
 * In the bed a pot loses more than in air once roots wrap it: uptake doubles over the first two
 * weeks, and follows the day's evaporative demand (ET0 against 7 mm) loosely.
 */
export const POT_UPTAKE = { atPlanting: 1.0, full: 2.0, daysToFull: 14, referenceEt0Mm: 7, et0Exponent: 0.4, lidlessFactor: 1.1, wetSoilFactor: 0.5 } as const;

/**
 * Garden beds of a few plants rarely reach the full cover FAO-56 Kc assumes: the share of ETc a
 * bed really uses rises from 0.35 at planting to 0.8 at full size. Invented.
 */
export const GROUND_COVER = { atPlanting: 0.35, full: 0.8, daysToFull: 50 } as const;

export function groundCover(daysSincePlanting: number): number {
  return GROUND_COVER.atPlanting + (GROUND_COVER.full - GROUND_COVER.atPlanting) * Math.min(1, daysSincePlanting / GROUND_COVER.daysToFull);
}

/** Share of surface water that reaches the roots (the rest evaporates or runs off). Invented. */
export const SURFACE_EFFICIENCY = 0.8;
/** Water the top 15 cm can hold between dry and wet, mm: drives the moisture readings. Invented. */
export const ROOT_ZONE_STORE_MM = 35;
/** Below this wetness (0-1) the plants are short of water and later picks suffer. Invented. */
export const DRY_WETNESS = 0.1;
/** How wet (0-1) the soil beside a working pot stays. Invented. */
export const OLLA_WETNESS = 0.72;
/** A surface bed is watered when its deficit reaches this (mm). */
export const SURFACE_TRIGGER_MM = 1.5;
/** Watering-in at planting, mm. */
export const WATERING_IN_MM = 6;

/**
 * Invented home-garden yields: kg per m² over a full picking season, days from planting to the
 * first pick, days between picks, mass of one fruit (for counts) and the marketable share.
 */
export const CROP_PROFILES: Record<
  Crop,
  {
    seasonKgPerM2: number;
    daysToFirstPick: number;
    pickEveryDays: readonly [number, number];
    fruitKg: number;
    marketableShare: readonly [number, number];
    plantsPerM2: number;
  }
> = {
  tomato: { seasonKgPerM2: 5.5, daysToFirstPick: 70, pickEveryDays: [3, 5], fruitKg: 0.14, marketableShare: [0.8, 0.95], plantsPerM2: 1 },
  'squash-zucchini': { seasonKgPerM2: 6.5, daysToFirstPick: 55, pickEveryDays: [2, 4], fruitKg: 0.32, marketableShare: [0.75, 0.95], plantsPerM2: 0.7 },
  'sweet-pepper': { seasonKgPerM2: 2.6, daysToFirstPick: 74, pickEveryDays: [5, 8], fruitKg: 0.12, marketableShare: [0.85, 0.97], plantsPerM2: 3 },
  'sweet-melon': { seasonKgPerM2: 4.5, daysToFirstPick: 78, pickEveryDays: [4, 7], fruitKg: 1.3, marketableShare: [0.8, 0.95], plantsPerM2: 0.7 },
  'green-beans': { seasonKgPerM2: 1.1, daysToFirstPick: 50, pickEveryDays: [3, 4], fruitKg: 0.008, marketableShare: [0.85, 0.95], plantsPerM2: 12 },
  watermelon: { seasonKgPerM2: 4, daysToFirstPick: 85, pickEveryDays: [5, 8], fruitKg: 5, marketableShare: [0.8, 0.95], plantsPerM2: 0.5 },
  lettuce: { seasonKgPerM2: 2, daysToFirstPick: 40, pickEveryDays: [4, 7], fruitKg: 0.3, marketableShare: [0.8, 0.95], plantsPerM2: 9 },
  cucumber: { seasonKgPerM2: 5, daysToFirstPick: 50, pickEveryDays: [2, 4], fruitKg: 0.3, marketableShare: [0.8, 0.95], plantsPerM2: 1.5 },
  other: { seasonKgPerM2: 2, daysToFirstPick: 60, pickEveryDays: [5, 8], fruitKg: 0.2, marketableShare: [0.8, 0.95], plantsPerM2: 2 },
};
/** Picking season the yields above assume, days. */
export const FULL_PICKING_DAYS = 60;

/** Seep rate in air (L/day) of a pot, before the test's own measuring noise. */
export function airSeepLPerDay(capacityL: number, cone: string | null, make: PotMake, rng: Rng, matchedSet = false): number {
  return AIR_SEEP_L_PER_DAY_1L * capacityL ** (2 / 3) * CONE_POROSITY[cone ?? 'unknown']! * MAKE_POROSITY[make] * rng.factor(matchedSet ? 0.03 : 0.12);
}

/** Plausible dimensions (cm) for a pot of this shape and capacity: volume ≈ fill factor × simple solid. */
export function potDimensions(shape: PotShape, capacityL: number, rng: Rng): { heightCm: number; widestDiameterCm: number; neckDiameterCm: number } {
  const cm3 = capacityL * 1000;
  // height = aspect × diameter; volume = fill × π/4 × d² × h  ⇒  d = ∛(volume / (fill × π/4 × aspect))
  const solids: Record<PotShape, { aspect: number; fill: number; neckCm: readonly [number, number] }> = {
    globe: { aspect: 1.05, fill: 0.6, neckCm: [6, 8] },
    bottle: { aspect: 1.5, fill: 0.55, neckCm: [4.5, 6] },
    cylinder: { aspect: 1.8, fill: 0.85, neckCm: [7, 9] },
    twin_pot: { aspect: 1.3, fill: 0.5, neckCm: [2.5, 3] },
  };
  const s = solids[shape];
  const d = Math.cbrt(cm3 / (s.fill * (Math.PI / 4) * s.aspect));
  return {
    widestDiameterCm: roundTo(d * rng.factor(0.03), 0.5),
    heightCm: roundTo(d * s.aspect * rng.factor(0.04), 0.5),
    neckDiameterCm: roundTo(rng.uniform(s.neckCm[0], s.neckCm[1]), 0.5),
  };
}

/** Soil wetness (0 dry … 1 wet) as the grower's instrument reads it. */
export function moistureValue(method: 'vwc' | 'tensiometer' | 'probe_index', wetness: number, soil: SoilTexture, rng: Rng): number {
  const w = clamp(wetness, 0, 1);
  if (method === 'vwc') {
    const s = SOILS[soil];
    return Math.round(clamp(s.wiltingPct + w * (s.fieldCapacityPct - s.wiltingPct) + rng.normal(0, 0.8), 1, 60) * 10) / 10;
  }
  if (method === 'tensiometer') return Math.round(clamp(4 + 76 * (1 - w) ** 1.8 + rng.normal(0, 1.5), 0, 85));
  return Math.round(clamp(1 + 9 * w + rng.normal(0, 0.5), 1, 10));
}

/** The stress threshold a grower would set for each method (below for VWC and index, above for kPa). */
export function stressThreshold(method: 'vwc' | 'tensiometer' | 'probe_index', soil: SoilTexture): number {
  if (method === 'vwc') {
    const s = SOILS[soil];
    return Math.round(s.wiltingPct + 0.35 * (s.fieldCapacityPct - s.wiltingPct));
  }
  return method === 'tensiometer' ? 40 : 3;
}
