/**
 * A refill saved on the phone without signal must survive the session running out before the
 * signal returns: the send is refused (signed out), the app asks the grower to sign in again, and
 * after signing in the Round gives the refill back to be saved — nothing typed in the garden is lost.
 * (Before session 3, signing in cleared the whole query client, the waiting refill with it.)
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv({ viewport: { width: 390, height: 844 } });
});
afterAll(async () => {
  await env?.close();
});

describe('the Round when the session runs out offline', () => {
  it('keeps a waiting refill through an expired session and a new sign-in, then saves it once', async ({ onTestFailed }) => {
    onTestFailed(() => env.screenshot('offline-session-expiry-failure'));
    const { page, context, baseUrl, t } = env;
    const email = `marta.${Date.now()}@example.test`;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Marta');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Marta' }).waitFor();

    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const post = async (url: string, data: object) => {
      const res = await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
      expect(res.ok(), `${url}: ${await res.text()}`).toBe(true);
      return (await res.json()).data;
    };
    const garden = await post('/api/gardens', { name: 'Patio norte', latitudeDeg: 32, longitudeDeg: -111, elevationM: 700, soilTexture: 'sandy_loam' });
    const trial = await post(`/api/gardens/${garden.id}/trials`, { title: 'Melones', crop: 'sweet-melon', plantingDate: '2026-04-10' });
    const olla = await post(`/api/trials/${trial.id}/plots`, { label: 'A1', blockKey: 'A', areaM2: 2, treatment: 'olla' });
    await post(`/api/trials/${trial.id}/plots`, { label: 'A2', blockKey: 'A', areaM2: 2, treatment: 'surface' });
    await post('/api/pots', { label: 'Pot A', capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: olla.id });
    await post(`/api/trials/${trial.id}/status`, { status: 'active' });
    const refills = async () => (await t.ds.query(`SELECT id FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill'`, [trial.id])) as unknown[];

    await page.goto(`${baseUrl}/trials/${trial.id}/round`);
    await page.getByRole('heading', { name: 'Pots (1)' }).waitFor();

    // No signal (the server drops the Round's POST, see offline-round.test.ts): one refill waits.
    env.signal.cut({ method: 'POST', path: /^\/api\/trials\/[^/]+\/round$/ });
    await context.setOffline(true);
    await page.waitForFunction(() => !navigator.onLine);
    await page.getByRole('listitem').filter({ hasText: 'Pot A · plot' }).getByRole('button', { name: '8 L', exact: true }).click();
    await page.getByRole('button', { name: 'Save 1 record' }).click();
    await page.getByText('Saved on this phone — waiting to send (1)').waitFor();

    // Meanwhile the session ends on the server (expired, or signed out elsewhere).
    await t.ds.query('DELETE FROM session');
    env.signal.restore();
    await context.setOffline(false);

    // The send is refused; the app sends the grower to sign in again.
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(await refills()).toEqual([]);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Sign in' }).click();

    // Back on the Round, the refill is there to be saved: one Save records it, once.
    await page.getByRole('heading', { name: 'Pots (1)' }).waitFor();
    await page.getByRole('button', { name: '✓ 8 L' }).waitFor();
    await env.screenshot('round-after-expired-session-390');
    await page.getByRole('button', { name: 'Save 1 record' }).click();
    await page.getByText('Saved 1 record.').waitFor();
    expect(await refills()).toHaveLength(1);
  });
});
