/**
 * The language-aware text and charts built in shared/: the same analysis in English and Spanish
 * gives the same numbers, only the words (and the decimal mark) change. Reference data: MASS::shoes
 * (Box, Hunter & Hunter 1978, p. 100), paired t-test p = 0.008539 (R t.test(A, B, paired = TRUE)).
 * Decimal marks: CLDR "en" uses ".", CLDR "es" uses "," (read here through Intl.NumberFormat).
 */
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { describeComparison } from '@shared/analysis/narrative';
import { analyseTrial, plotDailyWater, type TrialAnalysisInput } from '@shared/analysis/trial-analysis';
import { trialCharts } from '@shared/charts/trial-charts';
import { vegaLocale } from '@shared/charts/vega-locale';
import { formatNum, toLang, translator } from '@shared/i18n/translate';
import esAnalysis from '@shared/locales/es/analysis.json';
import { trialReportMarkdown } from '@shared/report/trial-report';

const shoesA = [13.2, 8.2, 10.9, 14.3, 10.7, 6.6, 9.5, 10.8, 8.8, 13.3];
const shoesB = [14.0, 8.8, 11.2, 14.2, 11.8, 6.4, 9.8, 11.3, 9.3, 13.6];

function input(pairs: [number, number][], extra: Partial<TrialAnalysisInput> = {}): TrialAnalysisInput {
  const plots = pairs.flatMap(([o, s], i) => [
    { id: `o${i}`, label: `${i}o`, treatment: 'olla', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: o * 2, ollaL: o * 2, surfaceL: 0, waterEvents: 1, harvestKg: 1 + i / 10, marketableKg: 1, harvests: 1 },
    { id: `s${i}`, label: `${i}s`, treatment: 'surface', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: s * 2, ollaL: 0, surfaceL: s * 2, waterEvents: 1, harvestKg: 1.05 + i / 9, marketableKg: 1, harvests: 1 },
  ]);
  return {
    trial: { crop: 'tomato', plantingDate: '2026-05-01', endDate: null, treatments: ['olla', 'surface'], kcOverrides: {}, stressThresholds: {} },
    garden: { latitudeDeg: 35, elevationM: 1500, coastal: false },
    plots,
    dailyWater: plotDailyWater(
      pairs.flatMap(([o, s], i) => [
        { plotId: `o${i}`, day: '2026-06-01', litres: o * 2 },
        { plotId: `s${i}`, day: '2026-06-02', litres: s * 2 },
      ]),
    ),
    weather: [],
    moisture: [],
    asOf: '2026-09-30',
    ...extra,
  };
}

/** Every number in a text, read with the language's decimal mark ("0,009" in Spanish is 0.009). */
function numbers(text: string, lang: 'en' | 'es'): number[] {
  const re = lang === 'es' ? /−?\d+(?:\.\d{3})*(?:,\d+)?/g : /−?\d+(?:,\d{3})*(?:\.\d+)?/g;
  return [...text.matchAll(re)].map((m) => {
    const s = m[0].replace('−', '-');
    return Number(lang === 'es' ? s.replaceAll('.', '').replace(',', '.') : s.replaceAll(',', ''));
  });
}

const shoes = () => analyseTrial(input(shoesA.map((a, i) => [a, shoesB[i]!])));

describe('translator', () => {
  it('picks the CLDR plural form of each language and interpolates', () => {
    const en = translator('en');
    const es = translator('es');
    expect(en('report.trial.design', { count: 1, design: 'x', treatments: 'y' })).toMatch(/1 complete pair\./);
    expect(en('report.trial.design', { count: 3, design: 'x', treatments: 'y' })).toMatch(/3 complete pairs\./);
    expect(es('report.trial.design', { count: 1, design: 'x', treatments: 'y' })).toMatch(/1 par completo\./);
    expect(es('report.trial.design', { count: 3, design: 'x', treatments: 'y' })).toMatch(/3 pares completos\./);
    expect(es('charts.trial.waterSoFar', { unit: 'L' })).toBe('Agua aplicada hasta la fecha (L)');
    expect(toLang('es-MX')).toBe('es');
    expect(toLang('fr')).toBe('en');
  });

  it('formats numbers for reading with the language’s decimal mark (CLDR), never for files', () => {
    expect(formatNum(1234.5, 1, 'en')).toBe('1,234.5');
    expect(formatNum(0.0085, 3, 'es')).toBe('0,009');
    expect(formatNum(-2.5, 1, 'es')).toBe('−2,5');
  });
});

describe('plain-language sentences in both languages', () => {
  it('gives the paired comparison with the same numbers in English and Spanish', () => {
    const c = shoes().comparisons[0]!;
    const en = describeComparison(c, { lang: 'en', units: 'metric' }).join(' ');
    const es = describeComparison(c, { lang: 'es', units: 'metric' }).join(' ');
    expect(en).toMatch(/paired t-test p = 0\.009/);
    expect(es).toMatch(/prueba t pareada p = 0,009/);
    expect(es).toMatch(/intervalo de confianza del 95 %/);
    expect(numbers(es, 'es')).toEqual(numbers(en, 'en'));
  });

  it('carries warnings as keys, shown in either language', () => {
    const r = analyseTrial(input([[10, 20]], { plots: input([[10, 20]]).plots.map((p) => ({ ...p, harvests: 0, harvestKg: 0 })) }));
    expect(r.notices.map((n) => n.key)).toEqual(expect.arrayContaining(['noHarvest', 'noWeather']));
    expect(r.warnings).toContain('No harvests logged yet: water-use efficiency and harvest comparisons will appear after the first pick.');
    expect(translator('es')('analysis.warnings.noHarvest')).toBe(esAnalysis.warnings.noHarvest);
    const m = r.comparisons[0]!.metrics.waterMm;
    expect(m.kind === 'descriptive' && m.reasonKey).toBe('singlePair');
  });

  it('writes the trial report in Spanish with the same numbers in its results', () => {
    const a = { ...shoes(), asOf: '2026-09-30' };
    const base = { title: 'Camas del patio', crop: 'Tomate', variety: '', plantingDate: '2026-05-01', endDate: null, design: 'paired', treatments: ['olla', 'surface'], question: '', randomisationSeed: 'abc', analysis: a, generatedOn: '2026-10-01', files: ['data/plots.csv'] };
    const en = trialReportMarkdown({ ...base, t: translator('en') });
    const es = trialReportMarkdown({ ...base, t: translator('es') });
    expect(es).toMatch(/^# Camas del patio: métodos y resultados/);
    expect(es).toMatch(/10 pares completos/);
    expect(es).toMatch(/\| olla \|/);
    expect(es).toMatch(/\| superficie \|/);
    const results = (md: string, h: string, next: string) => md.slice(md.indexOf(h), md.indexOf(next));
    expect(numbers(results(es, '## Resultados', '### Necesidad'), 'es')).toEqual(numbers(results(en, '## Results', '### Crop water need'), 'en'));
  });
});

describe('trial charts in both languages', () => {
  const numbersOf = (spec: unknown) => JSON.stringify(spec).match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g);

  it('translates titles, axes and legends and keeps every data value', () => {
    const a = shoes();
    const en = trialCharts(a, ['olla', 'surface'], { units: 'metric', width: 600, t: translator('en') });
    const es = trialCharts(a, ['olla', 'surface'], { units: 'metric', width: 600, t: translator('es') });
    expect(es.map((c) => c.id)).toEqual(en.map((c) => c.id));
    expect(es.map((c) => c.title)).toContain('Agua aplicada durante la temporada, por parcela');
    for (const [i, c] of es.entries()) expect(numbersOf(c.spec), c.id).toEqual(numbersOf(en[i]!.spec));
    const cumulative = JSON.stringify(es[0]!.spec);
    expect(cumulative).toContain('Agua aplicada hasta la fecha (L)');
    expect(cumulative).not.toMatch(/"Date"|"Treatment"|Water applied/);
    // Legend shows "superficie" while the data keep "surface" (colours and tooltips stay stable).
    expect(cumulative).toContain('superficie');
    expect(JSON.stringify(en[0]!.spec)).not.toContain('labelExpr');
  });

  it('renders axis numbers with a decimal comma in Spanish (vega with the es locale)', async () => {
    const a = shoes();
    const [harvest] = trialCharts(a, ['olla', 'surface'], { units: 'metric', width: 400, t: translator('es') }).filter((c) => c.id === 'harvest-vs-water');
    const render = async (lang: 'en' | 'es') => {
      const view = new vega.View(vega.parse(compile(harvest!.spec as unknown as TopLevelSpec).spec), { renderer: 'none', locale: vegaLocale(lang) } as unknown as vega.ViewOptions);
      const svg = await view.toSVG();
      view.finalize();
      return svg;
    };
    const es = await render('es');
    const en = await render('en');
    // The water axis runs 0 … 0.03 m³: ticks like "0,005" in Spanish, "0.005" in English.
    expect(es).toMatch(/>0,0\d+</);
    expect(es).not.toMatch(/>0\.0\d+</);
    expect(en).toMatch(/>0\.0\d+</);
    expect(es).toContain('Agua aplicada (m³)');
  }, 30_000);
  it('writes date ticks day first in Spanish ("1 jun") and month first in English ("Jun 1")', async () => {
    const a = shoes();
    const render = async (lang: 'en' | 'es') => {
      const [cumulative] = trialCharts(a, ['olla', 'surface'], { units: 'metric', width: 400, t: translator(lang) });
      const view = new vega.View(vega.parse(compile(cumulative!.spec as unknown as TopLevelSpec).spec), { renderer: 'none', locale: vegaLocale(lang) } as unknown as vega.ViewOptions);
      const svg = await view.toSVG();
      view.finalize();
      return svg;
    };
    // The shoes season logs water on 1 and 2 June 2026 (input() above).
    const es = await render('es');
    const en = await render('en');
    expect(es).toMatch(/>\d{1,2} jun</);
    expect(es).not.toMatch(/>(jun|Jun) \d/);
    expect(en).toMatch(/>Jun \d{1,2}</);
  }, 30_000);

  it('names soil-moisture methods in the facet, never by their codes', () => {
    const days = ['2026-06-01', '2026-06-02'];
    const moisture = days.flatMap((day) => [
      { day, treatment: 'olla', method: 'probe_index', mean: 6, n: 2 },
      { day, treatment: 'surface', method: 'vwc', mean: 21, n: 2 },
    ]);
    const a = analyseTrial(input(shoesA.map((x, i) => [x, shoesB[i]!]), { moisture }));
    const chart = (lang: 'en' | 'es') => trialCharts(a, ['olla', 'surface'], { units: 'metric', width: 400, t: translator(lang) }).find((c) => c.id === 'soil-moisture')!;
    const es = JSON.stringify(chart('es').spec);
    expect(es).toContain('Sonda de mano (1–10)');
    expect(es).toContain('Contenido volumétrico de agua (%)');
    expect(es).not.toContain('probe_index');
    expect(JSON.stringify(chart('en').spec)).toContain('Handheld probe (1–10)');
  });
});

describe('vega locales', () => {
  // d3-time-format's en-US locale file and CLDR "es" month names (from memory, common practice).
  it('derives short names from the full ones, the same shape for both languages', () => {
    const en = vegaLocale('en');
    const es = vegaLocale('es');
    expect(en.time.shortMonths).toEqual(['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']);
    expect(en.time.shortDays).toEqual(['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat']);
    expect(es.time.shortMonths).toEqual(['ene', 'feb', 'mar', 'abr', 'may', 'jun', 'jul', 'ago', 'sep', 'oct', 'nov', 'dic']);
    expect(es.time.shortDays).toEqual(['dom', 'lun', 'mar', 'mié', 'jue', 'vie', 'sáb']);
    expect([en.number.decimal, es.number.decimal]).toEqual(['.', ',']);
    expect(Object.keys(es.time)).toEqual(Object.keys(en.time));
  });
});
