/**
 * The results screens in Spanish, for people whose account is set to Spanish: a grower's trial
 * Results tab and an educator's pooled cohort results, on the invented Saltbush Bend demo season.
 * Headings, sentences and chart text are Spanish, numbers carry a decimal comma (CLDR "es":
 * decimal separator ","), and the estimates are the same numbers the English API computes.
 * Screenshots at 1280 and 360 px go to tests/artifacts/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, seedDemoIfEmpty } from '../../server/db/seed/demo';
import { createLogger } from '../../server/lib/logger';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
let cohortId = '';
let trialId = '';

beforeAll(async () => {
  env = await startBrowserEnv();
  env.t.clock.now = new Date('2026-10-15T12:00:00Z');
  expect(await seedDemoIfEmpty(env.t.ds, createLogger('silent'))).toBe(true);
  const [network] = (await env.t.ds.query(`SELECT id FROM cohorts WHERE name = 'Saltbush Bend Garden Network'`)) as { id: string }[];
  cohortId = network!.id;
  // The network's lead reads it in Spanish; Tomás (Spanish in the demo) owns trials with results.
  await env.t.ds.query(`UPDATE users SET language = 'es' WHERE email = 'marisol@saltbush.example'`);
  const [trial] = (await env.t.ds.query(
    `SELECT t.id FROM trials t JOIN users u ON u.id = t.owner_id
      WHERE u.email = 'tomas@saltbush.example' AND EXISTS (SELECT 1 FROM harvests h WHERE h.trial_id = t.id)
      ORDER BY t.planting_date LIMIT 1`,
  )) as { id: string }[];
  trialId = trial!.id;
});

afterAll(async () => {
  await env?.close();
});

/**
 * Signs in on the sign-in page; the account's Spanish takes over once signed in. The page is in
 * the device's language: English at first, Spanish after a Spanish account has signed out on it
 * (the last account language is kept on the device), so either wording is accepted.
 */
async function signIn(page: Page, email: string) {
  await page.goto(`${env.baseUrl}/sign-in`);
  await page.getByLabel(/^(E-mail|Correo electrónico)$/).fill(email);
  await page.getByLabel(/^(Password|Contraseña)$/).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: /^(Sign in|Iniciar sesión)$/ }).click();
  await page.getByRole('button', { name: /^Cerrar sesión/ }).waitFor();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: /^Cerrar sesión/ }).click();
  await page.waitForURL(/sign-in|\/$/);
}

async function both(name: string) {
  await env.screenshot(`${name}-1280`);
  await env.page.setViewportSize({ width: 360, height: 800 });
  await env.page.waitForTimeout(400);
  await env.screenshot(`${name}-360`);
  await env.page.setViewportSize({ width: 1280, height: 800 });
}

describe('results in Spanish', () => {
  it('a grower reads the Results tab of a trial in Spanish, with decimal commas', async () => {
    const { page } = env;
    await signIn(page, 'tomas@saltbush.example');
    await page.goto(`${env.baseUrl}/trials/${trialId}`);
    await page.getByRole('heading', { name: 'Totales por tratamiento' }).waitFor();
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('es');

    // The same analysis the API gives (language-free), shown in Spanish.
    const api = (await page.evaluate(async (id) => (await (await fetch(`/api/trials/${id}/analysis`)).json()) as { data: { comparisons: { pairs: unknown[] }[] } }, trialId)).data;
    const pairs = api.comparisons[0]!.pairs.length;
    await page.getByText(new RegExp(`En ${pairs} pares, las parcelas con olla recibieron de media`)).waitFor();
    await page.getByRole('columnheader', { name: 'Diferencia media' }).first().waitFor();
    await page.getByRole('heading', { name: 'Necesidad de agua del cultivo' }).waitFor();

    // Numbers: a decimal comma in the paired table (p-values have three decimals), never a decimal point.
    const table = (await page.locator('table').first().textContent()) ?? '';
    expect(table).toMatch(/\d,\d{3}/);
    expect(table).not.toMatch(/\d\.\d{3}(?!\d)/);

    // The charts are drawn with Spanish titles and axis labels.
    const cumulative = page.locator('figure').filter({ has: page.getByRole('heading', { name: 'Agua aplicada durante la temporada, por parcela' }) });
    await cumulative.locator('svg.marks').waitFor();
    expect(await cumulative.locator('svg.marks').textContent()).toContain('Agua aplicada hasta la fecha');
    // Date ticks read day first in Spanish ("17 may"), never "may 17" (charts.timeFormat.day).
    const ticks = (await cumulative.locator('svg.marks').textContent()) ?? '';
    expect(ticks).toMatch(/\d{1,2} (may|jun|jul|ago|sept?)/);
    expect(ticks).not.toMatch(/(may|jun|jul|ago|sept?|May|Jun|Jul|Aug|Sep) \d{1,2}/);
    await page.getByText('Ver los números en una tabla').first().waitFor();
    await both('results-tab-es');
    await signOut(page);
  });

  it('an educator reads the pooled cohort results in Spanish', async () => {
    const { page } = env;
    await signIn(page, 'marisol@saltbush.example');
    await page.goto(`${env.baseUrl}/cohorts/${cohortId}`);
    await page.getByRole('heading', { name: 'Resultados conjuntos' }).waitFor();
    const headline = page.getByRole('region', { name: 'Qué hicieron las ollas, en todos los huertos' });
    await headline.getByText(/las ollas usaron alrededor de un \d+\s% menos de agua/).waitFor();
    await page.getByRole('heading', { name: 'Qué cambia el agua ahorrada' }).waitFor();

    const forest = page.locator('figure').filter({ has: page.getByRole('heading', { name: 'Agua ahorrada en cada ensayo y en conjunto' }) });
    await forest.locator('svg.marks').waitFor();
    const svg = (await forest.locator('svg.marks').textContent()) ?? '';
    expect(svg).toContain('Estimación conjunta');
    expect(svg).toContain('Agua ahorrada por las ollas');

    // The pooled estimate on the page is the API's, with a decimal comma in its interval where it has decimals.
    const api = (await page.evaluate(async (id) => (await (await fetch(`/api/cohorts/${id}/results`)).json()) as { data: { effects: { waterLogRatio: { pooled: { display: { estimate: number } } } } } }, cohortId)).data;
    const estimate = Math.round(api.effects.waterLogRatio.pooled.display.estimate);
    await headline.getByText(new RegExp(`^${estimate}\\s%$`)).first().waitFor();
    const heterogeneity = (await page.getByRole('group', { name: 'Cuánto difieren los huertos' }).textContent()) ?? '';
    expect(heterogeneity).toMatch(/La heterogeneidad es (baja|moderada|sustancial|considerable)/);
    expect(heterogeneity).toMatch(/\d,\d{2}/); // Cochran's Q with two decimals
    // Members read "Cultivador K7" (stored and exported as "Grower K7"); pot capacity classes are words in Spanish;
    // the notes on how the results were made are Spanish (sent as codes, worded by the page).
    const body = (await page.locator('main').innerText()) ?? '';
    expect(body).toMatch(/Cultivador [A-Z]\d+ · /);
    expect(body).not.toMatch(/Grower [A-Z]\d+/);
    expect(body).toMatch(/De 6\sL a 10\sL/);
    expect(body).not.toMatch(/6–10 L|<6 L|>10 L/);
    await page.getByText('Cómo se calculan estos números').click();
    await page.getByText(/Cada cultivador aparece solo con su seudónimo en el grupo/).waitFor();
    expect(await page.locator('main').innerText()).not.toMatch(/Growers appear by their cohort pseudonym|Pooled by random effects/);
    await both('cohort-results-es');
  });
});
