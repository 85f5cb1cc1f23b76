/**
 * The cohort's pooled results in the browser. An educator creates a cohort, two growers join and
 * share paired trials with a few weeks of water logs and harvests, a student joins as observer
 * (all through the API, as people with real-looking names). The educator's cohort page shows the
 * pooled water saving, the forest plot (an SVG in its figure), switches the method and leaves a
 * trial out with a reason and puts it back; the observer sees the same page without exclusion
 * controls. No name or e-mail of anyone appears in either page. Then the Saltbush Bend demo
 * network, as its lead sees it, for screenshots of a realistic season. Screenshots at 1280 and
 * 360 px go to tests/artifacts/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { trialLabels } from '@shared/charts/cohort-charts';
import { cohortResultsSchema, type CohortResults } from '@shared/schemas/cohort-results';
import { DEMO_PASSWORD, demoAccounts, seedDemoIfEmpty } from '../../server/db/seed/demo';
import { createLogger } from '../../server/lib/logger';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';
import { ApiAgent } from '../helpers/test-app';

let env: BrowserEnv;
const PASSWORD = 'tomato-basin-clay-42';
const stamp = Date.now().toString(36);

interface Person {
  name: string;
  email: string;
  role: 'grower' | 'educator';
  a?: ApiAgent;
}
const lead: Person = { name: 'Rosalind Achterberg', email: `rosalind.${stamp}@example.test`, role: 'educator' };
const g1: Person = { name: 'Fenwick Olumide', email: `fenwick.${stamp}@example.test`, role: 'grower' };
const g2: Person = { name: 'Azucena Brightwater', email: `azucena.${stamp}@example.test`, role: 'grower' };
const student: Person = { name: 'Thaddeus Mwangi-Cole', email: `thaddeus.${stamp}@example.test`, role: 'grower' };
const everyone = [lead, g1, g2, student];

let cohortId = '';
let demoCohortId = '';

beforeAll(async () => {
  env = await startBrowserEnv();
  // After the season, so every log is in the past and the completeness counts are fixed.
  env.t.clock.now = new Date('2026-10-15T12:00:00Z');
  // The demo season loads only into an empty database: first, before anyone signs up.
  expect(await seedDemoIfEmpty(env.t.ds, createLogger('silent'))).toBe(true);
  const [network] = (await env.t.ds.query(`SELECT id FROM cohorts WHERE name = 'Saltbush Bend Garden Network'`)) as { id: string }[];
  demoCohortId = network!.id;

  for (const p of everyone) {
    p.a = new ApiAgent(env.t.app);
    await p.a.signUp({ email: p.email, displayName: p.name, role: p.role, password: PASSWORD });
  }
  const cohort = (await lead.a!.post('/api/cohorts', { name: 'Riverbend Olla Network 2026', kind: 'network' })).body.data as { id: string; joinCode: string };
  cohortId = cohort.id;
  for (const [p, role] of [
    [g1, 'contributor'],
    [g2, 'contributor'],
    [student, 'observer'],
  ] as const) {
    const res = await p.a!.post('/api/cohorts/join', { code: cohort.joinCode, role });
    if (res.status !== 201) throw new Error(`join: ${res.status} ${JSON.stringify(res.body)}`);
  }

  // Four trials of two pairs with different savings, pots and crops, and one single pair.
  await sharedTrial(g1, { crop: 'tomato', potL: 10, shape: 'globe', saving: 0.45, lat: 35.1 });
  await sharedTrial(g1, { crop: 'squash-zucchini', potL: 5, shape: 'bottle', saving: 0.3, lat: 35.1 });
  await sharedTrial(g2, { crop: 'tomato', potL: 8, shape: 'globe', saving: 0.55, lat: 33.6 });
  await sharedTrial(g2, { crop: 'sweet-pepper', potL: 12, shape: 'cylinder', saving: 0.38, lat: 33.6 });
  await sharedTrial(g2, { crop: 'tomato', potL: 8, shape: 'globe', saving: 0.5, lat: 33.6, pairs: 1 });
});

afterAll(async () => {
  await env?.close();
});

async function ok(res: { status: number; body: { data?: unknown } }, what: string) {
  if (res.status >= 300) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.data as { id: string } & Record<string, unknown>;
}

/** A garden, a paired trial (2 m² beds, one pot in each olla bed), four weeks of water, a harvest on every bed, shared with the cohort. */
async function sharedTrial(p: Person, o: { crop: string; potL: number; shape: string; saving: number; lat: number; pairs?: number }) {
  const a = p.a!;
  const garden = await ok(
    await a.post('/api/gardens', { name: `Secret garden of ${p.name}`, latitudeDeg: o.lat, longitudeDeg: -106.6, elevationM: 1500, soilTexture: 'sandy_loam' }),
    'garden',
  );
  const trial = await ok(
    await a.post(`/api/gardens/${garden.id}/trials`, { title: `Secret trial title of ${p.name}`, crop: o.crop, plantingDate: '2026-05-04', design: 'paired' }),
    'trial',
  );
  const entries: object[] = [];
  for (let i = 0; i < (o.pairs ?? 2); i++) {
    const key = `P${i + 1}`;
    const olla = await ok(
      await a.post(`/api/trials/${trial.id}/plots`, { label: `${key} pots`, blockKey: key, areaM2: 2, treatment: 'olla', plantCount: 3 }),
      'plot',
    );
    const surface = await ok(
      await a.post(`/api/trials/${trial.id}/plots`, { label: `${key} can`, blockKey: key, areaM2: 2, treatment: 'surface', plantCount: 3 }),
      'plot',
    );
    await ok(
      await a.post('/api/pots', { label: `${key} pot`, capacityL: o.potL, widestDiameterCm: 28, shape: o.shape, make: 'wheel_thrown', plotId: olla.id }),
      'pot',
    );
    // Pairs differ a little (±6 %), weeks a little more, so each trial has its own spread.
    const pairFactor = 1 + (i === 0 ? 0.06 : -0.06);
    for (let w = 0; w < 4; w++) {
      const day = new Date(Date.UTC(2026, 5, 1 + 7 * w, 7)).toISOString();
      const surfaceL = 14 + w;
      entries.push({ type: 'water', entry: { plotId: surface.id, occurredAt: day, kind: 'surface', volumeL: surfaceL } });
      entries.push({
        type: 'water',
        entry: { plotId: olla.id, occurredAt: day, kind: 'olla_refill', volumeL: Number((surfaceL * (1 - o.saving) * pairFactor).toFixed(2)) },
      });
    }
    entries.push({ type: 'harvest', entry: { plotId: olla.id, harvestedOn: '2026-08-10', freshKg: 4.2 + 0.3 * i } });
    entries.push({ type: 'harvest', entry: { plotId: surface.id, harvestedOn: '2026-08-10', freshKg: 3.9 + 0.1 * i } });
  }
  await ok(await a.post(`/api/trials/${trial.id}/status`, { status: 'active' }), 'status');
  await ok(await a.post(`/api/trials/${trial.id}/round`, { entries }), 'round');
  await ok(await a.post(`/api/trials/${trial.id}/shares`, { cohortId }), 'share');
}

async function apiResults(query = ''): Promise<CohortResults> {
  const res = await lead.a!.get(`/api/cohorts/${cohortId}/results${query}`);
  expect(res.status).toBe(200);
  return cohortResultsSchema.parse(res.body.data);
}

async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto(`${env.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
}

async function at360(name: string) {
  await env.page.setViewportSize({ width: 360, height: 800 });
  // Vega redraws the charts for the narrower container.
  await env.page.waitForTimeout(300);
  await env.screenshot(`${name}-360`);
  await env.page.setViewportSize({ width: 1280, height: 800 });
}

/** Nobody's name or e-mail in the page text (hidden parts too), nor garden names or trial titles. */
async function expectPseudonymsOnly(page: Page, people: { name: string; email: string }[], viewer: { name: string }) {
  // The app bar greets the viewer by their own name; nobody else's may appear.
  const text = (await page.evaluate(() => document.body.textContent ?? '')).replaceAll(viewer.name, '');
  for (const p of people) {
    expect(text).not.toContain(p.name);
    expect(text).not.toContain(p.email);
  }
  expect(text).not.toContain('Secret garden');
  expect(text).not.toContain('Secret trial');
}

function forestFigure(page: Page, title = 'Water saved in each trial and pooled') {
  return page.locator('figure').filter({ has: page.getByRole('heading', { name: title }) });
}

describe('cohort results in the browser', () => {
  it('the educator reads the pooled saving and the forest plot, switches method, and leaves a trial out with a reason', async () => {
    const { page } = env;
    const r = await apiResults();
    const water = r.effects.waterLogRatio;
    expect(water.k).toBe(4); // the single-pair trial waits for the toggle
    const labels = trialLabels(r);

    await signIn(page, lead.email);
    await page.goto(`${env.baseUrl}/cohorts/${cohortId}`);
    await page.getByRole('heading', { name: 'Pooled results', level: 2 }).waitFor();
    const headline = page.getByRole('region', { name: 'What the pots did, across all gardens' });
    const saving = Math.round(water.pooled!.display.estimate);
    await headline.getByText(`Across 4 trials (2 growers), the pots used about ${saving} % less water than surface watering`, { exact: false }).waitFor();
    await headline.getByText(/In one new garden like these, the saving would likely fall between/).waitFor();
    await headline.getByText(/^Harvest: the pot beds gave/).waitFor();

    const forest = forestFigure(page);
    await forest.locator('svg.marks').waitFor();
    await expect(forest.locator('svg.marks text', { hasText: 'Pooled estimate' }).count()).resolves.toBe(1);
    await expect(forest.locator('svg.marks text', { hasText: 'Prediction interval' }).count()).resolves.toBe(1);
    for (const f of water.forest) await expect(forest.locator('svg.marks text', { hasText: labels[f.trialId]! }).count()).resolves.toBe(1);
    // The table alternative carries the same numbers.
    await forest.getByText('Show the numbers as a table').click();
    await forest.getByRole('rowheader', { name: 'Pooled estimate (4 trials)' }).waitFor();
    await page.getByText(/Heterogeneity is (low|moderate|substantial|considerable) \(I² = /).waitFor();
    await expectPseudonymsOnly(page, everyone, lead);
    await env.screenshot('cohort-results-lead-1280');
    await at360('cohort-results-lead');

    // REML, and the single-pair trial on: the address and the numbers follow.
    await page.getByRole('radio', { name: /^REML/ }).check();
    await expect.poll(() => new URL(page.url()).searchParams.get('method')).toBe('REML');
    await page.getByText(/τ² by REML/).waitFor();
    await page.getByRole('checkbox', { name: /^Include single-pair trials/ }).check();
    await headline.getByText('Across 5 trials (2 growers), the pots used about', { exact: false }).waitFor();
    await page.getByRole('checkbox', { name: /^Include single-pair trials/ }).uncheck();
    await headline.getByText('Across 4 trials (2 growers), the pots used about', { exact: false }).waitFor();

    // Leaving a trial out needs a reason; the cohort sees it; putting it back restores the estimate.
    const target = water.forest[0]!;
    const label = labels[target.trialId]!;
    await page.getByRole('button', { name: `Leave out ${label}` }).click();
    const dialog = page.getByRole('dialog', { name: `Leave out ${label}?` });
    await dialog.getByRole('button', { name: 'Leave out of the results' }).click();
    await dialog.getByText(/Say why the trial is left out/).waitFor();
    await env.screenshot('cohort-results-exclude-dialog-1280');
    await dialog.getByLabel('Reason (shown to the cohort)').fill('Surface beds were on a drip line in July');
    await dialog.getByRole('button', { name: 'Leave out of the results' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await headline.getByText('Across 3 trials (2 growers), the pots used about', { exact: false }).waitFor();
    await page.getByText(/left out .* by you: .*Surface beds were on a drip line in July/).waitFor();
    const [row] = (await env.t.ds.query('SELECT reason FROM trial_exclusions WHERE cohort_id = $1 AND trial_id = $2', [cohortId, target.trialId])) as {
      reason: string;
    }[];
    expect(row?.reason).toBe('Surface beds were on a drip line in July');
    // Focus stays on the row's button, which now puts the trial back.
    await expect(page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).resolves.toBe(`Put ${label} back into the results`);
    await env.screenshot('cohort-results-excluded-1280');
    await page.getByRole('button', { name: `Put ${label} back into the results` }).click();
    await headline.getByText('Across 4 trials (2 growers), the pots used about', { exact: false }).waitFor();
    await page.getByText('The lead has not left any trial out.').waitFor();

    // Left out again for the observer to read.
    await page.getByRole('button', { name: `Leave out ${label}` }).click();
    await dialog.getByLabel('Reason (shown to the cohort)').fill('Surface beds were on a drip line in July');
    await dialog.getByRole('button', { name: 'Leave out of the results' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await headline.getByText('Across 3 trials', { exact: false }).waitFor();
    expect(env.pageErrors).toEqual([]);
    await signOut(page);
  });

  it('the observer sees the same page, the reason, and downloads, without exclusion controls', async () => {
    const { page } = env;
    await signIn(page, student.email);
    await page.goto(`${env.baseUrl}/cohorts/${cohortId}`);
    const headline = page.getByRole('region', { name: 'What the pots did, across all gardens' });
    const r = await apiResults();
    await headline
      .getByText(`Across 3 trials (2 growers), the pots used about ${Math.round(r.effects.waterLogRatio.pooled!.display.estimate)} % less water`, {
        exact: false,
      })
      .waitFor();
    await forestFigure(page).locator('svg.marks').waitFor();
    await page.getByText(/left out .* by the lead: .*Surface beds were on a drip line in July/).waitFor();
    await expect(page.getByRole('button', { name: /^Leave out|back into the results$/ }).count()).resolves.toBe(0);
    await expect(page.getByRole('dialog').count()).resolves.toBe(0);
    await expectPseudonymsOnly(page, everyone, student);

    // Every cohort CSV is a link; one downloads with pseudonyms only.
    for (const f of ['plots', 'water-events', 'moisture-readings', 'harvests', 'weather-days', 'data-dictionary']) {
      await expect(page.getByRole('link', { name: `${f}.csv` }).getAttribute('href')).resolves.toBe(`/api/cohorts/${cohortId}/export/${f}.csv`);
    }
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'harvests.csv' }).click();
    const text = await (await import('node:fs')).promises.readFile((await (await download).path())!, 'utf8');
    expect(text).toMatch(/^\uFEFF?trial_code,member,/);
    for (const p of everyone) expect(text).not.toContain(p.name);

    await env.screenshot('cohort-results-observer-1280');
    await at360('cohort-results-observer');
    expect(env.pageErrors).toEqual([]);
    await signOut(page);
  });

  it('the demo network’s lead reads a whole season: many trials, flags and subgroups, pseudonyms only', async () => {
    const { page } = env;
    await signIn(page, 'marisol@saltbush.example', DEMO_PASSWORD);
    await page.goto(`${env.baseUrl}/cohorts/${demoCohortId}`);
    await page
      .getByRole('region', { name: 'What the pots did, across all gardens' })
      .getByText(/the pots used about \d+\s% less water/)
      .waitFor();
    await forestFigure(page).locator('svg.marks').waitFor();
    await page
      .getByText(/Possible gallon \/ litre mix-up/)
      .first()
      .waitFor();
    await page.getByRole('heading', { name: 'What changes the water saved' }).waitFor();
    await expectPseudonymsOnly(
      page,
      demoAccounts.map((a) => ({ name: a.displayName, email: a.email })),
      { name: 'Marisol Quintero-Hale' },
    );
    await env.screenshot('cohort-results-demo-1280');
    await at360('cohort-results-demo');

    // The harvest measure: its own forest plot and subgroups.
    await page.getByRole('radio', { name: /^Harvest per plant/ }).check();
    await forestFigure(page, 'Harvest per plant difference in each trial and pooled').locator('svg.marks').waitFor();
    await page.getByRole('heading', { name: 'What changes the harvest per plant' }).waitFor();
    await env.screenshot('cohort-results-demo-harvest-1280');
    expect(env.pageErrors).toEqual([]);
  });
});
