/**
 * The Round suggests what a pot takes to fill: with a seep test, capacity minus the straight-line
 * estimate since the last refill (linear seepage is a simplification, common practice, no source);
 * without one, the last refill's volume. The reminder's link pre-marks the pot with the same
 * suggestion. "Last refilled" counts calendar days in the garden's zone (America/Denver, MDT =
 * UTC−6 in June, IANA tz database), not in the phone's (UTC here) nor 24-hour periods.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv({ viewport: { width: 390, height: 844 }, timezoneId: 'UTC' });
});
afterAll(async () => {
  env.t.clock.now = null;
  await env?.close();
});

describe('the Round’s top-up suggestion', () => {
  it('suggests capacity − the seep-test estimate, else the last refill, and pre-marks the reminder’s pot with it', async ({ onTestFailed }) => {
    onTestFailed(() => env.screenshot('round-top-up-failure'));
    const { page, baseUrl, t } = env;
    // 13:00Z on 1 June is 07:00 in Denver; both refills were at 03:00Z, 21:00 on 31 May in Denver.
    const now = new Date('2026-06-01T13:00:00Z');
    t.clock.now = now;
    await page.clock.setFixedTime(now);

    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Ilse');
    await page.getByLabel('E-mail').fill(`ilse.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('squash-vine-clay-77');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Ilse' }).waitFor();
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const post = async (url: string, data: object) => {
      const res = await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
      expect(res.ok(), `${url}: ${await res.text()}`).toBe(true);
      return (await res.json()).data;
    };
    const garden = await post('/api/gardens', { name: 'Huerta del arroyo', latitudeDeg: 39.7, longitudeDeg: -105, elevationM: 1600, soilTexture: 'loam', timeZone: 'America/Denver' });
    const trial = await post(`/api/gardens/${garden.id}/trials`, { title: 'Calabacitas', crop: 'squash-zucchini', plantingDate: '2026-05-01' });
    const pots: { id: string; plotId: string }[] = [];
    for (const pair of ['A', 'B']) {
      const olla = await post(`/api/trials/${trial.id}/plots`, { label: `${pair}1`, blockKey: pair, areaM2: 2, treatment: 'olla' });
      await post(`/api/trials/${trial.id}/plots`, { label: `${pair}2`, blockKey: pair, areaM2: 2, treatment: 'surface' });
      pots.push(await post('/api/pots', { label: `Pot ${pair}`, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: olla.id }));
    }
    await post(`/api/trials/${trial.id}/status`, { status: 'active' });
    for (const [i, pot] of pots.entries()) {
      await post(`/api/trials/${trial.id}/water-events`, { plotId: pot.plotId, potId: pot.id, occurredAt: '2026-06-01T03:00:00Z', kind: 'olla_refill', volumeL: i === 0 ? 7 : 6 });
    }
    // Pot A lost 3 L in 12 h: 6 L/day. Ten hours after its refill that is 2.5 L gone, 2.5 L to fill (not the 7 L it last took).
    await post(`/api/pots/${pots[0]!.id}/seep-tests`, { testedOn: '2026-05-20', setting: 'in_bed', litresLost: 3, hours: 12 });

    await page.goto(`${baseUrl}/trials/${trial.id}/round?pot=${pots[0]!.id}`);
    await page.getByRole('heading', { name: 'Pots (2)' }).waitFor();
    const potA = page.getByRole('listitem').filter({ hasText: 'Pot A · plot' });
    const potB = page.getByRole('listitem').filter({ hasText: 'Pot B · plot' });
    // The reminder's pot is marked with the suggestion; the estimate is shown (5.5 of 8 L ≈ 69 %).
    await potA.getByRole('button', { name: '✓ 2.5 L', pressed: true }).waitFor();
    await potA.getByText('about 2.5 L to fill, from its seep test').waitFor();
    await potA.getByText('~69% left').waitFor();
    // Ten hours ago, but on the day before in Denver (and on the same day in the phone's UTC).
    await potA.getByText('8 L pot · last refilled yesterday').waitFor();
    // No seep test: the last refill's volume, said so.
    await potB.getByText('same as last refill (no seep test to estimate from)').waitFor();
    await potB.getByRole('button', { name: '6 L', exact: true }).click();
    await env.screenshot('round-top-up-390');
    await page.getByRole('button', { name: 'Save 2 records' }).click();
    await page.getByText('Saved 2 records.').waitFor();
    const saved = (await t.ds.query(`SELECT pot_id, volume_l FROM water_events WHERE trial_id = $1 AND occurred_at = $2`, [trial.id, now])) as { pot_id: string; volume_l: number }[];
    expect(Object.fromEntries(saved.map((r) => [r.pot_id, Number(r.volume_l)]))).toEqual({ [pots[0]!.id]: 2.5, [pots[1]!.id]: 6 });

    // Refilled just now: the estimate is a full pot, and the pot is not marked again by the refresh.
    await potA.getByText('still about full, from its seep test').waitFor();
    await potA.getByText('8 L pot · last refilled today').waitFor();
    await expect(potA.getByRole('button', { pressed: true }).count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Tap what you watered' }).waitFor();
    expect(env.pageErrors).toEqual([]);
  });
});
