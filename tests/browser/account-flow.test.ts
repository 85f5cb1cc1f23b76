/**
 * A grower signs up, signs out, resets the password from the e-mailed link and signs in again,
 * all through the real client in headless Chromium.
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

describe('account flow in the browser', () => {
  it('signs up, signs out, resets the password by e-mail and signs in again', async () => {
    const { page, baseUrl, t } = env;
    const email = `ruth.${Date.now()}@example.test`;

    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await env.screenshot('sign-in-1280');
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByLabel('Name to show').fill('Ruth');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect(page.getByText('Use at least 10 characters.').isVisible()).resolves.toBe(true);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Ruth' }).waitFor();
    await env.screenshot('home-1280');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();

    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    // The reset page loads lazily and the sign-in page, with its own "E-mail" field, stays until it
    // has: wait for the new page, or the address goes into the old form (CI, session 2).
    await page.getByRole('heading', { name: 'Reset your password' }).waitFor();
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send me a reset link' }).click();
    await page.getByText(/reset link is on its way/).waitFor();

    const mail = await t.sink.waitFor((m) => m.to.includes(email) && /Reset/.test(m.subject));
    const link = mail.text.match(/http:\/\/seepwise\.test(\/reset-password\?token=[A-Za-z0-9_%-]+)/)![1]!;
    await page.goto(`${baseUrl}${link}`);
    await page.getByLabel('New password', { exact: true }).fill('fresh-melon-path-9');
    await page.getByLabel('Repeat the new password').fill('fresh-melon-path-9');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await page.getByText(/password has been changed/).waitFor();

    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    await page.getByLabel('Password').fill('fresh-melon-path-9');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Hello, Ruth' }).waitFor();
    expect(env.pageErrors).toEqual([]);
  });
});
