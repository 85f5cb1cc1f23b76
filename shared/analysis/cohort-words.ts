/**
 * The cohort results' codes in words, in the reader's language: the reasons and notes the pooling
 * sends as codes (cohort-effects.ts), quality flags, and subgroup (moderator) levels. Used by the
 * cohort page and by the report bundle's methods text (shared/report/cohort-report.ts), so both say
 * the same thing. Pure; words in shared/locales/<lang>/analysis.json (`cohort.*`).
 */
import { moistureMethodLabel } from '../charts/trial-charts';
import { cropLabel } from '../charts/cohort-charts';
import { enT, formatNum, type Translate } from '../i18n/translate';
import type { CohortNoteCode, CohortResults, EffectKey, EffectResult, ModeratorKey, QualityFlag, TrialEffectNoteCode } from '../schemas/cohort-results';
import { soilTextures } from '../schemas/gardens';
import { potMakeSchema, potShapeSchema } from '../schemas/pots';
import { toDisplay, unitLabel, type UnitSystem } from '../units';

/** The effect's long label ("Log ratio of water used…") and how its display values read. */
export function effectWords(effect: EffectKey, t: Translate = enT): { label: string; displayLabel: string } {
  return { label: t(`analysis.cohort.effects.${effect}.label`), displayLabel: t(`analysis.cohort.effects.${effect}.displayLabel`) };
}

/** Why an effect has no pooled estimate; null when it has one. */
export function noPooledReason(e: Pick<EffectResult, 'reasonCode' | 'k'>, t: Translate = enT): string | null {
  return e.reasonCode === 'too_few_trials' ? t('analysis.cohort.tooFewTrials', { count: e.k }) : null;
}

/** Why leave-one-out was not run; null when it was. */
export function leaveOneOutNote(e: Pick<EffectResult, 'k' | 'sensitivity'>, t: Translate = enT): string | null {
  return e.sensitivity.leaveOneOutNoteCode === 'too_few_trials' ? t('analysis.cohort.leaveOneOutTooFew', { count: e.k }) : null;
}

export function trialEffectNote(code: TrialEffectNoteCode | null, t: Translate = enT): string | null {
  return code === null ? null : t(`analysis.cohort.trialNotes.${code}`);
}

/** "How these results were made", one sentence per note code. */
export function cohortNotes(r: Pick<CohortResults, 'noteCodes' | 'options'>, t: Translate = enT): string[] {
  const method = t(`analysis.cohort.methods.${r.options.method}`);
  return r.noteCodes.map((code: CohortNoteCode) => t(`analysis.cohort.notes.${code}`, { method }));
}

/** A quality flag as one sentence (the report bundle); the page words them in its own short form. */
export function flagSentence(f: QualityFlag, t: Translate = enT): string {
  switch (f.kind) {
    case 'out-of-line': {
      const measure = f.effect ? effectWords(f.effect, t).label : '';
      return f.robustZ === null
        ? t('analysis.cohort.flags.outOfLineAllAgree', { measure })
        : t('analysis.cohort.flags.outOfLine', { measure, z: formatNum(f.robustZ, 1, t.lang) });
    }
    case 'wrong-unit': {
      const first = f.weeks[0];
      if (!first) return f.message;
      return t('analysis.cohort.flags.wrongUnit', {
        count: f.weeks.length,
        series: t(`analysis.cohort.flags.series.${first.series}`),
        week: first.weekStart,
        litres: formatNum(first.litresPerEvent, 1, t.lang),
        ratio: formatNum(first.ratioToMedian, 2, t.lang),
      });
    }
    case 'mixed-moisture-methods':
      return t('analysis.cohort.flags.mixedMethods', { count: f.methods.length, methods: f.methods.map((m) => moistureMethodLabel(m, t)).join(', ') });
    case 'closed-without-harvest':
      return t('analysis.cohort.flags.closedWithoutHarvest');
  }
}

/** The pot-capacity classes of potCapacityClass (cohort-effects.ts), with their limits in the reader's units. */
export function potCapacityLevelLabel(level: string, t: Translate = enT, units: UnitSystem = 'metric'): string {
  const v = (litres: number) => `${formatNum(toDisplay(litres, 'volume', units), units === 'us' ? 1 : 0, t.lang)}\u00a0${unitLabel('volume', units)}`;
  if (level === '<6 L') return t('analysis.cohort.levels.capacitySmall', { limit: v(6) });
  if (level === '6–10 L') return t('analysis.cohort.levels.capacityMedium', { from: v(6), to: v(10) });
  if (level === '>10 L') return t('analysis.cohort.levels.capacityLarge', { limit: v(10) });
  return level;
}

// The schemas' own lists, so a shape, make or soil class added there is worded here too.
const SHAPES = potShapeSchema.options;
const MAKES = potMakeSchema.options;
const SOILS = soilTextures;
const isOneOf = <T extends string>(list: readonly T[], v: string): v is T => (list as readonly string[]).includes(v);

export function moderatorName(moderator: ModeratorKey, t: Translate = enT): string {
  return t(`analysis.cohort.moderators.${moderator}`);
}

/** A subgroup level in words; "mixed" means the trial itself mixed several values, "unknown" was not recorded. */
export function moderatorLevelLabel(moderator: ModeratorKey, level: string, t: Translate = enT, units: UnitSystem = 'metric'): string {
  if (level === 'mixed') return t('analysis.cohort.levels.mixed');
  if (level === 'unknown') return t('analysis.cohort.levels.unknown');
  switch (moderator) {
    case 'potCapacity':
      return potCapacityLevelLabel(level, t, units);
    case 'potShape':
      return isOneOf(SHAPES, level) ? t(`analysis.cohort.levels.shapes.${level}`) : level;
    case 'potMake':
      return isOneOf(MAKES, level) ? t(`analysis.cohort.levels.makes.${level}`) : level;
    case 'soilTexture':
      return isOneOf(SOILS, level) ? t(`analysis.cohort.levels.soil.${level}`) : level;
    case 'crop':
      return cropLabel(level, t);
    case 'clayBody':
      return isOneOf(['earthenware', 'terracotta', 'stoneware'] as const, level) ? t(`analysis.cohort.levels.${level}`) : level;
    case 'setting':
      return isOneOf(['in_ground', 'raised_bed', 'container'] as const, level) ? t(`analysis.cohort.levels.${level}`) : level;
    case 'mulch':
    case 'lid':
      if (isOneOf(['mulched', 'bare', 'lid'] as const, level)) return t(`analysis.cohort.levels.${level}`);
      return level === 'no lid' ? t('analysis.cohort.levels.noLid') : level;
  }
}
