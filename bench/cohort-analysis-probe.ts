/**
 * Figure 2's pure part alone: `analyseCohort` (shared/analysis/cohort-effects.ts) and
 * `JSON.stringify` of its answer, on the 500-trial cohort's aggregates, without a server.
 *
 *   npx tsx --tsconfig server/tsconfig.json bench/cohort-analysis-probe.ts --dump [--pg-port 54352]
 *     reads the aggregates, exactly as the route's SQL returns them, from the database a
 *     `npm run bench -- --only cohort --keep-db` run left in .data/pg-bench (refreshing stale rollups
 *     first, as the route does) into bench/tmp/cohort-probe/inputs.json;
 *   npx tsx bench/cohort-analysis-probe.ts --against <git rev> [--rounds 30]
 *     extracts <rev>'s shared/ into bench/tmp/cohort-probe/<rev>/, checks that both give the same
 *     JSON, byte for byte, for 8 option sets (when <rev> predates a trim of the response: its answer
 *     cut down to the current schema, and the dropped forest fields equal to those forestTrials joins
 *     from the trial rows), then times both in one process, interleaved (the order alternates each
 *     round), and prints min / median / p90 per step.
 *
 * For a profile: `node --cpu-prof` on a bundle of this file (esbuild --bundle), so frames keep names.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type * as CohortEffects from '../shared/analysis/cohort-effects';

const REPO_ROOT = path.resolve(import.meta.dirname, '..');
const DIR = path.join(REPO_ROOT, 'bench', 'tmp', 'cohort-probe');
const INPUTS = path.join(DIR, 'inputs.json');

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(name);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

async function dump(port: number) {
  const { createDataSource } = await import('../server/db/data-source');
  const { startCluster } = await import('../server/infra/postgres-cluster');
  const { cohortResultsQueries: q } = await import('../server/services/cohort-results.service');
  const { refreshTrialRollups } = await import('../server/services/log-rollups');
  const cluster = await startCluster({ dataDir: path.join(REPO_ROOT, '.data', 'pg-bench'), port, database: 'postgres', log: console.log });
  try {
    const ds = createDataSource(`postgres://app@127.0.0.1:${cluster.port}/seepwise_bench`);
    await ds.initialize();
    try {
      // The benchmark's big cohort (bench/lib/scenario.ts).
      const [cohort] = (await ds.query(`SELECT id, lead_id FROM cohorts WHERE name = 'Dryland Olla Programme 2026'`)) as { id: string; lead_id: string }[];
      if (!cohort) throw new Error('No benchmark cohort in seepwise_bench: run `npm run bench -- --skip-browser --only cohort --keep-db` first.');
      const today = new Date().toISOString().slice(0, 10);
      const stale = (await ds.query(q.stale, [cohort.id])) as { id: string }[];
      if (stale.length) await refreshTrialRollups(ds, stale.map((t) => t.id));
      const rows = (await ds.query(q.trials, [cohort.id, cohort.lead_id, today])) as Record<string, unknown>[];
      const trials = rows.map(({ exclusionReason, exclusionCreatedAt, excludedByMe, ...t }) => ({
        ...t,
        exclusion: exclusionReason != null && exclusionCreatedAt != null ? { reason: exclusionReason, createdAt: (exclusionCreatedAt as Date).toISOString(), excludedByMe } : null,
      }));
      const out = {
        cohortId: cohort.id,
        asOf: today,
        trials,
        blocks: await ds.query(q.blocks, [cohort.id]),
        water: await ds.query(q.water, [cohort.id, today]),
        progress: await ds.query(q.progress, [cohort.id]),
      };
      fs.mkdirSync(DIR, { recursive: true });
      fs.writeFileSync(INPUTS, JSON.stringify(out));
      console.log(`${trials.length} trials, ${out.blocks.length} blocks, ${out.water.length} trial water rows, ${out.progress.length} progress rows → ${path.relative(REPO_ROOT, INPUTS)}`);
    } finally {
      await ds.destroy();
    }
  } finally {
    cluster.stop();
  }
}

function stats(values: number[]) {
  const v = [...values].sort((a, b) => a - b);
  const at = (p: number) => v[Math.min(v.length - 1, Math.floor(p * v.length))]!;
  return `min ${v[0]!.toFixed(1).padStart(6)}  median ${at(0.5).toFixed(1).padStart(6)}  p90 ${at(0.9).toFixed(1).padStart(6)} ms`;
}

async function compare(rev: string, rounds: number) {
  if (!fs.existsSync(INPUTS)) throw new Error(`No ${path.relative(REPO_ROOT, INPUTS)}: run with --dump first.`);
  const sha = execFileSync('git', ['rev-parse', '--short', rev], { cwd: REPO_ROOT, encoding: 'utf8' }).trim();
  const oldDir = path.join(DIR, sha);
  if (!fs.existsSync(path.join(oldDir, 'shared'))) {
    fs.mkdirSync(oldDir, { recursive: true });
    execFileSync('sh', ['-c', `git archive ${sha} shared | tar -x -C ${JSON.stringify(oldDir)}`], { cwd: REPO_ROOT });
  }
  const impls: [string, typeof CohortEffects][] = [
    [sha, (await import(pathToFileURL(path.join(oldDir, 'shared/analysis/cohort-effects.ts')).href)) as typeof CohortEffects],
    ['working tree', await import('../shared/analysis/cohort-effects')],
  ];
  const input = JSON.parse(fs.readFileSync(INPUTS, 'utf8')) as Omit<CohortEffects.CohortAnalysisInput, 'options'>;
  const optionSets: CohortEffects.CohortOptions[] = [];
  for (const method of ['DL', 'REML'] as const)
    for (const includeSinglePairs of [false, true]) for (const excludeFlagged of [false, true]) optionSets.push({ method, confidence: 0.95, includeSinglePairs, excludeFlagged });
  const { cohortResultsSchema } = await import('../shared/schemas/cohort-results');
  const { forestTrials } = await import('../shared/charts/cohort-charts');
  let projected = 0;
  for (const options of optionSets) {
    const [oldResult, newResult] = impls.map(([, m]) => m.analyseCohort({ ...input, options }));
    if (JSON.stringify(oldResult) === JSON.stringify(newResult)) continue;
    // A trimmed response (fields dropped from the schema): the old answer, cut down to today's schema (zod drops
    // unknown keys), must equal the new one byte for byte, and every dropped forest field must come back,
    // identical, from the trial rows (forestTrials).
    const cut = (r: unknown) => JSON.stringify(cohortResultsSchema.parse(r));
    if (cut(oldResult) !== cut(newResult)) throw new Error(`Different answers for ${JSON.stringify(options)}`);
    const old = oldResult as unknown as { effects: Record<string, { forest: Record<string, unknown>[] }> };
    for (const key of ['waterLogRatio', 'wueLogRatio', 'harvestPerPlantDiff'] as const) {
      const joined = forestTrials(newResult!, key);
      old.effects[key]!.forest.forEach((f, i) => {
        for (const field of ['pseudonym', 'estimate', 'variance', 'pairs', 'source', 'flagged'] as const) {
          if (field in f && f[field] !== joined[i]![field]) throw new Error(`forest ${key}[${i}].${field}: ${String(f[field])} ≠ ${String(joined[i]![field])} for ${JSON.stringify(options)}`);
        }
      });
    }
    projected += 1;
  }
  console.log(
    `same JSON from ${sha} and the working tree for ${optionSets.length} option sets (${input.trials.length} trials)` +
      (projected ? `; ${projected} of them after cutting ${sha}'s answer down to the current schema (dropped forest fields equal to the trial rows')` : ''),
  );
  const times = new Map<string, number[]>();
  const record = (key: string, ms: number) => times.set(key, [...(times.get(key) ?? []), ms]);
  for (let r = 0; r < rounds; r += 1) {
    for (const [name, m] of r % 2 === 0 ? impls : [...impls].reverse()) {
      let t = performance.now();
      m.describeTrials(input.trials, input.blocks, input.water);
      record(`${name.padEnd(12)} describeTrials`, performance.now() - t);
      for (const method of ['DL', 'REML'] as const) {
        t = performance.now();
        const result = m.analyseCohort({ ...input, options: { method, confidence: 0.95, includeSinglePairs: false, excludeFlagged: false } });
        const analysed = performance.now();
        JSON.stringify(result);
        record(`${name.padEnd(12)} analyseCohort ${method}`, analysed - t);
        record(`${name.padEnd(12)} JSON.stringify ${method}`, performance.now() - analysed);
      }
    }
  }
  for (const [key, values] of [...times.entries()].sort((a, b) => a[0].slice(13).localeCompare(b[0].slice(13)))) console.log(`${key.padEnd(36)} ${stats(values)}`);
}

if (process.argv.includes('--dump')) await dump(Number(arg('--pg-port') ?? 54352));
else await compare(arg('--against') ?? 'HEAD', Number(arg('--rounds') ?? 30));
