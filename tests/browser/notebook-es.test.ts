/**
 * The notebook in Spanish on a phone: a grower whose account language is Spanish creates a garden
 * and a paired trial, adds plots, starts the trial and logs a refill through the Round — every
 * screen in Spanish, numbers with a decimal comma (CLDR number symbols for "es": decimal ","),
 * decimals typed with a comma read as such. Screenshots at 360 px wide go to tests/artifacts; no
 * page may be wider than the screen (longer Spanish words must wrap, not overflow).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv({ viewport: { width: 360, height: 780 } });
});
afterAll(async () => {
  await env?.close();
});

/** The page fits the 360 px screen: nothing sticks out sideways. */
async function fitsTheScreen(name: string) {
  const { page } = env;
  await env.screenshot(name);
  const widths = await page.evaluate(() => {
    const client = document.documentElement.clientWidth;
    // The innermost elements that stick out, to say what is too wide.
    const out = Array.from(document.querySelectorAll('body *'))
      .filter((el) => el.getBoundingClientRect().right > client + 1 && !Array.from(el.children).some((c) => c.getBoundingClientRect().right > client + 1))
      .slice(0, 5)
      .map((el) => `${el.tagName.toLowerCase()}.${el.className} "${(el.textContent ?? '').trim().slice(0, 40)}"`);
    return { scroll: document.documentElement.scrollWidth, client, out };
  });
  expect(widths.scroll, `${name} is ${widths.scroll} px wide on a ${widths.client} px screen: ${widths.out.join('; ')}`).toBeLessThanOrEqual(widths.client);
}

describe('the notebook in Spanish', () => {
  it('garden → trial → plots → a refill through the Round, all in Spanish, at 360 px', async () => {
    const { page, baseUrl, t } = env;
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Lupe');
    await page.getByLabel('E-mail').fill(`lupe.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-up'));

    // Her account's language is Spanish (the Account page's setting, through the same API).
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const res = await page.request.patch(`${baseUrl}/api/account`, { headers: { 'X-CSRF-Token': csrf }, data: { language: 'es' } });
    expect(res.ok(), await res.text()).toBe(true);

    // A garden, typed with decimal commas.
    await page.goto(`${baseUrl}/gardens/new`);
    await page.getByRole('heading', { name: 'Nuevo huerto', level: 1 }).waitFor();
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('es');
    await page.getByLabel('Nombre del huerto').fill('Huerta de la acequia');
    await page.getByLabel('Latitud (°, norte +)').fill('35,08');
    await page.getByLabel('Longitud (°, este +)').fill('-106,65');
    await page.getByLabel('Altitud (m)').fill('1500');
    await page.getByLabel('Textura del suelo (clase USDA)').selectOption({ label: 'Franco arenoso' });
    await fitsTheScreen('es-new-garden-360');
    await page.getByRole('button', { name: 'Crear huerto' }).click();
    await page.getByRole('heading', { name: 'Huerta de la acequia' }).waitFor();
    // Stored to 0.1° and shown with a decimal comma.
    await page.getByText(/35,1°, -106,7° · 1500 m · Franco arenoso/).waitFor();
    const [garden] = await t.ds.query(`SELECT latitude_deg, longitude_deg FROM gardens WHERE name = 'Huerta de la acequia'`);
    expect([Number(garden.latitude_deg), Number(garden.longitude_deg)]).toEqual([35.1, -106.7]);
    await page.getByRole('heading', { name: 'Días de clima' }).waitFor();
    await fitsTheScreen('es-garden-360');

    // A paired trial.
    await page.getByRole('button', { name: 'Nuevo ensayo' }).click();
    await page.getByLabel('Título del ensayo').fill('Tomates de la acequia 2026');
    await expect(page.getByLabel('Cultivo').locator('option:checked').textContent()).resolves.toBe('Tomate');
    await page.getByLabel('Fecha de siembra').fill('2026-05-01');
    await page.getByRole('button', { name: 'Crear ensayo' }).click();
    await page.getByRole('heading', { name: 'Tomates de la acequia 2026' }).waitFor();
    await page.getByText(/Tomate · sembrado el 1 may 2026/).waitFor();
    await page.getByText('Borrador', { exact: true }).waitFor();

    // Two pairs of plots, the area typed with a decimal comma.
    await page.getByRole('tab', { name: 'Configuración' }).click();
    await page.getByRole('heading', { name: 'Parcelas y pares' }).waitFor();
    for (const [label, pair] of [
      ['A1', 'A'],
      ['A2', 'A'],
      ['B1', 'B'],
      ['B2', 'B'],
    ]) {
      // The form empties its label once the previous plot is saved; typing before that would be wiped.
      await expect.poll(() => page.getByLabel('Etiqueta').inputValue()).toBe('');
      await page.getByLabel('Etiqueta').fill(label!);
      await page.getByLabel('Par', { exact: true }).fill(pair!);
      await page.getByLabel('Superficie (m²)').fill('2,5');
      await page.getByRole('button', { name: 'Agregar parcela' }).click();
      await page.getByText(label!, { exact: true }).waitFor();
    }
    await page.getByText('2,5 m² · En el suelo · 1 planta').first().waitFor();
    const [trial] = await t.ds.query(`SELECT id FROM trials WHERE title = 'Tomates de la acequia 2026'`);
    const areas = await t.ds.query(`SELECT DISTINCT area_m2 FROM plots WHERE trial_id = $1`, [trial.id]);
    expect(areas.map((a: { area_m2: string }) => Number(a.area_m2))).toEqual([2.5]);
    await page.getByRole('button', { name: 'Asignar tratamientos al azar' }).click();
    await page.getByText(/Sorteo hecho con la semilla/).waitFor();
    await page.getByText('superficie', { exact: true }).first().waitFor();
    await fitsTheScreen('es-trial-setup-360');

    // One pot in each olla plot (the Pot shelf has its own test), placed through the API as the grower.
    const ollaPlots = await t.ds.query(`SELECT id FROM plots WHERE trial_id = $1 AND treatment = 'olla' ORDER BY label`, [trial.id]);
    for (const [i, p] of ollaPlots.entries()) {
      const made = await page.request.post(`${baseUrl}/api/pots`, {
        headers: { 'X-CSRF-Token': csrf },
        data: { label: `Olla ${i + 1}`, capacityL: 8, widestDiameterCm: 26, shape: 'globe', make: 'wheel_thrown', plotId: p.id },
      });
      expect(made.status()).toBe(201);
    }
    await page.getByRole('button', { name: 'Empezar el ensayo' }).click();
    await page.getByRole('dialog', { name: '¿Empezar este ensayo?' }).waitFor();
    await page.getByRole('button', { name: 'Sí' }).click();
    await page.getByText('Registra cada rellenado, cada riego y cada cosecha.').waitFor();

    // The Round: tap a pot (a full pot, 8 L, the first time), half a litre more, save.
    await page.getByRole('link', { name: 'Ronda de hoy' }).click();
    await page.getByRole('heading', { name: 'Ollas (2)' }).waitFor();
    await page.getByRole('heading', { name: 'Parcelas con riego superficial (2)' }).waitFor();
    await page.getByText('olla de 8 L · último rellenado nunca').first().waitFor();
    await page.waitForLoadState('networkidle');
    await page.getByRole('button', { name: '8 L', exact: true }).first().click();
    await page.getByRole('button', { name: '✓ 8 L', pressed: true }).waitFor();
    await page.getByRole('button', { name: /^Más agua para Olla \d · parcela [AB][12]$/ }).click();
    await page.getByRole('button', { name: '✓ 8,5 L' }).waitFor();
    await fitsTheScreen('es-round-360');
    await page.getByRole('button', { name: 'Guardar 1 registro' }).click();
    await page.getByText('Guardado: 1 registro.').waitFor();
    const refills = await t.ds.query(`SELECT volume_l FROM water_events WHERE trial_id = $1 AND kind = 'olla_refill'`, [trial.id]);
    expect(refills.map((r: { volume_l: string }) => Number(r.volume_l))).toEqual([8.5]);
    await page
      .getByText(/último rellenado hoy/)
      .first()
      .waitFor();

    // The record in the trial's table, with a decimal comma and the kind in Spanish.
    await page.getByRole('link', { name: 'Tomates de la acequia 2026' }).click();
    await page.getByRole('tab', { name: 'Registros' }).click();
    await page.getByText('Página 1 de 1 · 1 registro').waitFor();
    const row = page.getByRole('row').filter({ hasText: 'Rellenado de olla' });
    await expect(row.getByRole('cell').nth(3).textContent()).resolves.toBe('8,50');
    await page.getByRole('columnheader', { name: 'Volumen (L)' }).waitFor();
    await fitsTheScreen('es-records-360');

    // The history of changes names fields and values in Spanish ("Estado: Borrador → Activo"), not "status: draft".
    await page.getByRole('tab', { name: 'Historial' }).click();
    await page.getByText('Estado: Borrador → Activo').waitFor();
    expect(await page.getByRole('tabpanel').innerText()).not.toMatch(/status|draft|active/);
    await fitsTheScreen('es-history-360');

    // The refill forecast: the pot never refilled says so in Spanish (sent as the code no_refill).
    await page.getByRole('tab', { name: 'Resultados' }).click();
    await page.getByText('Aún no hay rellenos registrados: registra uno en la Ronda y el pronóstico parte de él.').waitFor();
    expect(await page.getByRole('tabpanel').innerText()).not.toContain('No refill logged yet');
    expect(env.pageErrors).toEqual([]);
  });
});
