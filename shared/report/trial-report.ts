/**
 * The methods-and-results text of a trial's report bundle, written from its analysis: the
 * design, n, the estimates with their intervals and caveats, data-quality notes, and how to cite.
 * Pure Markdown generation; the server zips it with the CSVs and charts.
 */
import { describeComparison } from '../analysis/narrative';
import type { TrialAnalysis } from '../analysis/trial-analysis';
import { treatmentName } from '../charts/trial-charts';
import { enT, formatNum, type Translate } from '../i18n/translate';

export interface TrialReportInput {
  title: string;
  crop: string;
  variety: string;
  plantingDate: string;
  endDate: string | null;
  design: string;
  treatments: string[];
  question: string;
  randomisationSeed: string | null;
  analysis: TrialAnalysis & { asOf: string };
  generatedOn: string;
  files: string[];
  /** The reader's language (shared/i18n/translate.ts); English when left out. */
  t?: Translate;
}

export function trialReportMarkdown(r: TrialReportInput): string {
  const t = r.t ?? enT;
  const lang = t.lang;
  const fmt = (v: number | null | undefined, d = 1) => formatNum(v, d, lang);
  const a = r.analysis;
  const pairs = a.comparisons[0]?.pairs.length ?? 0;
  const kc = a.cropWater.kc;
  const lines: string[] = [];
  lines.push(`# ${t('report.trial.heading', { title: r.title })}`, '');
  lines.push(t('report.trial.generated', { date: r.generatedOn, asOf: a.asOf }), '');
  if (r.question) lines.push(t('report.trial.question', { question: r.question }), '');
  lines.push(`## ${t('report.trial.methods')}`, '');
  const crop = `${r.crop}${r.variety ? ` (${r.variety})` : ''}`;
  lines.push(
    r.endDate ? t('report.trial.cropEnded', { crop, planted: r.plantingDate, ended: r.endDate }) : t('report.trial.crop', { crop, planted: r.plantingDate }),
    t('report.trial.design', {
      design: r.design === 'paired' ? t('report.trial.designPaired') : t('report.trial.designRcbd'),
      treatments: r.treatments.map((n) => treatmentName(n, t)).join(t('report.trial.and')),
      count: pairs,
    }),
    r.randomisationSeed ? t('report.trial.assignmentSeed', { seed: r.randomisationSeed }) : t('report.trial.assignmentHand'),
    t('report.trial.water'),
    t('report.trial.wue'),
    t('report.trial.cropWater', {
      pm: a.cropWater.methods['penman-monteith'],
      hg: a.cropWater.methods.hargreaves,
      kc: kc ? t('report.trial.kc', { ini: fmt(kc.ini, 2), mid: fmt(kc.mid, 2), end: fmt(kc.end, 2) }) : '',
    }),
    t('report.trial.statistics'),
    '',
  );
  lines.push(`## ${t('report.trial.results')}`, '');
  lines.push(t('report.trial.tableHeader'), '|---|---:|---:|---:|---:|---:|---:|');
  for (const row of a.treatments) {
    lines.push(`| ${treatmentName(row.treatment, t)} | ${row.plotCount} | ${fmt(row.areaM2)} | ${fmt(row.waterL, 0)} | ${fmt(row.depthMm, 0)} | ${fmt(row.harvestKg, 2)} | ${fmt(row.wueKgPerM3)} |`);
  }
  lines.push('');
  for (const c of a.comparisons) {
    lines.push(`### ${t('report.trial.against', { treatment: treatmentName(c.treatment, t), control: treatmentName(c.control, t) })}`, '');
    for (const s of describeComparison(c, { lang, units: 'metric' })) lines.push(s, '');
  }
  lines.push(`### ${t('report.trial.cropWaterHeading')}`, '');
  lines.push(
    t('report.trial.cropWaterLine', { days: a.cropWater.weatherDays, et0: fmt(a.cropWater.totalEt0Mm), etc: fmt(a.cropWater.totalEtcMm), rain: fmt(a.cropWater.totalRainMm) }),
    '',
  );
  if (a.notices.length) {
    lines.push(`## ${t('report.trial.caveats')}`, '');
    for (const w of a.notices) lines.push(`- ${t(`analysis.warnings.${w.key}`, w.params)}`);
    lines.push('');
  }
  lines.push(`## ${t('report.trial.files')}`, '');
  for (const f of r.files) lines.push(`- \`${f}\``);
  lines.push('', t('report.trial.unitsNote'), '');
  lines.push(`## ${t('report.trial.citation')}`, '', t('report.trial.citationLine', { title: r.title, year: r.plantingDate.slice(0, 4), date: r.generatedOn }), '');
  return lines.join('\n');
}
