/**
 * Proves that `npm run bench` works end to end at a tiny scale (a few hundred rows, a few
 * iterations, no browser): every figure is present in the results object and both files are
 * written. Speed is measured by the benchmark itself, never asserted here.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isSkipped, runBench, type BenchResults } from '../../bench/bench';
import { createTestDatabase } from '../helpers/test-db';

let db: Awaited<ReturnType<typeof createTestDatabase>>;
let dir: string;
let results: BenchResults;

/** A figure the run measured (every figure is selected here); fails with the skip reason otherwise. */
function measured<T extends object>(f: T | { skipped: string }): T {
  if (isSkipped(f)) throw new Error(`figure skipped: ${f.skipped}`);
  return f;
}

beforeAll(async () => {
  db = await createTestDatabase();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-bench-smoke-'));
  results = await runBench({ scale: 0.001, skipBrowser: true, databaseUrl: db.url, outDir: dir, tmpDir: path.join(dir, 'tmp'), log: () => {} });
}, 600_000);

afterAll(async () => {
  await db?.drop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe('npm run bench -- --scale 0.001 --skip-browser', () => {
  it('loads a tiny scenario through the same code as the full one', () => {
    const { half, full, load } = measured(results.scenario);
    expect(full.trials).toBeGreaterThan(half.trials);
    expect(full.logRows).toBeGreaterThan(half.logRows);
    expect(full.logRows).toBeLessThan(5000);
    expect(full.featuredTrialLogRows).toBeGreaterThan(0);
    expect(load.phases.map((p) => p.phase)).toEqual([0, 1]);
  });

  it('has every figure at both sizes', () => {
    for (const size of ['half', 'full'] as const) {
      const f = results.figures[size];
      const analysis = measured(f.analysis);
      const exported = measured(f.export);
      expect(analysis.routeMs.n).toBeGreaterThan(0);
      expect(analysis.bareSqlMs.n).toBe(analysis.routeMs.n);
      expect(analysis.responseBytes).toBeGreaterThan(0);
      // The cohort results route is measured when this checkout has it, and says why when it does not.
      expect('routeMs' in f.cohort || 'skipped' in f.cohort).toBe(true);
      // With the log rollups: the route against its old raw-row SQL, cold and one-trial-changed requests.
      const cache = measured(f.cohortCache ?? { skipped: 'absent' });
      expect([cache.routeMs.n, cache.rawSqlMs.n, cache.coldMs.n, cache.oneChangedMs.n].every((k) => k > 0)).toBe(true);
      expect(exported.rows).toBeGreaterThan(0);
      expect(exported.memory.hwmMb).toBeGreaterThan(0);
    }
    const scenario = measured(results.scenario);
    expect(measured(results.figures.full.export).rows).toBe(scenario.full.networkCohortWaterEvents);
    const writes = measured(results.figures.writes);
    expect(writes.api.ok).toBe(writes.api.requests);
    expect(writes.api.rowsWritten).toBe(writes.api.ok);
    expect(writes.direct.rows).toBe(writes.api.ok);
    const trips = { analysis: measured(results.roundTrips.analysis), write: measured(results.roundTrips.write) };
    expect(trips.analysis.route.length).toBeGreaterThanOrEqual(trips.analysis.bare);
    // The write's INSERT is a statement of its own or inside one WITH statement (bench/lib/query-counter.ts names it).
    expect(trips.write.route.some((q) => q.startsWith('INSERT INTO water_events') || q.endsWith('[INSERT INTO water_events, INSERT INTO audit_entries]'))).toBe(true);
    expect(measured(results.figures.import).rows).toBe(scenario.plan.importRows);
    expect(results.figures.client).toEqual({ skipped: 'browser step skipped (--skip-browser)' });
  });

  it('writes results.json and a RESULTS.md table with a row per figure', () => {
    const written = JSON.parse(fs.readFileSync(path.join(dir, 'results.json'), 'utf8')) as BenchResults;
    expect(written.table).toEqual(results.table);
    const ids = results.table.map((r) => r.id);
    for (const id of ['0', '1a', '1b', '2c', '2d', '3a', '3a′', '3b', '3c', '3c′', '3d', '4a', '4b', '5', '6', '7a', '7b', '7c', '7d']) expect(ids).toContain(id);
    expect(ids.some((id) => id.startsWith('2'))).toBe(true);
    for (const row of results.table) expect(['pass', 'miss', 'info', 'skipped']).toContain(row.status);
    const md = fs.readFileSync(path.join(dir, 'RESULTS.md'), 'utf8');
    expect(md).toContain('| # | Figure | Value | Spread | Target | Pass/miss | Ratio |');
    expect(md.split('\n').filter((l) => /^\| \d[a-d]?′? \|/.test(l))).toHaveLength(results.table.length);
  });
});
