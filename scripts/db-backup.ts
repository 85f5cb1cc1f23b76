/**
 * `npm run db:backup [-- <file>]`: a PostgreSQL custom-format dump (pg_dump -Fc, Debian's
 * binaries) of DATABASE_URL, or of the private cluster when it is unset, written to <file> or
 * to <SEEPWISE_DATA_DIR>/backups/<timestamp>.dump. Restore it with `npm run db:restore -- <file>`.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { parseEnv } from '../server/config/env';
import { ensurePgInstalled } from '../server/infra/postgres-cluster';
import { ensureDatabase } from '../server/runtime';

const env = parseEnv();
const bin = ensurePgInstalled(console.log);
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const file = path.resolve(process.argv[2] ?? path.join(env.SEEPWISE_DATA_DIR, 'backups', `${stamp}.dump`));
fs.mkdirSync(path.dirname(file), { recursive: true });

const { url, cluster } = await ensureDatabase(env, console.log);
try {
  // Written beside the target first, so a failed dump never leaves a truncated file under the real name.
  const partial = `${file}.partial`;
  execFileSync(path.join(bin, 'pg_dump'), ['--format=custom', '--no-owner', '--no-privileges', `--file=${partial}`, `--dbname=${url}`], { stdio: 'inherit' });
  fs.renameSync(partial, file);
  console.log(`Backup written to ${file} (${(fs.statSync(file).size / 1024).toFixed(0)} KiB).`);
} finally {
  cluster?.stop();
}
