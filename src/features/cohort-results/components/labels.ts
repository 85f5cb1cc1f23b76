import { potMakeLabels, potShapeLabels } from '@shared/schemas/pots';
import { soilTextureLabels } from '@shared/schemas/gardens';
import { cropLabel } from '@shared/charts/cohort-charts';
import type { CohortResults, CohortTrialRow, EffectKey, ModeratorKey, QualityFlag } from '@shared/schemas/cohort-results';
import { crT, measureLabels, num, plural, sharedT } from './format';

export const moderatorLabels: Record<ModeratorKey, string> = {
  potCapacity: 'Pot capacity',
  potShape: 'Pot shape',
  clayBody: 'Clay body',
  potMake: 'How the pots were made',
  crop: 'Crop',
  soilTexture: 'Soil texture',
  setting: 'Setting',
  mulch: 'Mulch',
  lid: 'Pot lid',
};

const clayBodyLabels: Record<string, string> = { earthenware: 'Earthenware', terracotta: 'Terracotta', stoneware: 'Stoneware' };
const settingLabels: Record<string, string> = { in_ground: 'In the ground', raised_bed: 'Raised bed', container: 'Container' };
const yesNoLabels: Record<string, string> = { mulched: 'Mulched', bare: 'Bare soil', lid: 'With lid', 'no lid': 'Open, no lid' };

/** A subgroup level in words: "mixed" means the trial itself mixed several values; "unknown" was not recorded. */
export function levelLabel(moderator: ModeratorKey, level: string): string {
  if (level === 'mixed') return 'Mixed within a trial';
  if (level === 'unknown') return 'Not recorded';
  switch (moderator) {
    case 'potCapacity':
      return level;
    case 'potShape':
      return potShapeLabels[level as keyof typeof potShapeLabels] ?? level;
    case 'clayBody':
      return clayBodyLabels[level] ?? level;
    case 'potMake':
      return potMakeLabels[level as keyof typeof potMakeLabels] ?? level;
    case 'crop':
      return cropLabel(level, sharedT());
    case 'soilTexture':
      return soilTextureLabels[level as keyof typeof soilTextureLabels] ?? level;
    case 'setting':
      return settingLabels[level] ?? level;
    case 'mulch':
    case 'lid':
      return yesNoLabels[level] ?? level;
  }
}

export function soilLabel(texture: string): string {
  return soilTextureLabels[texture as keyof typeof soilTextureLabels] ?? texture;
}

const seriesWords = { olla_refill: 'pot refills', surface: 'surface waterings' } as const;

/** A quality flag as a short headline and the particulars. */
export function flagWords(f: QualityFlag): { title: string; details: string[] } {
  switch (f.kind) {
    case 'out-of-line':
      return {
        title: `Far from the other gardens (${(f.effect ? measureLabels[f.effect] : 'result').toLowerCase()})`,
        details: [
          f.robustZ === null
            ? 'Most trials agree exactly, so any difference stands out.'
            : `Modified z-score ${num(f.robustZ, 1)} against the cohort’s median (flagged beyond ±3.5).`,
          'Check the entries and the set-up; a real difference is possible too.',
        ],
      };
    case 'wrong-unit':
      return {
        title: `Possible gallon / litre mix-up (${plural(f.weeks.length, 'week')})`,
        details: f.weeks.map(
          (w) =>
            `Week of ${w.weekStart}, ${seriesWords[w.series]}: ${num(w.litresPerEvent, 1)} L each, ${num(w.ratioToMedian, 2)}× this trial’s usual. ` +
            (w.kind === 'looks-like-gallons-typed-as-litres' ? 'Looks like gallons typed as litres' : 'Looks like gallons converted to litres twice') +
            ` (about ${num(w.suggestedLitresPerEvent, 1)} L each if so). Nothing was changed.`,
        ),
      };
    case 'mixed-moisture-methods':
      return { title: 'Soil moisture read with several methods', details: [f.message] };
    case 'closed-without-harvest':
      return { title: 'Closed without any harvest record', details: ['Harvest and water-use efficiency cannot be worked out for this trial.'] };
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
