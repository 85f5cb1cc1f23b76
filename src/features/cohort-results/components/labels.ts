import { potMakeLabels, potShapeLabels } from '@shared/schemas/pots';
import { soilTextureLabels } from '@shared/schemas/gardens';
import { cropLabel } from '@shared/charts/cohort-charts';
import type { CohortResults, CohortTrialRow, EffectKey, ModeratorKey, QualityFlag } from '@shared/schemas/cohort-results';
import { formatDate } from '@/lib/format';
import { crT, measureLabel, num, sharedT } from './format';

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
      // The server's message names the methods ("… with 2 methods (vwc, tensiometer); …"); read them back for the reader's language.
      const methods = /\(([^)]*)\)/.exec(f.message)?.[1];
      const count = methods ? methods.split(', ').length : 0;
      return { title: t(($) => $.flags.mixedMoisture), details: [methods ? t(($) => $.flags.mixedMoistureDetail, { count, methods }) : f.message] };
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
