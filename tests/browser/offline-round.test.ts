/**
 * The Round without signal: three refills saved with the phone offline stay on the phone ("waiting
 * to send (3)", nothing in the database), and go when the connection returns — three records,
 * not more. Then a save made offline survives a reload without a connection (the service worker
 * opens the app, the stored queue comes back) and is sent exactly once when the signal returns.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  // A phone-sized window: the Round is used on a phone in the garden.
  env = await startBrowserEnv({ viewport: { width: 390, height: 844 } });
});
afterAll(async () => {
  await env?.close();
});

/** Where the client keeps its offline queue (src/features/offline/persist.ts). */
const STORE = 'seepwise.offline.v1';

describe('the Round offline', () => {
  it('keeps refills on the phone while offline, sends each once when the connection returns, also after a reload; gives refused ones back', async () => {
    const { page, context, baseUrl, t } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Rosa');
    await page.getByLabel('E-mail').fill(`rosa.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Rosa' }).waitFor();

    // A paired trial with three pairs, one pot in each olla plot, made through the API as the grower.
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const post = async (url: string, data: object) => {
      const res = await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
      expect(res.ok(), `${url}: ${await res.text()}`).toBe(true);
      return (await res.json()).data;
    };
    const garden = await post('/api/gardens', { name: 'Huerto del fondo', latitudeDeg: 35, longitudeDeg: -106, elevationM: 1500, soilTexture: 'loam' });
    const trial = await post(`/api/gardens/${garden.id}/trials`, { title: 'Pimientos', crop: 'squash-zucchini', plantingDate: '2026-04-01' });
    for (const pair of ['A', 'B', 'C']) {
      const olla = await post(`/api/trials/${trial.id}/plots`, { label: `${pair}1`, blockKey: pair, areaM2: 2, treatment: 'olla' });
      await post(`/api/trials/${trial.id}/plots`, { label: `${pair}2`, blockKey: pair, areaM2: 2, treatment: 'surface' });
      await post('/api/pots', { label: `Pot ${pair}`, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: olla.id });
    }
    await post(`/api/trials/${trial.id}/status`, { status: 'active' });
    const waterEvents = async () =>
      (await t.ds.query(`SELECT idempotency_key FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill' ORDER BY idempotency_key`, [trial.id])) as {
        idempotency_key: string;
      }[];

    await page.goto(`${baseUrl}/trials/${trial.id}/round`);
    await page.getByRole('heading', { name: 'Pots (3)' }).waitFor();
    // The service worker has installed (precached the shell) and controls the page.
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    const manifest = await page.request.get(`${baseUrl}/manifest.webmanifest`);
    expect(await manifest.json()).toMatchObject({ name: 'Seepwise', start_url: '/', theme_color: '#b5562f', background_color: '#fdfaf5' });

    // The page hears of it by an `offline` event; wait for that, or a tap could still start a request.
    // Chromium's offline emulation is not airtight: a page controlled by the service worker has
    // been seen to reach the server while "offline" (CI, sessions 1 and 2), and `context.route`
    // does not see such requests either. A phone without signal reaches nothing, so the server
    // also drops the Round's POST unanswered until the signal "returns": what is checked is the
    // app's queue, not the emulator.
    const roundPost = /^\/api\/trials\/[^/]+\/round$/;
    const goOffline = async () => {
      env.signal.cut({ method: 'POST', path: roundPost });
      await context.setOffline(true);
      await page.waitForFunction(() => !navigator.onLine);
    };
    const goOnline = async () => {
      env.signal.restore();
      await context.setOffline(false);
    };
    const potButton = (label: string) => page.getByRole('listitem').filter({ hasText: `${label} · plot` }).getByRole('button', { name: '8 L', exact: true });
    const saveButton = page.getByRole('button', { name: /^Save \d+ records?$/ });

    // No signal: three refills, saved one by one. Each clears the taps and joins the queue.
    await goOffline();
    for (const [i, pot] of ['Pot A', 'Pot B', 'Pot C'].entries()) {
      await potButton(pot).click();
      await saveButton.click();
      await page.getByText(`Saved on this phone — waiting to send (${i + 1})`).waitFor();
      await expect(page.getByRole('button', { name: 'Tap what you watered' }).isDisabled()).resolves.toBe(true);
    }
    // The badge above the app's header says the same.
    await page.getByRole('status', { name: 'Offline · 3 waiting to send' }).waitFor();
    await env.screenshot('round-offline-390');
    expect(await waterEvents()).toEqual([]);

    // Signal back: the queue drains by itself, three records, one per idempotency key.
    await goOnline();
    await page.getByText('Sent — 3 records saved.').waitFor();
    const sent = await waterEvents();
    expect(sent).toHaveLength(3);
    expect(new Set(sent.map((r) => r.idempotency_key)).size).toBe(3);
    await page.getByRole('status', { name: /waiting to send/ }).waitFor({ state: 'detached' });
    await env.screenshot('round-sent-390');

    // Offline again: one refill, then the page is reloaded without a connection.
    await goOffline();
    await potButton('Pot B').click();
    await saveButton.click();
    await page.getByText('Saved on this phone — waiting to send (1)').waitFor();
    // Stored on the phone (the save is written a moment after the tap) ...
    const stored = await page.waitForFunction((key) => {
      const saved = JSON.parse(localStorage.getItem(key) ?? 'null') as {
        clientState: { mutations: { state: { status: string; variables: { input: { entries: { entry: { idempotencyKey: string } }[] } } } }[] };
      } | null;
      const pending = saved?.clientState.mutations.filter((m) => m.state.status === 'pending') ?? [];
      return pending.length === 1 ? pending[0]!.state.variables.input.entries.map((e) => e.entry.idempotencyKey) : null;
    }, STORE);
    const storedKeys = (await stored.jsonValue()) as string[];
    expect(storedKeys).toHaveLength(1);
    // ... but the CSRF token is not.
    const raw = (await page.evaluate((key) => localStorage.getItem(key), STORE)) ?? '';
    expect(raw).not.toContain(csrf);

    // The reload without signal opens from the service worker, with the Round and its queue.
    await page.reload();
    await page.getByRole('heading', { name: 'Pots (3)' }).waitFor();
    await page.getByText('Saved on this phone — waiting to send (1)').waitFor();
    await env.screenshot('round-reloaded-offline-390');
    expect(await waterEvents()).toHaveLength(3);

    // Signing out would clear the phone's queue: the app asks first, and staying keeps it.
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('button', { name: 'Sign out (Rosa)' }).click();
    const ask = page.getByRole('dialog', { name: '1 record has not reached Seepwise yet' });
    await ask.waitFor();
    await env.screenshot('round-sign-out-unsent-390');
    await ask.getByRole('button', { name: 'Stay signed in' }).click();
    await ask.waitFor({ state: 'hidden' });
    await page.getByText('Saved on this phone — waiting to send (1)').waitFor();

    // Signal back: sent once, with the key it was given before the reload (a fresh CSRF token is fetched).
    await goOnline();
    await page.getByText('Sent — 1 record saved.').waitFor();
    const after = await waterEvents();
    expect(after).toHaveLength(4);
    expect(after.map((r) => r.idempotency_key)).toContain(storedKeys[0]);
    // The same entry sent again (a retry after a lost answer) makes no second record.
    const [row] = await t.ds.query(
      `SELECT plot_id, pot_id, occurred_at, volume_l, idempotency_key FROM water_events WHERE idempotency_key = $1`,
      [storedKeys[0]],
    );
    const retry = await page.request.post(`${baseUrl}/api/trials/${trial.id}/round`, {
      headers: { 'X-CSRF-Token': csrf },
      data: {
        entries: [
          {
            type: 'water',
            entry: { plotId: row.plot_id, potId: row.pot_id, occurredAt: new Date(row.occurred_at).toISOString(), kind: 'olla_refill', volumeL: Number(row.volume_l), idempotencyKey: row.idempotency_key },
          },
        ],
      },
    });
    expect((await retry.json()).data).toEqual([expect.objectContaining({ created: false })]);
    expect(await waterEvents()).toHaveLength(4);
    // A save the server refuses is not lost: the trial is closed while a refill waits offline.
    await goOffline();
    await potButton('Pot C').click();
    await saveButton.click();
    await page.getByText('Saved on this phone — waiting to send (1)').waitFor();
    const loggedAt = await page.waitForFunction((key) => {
      const saved = JSON.parse(localStorage.getItem(key) ?? 'null') as {
        clientState: { mutations: { state: { status: string; variables: { input: { entries: { entry: { occurredAt: string } }[] } } } }[] };
      } | null;
      const pending = saved?.clientState.mutations.filter((m) => m.state.status === 'pending') ?? [];
      return pending.length === 1 ? pending[0]!.state.variables.input.entries[0]!.entry.occurredAt : null;
    }, STORE);
    const occurredAt = (await loggedAt.jsonValue()) as string;
    await t.ds.query(`UPDATE trials SET status = 'closed' WHERE id = $1`, [trial.id]);
    await goOnline();
    // Refused (409), it leaves the queue and waits as "not accepted" until looked at; nothing is written.
    await page.getByRole('status', { name: '1 record not accepted — open the Round to check' }).waitFor();
    expect(await waterEvents()).toHaveLength(4);
    // Reopened, the Round gives the refill back as a tap with the reason, and one Save records it.
    await t.ds.query(`UPDATE trials SET status = 'active' WHERE id = $1`, [trial.id]);
    await page.goto(`${baseUrl}/trials/${trial.id}/round`);
    await page.getByText('This trial is closed and read-only.').waitFor();
    await page.getByRole('button', { name: '✓ 8 L' }).waitFor();
    await env.screenshot('round-refused-390');
    await page.getByRole('button', { name: 'Save 1 record' }).click();
    await page.getByText('Saved 1 record.').waitFor();
    const [latest] = await t.ds.query(`SELECT occurred_at FROM water_events WHERE trial_id = $1 ORDER BY created_at DESC LIMIT 1`, [trial.id]);
    expect(new Date(latest.occurred_at).toISOString()).toBe(occurredAt);
    expect(await waterEvents()).toHaveLength(5);
    await page.getByRole('status', { name: /not accepted/ }).waitFor({ state: 'detached' });

    // Network failures while offline are expected; nothing else may go wrong on the page.
    // (A request the signal gate dropped shows as an empty response or a reset connection.)
    expect(env.pageErrors.filter((e) => !/ERR_INTERNET_DISCONNECTED|ERR_NETWORK_CHANGED|ERR_EMPTY_RESPONSE|ERR_CONNECTION_RESET|ERR_CONNECTION_CLOSED|Failed to fetch/.test(e))).toEqual([]);
  });
});
