import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { serveBuiltClient } from '../../server/http/built-client';
import { listen, startTestApp, type SignalGate, type TestApp } from './test-app';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const ARTIFACTS = path.resolve('tests/artifacts');

/** Serves the built client from dist/ behind the API, as production does. */
const builtClient = () => serveBuiltClient(path.resolve('dist'));

export interface BrowserEnv {
  t: TestApp;
  baseUrl: string;
  /** Drops matching requests at the server, as if the phone had no signal (see SignalGate). */
  signal: SignalGate;
  context: BrowserContext;
  page: Page;
  /** Errors the page threw or logged; a test can assert there were none. */
  pageErrors: string[];
  screenshot: (name: string) => Promise<void>;
  close: () => Promise<void>;
}

const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

/**
 * Another browser (its own profile: no cookies, no storage) on the same test app, e.g. one whose
 * language is Spanish (`locale: 'es-ES'` sets navigator.languages and Accept-Language).
 */
export async function openOtherBrowser(opts: { locale?: string; viewport?: { width: number; height: number } } = {}): Promise<{ context: BrowserContext; page: Page; close: () => Promise<void> }> {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: opts.viewport ?? { width: 1280, height: 800 },
    locale: opts.locale,
    args: CHROMIUM_ARGS,
  });
  context.setDefaultTimeout(60_000);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    async close() {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** A test app on a loopback port and a fresh headless Chromium profile pointed at it. */
export async function startBrowserEnv(opts: { viewport?: { width: number; height: number }; timezoneId?: string } = {}): Promise<BrowserEnv> {
  const t = await startTestApp({ client: builtClient() });
  const server = await listen(t.app);
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'seepwise-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: opts.viewport ?? { width: 1280, height: 800 },
    timezoneId: opts.timezoneId,
    args: CHROMIUM_ARGS,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  // Generous waits: CI machines here are small and sometimes busy.
  context.setDefaultTimeout(60_000);
  const pageErrors: string[] = [];
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error' && !/Failed to load resource: the server responded with a status of 4\d\d/.test(m.text())) pageErrors.push(m.text());
  });
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  return {
    t,
    baseUrl: server.url,
    signal: server.signal,
    context,
    page,
    pageErrors,
    screenshot: async (name) => {
      await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: true });
    },
    async close() {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
      await server.close();
      await t.close();
    },
  };
}
