/**
 * A grower fills the Pot shelf (a twin pot and its adhesive caution, two seep tests and their
 * chart, a move, a condition mark, a delete) and uses the Planner (pots for a bed, refill
 * interval, pairs for a trial), at 1280 and 360 px wide.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planOllas } from '@shared/agronomy/olla-layout';
import { pairedSampleSize } from '@shared/analysis/power';
import { startBrowserEnv, type BrowserEnv } from '../helpers/browser';

let env: BrowserEnv;
beforeAll(async () => {
  env = await startBrowserEnv();
});
afterAll(async () => {
  await env?.close();
});

describe('pot shelf and planner in the browser', () => {
  it('adds a twin pot with its caution, seep-tests it twice, marks and moves pots, and plans a bed, refills and pairs', async ({ onTestFailed }) => {
    const { page, baseUrl, t } = env;
    onTestFailed(() => env.screenshot('pot-shelf-planner-failure'));
    await page.goto(`${baseUrl}/sign-up`);
    await page.getByLabel('Name to show').fill('Amparo');
    await page.getByLabel('E-mail').fill(`amparo.${Date.now()}@example.test`);
    await page.getByLabel('Password').fill('tomato-basin-clay-42');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hello, Amparo' }).waitFor();

    // A paired trial with three pairs and a season of water, set up through the API as the grower.
    const csrf = (await (await page.request.get(`${baseUrl}/api/auth/session`)).json()).data.csrfToken as string;
    const post = async (url: string, data: unknown) => {
      const res = await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data });
      expect(res.status(), `${url}: ${await res.text()}`).toBeLessThan(300);
      return (await res.json()).data;
    };
    const garden = await post('/api/gardens', { name: 'Solar', latitudeDeg: 32.2, longitudeDeg: -110.9, elevationM: 730, soilTexture: 'sandy_loam' });
    const trial = await post(`/api/gardens/${garden.id}/trials`, { title: 'Melons 2026', crop: 'sweet-melon', plantingDate: '2026-05-01', design: 'paired' });
    for (const [label, blockKey, lid] of [
      ['A1', 'A', true],
      ['A2', 'A', true],
      ['B1', 'B', false],
      ['B2', 'B', false],
      ['C1', 'C', true],
      ['C2', 'C', true],
    ] as const) {
      await post(`/api/trials/${trial.id}/plots`, { label, blockKey, areaM2: 2, lid });
    }
    const { plots } = (await post(`/api/trials/${trial.id}/randomise`, { seed: 'pot-shelf' })) as { plots: { id: string; label: string; treatment: string; blockKey: string }[] };
    await post(`/api/trials/${trial.id}/status`, { status: 'active' });
    const water: Record<string, [number, number]> = { A: [40, 70], B: [52, 70], C: [38, 80] };
    for (const p of plots) {
      const [olla, surface] = water[p.blockKey]!;
      await post(`/api/trials/${trial.id}/water-events`, {
        plotId: p.id,
        occurredAt: '2026-07-01T07:00:00Z',
        kind: p.treatment === 'olla' ? 'olla_refill' : 'surface',
        volumeL: p.treatment === 'olla' ? olla : surface,
      });
    }
    const ollaA = plots.find((p) => p.blockKey === 'A' && p.treatment === 'olla')!;
    const ollaB = plots.find((p) => p.blockKey === 'B' && p.treatment === 'olla')!;

    // ---- Pot shelf ---- (a fresh load: the trial was made behind the page's back)
    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { name: 'Hello, Amparo' }).waitFor();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Pot shelf' }).click();
    await page.getByRole('heading', { name: 'Pot shelf', level: 1 }).waitFor();
    await page.getByText('Your shelf is empty.').waitFor();
    await page.getByText(/Before the first frost, empty and lift your pots/).waitFor();
    await page.getByRole('heading', { name: /Frost cracks pots/ }).waitFor();

    await page.getByRole('button', { name: 'Add a pot' }).click();
    const form = page.getByRole('form', { name: 'Add pot' });
    // Bad input gets field messages in words.
    await form.getByLabel('Capacity (L)').fill('lots');
    await form.getByRole('button', { name: 'Add pot' }).click();
    await form.getByText('Give the pot a label.').waitFor();
    await form.getByText('Write the capacity in L as a number, like 2.5.').waitFor();
    await form.getByText('Enter the widest diameter in mm.').waitFor();
    await form.getByLabel('Label').fill('Twin 1');
    await form.getByLabel('Capacity (L)').fill('6');
    await form.getByLabel('Widest diameter (mm)').fill('250');
    await form.getByLabel('Neck diameter (mm, optional)').fill('300');
    await form.getByRole('button', { name: 'Add pot' }).click();
    await form.getByText('The neck cannot be wider than the widest part of the pot.').waitFor();
    await form.getByLabel('Neck diameter (mm, optional)').fill('110');

    // Twin-pot construction shows the adhesive caution while the form is open.
    expect(await form.getByRole('note', { name: /Glues and sealants in twin-pot builds/ }).count()).toBe(0);
    await form.getByLabel('How it was made').selectOption('joined_terracotta');
    await form.getByRole('note', { name: /Glues and sealants in twin-pot builds/ }).waitFor();
    await form.getByLabel('Shape').selectOption('twin_pot');
    // A cone shows its chart temperature and band, and the kiln caution.
    await form.getByLabel('Firing cone (optional)').selectOption('04');
    await form.getByText(/Cone 04 is about 1060 °C \(Orton standard chart, heated at 150 °C\/h\)\. The typical olla firing, in the porous low-fire band/).waitFor();
    await form.getByRole('note', { name: /Firing your own pots/ }).waitFor();
    await form.getByLabel('Where it sits').selectOption({ label: `${ollaA.label} (olla)` });
    await env.screenshot('pot-form-1280');
    await form.getByRole('button', { name: 'Add pot' }).click();
    await page.getByText(`Twin 1 is on your shelf and placed in plot ${ollaA.label}.`).waitFor();

    const card = page.getByRole('article', { name: 'Twin 1' });
    await card.getByText('6 L', { exact: true }).waitFor();
    await card.getByText(/⌀ 250 mm, neck 110 mm/).waitFor();
    await card.getByText(/Cone 04/).waitFor();
    await card.getByText('1060 °C').waitFor();
    await card.getByText(`Plot ${ollaA.label}`).waitFor();
    await card.getByRole('link', { name: 'read the caution on adhesives' }).waitFor();
    await page.getByRole('note', { name: /Glues and sealants in twin-pot builds/ }).waitFor();
    const [stored] = await t.ds.query(`SELECT id, capacity_l, widest_diameter_cm, neck_diameter_cm, make, shape, firing_cone, plot_id FROM pots WHERE label = 'Twin 1'`);
    expect(stored).toMatchObject({ capacity_l: 6, widest_diameter_cm: 25, neck_diameter_cm: 11, make: 'joined_terracotta', shape: 'twin_pot', firing_cone: '04', plot_id: ollaA.id });

    // Two seep tests, a season apart: both rates listed, the chart and its table alternative.
    await card.getByRole('button', { name: 'Seep tests (0)' }).click();
    const seepForm = page.getByRole('form', { name: 'Add a seep test to Twin 1' });
    await seepForm.getByLabel('Water lost (L)').fill('-1');
    await seepForm.getByRole('button', { name: 'Save seep test' }).click();
    await seepForm.getByText('Water lost cannot be negative.').waitFor();
    await seepForm.getByLabel('Test date').fill('2026-04-10');
    await seepForm.getByLabel('Setting').selectOption('air');
    await seepForm.getByLabel('Water lost (L)').fill('3');
    await seepForm.getByLabel('Over how many hours').fill('24');
    await seepForm.getByRole('button', { name: 'Save seep test' }).click();
    await seepForm.getByText(/saved: 3 L\/day/).waitFor();
    await seepForm.getByLabel('Test date').fill('2026-09-20');
    await seepForm.getByLabel('Setting').selectOption('air');
    await seepForm.getByLabel('Water lost (L)').fill('1.05');
    await seepForm.getByLabel('Over how many hours').fill('12');
    await seepForm.getByRole('button', { name: 'Save seep test' }).click();
    const tests = card.getByRole('list', { name: 'Seep tests of Twin 1' });
    await tests.getByText('2.1 L/day').waitFor();
    await tests.getByText('3 L/day').waitFor();
    await card.getByRole('button', { name: 'Seep tests (2)' }).waitFor();
    await card.getByText('Seepage has fallen by 30%', { exact: false }).waitFor();
    await card.locator('figure svg').first().waitFor();
    await card.getByText('Show the numbers as a table').click();
    await card.getByRole('table').getByText('2.1 L/day').waitFor();
    const seeps = await t.ds.query(`SELECT litres_lost, hours FROM seep_tests WHERE pot_id = $1 ORDER BY tested_on`, [stored.id]);
    expect(seeps).toEqual([
      { litres_lost: 3, hours: 24 },
      { litres_lost: 1.05, hours: 12 },
    ]);
    await env.screenshot('pot-shelf-seep-tests-1280');

    // Mark it cracked and move it to the lidless pair: the rest of the pot stays as it was.
    await card.getByRole('button', { name: 'Move or mark' }).click();
    const place = page.getByRole('form', { name: 'Move or mark Twin 1' });
    await place.getByLabel('Where it sits').selectOption({ label: `${ollaB.label} (olla)` });
    await place.getByRole('note', { name: /Open pots can breed mosquitoes/ }).waitFor();
    await place.getByLabel('Condition').selectOption('cracked');
    await place.getByRole('button', { name: 'Save' }).click();
    await page.getByText(`Twin 1 is in plot ${ollaB.label}, cracked.`).waitFor();
    await card.getByText('Cracked', { exact: true }).waitFor();
    await card.getByRole('link', { name: /mosquitoes can breed/ }).waitFor();
    const [moved] = await t.ds.query(`SELECT condition, plot_id, firing_cone, neck_diameter_cm, make FROM pots WHERE id = $1`, [stored.id]);
    expect(moved).toEqual({ condition: 'cracked', plot_id: ollaB.id, firing_cone: '04', neck_diameter_cm: 11, make: 'joined_terracotta' });

    // A spare pot on the shelf: filter by condition, then delete it after the question.
    await post('/api/pots', { label: 'Spare', capacityL: 4, widestDiameterCm: 20, shape: 'globe', make: 'wheel_thrown' });
    await page.reload();
    await page.getByRole('article', { name: 'Spare' }).waitFor();
    await page.getByText('2 pots: 1 in plots, 1 on the shelf.').waitFor();
    const filter = page.getByRole('group', { name: 'Show pots by condition' });
    await filter.getByText('Cracked').click();
    expect(await filter.getByRole('radio', { name: /Cracked/ }).isChecked()).toBe(true);
    await page.getByRole('article', { name: 'Twin 1' }).waitFor();
    expect(await page.getByRole('article', { name: 'Spare' }).count()).toBe(0);
    await filter.getByText('Retired').click();
    await page.getByText('No retired pots.').waitFor();
    await filter.getByText('All').click();
    await page.getByRole('button', { name: 'Delete pot Spare' }).click();
    await page.getByRole('dialog', { name: 'Delete Spare?' }).getByRole('button', { name: 'Delete pot and its tests' }).click();
    await page.getByText('Spare deleted.').waitFor();
    expect(await t.ds.query(`SELECT id FROM pots WHERE label = 'Spare'`)).toEqual([]);
    await env.screenshot('pot-shelf-1280');

    // ---- Planner ----
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Planner' }).click();
    await page.getByRole('heading', { name: 'Planner', level: 1 }).waitFor();

    // (a) A 2 m × 1 m bed with 0.3 m pots: the count the page shows is planOllas's.
    const plan = planOllas({ lengthM: 2, widthM: 1 }, { widestDiameterM: 0.3 });
    await page.getByLabel('Bed length (m)').fill('2');
    await page.getByLabel('Bed width (m)').fill('1');
    await page.getByLabel('Pot widest diameter (mm)').first().fill('300');
    await page.locator('#bed-pot-count').filter({ hasText: new RegExp(`^${plan.count} pots$`) }).waitFor();
    await expect(page.locator('#bed-pot-count').textContent()).resolves.toBe(`${plan.count} pots`);
    await page.getByText(`${plan.rows} rows of ${plan.columns}, centres`).first().waitFor();
    await page.getByText(/Rule of thumb:.*a pot wets the soil about one pot radius beyond its wall/).first().waitFor();
    const drawing = page.getByRole('img', { name: /Layout drawing of the bed/ });
    expect(await drawing.locator('circle').count()).toBe(2 * plan.count);
    // Letting the corners stay dry asks for fewer pots (planOllas with minCoverage 0.8).
    const middle = planOllas({ lengthM: 2, widthM: 1 }, { widestDiameterM: 0.3 }, { minCoverage: 0.8 });
    expect(middle.count).toBeLessThan(plan.count);
    await page.getByRole('radio', { name: /Most of it/ }).check();
    await page.locator('#bed-pot-count').filter({ hasText: new RegExp(`^${middle.count} pots$`) }).waitFor();
    expect(await drawing.locator('circle').count()).toBe(2 * middle.count);
    await page.getByText(/Their wetted zones reach \d+% of the bed/).waitFor();
    await page.getByRole('radio', { name: /All of it/ }).check();
    await page.locator('#bed-pot-count').filter({ hasText: new RegExp(`^${plan.count} pots$`) }).waitFor();
    await page.getByLabel('Bed width (m)').fill('0.2');
    await page.getByText('A pot 300 mm wide does not fit inside this bed.').waitFor();
    await page.getByLabel('Bed width (m)').fill('1');

    // (b) 8 L at a measured 2 L/day: refill every 4 days (8 / 2, refillIntervalDays).
    await page.getByLabel('Capacity (L)').fill('8');
    await page.getByLabel('Seepage (L/day)').fill('2');
    await page.getByText('Refill about every 4 days').waitFor();
    await page.getByRole('radio', { name: /Crop water need/ }).check();
    await page.getByLabel('Crop water need (mm/day)').fill('');
    await page.getByText('Enter the crop water need in mm/day.').waitFor();

    // (c) δ = σ = 1: R power.t.test(delta = 1, sd = 1, type = "paired", power = 0.8) gives n = 9.94,
    // so 10 pairs (../shared/REFERENCES.md, "Sample size"; M, recomputed R).
    expect(pairedSampleSize({ meanDifference: 1, sdDifference: 1 })).toBe(10);
    await page.getByLabel('Expected saving (mm)').fill('1');
    await page.getByLabel('Standard deviation of the pair differences (mm)').fill('1');
    await page.getByText('About 10 pairs give an 80% chance to detect a saving of 1 mm when the pair differences spread by 1 mm', { exact: false }).waitFor();
    await page.getByText('9.94 pairs, rounded up', { exact: false }).waitFor();
    await page.getByLabel('Expected saving (mm)').fill('0');
    await page.getByText('Enter a saving above zero: no number of pairs can detect no difference.').waitFor();
    await page.getByLabel('Expected saving (mm)').fill('10');
    await page.getByLabel('Chance to detect (%)').fill('90');
    const sdTyped = pairedSampleSize({ meanDifference: 10, sdDifference: 1, power: 0.9 });
    await page.getByText(`About ${sdTyped} pairs give a 90% chance`, { exact: false }).waitFor();
    await page.getByLabel('Chance to detect (%)').fill('80');

    // The spread of the grower's own trial, read from its analysis.
    const analysis = (await (await page.request.get(`${baseUrl}/api/trials/${trial.id}/analysis`)).json()).data;
    const metric = analysis.comparisons[0].metrics.waterMm;
    expect(metric.kind).toBe('test');
    const sdMm = metric.result.sdDifference as number;
    await page.getByRole('radio', { name: /Use one of my trials/ }).check();
    await page.getByLabel('Trial', { exact: true }).selectOption({ label: 'Melons 2026' });
    await page.getByText(/In its 3 pairs, the olla − surface differences in water spread by/).waitFor();
    const fromTrial = pairedSampleSize({ meanDifference: 10, sdDifference: sdMm });
    await page.getByText(`About ${fromTrial} pairs give an 80% chance to detect a saving of 10 mm`, { exact: false }).waitFor();
    await env.screenshot('planner-1280');

    // ---- US customary units, on a narrow phone ----
    const patched = await page.request.patch(`${baseUrl}/api/account`, { headers: { 'X-CSRF-Token': csrf }, data: { unitSystem: 'us' } });
    expect(patched.status()).toBe(200);
    await page.setViewportSize({ width: 360, height: 800 });
    await page.goto(`${baseUrl}/pots`);
    const usCard = page.getByRole('article', { name: 'Twin 1' });
    await usCard.getByText('1.59 gal', { exact: true }).waitFor(); // 6 L / 3.785411784 L/gal
    await usCard.getByText(/⌀ 9.8 in, neck 4.3 in/).waitFor(); // 250 mm, 110 mm / 25.4 mm/in
    await usCard.getByText('1940 °F').waitFor(); // Orton standard chart, cone 04
    await usCard.getByText('0.55 gal/day').waitFor(); // 2.1 L/day
    // Saving the form untouched keeps the stored litres and centimetres exactly (no round trip through gallons).
    await usCard.getByRole('button', { name: 'Edit' }).click();
    const usForm = page.getByRole('form', { name: 'Save Twin 1' });
    await expect(usForm.getByLabel('Capacity (gal)').inputValue()).resolves.toBe('1.59');
    await usForm.getByLabel('Label').fill('Twin 1');
    await env.screenshot('pot-form-360');
    await usForm.getByRole('button', { name: 'Save Twin 1' }).click();
    await page.getByText('Twin 1 saved.').waitFor();
    const [kept] = await t.ds.query(`SELECT capacity_l, widest_diameter_cm, neck_diameter_cm, condition, plot_id FROM pots WHERE id = $1`, [stored.id]);
    expect(kept).toEqual({ capacity_l: 6, widest_diameter_cm: 25, neck_diameter_cm: 11, condition: 'cracked', plot_id: ollaB.id });
    await usCard.getByRole('button', { name: 'Seep tests (2)' }).click();
    await usCard.locator('figure svg').first().waitFor();
    await env.screenshot('pot-shelf-360');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);

    await page.goto(`${baseUrl}/planner`);
    await page.getByRole('heading', { name: 'Planner', level: 1 }).waitFor();
    const usPlan = planOllas({ lengthM: 6 * 0.3048, widthM: 3 * 0.3048 }, { widestDiameterM: 12 * 0.0254 });
    await page.getByLabel('Bed length (ft)').fill('6');
    await page.getByLabel('Bed width (ft)').fill('3');
    await page.getByLabel('Pot widest diameter (in)').first().fill('12');
    await page.locator('#bed-pot-count').filter({ hasText: new RegExp(`^${usPlan.count} pots$`) }).waitFor();
    await env.screenshot('planner-360');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    expect(env.pageErrors).toEqual([]);
  });
});
