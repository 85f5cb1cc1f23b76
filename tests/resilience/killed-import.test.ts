/**
 * The app process is killed (SIGKILL, no chance to clean up) in the middle of a 100,000-row CSV
 * import, while the import's transaction has already written rows. After a restart nothing of
 * that import is in the database, the session survived, and importing the same rows again
 * inserts all of them.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HttpClient, makeTrial, sharedDatabase, sleep, sql } from './support';

let dbUrl: string;
const children: ChildProcess[] = [];

beforeAll(async () => {
  dbUrl = await sharedDatabase('seepwise_killed_import');
});

afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) killGroup(c);
});

/** Starts tests/resilience/app-server.ts in its own process group; resolves with its base URL. */
async function startAppProcess(): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn(path.resolve('node_modules/.bin/tsx'), ['--tsconfig', 'server/tsconfig.json', 'tests/resilience/app-server.ts'], {
    detached: true,
    env: { ...process.env, DATABASE_URL: dbUrl, PORT: '0' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let stderr = '';
  child.stderr!.on('data', (d: Buffer) => (stderr += d.toString()));
  const url = await new Promise<string>((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => reject(new Error(`app process did not start in 60 s:\n${stderr}`)), 60_000);
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const line = out.split('\n').find((l) => l.startsWith('{'));
      if (line) {
        clearTimeout(timer);
        resolve((JSON.parse(line) as { listening: string }).listening);
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`app process exited (${code}) before listening:\n${stderr}`));
    });
  });
  return { child, url };
}

/** SIGKILL to the whole process group we started (tsx and the node process it runs). */
function killGroup(child: ChildProcess) {
  try {
    process.kill(-child.pid!, 'SIGKILL');
  } catch {
    // already gone
  }
}

const ROWS = 100_000;
/** 100,000 surface waterings, one a minute from 1 March 2026, over the four plots. */
function importRows() {
  const start = Date.parse('2026-03-01T00:00:00Z');
  const labels = ['A1', 'A2', 'B1', 'B2'];
  return Array.from({ length: ROWS }, (_, i) => ({
    line: i + 2,
    plotLabel: labels[i % 4]!,
    occurredAt: new Date(start + i * 60_000).toISOString(),
    kind: 'surface',
    volumeL: 1 + (i % 40) / 4,
  }));
}

describe('the app killed during a large import', () => {
  it('leaves nothing of the import behind, and the same import then inserts every row', async () => {
    const first = await startAppProcess();
    const grower = new HttpClient(first.url);
    await grower.signUp(`kill.${Date.now()}@example.test`);
    const { trialId } = await makeTrial(grower, '2026-02-15');
    const body = JSON.stringify({ kind: 'water-events', fileName: 'season.csv', rows: importRows() });

    const monitor = new pg.Client({ connectionString: dbUrl });
    await monitor.connect();
    try {
      let answered = false;
      const inFlight = grower
        .post(`/api/trials/${trialId}/import`, undefined, { rawBody: body, timeoutMs: 120_000 })
        .then((r) => ((answered = true), r))
        .catch((err: Error) => err);

      // Kill only once the import's transaction has written rows (it holds a transaction id) and not committed.
      let writing = false;
      for (let i = 0; i < 6000 && !answered; i++) {
        const { rows } = await monitor.query(
          `SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_xid IS NOT NULL`,
        );
        if (rows[0].n > 0) {
          writing = true;
          break;
        }
        await sleep(20);
      }
      expect(writing).toBe(true);
      killGroup(first.child);
      const outcome = await inFlight;
      // The request never got an answer: the process died under it.
      expect(outcome).toBeInstanceOf(Error);

      // PostgreSQL notices the dead client and rolls its transaction back.
      let open = -1;
      for (let i = 0; i < 200; i++) {
        const { rows } = await monitor.query(`SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid()`);
        open = rows[0].n;
        if (open === 0) break;
        await sleep(50);
      }
      expect(open).toBe(0);
    } finally {
      await monitor.end();
    }
    expect(await sql(dbUrl, 'SELECT count(*)::int AS n FROM water_events')).toEqual([{ n: 0 }]);

    // A new process on the same database: the session cookie still works (sessions live in PostgreSQL).
    const second = await startAppProcess();
    grower.baseUrl = second.url;
    expect((await grower.get('/api/account')).status).toBe(200);
    const again = await grower.post(`/api/trials/${trialId}/import`, undefined, { rawBody: body, timeoutMs: 120_000 });
    expect(again.status).toBe(201);
    expect(again.body.data).toEqual({ received: ROWS, inserted: ROWS, alreadyImported: 0 });
    expect(await sql(dbUrl, 'SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1', [trialId])).toEqual([{ n: ROWS }]);
    killGroup(second.child);
  });
});
