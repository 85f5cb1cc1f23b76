/**
 * `npm run db:backup` and `npm run db:restore`: the demo season, backed up from one fresh
 * database and restored into another, comes back identical, table by table (row count and a
 * checksum over every row of every table in the public schema).
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../server/db/data-source';
import { seedDemoIfEmpty } from '../../server/db/seed/demo';
import { createLogger } from '../../server/lib/logger';
import { sharedDatabase, sql } from './support';

let tmp: string;

beforeAll(async () => {
  tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-backup-'));
});

afterAll(() => {
  if (tmp) fs.rmSync(tmp, { recursive: true, force: true });
});

/** Runs an npm script with DATABASE_URL pointing at one database. */
function npmRun(script: string, args: string[], databaseUrl: string, extraEnv: Record<string, string> = {}) {
  return execFileSync('npm', ['run', '--silent', script, '--', ...args], {
    env: { ...process.env, DATABASE_URL: databaseUrl, ...extraEnv },
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
    timeout: 120_000,
  });
}

interface TableState {
  table: string;
  rows: number;
  checksum: string | null;
}

/** Row count and md5 over every row (in a stable order) of each table in the public schema. */
async function tableStates(url: string): Promise<TableState[]> {
  const tables = await sql<{ table_name: string }>(
    url,
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name`,
  );
  const out: TableState[] = [];
  for (const { table_name: table } of tables) {
    const [row] = await sql<{ rows: number; checksum: string | null }>(
      url,
      `SELECT count(*)::int AS rows, md5(string_agg(t::text, '|' ORDER BY t::text)) AS checksum FROM public."${table}" t`,
    );
    out.push({ table, ...row! });
  }
  return out;
}

describe('backup and restore', () => {
  it('restores the demo season into a fresh database with every table identical', async () => {
    const sourceUrl = await sharedDatabase('seepwise_backup_src');
    const ds = createDataSource(sourceUrl, { poolSize: 2 });
    await ds.initialize();
    expect(await seedDemoIfEmpty(ds, createLogger('silent'))).toBe(true);
    await ds.destroy();
    const before = await tableStates(sourceUrl);
    // The demo season really is there: accounts, logs, sessions table and the migration history.
    expect(before.find((t) => t.table === 'users')!.rows).toBeGreaterThan(5);
    expect(before.find((t) => t.table === 'water_events')!.rows).toBeGreaterThan(100);
    expect(before.length).toBeGreaterThan(15);

    // No file given: the dump goes to <SEEPWISE_DATA_DIR>/backups/<timestamp>.dump.
    npmRun('db:backup', [], sourceUrl, { SEEPWISE_DATA_DIR: tmp });
    const dumps = fs.readdirSync(path.join(tmp, 'backups'));
    expect(dumps).toHaveLength(1);
    expect(dumps[0]).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}-\d{2}-\d{2}-\d{3}Z\.dump$/);
    const file = path.join(tmp, 'backups', dumps[0]!);
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('PGDMP');

    const targetUrl = await sharedDatabase('seepwise_backup_dst', { empty: true });
    npmRun('db:restore', [file], targetUrl);
    expect(await tableStates(targetUrl)).toEqual(before);

    // Restoring over a database that has drifted puts it back as it was in the dump.
    await sql(targetUrl, `DELETE FROM water_events WHERE id IN (SELECT id FROM water_events LIMIT 10)`);
    await sql(targetUrl, `UPDATE gardens SET name = 'Changed after the backup'`);
    npmRun('db:restore', [file], targetUrl);
    expect(await tableStates(targetUrl)).toEqual(before);
  });

  it('writes a dump to the path given, and refuses to restore a file that does not exist', async () => {
    const url = await sharedDatabase('seepwise_backup_path', { empty: true });
    const file = path.join(tmp, 'nested', 'empty.dump');
    npmRun('db:backup', [file], url);
    expect(fs.readFileSync(file).subarray(0, 5).toString()).toBe('PGDMP');
    expect(fs.existsSync(`${file}.partial`)).toBe(false);
    expect(() => npmRun('db:restore', [path.join(tmp, 'no-such.dump')], url)).toThrow(/No such backup file/);
  });
});
