/**
 * Every trial chart that tells series apart by colour names them in a legend: a reader (and a
 * screen-reader user reading the SVG's text) must be able to tell which line is which. Rendered
 * with vega itself (the library the page uses), headless, to SVG text. The numbers here are an
 * invented scenario; what is checked is only that each series is named.
 *
 * Found in a session-3 walkthrough: the weekly crop-need chart drew three lines with no legend,
 * because Vega-Lite merges the colour and dash legends of one field and `legend: null` on the
 * dash encoding dropped both.
 */
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { analyseTrial, plotDailyWater, type TrialAnalysisInput } from '@shared/analysis/trial-analysis';
import { trialCharts } from '@shared/charts/trial-charts';
import { vegaLocale } from '@shared/charts/vega-locale';

function scenario(): TrialAnalysisInput {
  const days = Array.from({ length: 28 }, (_, i) => new Date(Date.UTC(2026, 5, 1 + i)).toISOString().slice(0, 10));
  const plots = [0, 1, 2].flatMap((i) => [
    { id: `o${i}`, label: `${i + 1}A`, treatment: 'olla', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: 120, ollaL: 120, surfaceL: 0, waterEvents: 14, harvestKg: 4 + i / 5, marketableKg: 4, harvests: 3 },
    { id: `s${i}`, label: `${i + 1}B`, treatment: 'surface', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: 260 + i * 10, ollaL: 0, surfaceL: 260 + i * 10, waterEvents: 28, harvestKg: 3.8 + i / 4, marketableKg: 3.5, harvests: 3 },
  ]);
  return {
    trial: { crop: 'tomato', plantingDate: '2026-05-20', endDate: null, treatments: ['olla', 'surface'], kcOverrides: {}, stressThresholds: {} },
    garden: { latitudeDeg: 34.6, elevationM: 900, coastal: false },
    plots,
    dailyWater: plotDailyWater(days.flatMap((day, d) => plots.map((p) => ({ plotId: p.id, day, litres: p.treatment === 'olla' ? (d % 2 ? 0 : 8) : 9 + (d % 3) })))),
    weather: days.map((day, d) => ({ day, tMinC: 14 + (d % 4), tMaxC: 31 + (d % 5), rainMm: d === 9 ? 6 : 0, rhMinPct: null, rhMaxPct: null, windSpeedMs: null, windHeightM: 2, sunshineHours: null, solarRadiationMJ: null })),
    moisture: days.flatMap((day, d) => [
      { day, treatment: 'olla', method: 'vwc_percent', mean: 24 - (d % 3), n: 3 },
      { day, treatment: 'surface', method: 'vwc_percent', mean: 19 - (d % 6), n: 3 },
    ]),
    asOf: '2026-06-28',
  };
}

async function svgOf(spec: unknown): Promise<string> {
  const view = new vega.View(vega.parse(compile(spec as TopLevelSpec).spec), { renderer: 'none', locale: vegaLocale('en') } as unknown as vega.ViewOptions);
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

describe('trial chart legends', () => {
  it('the weekly crop-need chart names its three lines', async () => {
    const charts = trialCharts(analyseTrial(scenario()), ['olla', 'surface'], { units: 'metric', width: 600 });
    const weekly = charts.find((c) => c.id.includes('need') || c.id.includes('week'));
    expect(weekly, charts.map((c) => c.id).join(', ')).toBeDefined();
    const svg = await svgOf(weekly!.spec);
    const spec = weekly!.spec as { encoding: { color: { scale: { domain: string[] } } } };
    const names = spec.encoding.color.scale.domain;
    expect(names).toHaveLength(3);
    for (const name of names) expect(svg, name).toContain(`>${name}<`);
  }, 30_000);

  it('every chart coloured by treatment shows both treatment names', async () => {
    const charts = trialCharts(analyseTrial(scenario()), ['olla', 'surface'], { units: 'metric', width: 600 });
    const coloured = charts.filter((c) => JSON.stringify(c.spec).includes('"field":"treatment"'));
    expect(coloured.length).toBeGreaterThanOrEqual(2);
    for (const c of coloured) {
      const svg = await svgOf(c.spec);
      expect(svg, c.id).toContain('>olla<');
      expect(svg, c.id).toContain('>surface<');
    }
  }, 60_000);
});
