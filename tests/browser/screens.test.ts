/**
 * Screenshots of the main screens with the invented Saltbush Bend demo season loaded, at 360 px
 * (a phone) and 1280 px wide, into tests/artifacts/screens/ for a person to look at. Each screen
 * must show its main heading, fit the window without sideways scrolling, and raise no page error.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, seedDemoIfEmpty } from '../../server/db/seed/demo';
import { createLogger } from '../../server/lib/logger';
import { ARTIFACTS, startBrowserEnv, type BrowserEnv } from '../helpers/browser';

const WIDTHS = [360, 1280] as const;
const SCREENS_TIMEOUT = 600_000;

interface Screen {
  name: string;
  path: () => string;
  heading: string | RegExp;
  tab?: string;
}

let env: BrowserEnv;
const ids = { garden: '', tomatoTrial: '', beansTrial: '', network: '' };

/** Waits until no request is in flight, no "Loading…" status is shown and every chart is drawn. */
async function settle(page: Page) {
  await page.waitForLoadState('networkidle', { timeout: 10_000 }).catch(() => undefined);
  await page.waitForFunction(
    () => {
      const busy = Array.from(document.querySelectorAll('[role="status"]')).some((e) => /Loading|Drawing/.test(e.textContent ?? ''));
      // A chart is ready once drawn and its save buttons are shown (they come with the drawn view).
      const undrawn = Array.from(document.querySelectorAll('figure div[role="img"]')).some((e) => !e.querySelector('svg') || !e.parentElement?.querySelector('button[aria-label^="Save “"]'));
      return !busy && !undrawn;
    },
    undefined,
    { timeout: 30_000, polling: 100 },
  );
}

async function signInAs(email: string) {
  const { page, baseUrl, context } = env;
  await context.clearCookies();
  // The app keeps the session on the device (offline use): forget the last person's copy too.
  if (page.url().startsWith(baseUrl)) await page.evaluate(() => localStorage.clear());
  const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
  const res = await page.request.post(`${baseUrl}/api/auth/sign-in`, { headers: { 'X-CSRF-Token': csrf }, data: { email, password: DEMO_PASSWORD } });
  expect(res.status(), await res.text()).toBe(200);
}

/** Opens each screen at each width, checks it and saves its picture. */
async function shoot(screens: Screen[]) {
  const { page, baseUrl } = env;
  const problems: string[] = [];
  for (const width of WIDTHS) {
    await page.setViewportSize({ width, height: width < 600 ? 780 : 900 });
    for (const s of screens) {
      const errorsBefore = env.pageErrors.length;
      await page.goto(`${baseUrl}${s.path()}`);
      const heading = page.getByRole('heading', { level: 1, name: s.heading, exact: typeof s.heading === 'string' });
      await heading.waitFor();
      if (s.tab) await page.getByRole('tab', { name: s.tab, exact: true }).click();
      await settle(page);
      await env.screenshot(`screens/${s.name}-${width}`);
      expect(await heading.isVisible(), `${s.name} @${width}px: main heading`).toBe(true);
      expect(fs.statSync(path.join(ARTIFACTS, 'screens', `${s.name}-${width}.png`)).size).toBeGreaterThan(0);
      const scroll = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
      if (scroll.scrollWidth > scroll.innerWidth + 1) problems.push(`${s.name} @${width}px scrolls sideways: ${scroll.scrollWidth}px in ${scroll.innerWidth}px`);
      if (env.pageErrors.length > errorsBefore) problems.push(`${s.name} @${width}px page errors: ${env.pageErrors.slice(errorsBefore).join(' | ')}`);
    }
  }
  return problems;
}

beforeAll(async () => {
  env = await startBrowserEnv();
  fs.mkdirSync(path.join(ARTIFACTS, 'screens'), { recursive: true });
  await seedDemoIfEmpty(env.t.ds, createLogger('silent'));
  const id = async (sql: string) => ((await env.t.ds.query(sql)) as { id: string }[])[0]!.id;
  ids.garden = await id(`SELECT id FROM gardens WHERE name = 'Mesquite Lane yard'`);
  ids.tomatoTrial = await id(`SELECT id FROM trials WHERE title = 'South bed tomatoes: ollas or the can?'`);
  ids.beansTrial = await id(`SELECT id FROM trials WHERE title = 'Late green beans in the small beds (trying it out)'`);
  ids.network = await id(`SELECT id FROM cohorts WHERE name = 'Saltbush Bend Garden Network'`);
});

afterAll(async () => {
  await env?.close();
});

describe('main screens at 360 and 1280 px', () => {
  it('a grower’s screens: home, garden, trial results and records, the Round, pot shelf, planner, guides, account', async () => {
    await signInAs('ruth@saltbush.example');
    const problems = await shoot([
      { name: 'home', path: () => '/', heading: 'Hello, Ruth Abernathy-Sol' },
      { name: 'garden', path: () => `/gardens/${ids.garden}`, heading: 'Mesquite Lane yard' },
      { name: 'trial-results', path: () => `/trials/${ids.tomatoTrial}`, tab: 'Results', heading: 'South bed tomatoes: ollas or the can?' },
      { name: 'trial-records', path: () => `/trials/${ids.tomatoTrial}`, tab: 'Records', heading: 'South bed tomatoes: ollas or the can?' },
      { name: 'round', path: () => `/trials/${ids.beansTrial}/round`, heading: 'Late green beans in the small beds (trying it out)' },
      { name: 'pot-shelf', path: () => '/pots', heading: 'Pot shelf' },
      { name: 'planner', path: () => '/planner', heading: 'Planner' },
      { name: 'guides', path: () => '/guides', heading: /guide/i },
      { name: 'account', path: () => '/account', heading: 'Account' },
    ]);
    expect(problems).toEqual([]);
  }, SCREENS_TIMEOUT);

  it('the cohort page as its lead', async () => {
    await signInAs('marisol@saltbush.example');
    const problems = await shoot([
      { name: 'cohorts', path: () => '/cohorts', heading: 'Cohorts' },
      { name: 'cohort', path: () => `/cohorts/${ids.network}`, heading: 'Saltbush Bend Garden Network' },
    ]);
    expect(problems).toEqual([]);
  }, SCREENS_TIMEOUT);

  it('the sign-in page', async () => {
    const { context, page } = env;
    await context.clearCookies();
    await page.evaluate(() => localStorage.clear());
    const problems = await shoot([{ name: 'sign-in', path: () => '/sign-in', heading: 'Sign in' }]);
    expect(problems).toEqual([]);
  }, SCREENS_TIMEOUT);
});
