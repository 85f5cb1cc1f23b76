/**
 * A grower creates a garden and a paired trial, lets Seepwise assign treatments at random, walks
 * the Round on seven mornings (the browser clock moved day by day) and finds every refill in the
 * records table and in the results. The browser is in Denver (America/Denver, MDT = UTC−6 in June,
 * IANA tz database): the new garden takes that zone, and the log form's "now" is Denver's clock.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv({ timezoneId: 'America/Denver' });
});
afterAll(async () => {
  await env?.close();
});

describe('the notebook in the browser', () => {
  it('garden → paired trial → random assignment → a week of refills through the Round → records and results', async () => {
    const { page, baseUrl, t } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Inés');
    await page.getByLabel('E-mail').fill(`ines.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Inés' }).waitFor();

    await page.getByRole('link', { name: 'Create your first garden' }).click();
    await page.getByLabel('Garden name').fill('Patio de atrás');
    await page.getByLabel('Latitude (°, north +)').fill('35.08');
    await page.getByLabel('Longitude (°, east +)').fill('-106.65');
    await page.getByLabel('Elevation (m)').fill('1500');
    await page.getByRole('button', { name: 'Create garden' }).click();
    await page.getByRole('heading', { name: 'Patio de atrás' }).waitFor();
    await page.getByText(/35\.1°, -106\.7°/).waitFor();
    // The garden form defaulted to the browser's zone; the page says whose days these are.
    await page.getByText('Days in America/Denver').waitFor();
    const [garden] = await t.ds.query(`SELECT time_zone FROM gardens WHERE name = 'Patio de atrás'`);
    expect(garden.time_zone).toBe('America/Denver');

    await page.getByRole('button', { name: 'New trial' }).click();
    await page.getByLabel('Trial title').fill('Tomates 2026');
    await page.getByLabel('Planting date').fill('2026-05-01');
    await page.getByRole('button', { name: 'Create trial' }).click();
    await page.getByRole('heading', { name: 'Tomates 2026' }).waitFor();

    await page.getByRole('tab', { name: 'Setup' }).click();
    for (const [label, pair] of [
      ['A1', 'A'],
      ['A2', 'A'],
      ['B1', 'B'],
      ['B2', 'B'],
    ]) {
      await page.getByLabel('Label').fill(label!);
      await page.getByLabel('Pair', { exact: true }).fill(pair!);
      await page.getByLabel('Area (m²)').fill('2');
      await page.getByRole('button', { name: 'Add plot' }).click();
      await page.getByText(label!, { exact: true }).waitFor();
    }
    await page.getByRole('button', { name: 'Assign treatments at random' }).click();
    await page.getByText(/Assignment drawn with seed/).waitFor();
    const [trial] = await t.ds.query(`SELECT id, randomisation_seed FROM trials WHERE title = 'Tomates 2026'`);
    expect(trial.randomisation_seed).toMatch(/^[0-9a-f]{12}$/);
    const assigned = await t.ds.query(`SELECT block_key, treatment FROM plots WHERE trial_id = $1 ORDER BY block_key, treatment`, [trial.id]);
    expect(assigned).toEqual([
      { block_key: 'A', treatment: 'olla' },
      { block_key: 'A', treatment: 'surface' },
      { block_key: 'B', treatment: 'olla' },
      { block_key: 'B', treatment: 'surface' },
    ]);
    await env.screenshot('trial-setup-1280');

    // One pot in each olla plot (the Pot shelf has its own test), placed through the API as the grower.
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const ollaPlots = await t.ds.query(`SELECT id, label FROM plots WHERE trial_id = $1 AND treatment = 'olla' ORDER BY label`, [trial.id]);
    for (const [i, p] of ollaPlots.entries()) {
      const res = await page.request.post(`${baseUrl}/api/pots`, {
        headers: { 'X-CSRF-Token': csrf },
        data: { label: `Pot ${i + 1}`, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: p.id },
      });
      expect(res.status()).toBe(201);
    }

    await page.getByRole('button', { name: 'Start the trial' }).click();
    await page.getByRole('button', { name: 'Yes' }).click();
    await page.getByText('Log every refill, every watering and every pick.').waitFor();

    // Seven mornings: two taps per refill (pot, then Save), the last volume as the default.
    for (let day = 1; day <= 7; day++) {
      await page.clock.setFixedTime(new Date(`2026-06-0${day}T13:00:00Z`)); // 07:00 in Denver
      await page.goto(`${baseUrl}/trials/${trial.id}/round`);
      await page.getByRole('heading', { name: 'Pots (2)' }).waitFor();
      // Each pot's button shows the default volume (the last refill, or a full pot); a tap marks it.
      await page.getByRole('button', { name: '8 L', exact: true }).first().click();
      await page.getByRole('button', { name: '8 L', exact: true }).first().click();
      await page.getByRole('button', { name: 'Save 2 records' }).click();
      await page.getByText('Saved 2 records.').waitFor();
      if (day === 1) await env.screenshot('round-1280');
    }
    const [{ n }] = await t.ds.query(`SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill'`, [trial.id]);
    expect(n).toBe(14);

    await page.goto(`${baseUrl}/trials/${trial.id}`);
    await page.getByRole('tab', { name: 'Records' }).click();
    await page.getByText('Page 1 of 1 · 14 records').waitFor();
    await env.screenshot('records-1280');
    // The log form's default "when" is now on the garden's clock: 13:00Z is 07:00 in Denver.
    await expect.poll(() => page.getByLabel('When').inputValue()).toBe('2026-06-07T07:00');
    await page.getByRole('tab', { name: 'Results' }).click();
    // Only the pots were watered in this walk, so every pair differs by the same amount: the honest sentence says so.
    await page.getByText(/In all 2 pairs, the olla plots received exactly/).first().waitFor();
    await env.screenshot('results-1280');
    expect(env.pageErrors).toEqual([]);
  });
});
