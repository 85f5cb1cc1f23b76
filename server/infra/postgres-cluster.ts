/**
 * A private PostgreSQL cluster for development, tests and benchmarks, built from Debian's
 * `postgresql` package. It listens on 127.0.0.1 only, on a port that is not 5432 by default,
 * with its socket inside the data directory. When run as root the server runs as the
 * unprivileged `postgres` system user.
 *
 * This file does process management only; nothing in it is imported by the request path.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

export interface ClusterOptions {
  /** Absolute path of the data directory. */
  dataDir: string;
  port: number;
  /** Database to create if missing. */
  database: string;
  log?: (msg: string) => void;
}

export interface RunningCluster {
  url: string;
  dataDir: string;
  port: number;
  /** True when this process started the server (and so should stop it). */
  startedHere: boolean;
  stop: () => void;
  /** Runs a client binary (createdb, psql, pg_dump...) against the cluster. */
  bin: (name: string) => string;
}

const DB_USER = 'app';

export class ClusterSetupError extends Error {}

function isRoot(): boolean {
  return typeof process.getuid === 'function' && process.getuid() === 0;
}

/** Finds the newest installed PostgreSQL server binaries (Debian layout). */
export function findPgBinDir(): string | null {
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return null;
  const versions = fs
    .readdirSync(root)
    .filter((v) => fs.existsSync(path.join(root, v, 'bin', 'postgres')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(root, versions[0], 'bin') : null;
}

/** Installs Debian's postgresql when run as root; otherwise explains the exact command. */
export function ensurePgInstalled(log: (m: string) => void): string {
  let bin = findPgBinDir();
  if (bin) return bin;
  if (!isRoot()) {
    throw new ClusterSetupError(
      'PostgreSQL server binaries were not found. Install them with:\n' +
        '  sudo apt-get update && sudo apt-get install -y postgresql\n' +
        'or set DATABASE_URL to an existing PostgreSQL server.',
    );
  }
  log('PostgreSQL server not found: installing Debian package "postgresql" (one time)...');
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', 'postgresql'], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  bin = findPgBinDir();
  if (!bin) throw new ClusterSetupError('Installing postgresql did not provide server binaries.');
  return bin;
}

function ensureSystemUser(): void {
  const r = spawnSync('id', ['-u', 'postgres']);
  if (r.status === 0) return;
  execFileSync('useradd', ['--system', '--no-create-home', '--shell', '/usr/sbin/nologin', 'postgres']);
}

/** Runs a PostgreSQL binary, as `postgres` when we are root. */
function runPg(binDir: string, name: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const file = path.join(binDir, name);
  const [cmd, cmdArgs] = isRoot() ? ['runuser', ['-u', 'postgres', '--', file, ...args]] : [file, args];
  const r = spawnSync(cmd, cmdArgs as string[], { cwd: '/', encoding: 'utf8' });
  if (r.status !== 0 && !opts.allowFail) {
    throw new ClusterSetupError(`${name} failed (exit ${r.status}):\n${r.stdout}\n${r.stderr}`);
  }
  return r;
}

/** Can the postgres system user reach this directory (every parent traversable)? */
function postgresCanReach(dir: string): boolean {
  if (!isRoot()) return true;
  let probe = dir;
  while (!fs.existsSync(probe)) probe = path.dirname(probe);
  const r = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', probe], { cwd: '/' });
  return r.status === 0;
}

/**
 * Chooses where the cluster lives: the requested folder when the postgres user can reach it,
 * otherwise (for example a checkout under /root, which is mode 700) a folder under /var/tmp
 * named after the requested one.
 */
export function resolveDataDir(requested: string, log: (m: string) => void): string {
  if (postgresCanReach(path.dirname(requested))) return requested;
  const hash = createHash('sha256').update(requested).digest('hex').slice(0, 12);
  const fallback = path.join('/var/tmp/seepwise-pg', hash);
  log(`The postgres user cannot reach ${requested}; using ${fallback} for the database files.`);
  return fallback;
}

export function portIsFree(port: number, host = '127.0.0.1'): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, host, () => srv.close(() => resolve(true)));
  });
}

function postmasterPid(dataDir: string): number | null {
  const file = path.join(dataDir, 'postmaster.pid');
  if (!fs.existsSync(file)) return null;
  const first = fs.readFileSync(file, 'utf8').split('\n')[0];
  const pid = Number(first);
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

/** The port a running cluster listens on (line 4 of postmaster.pid). */
function postmasterPort(dataDir: string): number | null {
  const lines = fs.readFileSync(path.join(dataDir, 'postmaster.pid'), 'utf8').split('\n');
  const port = Number(lines[3]);
  return Number.isInteger(port) && port > 0 ? port : null;
}

function processIsPostgres(pid: number): boolean {
  try {
    const comm = fs.readFileSync(`/proc/${pid}/comm`, 'utf8').trim();
    return comm.startsWith('postgres');
  } catch {
    return false;
  }
}

export async function startCluster(opts: ClusterOptions): Promise<RunningCluster> {
  const log = opts.log ?? (() => {});
  const binDir = ensurePgInstalled(log);
  if (isRoot()) ensureSystemUser();
  const dataDir = resolveDataDir(opts.dataDir, log);
  let { port } = opts;
  const bin = (name: string) => path.join(binDir, name);

  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    log(`Creating a private PostgreSQL cluster in ${dataDir} ...`);
    // Parents stay traversable for the postgres user; only the data directory itself is private.
    fs.mkdirSync(path.dirname(dataDir), { recursive: true, mode: 0o755 });
    fs.mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    if (isRoot()) execFileSync('chown', ['postgres', dataDir]);
    fs.chmodSync(dataDir, 0o700);
    runPg(binDir, 'initdb', ['-D', dataDir, '-U', DB_USER, '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  }

  // A postmaster.pid left by a crash (SIGKILL, power loss) must not block the next start.
  const pid = postmasterPid(dataDir);
  let alreadyRunning = false;
  if (pid !== null) {
    if (processIsPostgres(pid)) alreadyRunning = true;
    else {
      log('Removing a stale postmaster.pid left by an earlier crash.');
      fs.rmSync(path.join(dataDir, 'postmaster.pid'), { force: true });
    }
  }

  // A cluster already running from this data directory is reused on whatever port it has.
  if (alreadyRunning) port = postmasterPort(dataDir) ?? port;
  const url = `postgres://${DB_USER}@127.0.0.1:${port}/${opts.database}`;

  let startedHere = false;
  if (!alreadyRunning) {
    if (!(await portIsFree(port))) {
      throw new ClusterSetupError(
        `Port ${port} on 127.0.0.1 is taken by another program, so the private PostgreSQL cannot start.\n` +
          `Choose another port with SEEPWISE_PG_PORT=<port>, or point DATABASE_URL at an existing server.`,
      );
    }
    // The socket lives inside the data directory unless that path is too long for a socket.
    const socketDir = dataDir.length < 90 ? dataDir : fs.mkdtempSync('/tmp/seepwise-sock-');
    if (socketDir !== dataDir && isRoot()) execFileSync('chown', ['postgres', socketDir]);
    const pgOpts = `-h 127.0.0.1 -p ${port} -k ${socketDir} -c fsync=${process.env.SEEPWISE_PG_FSYNC ?? 'on'}`;
    runPg(binDir, 'pg_ctl', ['-D', dataDir, '-l', path.join(dataDir, 'server.log'), '-w', '-t', '60', '-o', pgOpts, 'start']);
    startedHere = true;
    log(`PostgreSQL listening on 127.0.0.1:${port}`);
  } else {
    log(`Reusing the PostgreSQL cluster already running from ${dataDir}.`);
  }

  const exists = runPg(
    binDir,
    'psql',
    ['-h', '127.0.0.1', '-p', String(port), '-U', DB_USER, '-d', 'postgres', '-tAc', `SELECT 1 FROM pg_database WHERE datname='${opts.database}'`],
    { allowFail: true },
  );
  if (exists.stdout.trim() !== '1') {
    runPg(binDir, 'createdb', ['-h', '127.0.0.1', '-p', String(port), '-U', DB_USER, opts.database]);
  }

  return {
    url,
    dataDir,
    port,
    startedHere,
    bin,
    stop: () => {
      if (!startedHere) return;
      runPg(binDir, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop'], { allowFail: true });
    },
  };
}

/** Drops and recreates a database in a running cluster (tests and benchmarks). */
export function recreateDatabase(cluster: RunningCluster, name: string): string {
  const binDir = path.dirname(cluster.bin('psql'));
  const common = ['-h', '127.0.0.1', '-p', String(cluster.port), '-U', DB_USER];
  runPg(binDir, 'dropdb', [...common, '--if-exists', '--force', name]);
  runPg(binDir, 'createdb', [...common, name]);
  return `postgres://${DB_USER}@127.0.0.1:${cluster.port}/${name}`;
}
