import { potMakeLabels, potShapeLabels, type PotMake, type PotShape } from '@shared/schemas/pots';
import { soilTextureLabels, type SoilTexture } from '@shared/schemas/gardens';
import { cropLabel } from '@shared/charts/cohort-charts';
import { moistureMethodLabel } from '@shared/charts/trial-charts';
import { potCapacityLevelLabel } from '@shared/analysis/cohort-words';
import type { UnitSystem } from '@shared/units';
import type { CohortResults, CohortTrialRow, EffectKey, ModeratorKey, QualityFlag } from '@shared/schemas/cohort-results';
import { i18n } from '@/i18n';
import { formatDate } from '@/lib/format';
import { crT, measureLabel, num, sharedT } from './format';

/** A trial feature's name, in the reader's language ("Pot shape"); `lower` for inside a sentence. */
export function moderatorLabel(moderator: ModeratorKey, lower = false): string {
  const t = crT();
  return lower ? t(($) => $.moderatorsLower[moderator]) : t(($) => $.moderators[moderator]);
}

/**
 * Pot shapes and makes and soil textures already have their words in the `pots` and `gardens`
 * namespaces; reuse them once loaded (the Subgroups section asks for both), else the English names
 * from the shared schemas.
 */
function shapeLabel(level: string): string {
  if (!(level in potShapeLabels)) return level;
  return i18n.hasLoadedNamespace('pots') ? i18n.getFixedT(null, 'pots')(($) => $.shapes[level as PotShape]) : potShapeLabels[level as PotShape];
}

function makeLabel(level: string): string {
  if (!(level in potMakeLabels)) return level;
  return i18n.hasLoadedNamespace('pots') ? i18n.getFixedT(null, 'pots')(($) => $.makes[level as PotMake]) : potMakeLabels[level as PotMake];
}

/** A subgroup level in words: "mixed" means the trial itself mixed several values; "unknown" was not recorded. */
export function levelLabel(moderator: ModeratorKey, level: string, units: UnitSystem = 'metric'): string {
  const t = crT();
  if (level === 'mixed') return t(($) => $.levels.mixed);
  if (level === 'unknown') return t(($) => $.levels.unknown);
  switch (moderator) {
    case 'potCapacity':
      return potCapacityLevelLabel(level, sharedT(), units);
    case 'potShape':
      return shapeLabel(level);
    case 'clayBody':
      return level === 'earthenware' || level === 'terracotta' || level === 'stoneware' ? t(($) => $.levels[level]) : level;
    case 'potMake':
      return makeLabel(level);
    case 'crop':
      return cropLabel(level, sharedT());
    case 'soilTexture':
      return soilLabel(level);
    case 'setting':
      return level === 'in_ground' || level === 'raised_bed' || level === 'container' ? t(($) => $.levels[level]) : level;
    case 'mulch':
    case 'lid':
      if (level === 'mulched' || level === 'bare' || level === 'lid') return t(($) => $.levels[level]);
      return level === 'no lid' ? t(($) => $.levels.noLid) : level;
  }
}

/** A soil texture (USDA class) in the reader's language, from the `gardens` namespace once loaded. */
export function soilLabel(texture: string): string {
  if (!(texture in soilTextureLabels)) return texture;
  return i18n.hasLoadedNamespace('gardens')
    ? i18n.getFixedT(null, 'gardens')(($) => $.soil[texture as SoilTexture])
    : soilTextureLabels[texture as SoilTexture];
}

/** A quality flag as a short headline and the particulars. */
export function flagWords(f: QualityFlag): { title: string; details: string[] } {
  const t = crT();
  switch (f.kind) {
    case 'out-of-line':
      return {
        title: t(($) => $.flags.outOfLine, { measure: f.effect ? measureLabel(f.effect, true) : t(($) => $.flags.result) }),
        details: [f.robustZ === null ? t(($) => $.flags.allAgree) : t(($) => $.flags.robustZ, { z: num(f.robustZ, 1) }), t(($) => $.flags.checkEntries)],
      };
    case 'wrong-unit':
      return {
        title: t(($) => $.flags.wrongUnit, { count: f.weeks.length }),
        details: f.weeks.map(
          (w) =>
            `${t(($) => $.flags.weekLine, { week: formatDate(w.weekStart), series: t(($) => $.flags.series[w.series]), litres: num(w.litresPerEvent, 1), ratio: num(w.ratioToMedian, 2) })} ` +
            `${w.kind === 'looks-like-gallons-typed-as-litres' ? t(($) => $.flags.typed) : t(($) => $.flags.twice)} ${t(($) => $.flags.ifSo, { litres: num(w.suggestedLitresPerEvent, 1) })}`,
        ),
      };
    case 'mixed-moisture-methods': {
      const methods = f.methods.map((m) => moistureMethodLabel(m, sharedT())).join(', ');
      return { title: t(($) => $.flags.mixedMoisture), details: [t(($) => $.flags.mixedMoistureDetail, { count: f.methods.length, methods })] };
    }
    case 'closed-without-harvest':
      return { title: t(($) => $.flags.closed), details: [t(($) => $.flags.closedDetail)] };
  }
}

/** Why a trial is not in a measure's pooled estimate, in words (the reader's language); null when it is in. */
export function whyNotPooled(t: CohortTrialRow, key: EffectKey, options: CohortResults['options']): string | null {
  const tr = crT();
  const e = t.effects[key];
  if (e.pooled) return null;
  if (t.exclusion) return tr(($) => $.why.excluded);
  if (options.excludeFlagged && t.flags.length) return tr(($) => $.why.flagged);
  if (e.pairs === 1 && e.estimate !== null) {
    return options.includeSinglePairs ? tr(($) => $.why.singleNoBorrow) : tr(($) => $.why.singleNotIncluded);
  }
  if (e.pairs >= 2 && e.estimate !== null && e.variance === null) return tr(($) => $.why.sameValue);
  if (key !== 'waterLogRatio' && t.completeness.pairsMissingHarvest > 0) return tr(($) => $.why.harvestMissing);
  if (t.pairs === 0) return tr(($) => $.why.noPair);
  return tr(($) => $.why.noRecords);
}

export function trialCrop(t: CohortTrialRow): string {
  return cropLabel(t.crop, sharedT());
}
