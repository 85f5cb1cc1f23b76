/**
 * Accessibility sweep: the invented Saltbush Bend demo season is loaded, and every route of
 * src/app/router.tsx is opened as the person who would use it (signed out, grower, cohort lead,
 * cohort observer, admin), at 1280 and at 360 px wide. axe-core checks each settled page (at 1280 px,
 * and the screens mostly used on a phone at 360 px too) against
 * WCAG 2.0/2.1 A and AA and WCAG 2.2 AA; serious and critical findings fail the sweep. The page
 * must also reflow without sideways scrolling at 360 px (WCAG 1.4.10) and at 200 % zoom of a
 * 1280 × 800 window, and the sign-in form and the Round must work from the keyboard alone.
 */
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, seedDemoIfEmpty } from '../../server/db/seed/demo';
import { createLogger } from '../../server/lib/logger';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';
import { ApiAgent } from '../helpers/test-app';

const WIDTHS = [1280, 360] as const;
/** A sweep opens dozens of pages and runs axe on each: minutes, not the default minute. */
const SWEEP_TIMEOUT = 900_000;
const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

interface Visit {
  /** How the route is named in the report. */
  name: string;
  path: string;
  /** A trial tab to open after the page loads. */
  tab?: string;
  /** The page's main heading (a string is matched exactly). */
  heading: string | RegExp;
  /**
   * A screen people mostly use on a phone: axe runs on it at 360 px as well. Every route gets axe at
   * 1280 px and the reflow check at 360 px; axe at both widths for all ~35 routes took over 20
   * minutes on a busy 2-core machine, and the narrow layout differs from the wide one mostly in the
   * menu, whose open state is checked on its own below.
   */
  phone?: boolean;
}

interface Finding {
  route: string;
  width: number;
  rule: string;
  impact: string;
  help: string;
  targets: string[];
}

let env: BrowserEnv;
const ids = {
  ruthGarden: '',
  tomatoTrial: '',
  beansTrial: '',
  network: '',
  inviteToken: '',
  resetToken: '',
  verifyToken: '',
  joinCode: '',
};
const findings: Finding[] = [];
const overflowing: string[] = [];
const visited: string[] = [];
/** Route @ width pairs axe checked. */
const axed: string[] = [];

/** Waits until the page has stopped loading: no request in flight, no "Loading…" status, every chart drawn. */
async function settle(page: Page) {
  await page.waitForLoadState('networkidle', { timeout: 10_000 }).catch(() => undefined);
  await page.waitForFunction(
    () => {
      const busy = Array.from(document.querySelectorAll('[role="status"]')).some((e) => /Loading|Drawing|Checking the link|Turning them off|Working…/.test(e.textContent ?? ''));
      // A chart is ready once drawn and its save buttons are shown (they come with the drawn view).
      const undrawn = Array.from(document.querySelectorAll('figure div[role="img"]')).some((e) => !e.querySelector('svg') || !e.parentElement?.querySelector('button[aria-label^="Save “"]'));
      return !busy && !undrawn;
    },
    undefined,
    { timeout: 30_000, polling: 100 },
  );
  await page.waitForLoadState('networkidle', { timeout: 10_000 }).catch(() => undefined);
}

/**
 * Forgets the signed-in person: the session cookie, and what the app keeps on the device (the
 * offline copy of the session and the Round in localStorage), as signing out on a shared phone does.
 */
/** The page's width against the window's, and the innermost elements that stick out past its right edge. */
function pageWidth(page: Page) {
  return page.evaluate(() => {
    const limit = window.innerWidth + 1;
    // Content a narrower scroll box clips does not widen the page, unless it is positioned (and so escapes the box).
    const clipped = (e: Element) => {
      if (['absolute', 'fixed'].includes(getComputedStyle(e).position)) return false;
      for (let a = e.parentElement; a; a = a.parentElement) {
        if (getComputedStyle(a).overflowX !== 'visible' && a.getBoundingClientRect().right <= limit) return true;
      }
      return false;
    };
    const out = Array.from(document.body.querySelectorAll('*')).filter((e) => e.getBoundingClientRect().right > limit && !clipped(e));
    const innermost = out.filter((e) => !out.some((o) => o !== e && e.contains(o)));
    const describe = (e: Element) => `<${e.tagName.toLowerCase()} class="${(e.getAttribute('class') ?? '').slice(0, 80)}"> ${Math.round(e.getBoundingClientRect().right)}px "${(e.textContent ?? '').trim().slice(0, 40)}"`;
    return { scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth, culprits: innermost.slice(0, 3).map(describe) };
  });
}

async function signOut() {
  const { page, baseUrl, context } = env;
  await context.clearCookies();
  if (page.url().startsWith(baseUrl)) {
    await page.evaluate(() => {
      localStorage.clear();
      sessionStorage.clear();
    });
  }
}

async function signIn(email: string) {
  const { page, baseUrl } = env;
  await signOut();
  const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
  const res = await page.request.post(`${baseUrl}/api/auth/sign-in`, { headers: { 'X-CSRF-Token': csrf }, data: { email, password: DEMO_PASSWORD } });
  expect(res.status(), await res.text()).toBe(200);
}

/** Opens a route, waits for it to settle, runs axe and records serious/critical findings and sideways scrolling. */
async function audit(v: Visit, width: number) {
  const { page, baseUrl } = env;
  const t0 = Date.now();
  const lap = (what: string) => process.env.A11Y_DEBUG && console.log(`${v.name} @${width}: ${what} ${Date.now() - t0}ms`);
  await page.goto(`${baseUrl}${v.path}`);
  const heading = page.getByRole('heading', { level: 1, name: v.heading, exact: typeof v.heading === 'string' });
  await heading.waitFor();
  if (v.tab) {
    await page.getByRole('tab', { name: v.tab, exact: true }).click();
    await page.getByRole('tab', { name: v.tab, exact: true, selected: true }).waitFor();
  }
  lap('heading');
  await settle(page);
  lap('settled');
  const label = `${v.name} @${width}px`;
  // Legacy mode runs axe in the page itself (no extra page per run: we have no iframes to combine).
  const runAxe = width >= 1280 || v.phone;
  const violations = runAxe ? (await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze()).violations : [];
  lap('axe');
  if (runAxe) axed.push(label);
  for (const violation of violations) {
    if (violation.impact !== 'serious' && violation.impact !== 'critical') continue;
    findings.push({
      route: label,
      width,
      rule: violation.id,
      impact: violation.impact,
      help: violation.help,
      targets: violation.nodes.map((n) => `${n.target.join(' ')}  ${n.html.replace(/\s+/g, ' ').slice(0, 140)}`),
    });
  }
  const scroll = await pageWidth(page);
  if (scroll.scrollWidth > scroll.innerWidth + 1) overflowing.push(`${label}: page is ${scroll.scrollWidth}px wide in a ${scroll.innerWidth}px window; widest: ${scroll.culprits.join(' | ')}`);
  expect(await heading.isVisible()).toBe(true);
  visited.push(label);
}

async function auditAll(visits: Visit[]) {
  for (const width of WIDTHS) {
    await env.page.setViewportSize({ width, height: 800 });
    for (const v of visits) await audit(v, width);
  }
}

function report(list: Finding[]) {
  return list.map((f) => `${f.route} · ${f.rule} (${f.impact}): ${f.help}\n    ${f.targets.slice(0, 8).join('\n    ')}${f.targets.length > 8 ? `\n    … and ${f.targets.length - 8} more` : ''}`).join('\n');
}

beforeAll(async () => {
  env = await startBrowserEnv();
  const { t } = env;
  await seedDemoIfEmpty(t.ds, createLogger('silent'));
  const one = async (sql: string, params: unknown[] = []) => ((await t.ds.query(sql, params)) as Record<string, string>[])[0]!;
  ids.ruthGarden = (await one(`SELECT g.id FROM gardens g JOIN users u ON u.id = g.owner_id WHERE u.email = 'ruth@saltbush.example' ORDER BY g.name LIMIT 1`)).id!;
  ids.tomatoTrial = (await one(`SELECT id FROM trials WHERE title = 'South bed tomatoes: ollas or the can?'`)).id!;
  ids.beansTrial = (await one(`SELECT id FROM trials WHERE title = 'Late green beans in the small beds (trying it out)'`)).id!;
  const network = await one(`SELECT id, join_code FROM cohorts WHERE name = 'Saltbush Bend Garden Network'`);
  ids.network = network.id!;
  ids.joinCode = network.join_code!;

  // The e-mailed links (an invitation, a password reset, an address confirmation), made through the API as their senders would.
  const lead = new ApiAgent(t.app);
  expect((await lead.signIn('marisol@saltbush.example', DEMO_PASSWORD)).status).toBe(200);
  expect((await lead.post(`/api/cohorts/${ids.network}/invitations`, { email: 'newcomer@saltbush.example', role: 'contributor' })).status).toBe(201);
  const invite = await t.sink.waitFor((m) => m.to.includes('newcomer@saltbush.example'));
  ids.inviteToken = decodeURIComponent(invite.text.match(/\/join\?invite=([A-Za-z0-9_%-]+)/)![1]!);
  const anon = new ApiAgent(t.app);
  await anon.refreshCsrf();
  expect((await anon.post('/api/auth/password-reset/request', { email: 'wendell@saltbush.example' })).status).toBe(202);
  const reset = await t.sink.waitFor((m) => m.to.includes('wendell@saltbush.example') && /reset-password\?token=/.test(m.text));
  ids.resetToken = decodeURIComponent(reset.text.match(/reset-password\?token=([A-Za-z0-9_%-]+)/)![1]!);
  const fresh = new ApiAgent(t.app);
  await fresh.signUp({ email: 'fresh.grower@example.test', displayName: 'Fresh Grower' });
  const verify = await t.sink.waitFor((m) => m.to.includes('fresh.grower@example.test') && /verify-email\?token=/.test(m.text));
  ids.verifyToken = decodeURIComponent(verify.text.match(/verify-email\?token=([A-Za-z0-9_%-]+)/)![1]!);
});

beforeEach(({ onTestFailed, task }) => {
  onTestFailed(async () => {
    await env.screenshot(`accessibility-failure-${task.name.slice(0, 30).replace(/[^a-z0-9]+/gi, '-')}`);
    console.error(`Page errors: ${env.pageErrors.join('\n') || 'none'}; at ${env.page.url()}`);
  });
});

afterAll(async () => {
  await env?.close();
});

describe('axe over every route, at 1280 and 360 px', () => {
  it('signed out: sign-in, sign-up, password reset, e-mail confirmation, unsubscribe, join with an invitation and with a code', async () => {
    await signOut();
    await auditAll([
      { name: 'sign-in', path: '/sign-in', heading: 'Sign in', phone: true },
      { name: 'sign-in (session ended)', path: '/sign-in?reason=expired', heading: 'Sign in' },
      { name: 'sign-up', path: '/sign-up', heading: 'Create an account', phone: true },
      { name: 'forgot password', path: '/forgot-password', heading: 'Reset your password' },
      { name: 'reset password', path: `/reset-password?token=${encodeURIComponent(ids.resetToken)}`, heading: 'Choose a new password' },
      { name: 'reset password (no token)', path: '/reset-password', heading: 'Choose a new password' },
      { name: 'unsubscribe (no token)', path: '/unsubscribe', heading: 'Stop these e-mails' },
      { name: 'join (invitation preview)', path: `/join?invite=${encodeURIComponent(ids.inviteToken)}`, heading: 'Your invitation' },
      { name: 'join (code)', path: `/join?code=${ids.joinCode}`, heading: 'Join a cohort', phone: true },
    ]);
    // Confirming an address works once: the link is opened at one width only, and a used link at the other.
    await env.page.setViewportSize({ width: 360, height: 800 });
    await audit({ name: 'verify e-mail', path: `/verify-email?token=${encodeURIComponent(ids.verifyToken)}`, heading: 'Confirm your e-mail' }, 360);
    await env.page.setViewportSize({ width: 1280, height: 800 });
    await audit({ name: 'verify e-mail (used link)', path: `/verify-email?token=${encodeURIComponent(ids.verifyToken)}`, heading: 'Confirm your e-mail' }, 1280);
    expect(visited.filter((v) => /^(sign|forgot|reset|unsubscribe|join|verify)/.test(v))).toHaveLength(20);
  }, SWEEP_TIMEOUT);

  it('grower: home, garden, every tab of a trial, the Round, pots, planner, guides, account, join, not found', async () => {
    await signIn('ruth@saltbush.example');
    const trial = `/trials/${ids.tomatoTrial}`;
    const trialHeading = 'South bed tomatoes: ollas or the can?';
    await auditAll([
      { name: 'home', path: '/', heading: 'Hello, Ruth Abernathy-Sol', phone: true },
      { name: 'garden', path: `/gardens/${ids.ruthGarden}`, heading: 'Mesquite Lane yard', phone: true },
      { name: 'new garden', path: '/gardens/new', heading: /garden/i },
      { name: 'trial · Results', path: trial, tab: 'Results', heading: trialHeading },
      { name: 'trial · Records', path: trial, tab: 'Records', heading: trialHeading, phone: true },
      { name: 'trial · Setup', path: trial, tab: 'Setup', heading: trialHeading },
      { name: 'trial · Sharing', path: trial, tab: 'Sharing', heading: trialHeading },
      { name: 'trial · History', path: trial, tab: 'History', heading: trialHeading },
      { name: 'active trial · Import', path: `/trials/${ids.beansTrial}`, tab: 'Import', heading: 'Late green beans in the small beds (trying it out)' },
      { name: 'Round', path: `/trials/${ids.beansTrial}/round`, heading: 'Late green beans in the small beds (trying it out)', phone: true },
      { name: 'pot shelf', path: '/pots', heading: /pot shelf/i, phone: true },
      { name: 'planner', path: '/planner', heading: /planner/i },
      { name: 'cohorts (contributor)', path: '/cohorts', heading: /cohorts/i },
      { name: 'guides', path: '/guides', heading: /guide/i },
      { name: 'account', path: '/account', heading: /account/i },
      { name: 'join (signed in)', path: '/join', heading: 'Join a cohort' },
      { name: 'not found', path: '/no-such-page', heading: /not found|no page/i },
      { name: 'admin (not an admin)', path: '/admin', heading: 'Not available' },
    ]);
    expect(visited.filter((v) => v.startsWith('trial ·'))).toHaveLength(10);
  }, SWEEP_TIMEOUT);

  it('cohort lead: cohorts and the cohort page with pooled results, members, invitations and settings', async () => {
    await signIn('marisol@saltbush.example');
    await auditAll([
      { name: 'cohorts (lead)', path: '/cohorts', heading: /cohorts/i },
      { name: 'cohort (lead)', path: `/cohorts/${ids.network}`, heading: 'Saltbush Bend Garden Network' },
      { name: 'shared trial · Results (cohort reader)', path: `/trials/${ids.tomatoTrial}`, tab: 'Results', heading: 'South bed tomatoes: ollas or the can?' },
      { name: 'shared trial · Setup (cohort reader)', path: `/trials/${ids.tomatoTrial}`, tab: 'Setup', heading: 'South bed tomatoes: ollas or the can?' },
    ]);
    expect(visited.filter((v) => v.startsWith('cohort (lead)'))).toHaveLength(2);
  }, SWEEP_TIMEOUT);

  it('cohort observer: cohorts and the cohort page', async () => {
    await signIn('student@saltbush.example');
    await auditAll([
      { name: 'cohorts (observer)', path: '/cohorts', heading: /cohorts/i },
      { name: 'cohort (observer)', path: `/cohorts/${ids.network}`, heading: 'Saltbush Bend Garden Network', phone: true },
    ]);
    expect(visited.filter((v) => v.startsWith('cohort (observer)'))).toHaveLength(2);
  }, SWEEP_TIMEOUT);

  it('admin: accounts and health, the outbox', async () => {
    await signIn('admin@saltbush.example');
    await auditAll([
      { name: 'admin', path: '/admin', heading: /admin/i },
      { name: 'admin outbox', path: '/admin/outbox', heading: /admin|outbox/i },
    ]);
    expect(visited.filter((v) => v.startsWith('admin'))).toHaveLength(4 + 2);
  }, SWEEP_TIMEOUT);

  it('finds no serious or critical axe violation on any route', () => {
    expect(findings, `\n${report(findings)}\n`).toEqual([]);
    expect(visited.length).toBeGreaterThan(60);
    // Every route at 1280 px, and the phone screens at 360 px too.
    expect(axed.filter((a) => a.endsWith('@1280px')).length).toBeGreaterThan(30);
    expect(axed.filter((a) => a.endsWith('@360px')).length).toBeGreaterThanOrEqual(9);
  });

  it('never scrolls the page sideways at 360 px (WCAG 1.4.10 reflow)', () => {
    expect(overflowing, `\n${overflowing.join('\n')}\n`).toEqual([]);
  });
});

describe('open states', () => {
  it('the phone menu and a confirmation dialog, open, have no serious or critical axe violation', async () => {
    const { page, baseUrl } = env;
    await signIn('ruth@saltbush.example');
    await page.setViewportSize({ width: 360, height: 800 });
    const found: Finding[] = [];
    const check = async (route: string) => {
      const result = await new AxeBuilder({ page }).withTags(TAGS).setLegacyMode(true).analyze();
      for (const v of result.violations.filter((x) => x.impact === 'serious' || x.impact === 'critical')) {
        found.push({ route, width: 360, rule: v.id, impact: v.impact!, help: v.help, targets: v.nodes.map((n) => n.target.join(' ')) });
      }
    };
    await page.goto(`${baseUrl}/gardens/${ids.ruthGarden}`);
    await page.getByRole('heading', { level: 1, name: 'Mesquite Lane yard' }).waitFor();
    await settle(page);
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Pot shelf' }).waitFor();
    await check('garden, menu open');
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    const dialog = page.getByRole('dialog', { name: 'Delete Mesquite Lane yard?' });
    await dialog.waitFor();
    // The safe choice has the focus first.
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Cancel');
    await check('garden, delete dialog open');
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(found, `\n${report(found)}\n`).toEqual([]);
    await page.setViewportSize({ width: 1280, height: 800 });
  }, SWEEP_TIMEOUT);
});

describe('200 % zoom', () => {
  it('the main screens reflow without sideways scrolling in a 1280 × 800 window zoomed to 200 % (640 × 400 CSS px)', async () => {
    const { page, baseUrl } = env;
    await signIn('ruth@saltbush.example');
    // Browser zoom divides the CSS viewport: 200 % of 1280 × 800 lays the page out in 640 × 400 CSS px.
    await page.setViewportSize({ width: 640, height: 400 });
    const screens: Visit[] = [
      { name: 'home', path: '/', heading: 'Hello, Ruth Abernathy-Sol' },
      { name: 'trial · Results', path: `/trials/${ids.tomatoTrial}`, heading: 'South bed tomatoes: ollas or the can?' },
      { name: 'trial · Records', path: `/trials/${ids.tomatoTrial}`, tab: 'Records', heading: 'South bed tomatoes: ollas or the can?' },
      { name: 'Round', path: `/trials/${ids.beansTrial}/round`, heading: 'Late green beans in the small beds (trying it out)' },
      { name: 'pot shelf', path: '/pots', heading: /pot shelf/i },
      { name: 'planner', path: '/planner', heading: /planner/i },
      { name: 'guides', path: '/guides', heading: /guide/i },
      { name: 'account', path: '/account', heading: /account/i },
    ];
    const wide: string[] = [];
    for (const v of screens) {
      await page.goto(`${baseUrl}${v.path}`);
      await page.getByRole('heading', { level: 1, name: v.heading, exact: typeof v.heading === 'string' }).waitFor();
      if (v.tab) await page.getByRole('tab', { name: v.tab, exact: true }).click();
      await settle(page);
      const s = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
      if (s.scrollWidth > s.innerWidth + 1) wide.push(`${v.name}: ${s.scrollWidth}px in ${s.innerWidth}px`);
    }
    // The navigation stays reachable: the menu button opens it.
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Planner' }).waitFor();
    expect(wide).toEqual([]);
    await page.setViewportSize({ width: 1280, height: 800 });
  }, SWEEP_TIMEOUT);
});

describe('keyboard only', () => {
  it('signs in from the keyboard: Tab moves through the form in order and Enter submits', async () => {
    const { page, baseUrl } = env;
    await signOut();
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
    const focused = () => page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      return el ? (el.getAttribute('aria-label') ?? (el as HTMLInputElement).labels?.[0]?.textContent ?? el.textContent ?? '').trim() : '';
    });
    const order: string[] = [];
    for (let i = 0; i < 5; i++) {
      await page.keyboard.press('Tab');
      order.push(await focused());
    }
    // The logo link home comes first, then the language picker, then the form in reading order.
    expect(order).toEqual(['Seepwise home', 'Language', 'E-mail', 'Password', 'Sign in']);
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Shift+Tab');
    expect(await focused()).toBe('E-mail');
    await page.keyboard.type('ruth@saltbush.example');
    await page.keyboard.press('Tab');
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Hello, Ruth Abernathy-Sol', level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/');
  }, SWEEP_TIMEOUT);

  it('saves a chart from the keyboard: the save buttons sit outside the chart image and Enter downloads the file', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/trials/${ids.tomatoTrial}`);
    await page.getByRole('heading', { name: 'South bed tomatoes: ollas or the can?', level: 1 }).waitFor();
    await settle(page);
    const save = page.getByRole('button', { name: 'Save “Water difference in each pair” as SVG' });
    expect(await save.evaluate((b) => b.closest('[role="img"]'))).toBeNull();
    await save.focus();
    const [download] = await Promise.all([page.waitForEvent('download'), page.keyboard.press('Enter')]);
    expect(download.suggestedFilename()).toBe('paired-differences.svg');
  }, SWEEP_TIMEOUT);

  it('walks the Round from the keyboard: Tab reaches the pot buttons, Space marks a pot, Enter saves', async () => {
    const { page, baseUrl, t } = env;
    await page.goto(`${baseUrl}/trials/${ids.beansTrial}/round`);
    await page.getByRole('heading', { name: /^Pots \(\d+\)$/ }).waitFor();
    await settle(page);
    const before = ((await t.ds.query(`SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill'`, [ids.beansTrial])) as { n: number }[])[0]!.n;

    // Tab from the top of the page until a pot button (a toggle: aria-pressed) has the focus.
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
    let reached = false;
    for (let i = 0; i < 40 && !reached; i++) {
      await page.keyboard.press('Tab');
      reached = await page.evaluate(() => document.activeElement?.getAttribute('aria-pressed') === 'false' && Boolean(document.activeElement.closest('section[aria-labelledby="pots-heading"]')));
    }
    expect(reached).toBe(true);
    const firstPot = await page.evaluate(() => document.activeElement!.textContent);
    await page.keyboard.press('Space');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-pressed'))).toBe('true');
    // The focus stays on the pot just marked, and Tab goes on to its − and + buttons.
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? '')).toMatch(/^Less water for /);
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? '')).toMatch(/^More water for /);
    // Space again on the same pot unmarks it; once more marks it again.
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Space');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-pressed'))).toBe('false');
    await page.keyboard.press('Space');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-pressed'))).toBe('true');
    expect(firstPot).toBeTruthy();

    // Tab on to the save button and press Enter.
    let onSave = false;
    for (let i = 0; i < 80 && !onSave; i++) {
      await page.keyboard.press('Tab');
      onSave = await page.evaluate(() => /^Save 1 record$/.test(document.activeElement?.textContent?.trim() ?? ''));
    }
    expect(onSave).toBe(true);
    await page.keyboard.press('Enter');
    await page.getByText('Saved 1 record.').waitFor();
    const after = ((await t.ds.query(`SELECT count(*)::int AS n FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill'`, [ids.beansTrial])) as { n: number }[])[0]!.n;
    expect(after).toBe(before + 1);
    expect(env.pageErrors).toEqual([]);
  }, SWEEP_TIMEOUT);
});
