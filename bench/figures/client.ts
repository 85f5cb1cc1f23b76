/**
 * Figure 6: the first page a visitor sees (the sign-in page) from the production build on
 * loopback, in headless Chromium: the JavaScript and CSS it fetches (raw, gzipped, and what went
 * over the wire) and its Largest Contentful Paint over repeated cold loads.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import type { DataSource } from 'typeorm';
import { chromium } from 'playwright-core';
import { serveBuiltClient } from '../../server/http/built-client';
import { buildBenchApp, listenLoopback } from '../lib/app';
import { REPO_ROOT } from '../lib/child';
import { r3, roundSummary, summarise, type Summary } from '../lib/stats';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export interface ClientFigure {
  page: string;
  buildSeconds: number;
  files: { path: string; type: 'script' | 'stylesheet'; rawBytes: number; gzipBytes: number; transferBytes: number; encoding: string }[];
  jsCssRawKb: number;
  jsCssGzipKb: number;
  /** Bytes the server actually sent for them (encoded body sizes: gzip from server/http/compression.ts). */
  jsCssTransferKb: number;
  otherRequests: { path: string; type: string; bytes: number }[];
  loads: number;
  lcpMs: Summary;
  lcpElement: string;
}

export async function measureClient(o: {
  tmpDir: string;
  dataSource: DataSource;
  databaseUrl: string;
  smtpUrl: string;
  s3Endpoint?: string;
  loads: number;
  log: (m: string) => void;
  /** Measure this already built client instead of building one (for comparing a proposed change). */
  prebuiltDist?: string;
}): Promise<ClientFigure> {
  const dist = o.prebuiltDist ?? path.join(o.tmpDir, 'dist');
  const t0 = performance.now();
  const build = o.prebuiltDist ? { status: 0, stdout: '', stderr: '' } : spawnSync(process.execPath, [path.join(REPO_ROOT, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--outDir', dist, '--emptyOutDir', '--logLevel', 'warn'], {
    cwd: REPO_ROOT,
    encoding: 'utf8',
    env: { ...process.env, NODE_ENV: 'production' },
  });
  if (build.status !== 0) throw new Error(`vite build failed:\n${build.stdout}\n${build.stderr}`);
  const buildSeconds = (performance.now() - t0) / 1000;
  o.log(`client built in ${buildSeconds.toFixed(1)} s`);

  // Served as server/start.ts serves it in production (the app compresses it, server/http/compression.ts).
  const client = serveBuiltClient(dist);
  const app = buildBenchApp({ dataSource: o.dataSource, databaseUrl: o.databaseUrl, smtpUrl: o.smtpUrl, s3Endpoint: o.s3Endpoint, client });
  const server = await listenLoopback(app);
  const profile = fs.mkdtempSync(path.join(o.tmpDir, 'chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  const pagePath = '/sign-in';
  try {
    const files: ClientFigure['files'] = [];
    const other: ClientFigure['otherRequests'] = [];
    const lcps: number[] = [];
    let lcpElement = '';
    // One unmeasured load warms Chromium itself; then every load starts with the HTTP cache disabled.
    for (let k = 0; k <= o.loads; k++) {
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
      await page.addInitScript(() => {
        const w = window as unknown as { __lcp: { t: number; el: string } };
        w.__lcp = { t: 0, el: '' };
        new PerformanceObserver((list) => {
          for (const e of list.getEntries() as (PerformanceEntry & { element?: Element | null })[]) {
            w.__lcp = { t: e.startTime, el: e.element ? `${e.element.tagName.toLowerCase()}${e.element.id ? `#${e.element.id}` : ''}` : '' };
          }
        }).observe({ type: 'largest-contentful-paint', buffered: true });
      });
      const pending: Promise<void>[] = [];
      if (k === 1) {
        page.on('response', (res) => {
          const type = res.request().resourceType();
          const p = new URL(res.url()).pathname;
          pending.push(
            (async () => {
              const body = await res.body().catch(() => Buffer.alloc(0));
              // What went over the wire: the body as the server encoded it (gzip when the app compresses it).
              const headers = res.headers();
              const sent = (await res.request().sizes().catch(() => null))?.responseBodySize ?? NaN;
              if (type === 'script' || type === 'stylesheet') {
                files.push({ path: p, type, rawBytes: body.length, gzipBytes: gzipSync(body).length, transferBytes: Number.isFinite(sent) ? sent : body.length, encoding: headers['content-encoding'] ?? 'identity' });
              } else other.push({ path: p, type, bytes: body.length });
            })(),
          );
        });
      }
      await page.goto(server.url + pagePath, { waitUntil: 'networkidle' });
      await page.getByRole('button', { name: /sign in/i }).first().waitFor({ timeout: 10_000 });
      await page.waitForTimeout(300);
      const lcp = await page.evaluate(() => (window as unknown as { __lcp: { t: number; el: string } }).__lcp);
      await Promise.all(pending);
      if (k > 0) {
        lcps.push(lcp.t);
        lcpElement = lcp.el;
      }
      await page.close();
    }
    const sum = (f: (x: ClientFigure['files'][number]) => number) => r3(files.reduce((s, x) => s + f(x), 0) / 1024);
    return {
      page: pagePath,
      buildSeconds: r3(buildSeconds),
      files: files.sort((a, b) => b.gzipBytes - a.gzipBytes),
      jsCssRawKb: sum((x) => x.rawBytes),
      jsCssGzipKb: sum((x) => x.gzipBytes),
      jsCssTransferKb: sum((x) => x.transferBytes),
      otherRequests: other,
      loads: o.loads,
      lcpMs: roundSummary(summarise(lcps)),
      lcpElement,
    };
  } finally {
    await context.close();
    fs.rmSync(profile, { recursive: true, force: true });
    await server.close();
    await (app.locals.closeExtras as () => Promise<void>)();
  }
}
