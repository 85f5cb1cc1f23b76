import archiver from 'archiver';
import type { Response } from 'express';
import type { PoolClient } from 'pg';
import { to as copyTo } from 'pg-copy-streams';
import { cohortCharts } from '@shared/charts/cohort-charts';
import { trialCharts } from '@shared/charts/trial-charts';
import { cohortReportMarkdown } from '@shared/report/cohort-report';
import { trialReportMarkdown } from '@shared/report/trial-report';
import { cropLabel } from '@shared/charts/cohort-charts';
import type { Translate } from '@shared/i18n/translate';
import type { Crop } from '@shared/schemas/trials';
import type { AppContext } from '../context';
import { renderChart } from '../lib/render-chart';
import { analysisService } from './analysis.service';
import { cohortResultsService } from './cohort-results.service';
import { dictionaryRows, exportSelect, exportTables, type ExportScope } from './export-tables';
import Papa from 'papaparse';

const BOM = '\uFEFF';

/**
 * Report bundles: one ZIP with the CSVs (streamed from COPY), the data dictionary, every chart as
 * SVG and PNG, and a methods-and-results text in Markdown. The archive streams to the response.
 */
export function bundleService(ctx: AppContext) {
  const analysis = analysisService(ctx);
  const cohortResults = cohortResultsService(ctx);

  /** Pipes a ZIP to the response; resolves when the response is finished. */
  function startZip(res: Response, fileName: string) {
    res.status(200);
    res.setHeader('Content-Type', 'application/zip');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.setHeader('Cache-Control', 'no-store');
    const zip = archiver('zip', { zlib: { level: 6 } });
    const finished = new Promise<void>((resolve, reject) => {
      res.on('close', resolve);
      zip.on('error', reject);
    });
    zip.pipe(res);
    return { zip, finished };
  }

  async function withClient<T>(fn: (client: PoolClient) => Promise<T>): Promise<T> {
    const runner = ctx.ds.createQueryRunner();
    const client = (await runner.connect()) as PoolClient;
    try {
      return await fn(client);
    } finally {
      await runner.release();
    }
  }

  /** Adds every table of the scope to the archive, each streamed from its own COPY in turn. */
  async function addTables(zip: archiver.Archiver, client: PoolClient, scope: ExportScope, dir: string, t: Translate) {
    for (const table of exportTables) {
      const sql = exportSelect(table, scope, (v) => client.escapeLiteral(v));
      const stream = client.query(copyTo(`COPY (${sql}) TO STDOUT WITH (FORMAT csv, HEADER true)`));
      const done = new Promise<void>((resolve, reject) => {
        stream.on('end', resolve);
        stream.on('error', reject);
      });
      zip.append(stream, { name: `${dir}/${table.name}.csv` });
      // COPY streams on one connection must run one after another.
      await done;
    }
    const dictionary = dictionaryRows(scope, t, { withTrialsTable: scope.kind === 'cohort' });
    zip.append(BOM + Papa.unparse(dictionary, { newline: '\r\n', escapeFormulae: true }), { name: `${dir}/data-dictionary.csv` });
  }

  return {
    async streamTrialBundle(res: Response, trialId: string, t: Translate) {
      // generated_on: the request's day in the garden's time zone.
      const [trial] = (await ctx.ds.query(
        `SELECT t.title, t.crop, t.crop_name, t.variety, t.planting_date, t.end_date, t.design, t.treatments, t.question, t.randomisation_seed,
                to_char(($2::timestamptz AT TIME ZONE g.time_zone)::date, 'YYYY-MM-DD') AS generated_on
           FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`,
        [trialId, ctx.now()],
      )) as {
        title: string;
        crop: Crop;
        crop_name: string;
        variety: string;
        planting_date: string;
        end_date: string | null;
        design: string;
        treatments: string[];
        question: string;
        randomisation_seed: string | null;
        generated_on: string;
      }[];
      const a = await analysis.forTrial(trialId);
      const charts = trialCharts(a, trial!.treatments, { units: 'metric', width: 640, t });
      const rendered = await Promise.all(charts.map(async (c) => ({ ...c, ...(await renderChart(c.spec, { lang: t.lang })) })));
      const files = [
        ...exportTables.map((t) => `data/${t.name}.csv`),
        'data/data-dictionary.csv',
        ...rendered.flatMap((c) => [`charts/${c.id}.svg`, `charts/${c.id}.png`]),
      ];
      const markdown = trialReportMarkdown({
        title: trial!.title,
        crop: trial!.crop === 'other' ? trial!.crop_name : cropLabel(trial!.crop, t),
        variety: trial!.variety,
        plantingDate: trial!.planting_date,
        endDate: trial!.end_date,
        design: trial!.design,
        treatments: trial!.treatments,
        question: trial!.question,
        randomisationSeed: trial!.randomisation_seed,
        analysis: a,
        generatedOn: trial!.generated_on,
        files,
        t,
      });

      const { zip, finished } = startZip(res, `seepwise-trial-${trialId.slice(0, 8)}-report.zip`);
      zip.append(markdown, { name: 'methods-and-results.md' });
      for (const c of rendered) {
        zip.append(c.svg, { name: `charts/${c.id}.svg` });
        zip.append(c.png, { name: `charts/${c.id}.png` });
      }
      await withClient((client) => addTables(zip, client, { kind: 'trial', trialId }, 'data', t));
      await zip.finalize();
      await finished;
    },

    /** The students' bundle: the cohort's pseudonymised CSVs, its charts, and the methods text with licence. */
    async streamCohortBundle(res: Response, cohortId: string, userId: string, t: Translate) {
      const [cohort] = (await ctx.ds.query('SELECT name, licence FROM cohorts WHERE id = $1', [cohortId])) as { name: string; licence: string }[];
      const results = await cohortResults.results(cohortId, userId, { method: 'DL', confidence: 0.95, includeSinglePairs: false, excludeFlagged: false });
      const charts = cohortCharts(results, { units: 'metric', width: 640, t });
      const rendered = await Promise.all(charts.map(async (c) => ({ ...c, ...(await renderChart(c.spec, { lang: t.lang })) })));
      const files = [
        ...exportTables.map((t) => `data/${t.name}.csv`),
        'data/data-dictionary.csv',
        'data/trials.csv',
        ...rendered.flatMap((c) => [`charts/${c.id}.svg`, `charts/${c.id}.png`]),
      ];
      // A cohort spans gardens in several time zones: its report is dated by the request's UTC day.
      const markdown = cohortReportMarkdown({ cohortName: cohort!.name, licence: cohort!.licence, results, generatedOn: ctx.now().toISOString().slice(0, 10), files, t });
      const { zip, finished } = startZip(res, `seepwise-cohort-${cohortId.slice(0, 8)}-report.zip`);
      zip.append(markdown, { name: 'methods-and-results.md' });
      // One row per trial with its pseudonym, effects, flags and exclusion: the table behind the forest plot.
      const trialRows = results.trials.map((t) => ({
        member: t.pseudonym,
        crop: t.crop,
        region: t.region.label,
        soil_texture: t.soilTexture,
        pairs: t.pairs,
        completeness_pct: t.completeness.share === null ? '' : Math.round(t.completeness.share * 100),
        water_log_ratio: t.effects.waterLogRatio?.estimate ?? '',
        water_log_ratio_variance: t.effects.waterLogRatio?.variance ?? '',
        flags: t.flags.map((f) => f.kind).join(' '),
        excluded: results.exclusions.some((x) => x.trialId === t.trialId) ? 'true' : 'false',
      }));
      zip.append(BOM + Papa.unparse(trialRows, { newline: '\r\n', escapeFormulae: true }), { name: 'data/trials.csv' });
      for (const c of rendered) {
        zip.append(c.svg, { name: `charts/${c.id}.svg` });
        zip.append(c.png, { name: `charts/${c.id}.png` });
      }
      await withClient((client) => addTables(zip, client, { kind: 'cohort', cohortId }, 'data', t));
      await zip.finalize();
      await finished;
    },
  };
}
