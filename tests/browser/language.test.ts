/**
 * Two languages: a visitor picks Spanish on the sign-in page (before any account exists) and the
 * page, its <html lang> and later visits on this device follow.
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

describe('language', () => {
  it('follows the choice made on the sign-in page, also after a reload', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/sign-in`);
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('en');
    await page.getByLabel('Language').selectOption('es');
    await page.getByText('Seepwise compara ollas de barro enterradas').waitFor();
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('es');
    await env.screenshot('language-sign-in-es');

    // A reload keeps the device's choice.
    await page.reload();
    await page.getByText('Seepwise compara ollas de barro enterradas').waitFor();
  });
});
