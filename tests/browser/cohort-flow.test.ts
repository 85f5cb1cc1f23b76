/**
 * A cohort from both sides, through the real client in headless Chromium: an educator creates a
 * cohort and reads its join code; a grower joins with the code as a contributor, a student joins
 * through a join link as an observer, and a third person accepts an e-mailed invitation. The lead
 * then sees pseudonyms only (no names, no e-mail addresses of members). An admin finds the
 * invitation in the outbox. Screenshots at 1280 and 360 px wide go to tests/artifacts/.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv();
});
afterAll(async () => {
  await env?.close();
});

const PASSWORD = 'saltbush-olla-trial-7';
const stamp = Date.now().toString(36);
const lead = { name: 'Marisol Quintero-Hale', email: `marisol.${stamp}@example.test` };
const grower = { name: 'Wendell Pike', email: `wendell.${stamp}@example.test` };
const student = { name: 'Ada Okafor-Reyes', email: `ada.${stamp}@example.test` };
const invitee = { name: 'Priya Dunmore', email: `priya.${stamp}@example.test` };
const cohortName = 'Saltbush Bend Summer Trials';

let cohortUrl = '';
let joinCode = '';
let growerPseudonym = '';
let studentPseudonym = '';
let inviteePseudonym = '';

async function signUp(page: Page, who: { name: string; email: string }, role: 'grower' | 'educator' = 'grower') {
  await page.getByLabel('Name to show').fill(who.name);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByLabel('I am joining as').selectOption(role);
  await page.getByRole('button', { name: 'Create account' }).click();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
}

async function signIn(page: Page, email: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** The pseudonym the cohort page shows its viewer ("You appear as Grower K7"). */
async function myPseudonym(page: Page): Promise<string> {
  const line = await page.getByText(/^You appear as /).first().textContent();
  const m = line?.match(/You appear as ((?:Grower|Observer) [A-Z]\d+)/);
  expect(m, `pseudonym line: ${line}`).not.toBeNull();
  return m![1]!;
}

async function at360(name: string) {
  await env.page.setViewportSize({ width: 360, height: 800 });
  await env.screenshot(`${name}-360`);
  await env.page.setViewportSize({ width: 1280, height: 800 });
}

describe('cohort flow in the browser', () => {
  it('an educator creates a cohort and reads its join code', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await signUp(page, lead, 'educator');
    await page.getByRole('heading', { name: `Hello, ${lead.name}` }).waitFor();
    await page.getByText('None yet. Got a code from an educator').waitFor();

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).click();
    await page.getByRole('heading', { name: 'Cohorts', level: 1 }).waitFor();
    await page.getByText('You are not in any cohort yet.').waitFor();
    await page.getByRole('button', { name: 'New cohort' }).click();
    const form = page.getByRole('form', { name: 'New cohort' });
    // The form opens with the cursor in the name field.
    await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.name)).toBe('name');
    await form.getByRole('button', { name: 'Create cohort' }).click();
    await page.getByText('Give the cohort a name of at least 2 characters.').waitFor();
    await form.getByLabel('Member limit (optional)').fill('0');
    await form.getByLabel('Name').fill(cohortName);
    await form.getByRole('button', { name: 'Create cohort' }).click();
    await page.getByText('Enter a whole number from 1 to 10,000, or leave it empty for no limit.').waitFor();
    await form.getByLabel('Member limit (optional)').fill('30');
    await form.getByLabel('Description (optional)').fill('Home gardens in Saltbush Bend comparing buried clay pots with surface watering, tomato and squash, one summer.');
    await form.getByLabel('Kind').selectOption('programme');
    await env.screenshot('cohorts-new-1280');
    await form.getByRole('button', { name: 'Create cohort' }).click();

    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    cohortUrl = page.url();
    expect(cohortUrl).toMatch(/\/cohorts\/[0-9a-f-]{36}$/);
    await page.getByText('You lead this cohort').waitFor();
    await page.getByText('No members yet.').waitFor();
    const shown = (await page.getByTestId('join-code').textContent())!.trim();
    expect(shown).toMatch(/^[2-9A-HJKMNP-Z]{4}-[2-9A-HJKMNP-Z]{4}$/);
    joinCode = shown.replace('-', '');
    // Members never see a results section yet (the pooled analysis arrives later); nothing fake stands in.
    await expect(page.getByRole('heading', { name: /result/i }).count()).resolves.toBe(0);

    // Making a new code asks first; cancelling keeps the code.
    await page.getByRole('button', { name: 'Make a new code' }).click();
    const dialog = page.getByRole('dialog', { name: 'Make a new join code?' });
    await dialog.getByText(`The code ${shown} stops working at once`).waitFor();
    await env.screenshot('cohort-new-code-confirm-1280');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await expect(page.getByTestId('join-code').textContent()).resolves.toBe(shown);
    await env.screenshot('cohort-lead-empty-1280');
    await at360('cohort-lead-empty');
  });

  it('the lead invites someone by e-mail and the invitation arrives', async () => {
    const { page, t } = env;
    const invite = page.getByRole('form', { name: 'Invite by e-mail' });
    await invite.getByLabel('E-mail address').fill('not-an-address');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText('Enter a valid e-mail address.').waitFor();
    await invite.getByLabel('E-mail address').fill(invitee.email);
    await invite.getByLabel('Joins as').selectOption('contributor');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${invitee.email}.`).waitFor();
    const sent = page.getByRole('list', { name: 'Invitations sent' });
    await sent.getByText(invitee.email).waitFor();
    await sent.getByText(/^Waiting · until /).waitFor();

    const mail = await t.sink.waitFor((m) => m.to.includes(invitee.email) && m.subject.includes(cohortName));
    expect(mail.subject).toBe(`You are invited to "${cohortName}" on Seepwise`);
    expect(mail.text).toContain('as a contributor');
    expect(mail.text).toMatch(/http:\/\/seepwise\.test\/join\?invite=[A-Za-z0-9_%-]+/);
    await signOut(page);
  });

  it('a grower joins with the code as a contributor', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await signUp(page, grower);
    await page.getByRole('heading', { name: `Hello, ${grower.name}` }).waitFor();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).click();
    await page.getByRole('heading', { name: 'Cohorts', level: 1 }).waitFor();
    // Growers cannot start cohorts.
    await expect(page.getByRole('button', { name: 'New cohort' }).count()).resolves.toBe(0);

    const join = page.getByRole('form', { name: 'Join with a code' });
    await join.getByLabel('Join code').fill('abc');
    await join.getByRole('button', { name: 'Join cohort' }).click();
    await page.getByText('A join code has 8 letters and digits, like K7QM-4XPA.').waitFor();
    // A well-formed code that no cohort uses: the server's own words.
    const wrong = joinCode.startsWith('2') ? `3${joinCode.slice(1)}` : `2${joinCode.slice(1)}`;
    await join.getByLabel('Join code').fill(wrong);
    await join.getByRole('button', { name: 'Join cohort' }).click();
    await page.getByText('No cohort uses that join code. Check it with your lead; codes can be changed.').waitFor();
    await env.screenshot('cohorts-join-error-1280');
    await at360('cohorts-join-error');

    // Typed the way people type: lower case, with the dash.
    await join.getByLabel('Join code').fill(`${joinCode.slice(0, 4)}-${joinCode.slice(4)}`.toLowerCase());
    await join.getByLabel('Contributor').check();
    await join.getByRole('button', { name: 'Join cohort' }).click();
    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    growerPseudonym = await myPseudonym(page);
    expect(growerPseudonym).toMatch(/^Grower /);
    const members = page.getByRole('list', { name: 'Members' });
    await members.getByText(growerPseudonym).waitFor();
    await expect(members.getByText('you', { exact: true }).count()).resolves.toBe(1);
    // A member sees no join code, no invitations and no settings; they can leave.
    await expect(page.getByTestId('join-code').count()).resolves.toBe(0);
    await expect(page.getByRole('form', { name: 'Cohort settings' }).count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Leave cohort' }).waitFor();
    await env.screenshot('cohort-member-1280');
    await at360('cohort-member');

    // Joining twice gets a clear answer.
    await page.goto(`${baseUrl}/join?code=${joinCode}`);
    await page.getByRole('form', { name: 'Join with a code' }).getByRole('button', { name: 'Join cohort' }).click();
    await page.getByText('You are already a member of this cohort.').waitFor();

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Home' }).click();
    const homeCohorts = page.getByRole('region', { name: 'Your cohorts' });
    await homeCohorts.getByText(cohortName).waitFor();
    await homeCohorts.getByText(`You appear as ${growerPseudonym}`).waitFor();
    await env.screenshot('home-with-cohort-1280');
    await at360('home-with-cohort');
    await signOut(page);
  });

  it('a student follows a join link and joins as an observer', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/join?code=${joinCode}`);
    await page.getByRole('heading', { name: 'Join a cohort' }).waitFor();
    await page.getByText('Sign in or create an account first; the code comes along.').waitFor();
    await at360('join-signed-out');
    await page.getByRole('link', { name: 'Create an account' }).click();
    await signUp(page, student);
    // Back on the join page with the code filled in.
    const join = page.getByRole('form', { name: 'Join with a code' });
    await join.waitFor();
    await expect(join.getByLabel('Join code').inputValue()).resolves.toBe(joinCode);
    await join.getByLabel('Observer').check();
    await join.getByRole('button', { name: 'Join cohort' }).click();
    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    studentPseudonym = await myPseudonym(page);
    expect(studentPseudonym).toMatch(/^Observer /);
    await page.getByRole('list', { name: 'Members' }).getByText(growerPseudonym).waitFor();
    await signOut(page);
  });

  it('the invited person opens the e-mailed link, signs up and accepts', async () => {
    const { page, baseUrl, t } = env;
    const mail = await t.sink.waitFor((m) => m.to.includes(invitee.email) && m.subject.includes(cohortName));
    const path = mail.text.match(/http:\/\/seepwise\.test(\/join\?invite=[A-Za-z0-9_%-]+)/)![1]!;
    await page.goto(`${baseUrl}${path}`);
    await page.getByRole('heading', { name: 'Your invitation' }).waitFor();
    await page.getByText(cohortName).waitFor();
    await page.getByText('Other members will see you under a pseudonym, never your name or e-mail.').waitFor();
    await at360('join-invitation-signed-out');
    await page.getByRole('link', { name: 'Create an account' }).click();
    await signUp(page, invitee);
    await page.getByRole('heading', { name: 'Your invitation' }).waitFor();
    await page.getByRole('button', { name: 'Accept and join' }).click();
    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    inviteePseudonym = await myPseudonym(page);

    // The link works once.
    await page.goto(`${baseUrl}${path}`);
    await page.getByText('This invitation has already been used.').waitFor();
    await signOut(page);
  });

  it('the lead sees every member by pseudonym only, never by name or e-mail', async () => {
    const { page, baseUrl } = env;
    await page.goto(cohortUrl);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await signIn(page, lead.email);
    // Sign-in comes back to the cohort page.
    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    const members = page.getByRole('list', { name: 'Members' });
    for (const p of [growerPseudonym, studentPseudonym, inviteePseudonym]) await members.getByText(p, { exact: true }).waitFor();
    await expect(members.getByRole('listitem').count()).resolves.toBe(3);
    await page.getByText('2 contributors, 1 observer.').waitFor();

    const text = await page.locator('main').innerText();
    for (const who of [grower, student]) {
      expect(text).not.toContain(who.name);
      expect(text).not.toContain(who.email);
    }
    expect(text).not.toContain(invitee.name);
    // The invitation list shows the address the lead typed, now accepted.
    await page.getByRole('list', { name: 'Invitations sent' }).getByText(/^Accepted /).waitFor();
    await env.screenshot('cohort-lead-members-1280');
    await at360('cohort-lead-members');

    // Removing a member asks first, then the list and the count follow.
    await page.getByRole('button', { name: `Remove ${studentPseudonym}` }).click();
    const dialog = page.getByRole('dialog', { name: `Remove ${studentPseudonym}?` });
    await dialog.waitFor();
    await env.screenshot('cohort-remove-confirm-1280');
    await dialog.getByRole('button', { name: 'Remove member' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => members.getByRole('listitem').count()).toBe(2);
    await page.getByText('2 contributors, 0 observers.').waitFor();

    // A new join code replaces the old one, which then stops working.
    const oldShown = (await page.getByTestId('join-code').textContent())!.trim();
    await page.getByRole('button', { name: 'Make a new code' }).click();
    await page.getByRole('dialog', { name: 'Make a new join code?' }).getByRole('button', { name: 'Make a new code' }).click();
    await expect.poll(async () => (await page.getByTestId('join-code').textContent())?.trim()).not.toBe(oldShown);

    // Closing the cohort blocks invitations and says why.
    const settings = page.getByRole('form', { name: 'Cohort settings' });
    await settings.getByLabel('Closed to new members').check();
    await settings.getByRole('button', { name: 'Save settings' }).click();
    await settings.getByText('Saved.').waitFor();
    await page.getByText('The cohort is closed to new members: untick').waitFor();
    await expect(page.getByRole('button', { name: 'Send invitation' }).isDisabled()).resolves.toBe(true);
    await page.goto(`${baseUrl}/cohorts`);
    await page.getByRole('list', { name: 'Your cohorts' }).getByText('Closed to new members').waitFor();
    await env.screenshot('cohorts-list-lead-1280');
    await at360('cohorts-list-lead');
    await signOut(page);
  });

  it('the removed observer can no longer open the cohort', async () => {
    const { page } = env;
    await page.goto(cohortUrl);
    await signIn(page, student.email);
    await page.getByRole('heading', { name: 'Cohort not found' }).waitFor();
    await page.getByRole('link', { name: '← All cohorts' }).click();
    await page.getByText('You are not in any cohort yet.').waitFor();
    await signOut(page);
  });

  it('a member leaves the cohort after confirming', async () => {
    const { page, t } = env;
    await page.goto(cohortUrl);
    await signIn(page, invitee.email);
    await page.getByRole('heading', { name: cohortName, level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Leave cohort' }).click();
    const dialog = page.getByRole('dialog', { name: `Leave ${cohortName}?` });
    await dialog.getByText(`${inviteePseudonym} leaves its member list`).waitFor();
    await dialog.getByRole('button', { name: 'Leave cohort' }).click();
    await page.getByRole('heading', { name: 'Cohorts', level: 1 }).waitFor();
    await page.getByText('You are not in any cohort yet.').waitFor();
    const rows = (await t.ds.query(`SELECT pseudonym FROM cohort_memberships m JOIN users u ON u.id = m.user_id WHERE u.email = $1`, [invitee.email])) as unknown[];
    expect(rows).toEqual([]);
    await signOut(page);
  });

  it('an admin finds the invitation in the outbox and manages accounts', async () => {
    const { page, baseUrl, t } = env;
    const adminEmail = `admin.${stamp}@example.test`;
    await page.goto(`${baseUrl}/sign-up`);
    await signUp(page, { name: 'Site Admin', email: adminEmail });
    await page.getByRole('heading', { name: 'Hello, Site Admin' }).waitFor();
    await page.goto(`${baseUrl}/admin`);
    await page.getByText('This page is for admin accounts.').waitFor();
    await t.ds.query(`UPDATE users SET role = 'admin' WHERE email = $1`, [adminEmail]);
    await page.reload();

    await page.getByRole('heading', { name: 'Admin', level: 1 }).waitFor();
    await page.getByText(/Database is up, answered in/).waitFor();
    const table = page.getByRole('table', { name: 'Accounts' });
    await table.getByText(grower.email).waitFor();
    await page.getByRole('searchbox', { name: 'Search accounts' }).fill('wendell');
    await page.getByRole('button', { name: 'Search' }).click();
    await page.getByText('1–1 of 1 account matching “wendell”').waitFor();
    expect(page.url()).toContain('q=wendell');
    await table.getByRole('combobox', { name: `Role of ${grower.name}` }).selectOption('educator');
    const roleDialog = page.getByRole('dialog', { name: `Make ${grower.name} an educator?` });
    await roleDialog.getByRole('button', { name: 'Change role' }).click();
    await roleDialog.waitFor({ state: 'hidden' });
    await expect.poll(() => table.getByRole('combobox', { name: `Role of ${grower.name}` }).inputValue()).toBe('educator');
    await page.getByRole('button', { name: `Disable ${grower.name}` }).click();
    await page.getByRole('dialog', { name: `Disable ${grower.name}?` }).getByRole('button', { name: 'Disable account' }).click();
    await table.getByText('Disabled').waitFor();
    // The badge can show before the write is read back on a busy machine: poll the database.
    await expect
      .poll(async () => ((await t.ds.query(`SELECT role, disabled_at FROM users WHERE email = $1`, [grower.email])) as { role: string; disabled_at: Date | null }[])[0], { timeout: 30_000 })
      .toMatchObject({ role: 'educator', disabled_at: expect.any(Date) });
    await page.getByRole('button', { name: 'Show all' }).click();
    await table.getByText(lead.email).waitFor();
    await env.screenshot('admin-1280');
    await at360('admin');

    await page.getByRole('link', { name: 'Outbox' }).click();
    await page.getByRole('heading', { name: 'Outbox', level: 1 }).waitFor();
    const mail = page.getByRole('listitem').filter({ hasText: `You are invited to "${cohortName}" on Seepwise` });
    await mail.getByText(`to ${invitee.email}`).waitFor();
    await mail.getByText(`You are invited to "${cohortName}" on Seepwise`).click();
    await mail.getByText(/You have been invited to join/).waitFor();
    await mail.getByRole('link', { name: /\/join\?invite=/ }).waitFor();
    await env.screenshot('admin-outbox-1280');
    await at360('admin-outbox');
  });

  it('the account page saves preferences and says whether the e-mail is confirmed', async () => {
    const { page, t } = env;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Account' }).click();
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
    await page.getByText('Not confirmed yet.').waitFor();
    const before = t.sink.messages.length;
    await page.getByRole('button', { name: 'Send the link again' }).click();
    await page.getByText('A new confirmation link is on its way.').waitFor();
    await t.sink.waitFor((m) => t.sink.messages.indexOf(m) >= before && /Confirm your e-mail/.test(m.subject));

    const prefs = page.getByRole('form', { name: 'Profile and preferences' });
    await prefs.getByLabel('Units').selectOption('us');
    await prefs.getByLabel('Language').selectOption('es');
    await prefs.getByRole('button', { name: 'Save changes' }).click();
    // The account's language takes over the screens at once (src/i18n): the page turns Spanish.
    await page.getByRole('heading', { name: 'Cuenta', level: 1 }).waitFor();
    await page.getByRole('form', { name: 'Perfil y preferencias' }).getByText('Guardado.').waitFor();
    const [row] = (await t.ds.query(`SELECT unit_system, language FROM users WHERE role = 'admin' ORDER BY created_at DESC LIMIT 1`)) as { unit_system: string; language: string }[];
    expect(row).toEqual({ unit_system: 'us', language: 'es' });

    const pw = page.getByRole('form', { name: 'Cambiar la contraseña' });
    await pw.getByLabel('Contraseña actual').fill('wrong-password-here');
    await pw.getByLabel('Contraseña nueva', { exact: true }).fill('new-melon-basin-88');
    await pw.getByLabel('Repite la contraseña nueva').fill('new-melon-basin-88');
    await pw.getByRole('button', { name: 'Cambiar la contraseña' }).click();
    // The server's field refusal (reason current_password_wrong) in the account's language.
    await pw.getByText('La contraseña actual no es correcta.').waitFor();
    await expect(pw.getByLabel('Contraseña actual').getAttribute('aria-invalid')).resolves.toBe('true');
    await env.screenshot('account-1280');
    await at360('account');
    expect(env.pageErrors).toEqual([]);
  });
});
