/** Starts bench/server-child.ts in its own Node process and reads its memory from /proc. */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface ChildServer {
  url: string;
  pid: number;
  memory: () => { rssKb: number; hwmKb: number };
  stop: () => Promise<void>;
}

export function readMemory(pid: number): { rssKb: number; hwmKb: number } {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (key: string) => Number(new RegExp(`^${key}:\\s+(\\d+) kB`, 'm').exec(status)?.[1] ?? NaN);
  return { rssKb: kb('VmRSS'), hwmKb: kb('VmHWM') };
}

/** Samples VmRSS every `everyMs` until stopped; returns the peak and the samples. */
export function sampleMemory(pid: number, everyMs = 20) {
  const samples: number[] = [];
  const timer = setInterval(() => {
    try {
      samples.push(readMemory(pid).rssKb);
    } catch {
      /* the process is gone */
    }
  }, everyMs);
  return {
    stop() {
      clearInterval(timer);
      return { peakRssKb: Math.max(0, ...samples), samples: samples.length };
    },
  };
}

export async function startChildServer(env: { databaseUrl: string; smtpUrl: string; s3Endpoint?: string }): Promise<ChildServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(REPO_ROOT, 'bench', 'server-child.ts')], {
    cwd: REPO_ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      TSX_TSCONFIG_PATH: path.join(REPO_ROOT, 'server', 'tsconfig.json'),
      BENCH_DATABASE_URL: env.databaseUrl,
      BENCH_SMTP_URL: env.smtpUrl,
      BENCH_S3_ENDPOINT: env.s3Endpoint ?? '',
    },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const pid = child.pid!;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the child server did not start within 180 s')), 180_000);
    child.once('message', (m: { type?: string; url?: string }) => {
      clearTimeout(timer);
      if (m.type === 'ready' && m.url) resolve(m.url);
      else reject(new Error(`unexpected message from the child server: ${JSON.stringify(m)}`));
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the child server exited with code ${code} before it was ready`));
    });
  });
  return {
    url,
    pid,
    memory: () => readMemory(pid),
    async stop() {
      if (child.exitCode !== null) return;
      child.send({ type: 'stop' });
      const timeout = new Promise<'timeout'>((r) => setTimeout(() => r('timeout'), 10_000).unref());
      if ((await Promise.race([exited.then(() => 'exited' as const), timeout])) === 'timeout') {
        child.kill('SIGKILL');
        await exited;
      }
    },
  };
}
