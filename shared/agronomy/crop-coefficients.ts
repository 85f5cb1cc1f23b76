/**
 * Single crop coefficients (Kc) and crop stages after FAO Irrigation and Drainage Paper 56
 * (Allen et al., 1998).
 *
 * - Kc ini / mid / end: FAO-56 Table 12, read in more than one transcription (the FAO text
 *   itself could not be opened). Digitisations disagree on tomato's Kc end, so it is kept
 *   as the range 0.70-0.90. Table 12 values are for a sub-humid climate (RHmin ≈ 45 %,
 *   u2 ≈ 2 m/s); see adjustKcForClimate.
 * - Stage lengths: FAO-56 Table 11 typical lengths for one planting region per crop,
 *   FROM MEMORY (not re-read). They vary widely with climate, cultivar and planting
 *   date: treat them as editable defaults and pass your own `stages`.
 */
import { AnalysisInputError, assertFinite, assertNonNegative, assertPositive } from '../analysis/input-error';

export type CropId = 'tomato' | 'sweet-pepper' | 'squash-zucchini' | 'sweet-melon' | 'watermelon' | 'lettuce' | 'green-beans' | 'cucumber';

export interface KcRange {
  min: number;
  max: number;
}

export interface CropStages {
  /** Initial stage length, days (Kc = Kc ini). */
  initialDays: number;
  /** Crop development, days (Kc rises linearly to Kc mid). */
  developmentDays: number;
  /** Mid-season, days (Kc = Kc mid). */
  midDays: number;
  /** Late season, days (Kc falls linearly to Kc end). */
  lateDays: number;
}

export interface CropCoefficients {
  id: CropId;
  label: string;
  kcIni: number;
  kcMid: number;
  /** Kc at harvest; min = max when Table 12 prints one value. */
  kcEnd: KcRange;
  /** FAO-56 Table 11 typical stage lengths (from memory, see module note). */
  stages: CropStages;
  /** Where the stage lengths in Table 11 were observed, as recalled. */
  stagesRegion: string;
  /** Maximum crop height in m (FAO-56 Table 12, from memory), used by adjustKcForClimate. */
  heightM: number;
}

/** FAO-56 Table 12 single Kc (V(t) in REFERENCES.md); stage lengths and heights from memory. */
export const CROP_COEFFICIENTS: Readonly<Record<CropId, CropCoefficients>> = {
  tomato: {
    id: 'tomato',
    label: 'Tomato',
    kcIni: 0.6,
    kcMid: 1.15,
    kcEnd: { min: 0.7, max: 0.9 },
    stages: { initialDays: 30, developmentDays: 40, midDays: 40, lateDays: 25 },
    stagesRegion: 'arid region, planted January (memory)',
    heightM: 0.6,
  },
  'sweet-pepper': {
    id: 'sweet-pepper',
    label: 'Sweet pepper',
    kcIni: 0.6,
    kcMid: 1.05,
    kcEnd: { min: 0.9, max: 0.9 },
    stages: { initialDays: 25, developmentDays: 35, midDays: 40, lateDays: 20 },
    stagesRegion: 'Europe and Mediterranean, planted April/June (memory)',
    heightM: 0.7,
  },
  'squash-zucchini': {
    id: 'squash-zucchini',
    label: 'Squash, zucchini',
    kcIni: 0.5,
    kcMid: 0.95,
    kcEnd: { min: 0.75, max: 0.75 },
    stages: { initialDays: 25, developmentDays: 35, midDays: 25, lateDays: 15 },
    stagesRegion: 'Mediterranean and arid, planted April/December (memory)',
    heightM: 0.3,
  },
  'sweet-melon': {
    id: 'sweet-melon',
    label: 'Sweet melon',
    kcIni: 0.5,
    kcMid: 1.05,
    kcEnd: { min: 0.75, max: 0.75 },
    stages: { initialDays: 25, developmentDays: 35, midDays: 40, lateDays: 20 },
    stagesRegion: 'Mediterranean, planted May (memory)',
    heightM: 0.4,
  },
  watermelon: {
    id: 'watermelon',
    label: 'Watermelon',
    kcIni: 0.4,
    kcMid: 1.0,
    kcEnd: { min: 0.75, max: 0.75 },
    stages: { initialDays: 20, developmentDays: 30, midDays: 30, lateDays: 30 },
    stagesRegion: 'Italy, planted April (memory)',
    heightM: 0.4,
  },
  lettuce: {
    id: 'lettuce',
    label: 'Lettuce',
    kcIni: 0.7,
    kcMid: 1.0,
    kcEnd: { min: 0.95, max: 0.95 },
    stages: { initialDays: 20, developmentDays: 30, midDays: 15, lateDays: 10 },
    stagesRegion: 'Mediterranean, planted April (memory)',
    heightM: 0.3,
  },
  'green-beans': {
    id: 'green-beans',
    label: 'Green beans',
    kcIni: 0.5,
    kcMid: 1.05,
    kcEnd: { min: 0.9, max: 0.9 },
    stages: { initialDays: 20, developmentDays: 30, midDays: 30, lateDays: 10 },
    stagesRegion: 'California and Mediterranean, planted February/March (memory)',
    heightM: 0.4,
  },
  cucumber: {
    id: 'cucumber',
    label: 'Cucumber',
    kcIni: 0.6,
    kcMid: 1.0,
    kcEnd: { min: 0.75, max: 0.75 },
    stages: { initialDays: 20, developmentDays: 30, midDays: 40, lateDays: 15 },
    stagesRegion: 'arid region, planted June/August (memory)',
    heightM: 0.3,
  },
};

export const CROP_IDS = Object.keys(CROP_COEFFICIENTS) as CropId[];

export function seasonLengthDays(stages: CropStages): number {
  return stages.initialDays + stages.developmentDays + stages.midDays + stages.lateDays;
}

export type CropStageName = 'initial' | 'development' | 'mid' | 'late' | 'after-season';

export interface KcForDayOptions {
  /** Stage lengths replacing the Table 11 defaults. */
  stages?: CropStages;
  /**
   * Kc end to use: 'min', 'max', 'mid' (midpoint of the range, default) or a number.
   * It only matters for crops whose Table 12 value is a range (tomato).
   */
  kcEnd?: 'min' | 'mid' | 'max' | number;
}

export interface KcForDay {
  kc: number;
  stage: CropStageName;
}

function validateStages(stages: CropStages): void {
  assertNonNegative('stages.initialDays', stages.initialDays);
  assertNonNegative('stages.developmentDays', stages.developmentDays);
  assertNonNegative('stages.midDays', stages.midDays);
  assertNonNegative('stages.lateDays', stages.lateDays);
  if (seasonLengthDays(stages) <= 0) throw new AnalysisInputError('The crop season must last at least one day.');
}

function resolveKcEnd(range: KcRange, choice: KcForDayOptions['kcEnd']): number {
  if (typeof choice === 'number') {
    assertPositive('kcEnd', choice);
    return choice;
  }
  if (choice === 'min') return range.min;
  if (choice === 'max') return range.max;
  return (range.min + range.max) / 2;
}

/**
 * Kc on a given day after planting (FAO-56 Fig. 25 construction and eq. 66):
 * Kc ini during the initial stage, linear from Kc ini to Kc mid during development,
 * Kc mid in mid-season, linear from Kc mid to Kc end in the late season, and Kc end after
 * the season. Day 0 is the planting day. Fractional days interpolate.
 */
export function kcForDay(crop: CropId | CropCoefficients, daysSincePlanting: number, options: KcForDayOptions = {}): KcForDay {
  const coefficients = typeof crop === 'string' ? CROP_COEFFICIENTS[crop] : crop;
  if (!coefficients) throw new AnalysisInputError(`Unknown crop "${String(crop)}".`);
  assertFinite('daysSincePlanting', daysSincePlanting);
  if (daysSincePlanting < 0) throw new AnalysisInputError(`daysSincePlanting must not be negative (got ${daysSincePlanting}).`);
  const stages = options.stages ?? coefficients.stages;
  validateStages(stages);
  const kcEnd = resolveKcEnd(coefficients.kcEnd, options.kcEnd);
  const { kcIni, kcMid } = coefficients;

  const endInitial = stages.initialDays;
  const endDevelopment = endInitial + stages.developmentDays;
  const endMid = endDevelopment + stages.midDays;
  const endLate = endMid + stages.lateDays;
  const day = daysSincePlanting;

  // eq. 66: Kc_i = Kc_prev + [(i − ΣL_prev) / L_stage]·(Kc_next − Kc_prev)
  if (day < endInitial) return { kc: kcIni, stage: 'initial' };
  if (day < endDevelopment) {
    return { kc: kcIni + ((day - endInitial) / stages.developmentDays) * (kcMid - kcIni), stage: 'development' };
  }
  if (day < endMid) return { kc: kcMid, stage: 'mid' };
  if (day < endLate) {
    return { kc: kcMid + ((day - endMid) / stages.lateDays) * (kcEnd - kcMid), stage: 'late' };
  }
  return { kc: kcEnd, stage: 'after-season' };
}

/** Crop evapotranspiration under standard conditions ETc = Kc·ET0 (FAO-56 eq. 56), mm d⁻¹. */
export function etc(et0Mm: number, kc: number): number {
  assertNonNegative('et0Mm', et0Mm);
  assertNonNegative('kc', kc);
  return et0Mm * kc;
}

/**
 * Climate adjustment of a Table 12 Kc mid or Kc end (FAO-56 eq. 62), for values ≥ 0.45:
 * Kc = Kc(Tab) + [0.04(u2 − 2) − 0.004(RHmin − 45)]·(h/3)^0.3.
 * u2 in m/s (1-6), RHmin in % (20-80), h crop height in m (0.1-10); inputs are clamped to
 * those ranges as FAO-56 prescribes.
 */
export function adjustKcForClimate(kcTable: number, input: { u2: number; rhMinPct: number; heightM: number }): number {
  assertNonNegative('kcTable', kcTable);
  assertFinite('u2', input.u2);
  assertFinite('rhMinPct', input.rhMinPct);
  assertFinite('heightM', input.heightM);
  if (kcTable < 0.45) return kcTable;
  const u2 = Math.min(6, Math.max(1, input.u2));
  const rhMin = Math.min(80, Math.max(20, input.rhMinPct));
  const h = Math.min(10, Math.max(0.1, input.heightM));
  return kcTable + (0.04 * (u2 - 2) - 0.004 * (rhMin - 45)) * (h / 3) ** 0.3;
}
