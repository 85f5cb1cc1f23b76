/**
 * HTML and script-like text typed into any free-text field never runs in any page. Through the
 * API a grower and a lead fill every free-text field they can reach (display names, garden,
 * trial, plots, pots, seep tests, logs, cohort) with markup; then a real browser visits every
 * page that shows them. Each page must show the text as text: no injected element in the DOM,
 * no `window.__xss`, no dialog, and no blocked inline script reported by the CSP (which would mean
 * markup got through and only the policy stopped it).
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';
import { ApiAgent, uniqueEmail } from '../helpers/test-app';

const IMG = '<img src=x onerror=window.__xss=1>';
const SCRIPT = '<script>window.__xss=1</script>';
const SVG = '<svg onload=window.__xss=1>';
const LINK = '<a href="javascript:window.__xss=1">x</a>';
const JS_URL = 'javascript:window.__xss=1';
const ALL = `${IMG} ${SCRIPT} ${SVG} ${LINK} ${JS_URL}`;

let env: BrowserEnv;
const dialogs: string[] = [];
const PASSWORD = 'tomato-basin-clay-42';

beforeAll(async () => {
  env = await startBrowserEnv();
  env.page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  // Report every CSP violation into the page, before any page script runs.
  await env.context.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    // zod probes `new Function('')` once to see whether eval is allowed: that blocked eval is ours, not injected.
    document.addEventListener('securitypolicyviolation', (e) => {
      if (e.blockedURI !== 'eval') w.__csp.push(`${e.violatedDirective} ${e.blockedURI} ${e.sample}`);
    });
  });
});

afterAll(async () => {
  await env?.close();
});

/** Forgets whoever was signed in: cookies, and whatever the client keeps in the browser's storage. */
async function forgetBrowser(page: Page, baseUrl: string) {
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in`);
  await page.evaluate(async () => {
    localStorage.clear();
    sessionStorage.clear();
    for (const db of await indexedDB.databases()) if (db.name) indexedDB.deleteDatabase(db.name);
  });
}

/** Signs in through the sign-in form, as a person would. */
async function signInBrowser(page: Page, baseUrl: string, email: string) {
  await forgetBrowser(page, baseUrl);
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), { timeout: 60_000 });
}

/** What a page must not contain once it has rendered our data. */
async function injectedMarkup(page: Page) {
  return page.evaluate(() => {
    const w = window as unknown as { __xss?: unknown; __csp?: string[] };
    return {
      xss: w.__xss,
      csp: w.__csp ?? [],
      elements: Array.from(document.querySelectorAll('img[src="x"], svg[onload], [onerror], [onload], a[href^="javascript:" i], iframe, object, embed')).map(
        (e) => e.outerHTML.slice(0, 120),
      ),
      scripts: Array.from(document.querySelectorAll('script')).filter((s) => s.textContent?.includes('__xss')).length,
      text: document.body.innerText,
    };
  });
}

describe('script-like text in every free-text field', () => {
  it('is shown as text and never runs, on every page that shows it', async () => {
    const { page, baseUrl, t } = env;
    const growerEmail = uniqueEmail('xss-grower');
    const leadEmail = uniqueEmail('xss-lead');

    // The lead: an admin educator with a cohort whose name and description carry markup.
    const lead = new ApiAgent(t.app);
    const leadUser = await lead.signUp({ email: leadEmail, password: PASSWORD, role: 'educator', displayName: `${IMG}${SCRIPT}`.slice(0, 80) });
    await t.ds.query(`UPDATE users SET role = 'admin' WHERE id = $1`, [leadUser.id]);
    const cohort = (await lead.post('/api/cohorts', { name: `${IMG} cohort`, description: ALL })).body.data;
    expect(cohort.id).toBeTruthy();

    // The grower fills every free-text field of the notebook.
    const a = new ApiAgent(t.app);
    await a.signUp({ email: growerEmail, password: PASSWORD, displayName: `${SVG}${LINK}`.slice(0, 80) });
    const garden = (
      await a.post('/api/gardens', { name: `${IMG} garden`, notes: ALL, latitudeDeg: 35.08, longitudeDeg: -106.65, elevationM: 1500, soilTexture: 'loam' })
    ).body.data;
    const trialRes = await a.post(`/api/gardens/${garden.id}/trials`, {
      title: `${SCRIPT} trial`,
      crop: 'other',
      cropName: IMG,
      variety: SVG,
      question: ALL,
      protocolNotes: ALL,
      plantingDate: '2026-05-01',
      design: 'paired',
    });
    expect(trialRes.status).toBe(201);
    const trial = trialRes.body.data;
    for (const [label, blockKey] of [
      [IMG, SVG],
      [SCRIPT, SVG],
      [SVG, JS_URL],
      [LINK.slice(0, 40), JS_URL],
    ] as const) {
      expect((await a.post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 2 })).status).toBe(201);
    }
    const plots = (await a.post(`/api/trials/${trial.id}/randomise`, {})).body.data.plots as { id: string; treatment: string }[];
    await a.post(`/api/trials/${trial.id}/status`, { status: 'active' });
    const olla = plots.find((p) => p.treatment === 'olla')!;
    const pot = (
      await a.post('/api/pots', { label: SVG, notes: ALL, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: olla.id })
    ).body.data;
    expect((await a.post(`/api/pots/${pot.id}/seep-tests`, { testedOn: '2026-04-20', setting: 'air', litresLost: 1.2, hours: 24, notes: IMG })).status).toBe(
      201,
    );
    expect(
      (
        await a.post(`/api/trials/${trial.id}/water-events`, {
          plotId: olla.id,
          occurredAt: '2026-06-01T07:00:00Z',
          kind: 'olla_refill',
          volumeL: 5,
          potId: pot.id,
          notes: ALL.slice(0, 500),
        })
      ).status,
    ).toBe(201);
    expect((await a.post(`/api/trials/${trial.id}/observations`, { plotId: olla.id, observedAt: '2026-06-02T07:00:00Z', text: ALL })).status).toBe(201);
    expect((await a.post(`/api/trials/${trial.id}/harvests`, { plotId: olla.id, harvestedOn: '2026-07-20', freshKg: 1.5, notes: SCRIPT })).status).toBe(201);
    expect((await a.post('/api/cohorts/join', { code: cohort.joinCode })).status).toBeLessThan(300);
    expect((await a.post(`/api/trials/${trial.id}/shares`, { cohortId: cohort.id })).status).toBe(201);
    // Edits while shared are audited: the History tab shows markup in old and new values.
    await a.patch(`/api/trials/${trial.id}`, { title: `${IMG} trial, renamed` });
    // An invitation whose e-mail (shown in the admin outbox) and preview page carry the cohort name.
    const invitee = uniqueEmail('xss-invitee');
    expect((await lead.post(`/api/cohorts/${cohort.id}/invitations`, { email: invitee })).status).toBe(201);
    const mail = await t.sink.waitFor((m) => m.to.includes(invitee));
    const inviteToken = decodeURIComponent(/join\?invite=([A-Za-z0-9_%-]+)/.exec(mail.text)![1]!);

    const visited: string[] = [];
    const failures: string[] = [];
    /** Opens a page (and a tab on it), waits for the data, and checks nothing injected rendered or ran. */
    const visit = async (path: string, opts: { tab?: string; mustShow?: string } = {}) => {
      await page.goto(`${baseUrl}${path}`);
      await page.waitForLoadState('networkidle');
      if (opts.tab) {
        await page.getByRole('tab', { name: opts.tab }).click();
        await page.waitForLoadState('networkidle');
      }
      if (opts.mustShow) await page.getByText(opts.mustShow, { exact: false }).first().waitFor({ timeout: 60_000 });
      const found = await injectedMarkup(page);
      const where = `${path}${opts.tab ? ` [${opts.tab}]` : ''}`;
      visited.push(where);
      if (found.xss !== undefined) failures.push(`${where}: window.__xss was set`);
      if (found.elements.length) failures.push(`${where}: injected elements ${found.elements.join(' | ')}`);
      if (found.scripts) failures.push(`${where}: ${found.scripts} injected script element(s)`);
      if (found.csp.length) failures.push(`${where}: CSP blocked ${found.csp.join(' | ')}`);
      if (opts.mustShow && !found.text.includes(opts.mustShow)) failures.push(`${where}: the text "${opts.mustShow}" is not shown as text`);
    };

    await signInBrowser(page, baseUrl, growerEmail);
    await visit('/', { mustShow: 'onload=window.__xss=1' });
    await visit(`/gardens/${garden.id}`, { mustShow: `${IMG} garden` });
    await visit(`/trials/${trial.id}`, { mustShow: `${IMG} trial, renamed` });
    await visit(`/trials/${trial.id}`, { tab: 'Records', mustShow: 'onerror=window.__xss=1' });
    await visit(`/trials/${trial.id}`, { tab: 'Setup', mustShow: SCRIPT });
    await visit(`/trials/${trial.id}`, { tab: 'Sharing', mustShow: `${IMG} cohort` });
    await visit(`/trials/${trial.id}`, { tab: 'History', mustShow: 'window.__xss=1' });
    await visit(`/trials/${trial.id}/round`, { mustShow: SVG });
    await visit('/pots', { mustShow: SVG });
    await visit('/planner');
    await visit('/cohorts', { mustShow: `${IMG} cohort` });
    await visit(`/cohorts/${cohort.id}`, { mustShow: `${IMG} cohort` });
    await visit('/account', { mustShow: 'onload=window.__xss=1' });
    await visit(`/join?code=${cohort.joinCode}`);

    await signInBrowser(page, baseUrl, leadEmail);
    await visit(`/cohorts/${cohort.id}`, { mustShow: JS_URL });
    await visit('/admin', { mustShow: 'onerror=window.__xss=1' });
    await visit('/admin/outbox', { mustShow: `${IMG} cohort` });
    await visit('/account', { mustShow: SCRIPT });
    await forgetBrowser(page, baseUrl);

    await visit(`/join?invite=${encodeURIComponent(inviteToken)}`, { mustShow: `${IMG} cohort` });

    // The detector is not blind: markup planted on purpose is found, and the CSP reports its blocked handler.
    await page.evaluate((html) => document.body.insertAdjacentHTML('beforeend', html), IMG);
    await page.waitForFunction(() => ((window as unknown as { __csp?: string[] }).__csp ?? []).length > 0, undefined, { timeout: 10_000 });
    const planted = await injectedMarkup(page);
    expect(planted.elements.length).toBeGreaterThan(0);
    expect(planted.xss).toBeUndefined();

    expect(visited.length).toBeGreaterThanOrEqual(18);
    expect(failures).toEqual([]);
    expect(dialogs).toEqual([]);
    expect(await page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss)).toBeUndefined();
  }, 300_000);
});
