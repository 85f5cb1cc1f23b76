import { describe, expect, it } from 'vitest';
import { describeComparison } from '@shared/analysis/narrative';
import { analyseTrial, cumulativePoints, plotDailyWater, weekStart, type TrialAnalysisInput } from '@shared/analysis/trial-analysis';
import { cumulativeWaterSpec } from '@shared/charts/trial-charts';

// MASS::shoes (Box, Hunter & Hunter 1978, p. 100): material A and B worn by the same boy.
const shoesA = [13.2, 8.2, 10.9, 14.3, 10.7, 6.6, 9.5, 10.8, 8.8, 13.3];
const shoesB = [14.0, 8.8, 11.2, 14.2, 11.8, 6.4, 9.8, 11.3, 9.3, 13.6];

function input(pairs: [number, number][], extra: Partial<TrialAnalysisInput> = {}): TrialAnalysisInput {
  const plots = pairs.flatMap(([o, s], i) => [
    { id: `o${i}`, label: `${i}o`, treatment: 'olla', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: o * 2, ollaL: o * 2, surfaceL: 0, waterEvents: 1, harvestKg: 1, marketableKg: 1, harvests: 1 },
    { id: `s${i}`, label: `${i}s`, treatment: 'surface', blockKey: `B${i}`, areaM2: 2, plantCount: 2, waterL: s * 2, ollaL: 0, surfaceL: s * 2, waterEvents: 1, harvestKg: 1, marketableKg: 1, harvests: 1 },
  ]);
  return {
    trial: { crop: 'tomato', plantingDate: '2026-05-01', endDate: null, treatments: ['olla', 'surface'], kcOverrides: {}, stressThresholds: {} },
    garden: { latitudeDeg: 35, elevationM: 1500, coastal: false },
    plots,
    dailyWater: [],
    weather: [],
    moisture: [],
    asOf: '2026-09-30',
    ...extra,
  };
}

describe('analyseTrial', () => {
  it('compares water depths per pair with the paired t-test (MASS shoes: t = -3.3489, df 9, p = 0.008539)', () => {
    // Depth in mm = litres / m²; plots of 2 m² carry twice the value in litres.
    const r = analyseTrial(input(shoesA.map((a, i) => [a, shoesB[i]!])));
    const m = r.comparisons[0]!.metrics.waterMm;
    expect(m.kind).toBe('test');
    if (m.kind !== 'test') return;
    expect(m.result.t).toBeCloseTo(-3.3489, 4); // R t.test(A, B, paired = TRUE), REFERENCES.md
    expect(m.result.pValue).toBeCloseTo(0.008539, 6);
    expect(m.result.ci[0]).toBeCloseTo(-0.6869539, 6);
    expect(m.result.ci[1]).toBeCloseTo(-0.1330461, 6);
  });

  it('never pairs days: a single pair stays descriptive however many logs it has', () => {
    const r = analyseTrial(input([[30, 70]], { dailyWater: plotDailyWater(Array.from({ length: 40 }, (_, d) => ({ plotId: 'o0', day: `2026-06-${String((d % 28) + 1).padStart(2, '0')}`, litres: 1 }))) }));
    expect(r.comparisons[0]!.metrics.waterMm.kind).toBe('descriptive');
  });

  it('counts stress days per method on its own scale (tensiometer: higher suction is drier)', () => {
    const r = analyseTrial(
      input([[1, 2]], {
        trial: { crop: 'tomato', plantingDate: '2026-05-01', endDate: null, treatments: ['olla', 'surface'], kcOverrides: {}, stressThresholds: { vwc: 15, tensiometer: 50 } },
        moisture: [
          { day: '2026-06-01', treatment: 'olla', method: 'vwc', mean: 18, n: 1 },
          { day: '2026-06-02', treatment: 'olla', method: 'vwc', mean: 12, n: 1 },
          { day: '2026-06-01', treatment: 'surface', method: 'tensiometer', mean: 60, n: 2 },
          { day: '2026-06-02', treatment: 'surface', method: 'tensiometer', mean: 30, n: 2 },
        ],
      }),
    );
    expect(r.moisture.stress).toEqual([
      { treatment: 'olla', method: 'vwc', threshold: 15, daysBelow: 1, daysMeasured: 2 },
      { treatment: 'surface', method: 'tensiometer', threshold: 50, daysBelow: 1, daysMeasured: 2 },
    ]);
  });

  it('keeps one running total per plot, in day order, plots in numeric label order; weekly depths per ISO week', () => {
    // Eleven pairs so that labels "2o" and "10o" test numeric order. Daily rows arrive out of order.
    const pairs = Array.from({ length: 11 }, (): [number, number] => [10, 20]);
    const r = analyseTrial(
      input(pairs, {
        // Grouped per plot as the analysis SQL does (a second row for a day adds to it).
        dailyWater: plotDailyWater([
          { plotId: 'o10', day: '2026-06-03', litres: 2 },
          { plotId: 'o2', day: '2026-06-08', litres: 4 },
          { plotId: 'o10', day: '2026-06-01', litres: 1 },
          { plotId: 's2', day: '2026-06-02', litres: 3.5 },
          { plotId: 'o2', day: '2026-06-01', litres: 0.25 },
          { plotId: 'o10', day: '2026-06-08', litres: 4 },
          { plotId: 'o2', day: '2026-06-01', litres: 0.25 },
        ]),
      }),
    );
    expect(r.waterDays).toEqual([
      { plotId: 'o2', label: '2o', treatment: 'olla', firstDay: '2026-06-01', dayOffsets: [0, 7], litres: [0.5, 4] },
      { plotId: 's2', label: '2s', treatment: 'surface', firstDay: '2026-06-02', dayOffsets: [0], litres: [3.5] },
      { plotId: 'o10', label: '10o', treatment: 'olla', firstDay: '2026-06-01', dayOffsets: [0, 2, 7], litres: [1, 2, 4] },
    ]);
    // Running totals, as the chart and any reader rebuild them.
    expect(r.waterDays.map(cumulativePoints)).toEqual([
      [['2026-06-01', 0.5], ['2026-06-08', 4.5]],
      [['2026-06-02', 3.5]],
      [['2026-06-01', 1], ['2026-06-03', 3], ['2026-06-08', 7]],
    ]);
    // Depth = litres over the treatment's area (1 L on 1 m² is 1 mm, by definition); each treatment has 11 plots of 2 m².
    expect(r.cropWater.weekly.map((w) => [w.weekStart, w.appliedMm.olla, w.appliedMm.surface])).toEqual([
      ['2026-06-01', expect.closeTo(3.5 / 22, 12), expect.closeTo(3.5 / 22, 12)],
      ['2026-06-08', expect.closeTo(8 / 22, 12), 0],
    ]);
    // The chart draws the same points, one row per plot and day.
    const values = (cumulativeWaterSpec(r, ['olla', 'surface'], { units: 'metric', width: 400 }).data as { values: unknown[] }).values;
    expect(values).toEqual([
      { plot: '2o', treatment: 'olla', day: '2026-06-01', value: 0.5 },
      { plot: '2o', treatment: 'olla', day: '2026-06-08', value: 4.5 },
      { plot: '2s', treatment: 'surface', day: '2026-06-02', value: 3.5 },
      { plot: '10o', treatment: 'olla', day: '2026-06-01', value: 1 },
      { plot: '10o', treatment: 'olla', day: '2026-06-03', value: 3 },
      { plot: '10o', treatment: 'olla', day: '2026-06-08', value: 7 },
    ]);
  });

  it('puts ISO weeks on Mondays', () => {
    expect(weekStart('2026-07-06')).toBe('2026-07-06'); // a Monday
    expect(weekStart('2026-07-12')).toBe('2026-07-06'); // the Sunday after
  });
});

describe('describeComparison', () => {
  it('states n, the interval, both tests and the one-site caveat, in the reader’s units', () => {
    const r = analyseTrial(input(shoesA.map((a, i) => [a, shoesB[i]!])));
    const en = describeComparison(r.comparisons[0]!, { lang: 'en', units: 'metric' }).join(' ');
    expect(en).toMatch(/Across 10 pairs/);
    expect(en).toMatch(/95% confidence interval/);
    expect(en).toMatch(/paired t-test p = 0\.009/);
    expect(en).not.toMatch(/p = </);
    expect(en).toMatch(/Wilcoxon signed-rank p = /);
    expect(en).toMatch(/one site/);
    const us = describeComparison(r.comparisons[0]!, { lang: 'en', units: 'us' }).join(' ');
    expect(us).toMatch(/ in /);
    const es = describeComparison(r.comparisons[0]!, { lang: 'es', units: 'metric' }).join(' ');
    expect(es).toMatch(/En 10 pares/);
  });

  it('says how low the exact Wilcoxon p-value can go with few pairs (2/2^n: 0.125 for 4 pairs)', () => {
    // Exact signed-rank null distribution: all 2^n sign patterns equally likely; the most extreme
    // two-sided outcome has probability 2/2^n (Hollander & Wolfe 1973, ch. 3).
    const r = analyseTrial(input([[10, 20], [11, 23], [9, 20], [12, 25]]));
    const text = describeComparison(r.comparisons[0]!, { lang: 'en', units: 'metric' }).join(' ');
    expect(text).toMatch(/cannot give a p-value below 0\.125/);
    const m = r.comparisons[0]!.metrics.waterMm;
    expect(m.kind === 'test' && m.result.wilcoxon.pValue).toBe(0.125);
  });

  it('with one pair says plainly that no test is possible', () => {
    const r = analyseTrial(input([[30, 70]]));
    const text = describeComparison(r.comparisons[0]!, { lang: 'en', units: 'metric' }).join(' ');
    expect(text).toMatch(/single pair/);
    expect(text).toMatch(/No test across replicates is possible/);
    expect(text).toMatch(/57% saving/);
  });
});
