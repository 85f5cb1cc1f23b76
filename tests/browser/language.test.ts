/**
 * Two languages: a visitor picks Spanish on the sign-in page (before any account exists) and the
 * page, its <html lang> and later visits on this device follow. A Spanish sign-up then runs the
 * app in Spanish (validation, server refusals, numbers), the account setting switches it back at
 * once, and a second browser whose own language is Spanish still shows an English account in
 * English. The main Spanish screens are photographed at 360 px (tests/artifacts/*-es-360.png) and
 * checked for sideways overflow, since Spanish strings run longer.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openOtherBrowser, startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv();
});
afterAll(async () => {
  await env?.close();
});

/** Nothing wider than the window: a long Spanish word or button would push the page sideways. */
async function expectNoSidewaysScroll(page: Page, screen: string) {
  const { scroll, width } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, width: window.innerWidth }));
  expect(scroll, `${screen} is wider than the window`).toBeLessThanOrEqual(width);
}

async function shoot360(page: Page, name: string) {
  await page.setViewportSize({ width: 360, height: 800 });
  await expectNoSidewaysScroll(page, name);
  await env.screenshot(`${name}-es-360`);
}

describe('language', () => {
  it('follows the choice made on the sign-in page, also after a reload', async () => {
    const { page, baseUrl } = env;
    await page.goto(`${baseUrl}/sign-in`);
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('en');
    // The sign-in form checks with the shared schema (shared/schemas/auth.ts signInInputSchema), in its own words in English…
    const signInForm = page.getByRole('form', { name: 'Sign in' });
    await signInForm.getByRole('button', { name: 'Sign in' }).click();
    await signInForm.getByText('Enter a valid e-mail address.').waitFor();
    await signInForm.getByText('Enter your password.').waitFor();
    await page.getByLabel('Language').selectOption('es');
    await page.getByText('Seepwise compara ollas de barro enterradas').waitFor();
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('es');
    await env.screenshot('language-sign-in-es');

    // A reload keeps the device's choice.
    await page.reload();
    await page.getByText('Seepwise compara ollas de barro enterradas').waitFor();

    // …and in Spanish, including the schema's length limit on the password (max 200), which a hand-made check would not know.
    const form = page.getByRole('form', { name: 'Iniciar sesión' });
    await form.getByRole('button', { name: 'Iniciar sesión' }).click();
    await form.getByText('Escribe una dirección de correo válida.').waitFor();
    await form.getByText('Escribe tu contraseña.').waitFor();
    await form.getByLabel('Correo electrónico').fill('ana@example.test');
    await form.getByLabel('Contraseña').fill('x'.repeat(201));
    await form.getByRole('button', { name: 'Iniciar sesión' }).click();
    await form.getByText('Usa como máximo 200 caracteres.').waitFor();
    await expect(form.getByText('Escribe una dirección de correo válida.').count()).resolves.toBe(0);
    await env.screenshot('language-sign-in-schema-es');
  });

  it('signs up in Spanish, switches to English from the account, and an English account stays English in a Spanish browser', async () => {
    const { page, baseUrl, t } = env;
    const email = `ana.${Date.now()}@example.test`;
    const password = 'barro-sandia-sombra-7';

    // The device chose Spanish in the test above; the sign-up form's language starts there.
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('heading', { name: 'Iniciar sesión' }).waitFor();
    await shoot360(page, 'sign-in');
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.getByRole('link', { name: 'Crear una cuenta' }).click();
    await page.getByRole('heading', { name: 'Crear una cuenta' }).waitFor();
    const signUp = page.getByRole('form', { name: 'Crear una cuenta' });
    await expect(signUp.getByLabel('Idioma').inputValue()).resolves.toBe('es');

    // The form's own check speaks Spanish (from zod's too_small issue, not the schema's English).
    await page.getByLabel('Nombre para mostrar').fill('Ana');
    await page.getByLabel('Correo electrónico').fill('no-es-un-correo');
    await page.getByLabel('Contraseña').fill('corta');
    await page.getByRole('button', { name: 'Crear cuenta' }).click();
    await page.getByText('Escribe una dirección de correo válida.').waitFor();
    await page.getByText('Usa al menos 10 caracteres.').waitFor();
    await shoot360(page, 'sign-up');
    await page.setViewportSize({ width: 1280, height: 800 });

    await page.getByLabel('Correo electrónico').fill(email);
    await page.getByLabel('Contraseña').fill(password);
    await page.getByLabel('Me uno como').selectOption('educator');
    await page.getByRole('button', { name: 'Crear cuenta' }).click();

    // Home and navigation in Spanish; the account was stored in Spanish.
    await page.getByRole('heading', { name: 'Hola, Ana' }).waitFor();
    const nav = page.getByRole('navigation', { name: 'Principal' });
    for (const label of ['Inicio', 'Estante de ollas', 'Planificador', 'Grupos', 'Guías', 'Cuenta']) await nav.getByRole('link', { name: label }).waitFor({ state: 'attached' });
    await page.getByRole('heading', { name: 'Tus ensayos' }).waitFor();
    const [stored] = (await t.ds.query(`SELECT language FROM users WHERE email = $1`, [email])) as { language: string }[];
    expect(stored?.language).toBe('es');
    await shoot360(page, 'home');

    // A refusal from the server, worded by its reason on the client (server text is English).
    await page.goto(`${baseUrl}/cohorts`);
    await page.getByRole('heading', { name: 'Grupos', level: 1 }).waitFor();
    await page.getByText('Todavía no estás en ningún grupo.').waitFor();
    const join = page.getByRole('form', { name: 'Unirte con un código' });
    await join.getByLabel('Código para unirte').fill('2345-6789');
    await join.getByRole('button', { name: 'Unirme al grupo' }).click();
    await page.getByText('Ningún grupo usa ese código. Confírmalo con quien coordina el grupo; los códigos pueden cambiar.').waitFor();
    await shoot360(page, 'cohorts');
    await page.setViewportSize({ width: 1280, height: 800 });

    // An educator starts a cohort: the lead's page with join code, members and settings.
    await page.getByRole('button', { name: 'Nuevo grupo' }).click();
    const create = page.getByRole('form', { name: 'Nuevo grupo' });
    await create.getByLabel('Nombre', { exact: true }).fill('Huertas del Arroyo Seco');
    await create.getByLabel('Límite de miembros (opcional)').fill('12000');
    await create.getByRole('button', { name: 'Crear grupo' }).click();
    await page.getByText('Escribe un número entero de 1 a 10.000, o déjalo vacío para no poner límite.').waitFor();
    await create.getByLabel('Límite de miembros (opcional)').fill('1500');
    await create.getByRole('button', { name: 'Crear grupo' }).click();
    await page.getByRole('heading', { name: 'Huertas del Arroyo Seco', level: 1 }).waitFor();
    await page.getByText('Coordinas este grupo. Nadie se ha unido todavía').waitFor();
    // Numbers in the reader's locale: 1500 → "1500" or "1.500" depending on CLDR's minimum grouping for Spanish; the limit reads "0 de …".
    await page.getByText(/^0 de 1\.?500$/).waitFor();
    await page.getByRole('heading', { name: 'Código para unirse' }).waitFor();
    await shoot360(page, 'cohort-lead');
    await page.setViewportSize({ width: 1280, height: 800 });

    await page.goto(`${baseUrl}/guides`);
    await page.getByRole('heading', { name: 'Guías', level: 1 }).waitFor();
    await expect(page.locator('article').getAttribute('lang')).resolves.toBe('es');
    await shoot360(page, 'guides');
    await page.setViewportSize({ width: 1280, height: 800 });

    // The account page; then the setting to English switches every screen at once (no reload).
    await page.getByRole('navigation', { name: 'Principal' }).getByRole('link', { name: 'Cuenta' }).click();
    await page.getByRole('heading', { name: 'Cuenta', level: 1 }).waitFor();
    await page.getByText(/^Cuenta de educador desde el /).waitFor();
    await shoot360(page, 'account');
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.getByRole('form', { name: 'Perfil y preferencias' }).getByLabel('Idioma').selectOption('en');
    await page.getByRole('button', { name: 'Guardar cambios' }).click();
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).waitFor({ state: 'attached' });
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('en');
    const [after] = (await t.ds.query(`SELECT language FROM users WHERE email = $1`, [email])) as { language: string }[];
    expect(after?.language).toBe('en');

    // Admin screens in Spanish (the account made admin in the database, then Spanish again).
    await t.ds.query(`UPDATE users SET role = 'admin', language = 'es' WHERE email = $1`, [email]);
    await page.goto(`${baseUrl}/admin`);
    await page.getByRole('heading', { name: 'Administración', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Estado' }).waitFor();
    await page.getByText(/^1–\d+ de \d+ cuentas?$/).waitFor();
    await shoot360(page, 'admin');
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.goto(`${baseUrl}/account`);
    await page.getByRole('form', { name: 'Perfil y preferencias' }).getByLabel('Idioma').selectOption('en');
    await page.getByRole('button', { name: 'Guardar cambios' }).click();
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();

    // Signed out, the public page stays in the account's last language.
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('en');

    // Another browser whose own language is Spanish: the public page is Spanish until the English account signs in.
    const other = await openOtherBrowser({ locale: 'es-ES' });
    try {
      await other.page.goto(`${baseUrl}/sign-in`);
      await other.page.getByRole('heading', { name: 'Iniciar sesión' }).waitFor();
      // A wrong password is refused in the browser's language (reason bad_credentials).
      await other.page.getByLabel('Correo electrónico').fill(email);
      await other.page.getByLabel('Contraseña').fill('no-es-esta-clave');
      await other.page.getByRole('button', { name: 'Iniciar sesión' }).click();
      await other.page.getByText('Ese correo y esa contraseña no corresponden a ninguna cuenta.').waitFor();
      await other.page.getByLabel('Contraseña').fill(password);
      await other.page.getByRole('button', { name: 'Iniciar sesión' }).click();
      await other.page.getByRole('heading', { name: 'Hello, Ana' }).waitFor();
      await other.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).waitFor({ state: 'attached' });
      await expect(other.page.evaluate(() => document.documentElement.lang)).resolves.toBe('en');
    } finally {
      await other.close();
    }
    expect(env.pageErrors).toEqual([]);
  });
});
