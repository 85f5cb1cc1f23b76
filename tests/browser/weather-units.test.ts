/**
 * A grower on US customary units logs a weather day: temperatures in °F and wind in mph go into
 * the form, SI values (°C, m/s, what FAO-56 ET0 takes) into the database, and the table shows them
 * back in the grower's units. Conversions: °C = (°F − 32) × 5/9; 1 mph = 0.44704 m/s exactly
 * (NIST SP 811, App. B: mile = 1,609.344 m).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv();
});
afterAll(async () => {
  await env?.close();
});

describe('weather days in US units', () => {
  it('takes °F and mph, stores °C and m/s, shows mph back', async () => {
    const { page, baseUrl, t } = env;
    const email = `wind.${Date.now()}@example.test`;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Wren');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Wren' }).waitFor();

    await page.getByRole('link', { name: 'Create your first garden' }).click();
    await page.getByLabel('Garden name').fill('Windy corner');
    await page.getByLabel('Latitude (°, north +)').fill('35.08');
    await page.getByLabel('Longitude (°, east +)').fill('-106.65');
    await page.getByLabel('Elevation (m)').fill('1500');
    await page.getByRole('button', { name: 'Create garden' }).click();
    await page.getByRole('heading', { name: 'Windy corner' }).waitFor();

    // Switch the account to US units (the account page is tested elsewhere) and reload the garden.
    await t.ds.query(`UPDATE users SET unit_system = 'us' WHERE email = $1`, [email]);
    await page.reload();
    await page.getByLabel('Wind at 2 m (mph)').waitFor();
    await page.getByLabel('Day', { exact: true }).fill('2026-06-10');
    await page.getByLabel('Min (°F)').fill('50');
    await page.getByLabel('Max (°F)').fill('86');
    await page.getByLabel('Wind at 2 m (mph)').fill('10');
    await page.getByRole('button', { name: 'Save weather day' }).click();
    await page.getByRole('cell', { name: '10 mph' }).waitFor();

    const [w] = (await t.ds.query(
      `SELECT w.t_min_c, w.t_max_c, w.wind_speed_ms FROM weather_days w JOIN gardens g ON g.id = w.garden_id WHERE g.name = 'Windy corner' AND w.day = '2026-06-10'`,
    )) as { t_min_c: number; t_max_c: number; wind_speed_ms: number }[];
    expect(w!.t_min_c).toBeCloseTo(10, 9); // (50 − 32) × 5/9
    expect(w!.t_max_c).toBeCloseTo(30, 9); // (86 − 32) × 5/9
    expect(w!.wind_speed_ms).toBeCloseTo(4.4704, 9); // 10 × 0.44704
    await page.screenshot({ path: 'tests/artifacts/weather-us-units.png', fullPage: true });
  });
});
