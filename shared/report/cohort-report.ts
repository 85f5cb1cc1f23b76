/**
 * The methods-and-results text of a cohort's report bundle (what a student cites): the design,
 * k trials, the pooled estimates with confidence and prediction intervals, heterogeneity,
 * subgroups, sensitivity, the data-quality flags and exclusions, and a citation line with the
 * cohort's licence. Written from the cohort results in the reader's language (`t`, English when
 * left out); pseudonyms only. Words: shared/locales/<lang>/report.json (`cohort`) and the cohort
 * codes' words in analysis.json through shared/analysis/cohort-words.ts.
 */
import { cohortNotes, effectWords, flagSentence, moderatorLevelLabel, moderatorName, noPooledReason } from '../analysis/cohort-words';
import { pseudonymLabel } from '../charts/cohort-charts';
import { enT, formatNum, type Translate } from '../i18n/translate';
import type { CohortResults, EffectResult, PooledEstimate } from '../schemas/cohort-results';

export interface CohortReportInput {
  cohortName: string;
  licence: string;
  results: CohortResults;
  generatedOn: string;
  files: string[];
  /** The reader's language (shared/i18n/translate.ts); English when left out. */
  t?: Translate;
}

/** Licence ids (cohort settings) → their keys under report.cohort.licences (ids hold dots, keys cannot). */
const LICENCE_KEYS = { 'CC-BY-4.0': 'ccBy', 'CC-BY-SA-4.0': 'ccBySa', 'CC0-1.0': 'cc0', 'CC-BY-NC-4.0': 'ccByNc' } as const;
const isLicence = (l: string): l is keyof typeof LICENCE_KEYS => Object.hasOwn(LICENCE_KEYS, l);

export function cohortReportMarkdown(r: CohortReportInput): string {
  const t = r.t ?? enT;
  const res = r.results;
  const conf = res.options.confidence;
  const c = Math.round(conf * 100);
  const n = (v: number | null | undefined, d = 1) => formatNum(v, d, t.lang);
  const p = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v < 0.001 ? `< ${n(0.001, 3)}` : n(v, 3));
  const who = (pseudonym: string) => pseudonymLabel(pseudonym, t);

  const pooledLine = (e: EffectResult, pooled: PooledEstimate): string => {
    const d = pooled.display;
    const prediction = d.predictionInterval
      ? t('report.cohort.predictionPart', { confidence: c, lo: n(d.predictionInterval[0]), hi: n(d.predictionInterval[1]) })
      : t('report.cohort.noPredictionPart');
    return t('report.cohort.pooledLine', {
      label: effectWords(e.effect, t).displayLabel,
      estimate: n(d.estimate),
      confidence: c,
      lo: n(d.ci[0]),
      hi: n(d.ci[1]),
      prediction,
      k: pooled.k,
      method: pooled.method,
      q: n(pooled.q, 2),
      df: pooled.df,
      p: p(pooled.pQ),
      i2: n(pooled.i2, 0),
      tau2: n(pooled.tau2, 4),
    });
  };

  const lines: string[] = [];
  lines.push(`# ${t('report.cohort.heading', { name: r.cohortName })}`, '');
  lines.push(t('report.cohort.generated', { date: r.generatedOn, asOf: res.asOf }), '');
  lines.push(`## ${t('report.cohort.methods')}`, '');
  const rule = t('analysis.cohort.singlePairRule');
  lines.push(
    t('report.cohort.trials', { shared: res.counts.sharedTrials, excluded: res.counts.excluded, flagged: res.counts.flagged }),
    t('report.cohort.design'),
    t('report.cohort.effects'),
    t('report.cohort.pooling', { method: res.options.method === 'DL' ? t('report.cohort.methodDL') : t('report.cohort.methodREML'), confidence: c }),
    res.options.includeSinglePairs ? t('report.cohort.singlePairsIncluded', { rule }) : t('report.cohort.singlePairsLeftOut', { rule }),
    res.options.excludeFlagged ? t('report.cohort.flaggedLeftOut') : t('report.cohort.flaggedKept'),
    '',
  );
  lines.push(`## ${t('report.cohort.results')}`, '');
  for (const e of [res.effects.waterLogRatio, res.effects.wueLogRatio, res.effects.harvestPerPlantDiff]) {
    const words = effectWords(e.effect, t);
    lines.push(`### ${words.label}`, '');
    if (e.pooled) lines.push(pooledLine(e, e.pooled), '');
    else lines.push(t('report.cohort.noPooled', { reason: noPooledReason(e, t) ?? t('analysis.cohort.tooFewTrials', { count: e.k }) }), '');
    const tested = e.subgroups.filter((s) => s.test);
    if (tested.length) {
      lines.push(t('report.cohort.subgroupsIntro'), '');
      lines.push(t('report.cohort.subgroupsHeader'), '|---|---|---:|---:|---:|');
      for (const s of tested) {
        const levels = s.levels
          .map((l) => t(l.smallSample ? 'report.cohort.levelKFew' : 'report.cohort.levelK', { level: moderatorLevelLabel(s.moderator, l.level, t), k: l.k }))
          .join('; ');
        lines.push(`| ${moderatorName(s.moderator, t)} | ${levels} | ${n(s.test!.q, 2)} | ${s.test!.df} | ${p(s.test!.pValue)} |`);
      }
      lines.push('');
    }
    const without = e.sensitivity.withoutFlagged;
    if (without && e.sensitivity.flaggedTrials > 0) {
      lines.push(
        t('report.cohort.sensitivityFlagged', {
          count: e.sensitivity.flaggedTrials,
          label: words.displayLabel.charAt(0).toLocaleLowerCase(t.lang) + words.displayLabel.slice(1),
          estimate: n(without.display.estimate),
          lo: n(without.display.ci[0]),
          hi: n(without.display.ci[1]),
        }),
        '',
      );
    }
    if (e.sensitivity.leaveOneOut.length > 1) {
      const ests = e.sensitivity.leaveOneOut.map((l) => l.estimate);
      lines.push(t('report.cohort.leaveOneOut', { min: n(Math.min(...ests), 3), max: n(Math.max(...ests), 3) }), '');
    }
  }
  lines.push(`## ${t('report.cohort.quality')}`, '');
  const flagged = res.trials.filter((tr) => tr.flags.length);
  if (!flagged.length) lines.push(t('report.cohort.noFlags'), '');
  for (const tr of flagged) for (const f of tr.flags) lines.push(`- ${who(tr.pseudonym)}: ${flagSentence(f, t)}`);
  if (flagged.length) lines.push('');
  if (res.exclusions.length) {
    lines.push(t('report.cohort.excludedHeading'), '');
    // The lead's reason is their own words, quoted as written.
    for (const x of res.exclusions) lines.push(`- ${who(x.pseudonym)}: ${x.reason}`);
    lines.push('');
  }
  const notes = cohortNotes(res, t);
  if (notes.length) {
    lines.push(t('report.cohort.notes'), '');
    for (const note of notes) lines.push(`- ${note}`);
    lines.push('');
  }
  lines.push(`## ${t('report.cohort.caveats')}`, '');
  lines.push(t('report.cohort.caveatSample'), t('report.cohort.caveatIntervals'), t('report.cohort.caveatMeasured'), '');
  lines.push(`## ${t('report.cohort.files')}`, '');
  for (const f of r.files) lines.push(`- \`${f}\``);
  lines.push('', t('report.cohort.filesNote'), '');
  lines.push(`## ${t('report.cohort.citation')}`, '');
  const licence = isLicence(r.licence) ? t(`report.cohort.licences.${LICENCE_KEYS[r.licence]}`) : r.licence;
  lines.push(t('report.cohort.citationLine', { name: r.cohortName, year: res.asOf.slice(0, 4), date: r.generatedOn, licence }), '');
  return lines.join('\n');
}
