/**
 * `npm run db:restore -- <file>`: restores a dump made by `npm run db:backup` into DATABASE_URL,
 * or into the private cluster when it is unset (pg_restore --clean --if-exists: objects in the
 * dump replace those already there). Stop the app first; the restore runs in one transaction,
 * so a failure leaves the database as it was.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { parseEnv } from '../server/config/env';
import { ensurePgInstalled } from '../server/infra/postgres-cluster';
import { ensureDatabase } from '../server/runtime';

const file = process.argv[2];
if (!file || !fs.existsSync(file)) {
  console.error(file ? `No such backup file: ${file}` : 'Usage: npm run db:restore -- <file.dump>');
  process.exit(2);
}
const env = parseEnv();
const bin = ensurePgInstalled(console.log);
const { url, cluster } = await ensureDatabase(env, console.log);
try {
  execFileSync(
    path.join(bin, 'pg_restore'),
    ['--clean', '--if-exists', '--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', `--dbname=${url}`, path.resolve(file)],
    { stdio: 'inherit' },
  );
  console.log(`Restored ${file}.`);
} finally {
  cluster?.stop();
}
