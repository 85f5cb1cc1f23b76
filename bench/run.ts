/**
 * `npm run bench [-- --scale 0.001] [--skip-browser] [--only client,export] [--out DIR] [--keep-db]`
 * `npm run bench -- --render bench/results.json` rebuilds the table and RESULTS.md from saved measurements.
 *
 * Starts the benchmark's own PostgreSQL (.data/pg-bench on 127.0.0.1:54349), loads the invented
 * scenario, measures, and writes bench/results.json and bench/RESULTS.md. SEEPWISE_PG_FSYNC=off is
 * honoured (and reported) like everywhere else; the default is fsync=on.
 */
import fs from 'node:fs';
import path from 'node:path';
import { defaultOptions, FIGURE_NAMES, runBench, type BenchOptions, type BenchResults, type FigureName } from './bench';
import { runAnalysisOnly, type AnalysisOnlyOptions } from './analysis-only';
import { renderMarkdown, tableRows } from './lib/report';

type Parsed = Partial<BenchOptions> & Partial<Pick<AnalysisOnlyOptions, 'reuseDatabase' | 'iterations' | 'label'>> & { analysisProbe?: boolean };

function parseArgs(argv: string[]): Parsed {
  const o: Parsed = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    const value = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    if (a === '--scale') {
      o.scale = Number(value());
      if (!(o.scale > 0 && o.scale <= 1)) throw new Error('--scale takes a number in (0, 1]');
    } else if (a === '--skip-browser') o.skipBrowser = true;
    else if (a === '--only') {
      const names = value().split(',').map((x) => x.trim()).filter(Boolean);
      const unknown = names.filter((x) => !(FIGURE_NAMES as readonly string[]).includes(x));
      if (!names.length || unknown.length) throw new Error(`--only takes a comma list of figures from ${FIGURE_NAMES.join(', ')}${unknown.length ? `; unknown: ${unknown.join(', ')}` : ''}`);
      o.only = [...new Set(names)] as FigureName[];
    }
    else if (a === '--out') o.outDir = path.resolve(value());
    else if (a === '--keep-db') o.keepDatabase = true;
    else if (a === '--reads-in-process') o.readsInProcess = true;
    else if (a === '--pg-port') o.pgPort = Number(value());
    else if (a === '--analysis-probe') o.analysisProbe = true;
    else if (a === '--reuse-db') o.reuseDatabase = true;
    else if (a === '--iterations') o.iterations = Number(value());
    else if (a === '--label') o.label = value();
    else if (a === '--help' || a === '-h') {
      console.log(`npm run bench -- [--scale 0.001] [--skip-browser] [--only ${FIGURE_NAMES.join(',')}] [--out DIR] [--keep-db] [--reads-in-process] [--pg-port 54349]`);
      console.log('npm run bench -- --analysis-probe [--keep-db] [--reuse-db] [--iterations 50] [--label TEXT] [--pg-port 54349]');
      process.exit(0);
    } else throw new Error(`Unknown option ${a}`);
  }
  return o;
}

// `npm run bench -- --render bench/results.json`: rebuild the table and RESULTS.md from saved measurements.
const renderAt = process.argv.indexOf('--render');
if (renderAt !== -1) {
  const file = path.resolve(process.argv[renderAt + 1] ?? 'bench/results.json');
  const saved = JSON.parse(fs.readFileSync(file, 'utf8')) as BenchResults;
  saved.table = tableRows(saved);
  fs.writeFileSync(file, JSON.stringify(saved, null, 2) + '\n');
  fs.writeFileSync(path.join(path.dirname(file), 'RESULTS.md'), renderMarkdown(saved));
  console.log(`re-rendered ${file} and RESULTS.md`);
  process.exit(0);
}

const { analysisProbe, reuseDatabase, iterations, label, ...parsed } = parseArgs(process.argv.slice(2));
if (analysisProbe) {
  // Figure 1 alone against a kept full-size database, for before/after comparisons from two checkouts
  // (bench/analysis-only.ts): appends to bench/tmp/analysis-only.json, not the full report.
  runAnalysisOnly({ ...defaultOptions(), ...parsed, reuseDatabase: reuseDatabase ?? false, iterations: iterations ?? 50, label: label ?? 'analysis-only' }).then(
    () => process.exit(0),
    (err: unknown) => {
      console.error(err);
      process.exit(1);
    },
  );
} else {
// A partial run does not overwrite the full run's bench/results.json and RESULTS.md unless --out says so.
const options = { ...defaultOptions(), ...(parsed.only ? { outDir: path.join(defaultOptions().tmpDir, 'only') } : {}), ...parsed };
runBench(options).then(
  (r) => {
    const misses = r.table.filter((row) => row.status === 'miss');
    console.log(`\n${r.table.map((row) => `${row.status.padEnd(7)} ${row.id.padEnd(3)} ${row.figure}: ${row.value}`).join('\n')}`);
    if (options.only) console.log(`\n(only ${options.only.join(', ')}; written to ${path.relative(process.cwd(), options.outDir) || '.'})`);
    console.log(`\n${misses.length ? `${misses.length} target(s) missed: see ${path.relative(process.cwd(), path.join(options.outDir, 'RESULTS.md'))} and bench/FINDINGS.md.` : 'Every target met.'}`);
    process.exit(0);
  },
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
}
