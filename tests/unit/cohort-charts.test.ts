/**
 * The cohort chart specs mirror the pooled results they are built from: one forest row per pooled
 * trial at its back-transformed saving, the pooled diamond across its confidence interval, the
 * dashed prediction interval, units converted, labels unambiguous and pseudonymous.
 */
import { compile, type TopLevelSpec } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { analyseCohort, type BlockAggregate, type CohortTrialAggregate, type ProgressAggregate } from '@shared/analysis/cohort-effects';
import { cohortCharts, cohortProgressSpec, forestPlotSpec, POOLED_ROW, PREDICTION_ROW, trialLabels, weekLabel } from '@shared/charts/cohort-charts';
import { translator } from '@shared/i18n/translate';
import type { CohortResults } from '@shared/schemas/cohort-results';
import { KG_PER_POUND, MM_PER_INCH } from '@shared/units';

type Layer = { mark: { type: string; strokeDash?: number[]; color?: string }; data: { values: Record<string, unknown>[] }; encoding: Record<string, unknown> };

const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

function trial(n: number, pseudonym: string, crop: string, capacityL: number): CohortTrialAggregate {
  return {
    trialId: uuid(n),
    pseudonym,
    mine: false,
    crop,
    status: 'active',
    plantingDate: '2026-05-01',
    endDate: null,
    latitudeDeg: 35,
    longitudeDeg: -107,
    soilTexture: 'loam',
    expectedDays: 100,
    harvestRecords: 4,
    moistureMethods: [],
    settings: ['in_ground'],
    mulch: [false],
    lids: [true],
    potCount: 2,
    meanPotCapacityL: capacityL,
    potCapacitiesL: [capacityL],
    potShapes: ['globe'],
    clayBodies: ['terracotta'],
    potMakes: ['wheel_thrown'],
    exclusion: null,
  };
}

function block(n: number, key: string, ollaL: number, surfaceL: number, ollaKg = 2.2, surfaceKg = 2): BlockAggregate {
  return {
    trialId: uuid(n),
    blockKey: key,
    ollaPlots: 1,
    ollaAreaM2: 2,
    ollaPlants: 3,
    ollaL,
    ollaHarvestKg: ollaKg,
    ollaPlotsWithoutHarvest: 0,
    surfacePlots: 1,
    surfaceAreaM2: 2,
    surfacePlants: 3,
    surfaceL,
    surfaceHarvestKg: surfaceKg,
    surfacePlotsWithoutHarvest: 0,
  };
}

const progress: ProgressAggregate[] = [
  { weekStart: '2026-06-01', isoWeek: '2026-W23', treatment: 'olla', litres: 40, cumulativeLitres: 40, trials: 4 },
  { weekStart: '2026-06-01', isoWeek: '2026-W23', treatment: 'surface', litres: 80, cumulativeLitres: 80, trials: 4 },
  { weekStart: '2026-06-08', isoWeek: '2026-W24', treatment: 'olla', litres: 44, cumulativeLitres: 84, trials: 4 },
  { weekStart: '2026-06-08', isoWeek: '2026-W24', treatment: 'surface', litres: 90, cumulativeLitres: 170, trials: 4 },
];

function cohort(extraBlocks: BlockAggregate[] = [], extraTrials: CohortTrialAggregate[] = []): CohortResults {
  const trials = [
    trial(1, 'Grower K7', 'tomato', 10),
    trial(2, 'Grower K7', 'tomato', 5),
    trial(3, 'Grower B12', 'squash-zucchini', 12),
    trial(4, 'Grower R31', 'sweet-pepper', 8),
    ...extraTrials,
  ];
  const blocks = [
    block(1, 'A', 60, 100),
    block(1, 'B', 64, 100),
    block(2, 'A', 50, 100),
    block(2, 'B', 58, 100),
    block(3, 'A', 70, 100),
    block(3, 'B', 66, 100),
    block(4, 'A', 40, 100, 2.5, 2),
    block(4, 'B', 48, 100, 2.4, 2.1),
    ...extraBlocks,
  ];
  return analyseCohort({
    cohortId: uuid(99),
    asOf: '2026-10-01',
    trials,
    blocks,
    water: [],
    progress,
    options: { method: 'DL', confidence: 0.95, includeSinglePairs: false, excludeFlagged: false },
  });
}

function layers(spec: Record<string, unknown> | null): Layer[] {
  expect(spec).not.toBeNull();
  return spec!.layer as Layer[];
}

describe('trialLabels', () => {
  it('names trials by pseudonym and crop, numbering a grower’s second trial of the same crop', () => {
    const labels = trialLabels(cohort());
    expect(labels[uuid(1)]).toBe('Grower K7 · Tomato (1)');
    expect(labels[uuid(2)]).toBe('Grower K7 · Tomato (2)');
    expect(labels[uuid(3)]).toBe('Grower B12 · Squash / zucchini');
  });
});

describe('forestPlotSpec', () => {
  it('draws one row per pooled trial at its % saving, largest first, then the pooled diamond and the prediction interval', () => {
    const r = cohort();
    const water = r.effects.waterLogRatio;
    expect(water.k).toBe(4);
    const all = layers(forestPlotSpec(r, 'waterLogRatio', { units: 'metric', width: 'container' }));
    const points = all.find((l) => l.mark.type === 'point')!;
    const rows = points.data.values as { row: string; estimate: number; lo: number; hi: number; weight: number }[];
    expect(rows).toHaveLength(4);
    expect(rows.map((x) => x.estimate)).toEqual([...rows.map((x) => x.estimate)].sort((a, b) => b - a));
    // Trial 2: pairs at 50 % and 42 % of surface depth, ln ratios averaged, back-transformed: (1 − e^mean)·100.
    const t2 = rows.find((x) => x.row === 'Grower K7 · Tomato (2)')!;
    expect(t2.estimate).toBeCloseTo((1 - Math.exp((Math.log(0.5) + Math.log(0.58)) / 2)) * 100, 10);
    const forest2 = water.forest.find((f) => f.trialId === uuid(2))!;
    expect([t2.lo, t2.hi]).toEqual(forest2.display.ci);
    expect(rows.reduce((s, x) => s + x.weight, 0)).toBeCloseTo(100, 10);

    const diamond = all.find((l) => l.mark.type === 'trail')!;
    const p = water.pooled!;
    expect(diamond.data.values.map((v) => [v.x, v.w])).toEqual([
      [p.display.ci[0], 0],
      [p.display.estimate, 14],
      [p.display.ci[1], 0],
    ]);
    const pi = all.find((l) => l.mark.type === 'rule' && l.data.values[0]?.row === PREDICTION_ROW)!;
    expect(pi.mark.strokeDash).toEqual([6, 4]);
    expect(pi.data.values[0]).toMatchObject({ row: PREDICTION_ROW, lo: p.display.predictionInterval![0], hi: p.display.predictionInterval![1] });
    const y = points.encoding.y as { scale: { domain: string[] } };
    expect(y.scale.domain.slice(-2)).toEqual([POOLED_ROW, PREDICTION_ROW]);
    // Sage and slate mean olla and surface everywhere; a trial's effect is neither.
    expect(JSON.stringify(all)).not.toMatch(/#4a7642|#3b5f8a/i);
  });

  it('puts row labels on two lines and shortens the axis title on a narrow screen', () => {
    const all = layers(forestPlotSpec(cohort(), 'waterLogRatio', { units: 'metric', width: 'container', compact: true }));
    const points = all.find((l) => l.mark.type === 'point')!;
    expect((points.encoding.y as { axis: { labelExpr: string } }).axis.labelExpr).toBe("split(datum.label, ' · ')");
    expect((points.encoding.x as { title: string[] }).title[0]).toBe('Water saved by the pots (%)');
  });

  it('shows harvest per plant in pounds for US units', () => {
    const r = cohort();
    const all = layers(forestPlotSpec(r, 'harvestPerPlantDiff', { units: 'us', width: 600 }));
    const rows = all.find((l) => l.mark.type === 'point')!.data.values as { row: string; estimate: number }[];
    const kg = r.effects.harvestPerPlantDiff.forest.find((f) => f.trialId === uuid(4))!.display.estimate;
    // 1 lb = 0.45359237 kg (NIST Handbook 44, Appendix C).
    expect(rows.find((x) => x.row === 'Grower R31 · Sweet pepper')!.estimate).toBeCloseTo(kg / KG_PER_POUND, 12);
  });

  it('cuts an interval that runs past −100 % saved at the edge, with an arrow', () => {
    // Pots that used 1.5× and 4× the surface water in two pairs: a very wide interval below −100 %.
    const r = cohort([block(5, 'A', 150, 100), block(5, 'B', 400, 100)], [trial(5, 'Grower X12', 'lettuce', 6)]);
    const all = layers(forestPlotSpec(r, 'waterLogRatio', { units: 'metric', width: 'container' }));
    const rows = all.find((l) => l.mark.type === 'point')!.data.values as { row: string; lo: number; loClipped: boolean }[];
    const wide = rows.find((x) => x.row === 'Grower X12 · Lettuce')!;
    expect(wide.loClipped).toBe(true);
    expect(wide.lo).toBe(-100);
    expect(all.find((l) => l.mark.type === 'text')!.data.values).toContainEqual({ row: 'Grower X12 · Lettuce', at: -100, arrow: '←' });
  });

  it('has nothing to draw without a trial', () => {
    const r = analyseCohort({
      cohortId: uuid(99),
      asOf: '2026-10-01',
      trials: [],
      blocks: [],
      water: [],
      progress: [],
      options: { method: 'DL', confidence: 0.95, includeSinglePairs: false, excludeFlagged: false },
    });
    expect(forestPlotSpec(r, 'waterLogRatio', { units: 'metric', width: 'container' })).toBeNull();
    expect(cohortProgressSpec(r, { units: 'metric', width: 'container' })).toBeNull();
    expect(cohortCharts(r, { units: 'metric', width: 600 })).toEqual([]);
  });
});

describe('cohortProgressSpec', () => {
  it('plots cumulative depth per treatment in the treatment colours, in inches for US units', () => {
    const r = cohort();
    const spec = cohortProgressSpec(r, { units: 'us', width: 600 })!;
    const line = (spec.layer as Layer[])[0]!;
    const color = line.encoding.color as { scale: { domain: string[]; range: string[] } };
    expect(color.scale).toEqual({ domain: ['olla', 'surface'], range: ['#4a7642', '#3b5f8a'] });
    const lastOlla = line.data.values.filter((v) => v.treatment === 'olla').at(-1)!;
    // 84 L over the olla beds' 16 m² (4 trials × 2 pairs × 2 m²) = 5.25 mm; 1 in = 25.4 mm (NIST Handbook 44, Appendix C).
    expect(lastOlla.value).toBeCloseTo(84 / 16 / MM_PER_INCH, 12);
  });

  it('labels weeks by their Monday, in order', () => {
    const spec = cohortProgressSpec(cohort(), { units: 'metric', width: 600 })!;
    const x = (spec.layer as Layer[])[0]!.encoding.x as { sort: string[] };
    expect(x.sort).toEqual(['1 Jun', '8 Jun']);
  });

  it('lists the forest plots of every measure with data and the season chart for the report bundle', () => {
    expect(cohortCharts(cohort(), { units: 'metric', width: 600 }).map((c) => c.id)).toEqual([
      'forest-water-saved',
      'forest-water-use-efficiency',
      'forest-harvest-per-plant',
      'cohort-water-progress',
    ]);
  });
});

describe('every cohort chart', () => {
  it('compiles with Vega-Lite without a warning, wide and narrow', () => {
    const r = cohort([block(5, 'A', 150, 100), block(5, 'B', 400, 100)], [trial(5, 'Grower X12', 'lettuce', 6)]);
    const warnings: unknown[] = [];
    const logger = {
      level: () => logger,
      error: (...a: unknown[]) => (warnings.push(a), logger),
      warn: (...a: unknown[]) => (warnings.push(a), logger),
      info: () => logger,
      debug: () => logger,
    };
    const specs = [
      ...cohortCharts(r, { units: 'metric', width: 600 }).map((c) => c.spec),
      forestPlotSpec(r, 'waterLogRatio', { units: 'us', width: 'container', compact: true })!,
    ];
    for (const spec of specs) compile(spec as unknown as TopLevelSpec, { logger });
    expect(warnings).toEqual([]);
  });
});

describe('cohort charts in Spanish', () => {
  // Same results, two languages: every number in the spec is identical, only the words change.
  const numbersOf = (spec: unknown) => JSON.stringify(spec).match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g);
  const en = translator('en');
  const es = translator('es');

  it('translates titles, rows and legends and keeps every number', () => {
    const r = cohort();
    const specEn = forestPlotSpec(r, 'waterLogRatio', { units: 'metric', width: 600, t: en })!;
    const specEs = forestPlotSpec(r, 'waterLogRatio', { units: 'metric', width: 600, t: es })!;
    expect(numbersOf(specEs)).toEqual(numbersOf(specEn));
    const y = layers(specEs).find((l) => l.mark.type === 'point')!.encoding.y as { scale: { domain: string[] } };
    expect(y.scale.domain.slice(-2)).toEqual(['Estimación conjunta', 'Intervalo de predicción']);
    // Stored pseudonyms are "Grower R31" (stable in CSVs); a Spanish reader sees "Cultivador R31".
    expect(y.scale.domain[0]).toMatch(/^Cultivador \w+ · (Tomate|Calabaza \/ calabacín|Pimiento)/);
    expect((layers(specEs).find((l) => l.mark.type === 'point')!.encoding.x as { title: string[] }).title).toEqual([
      'Agua ahorrada por las ollas, % del riego en superficie',
      '← las ollas usaron más · las ollas usaron menos →',
    ]);
    expect(JSON.stringify(specEs)).not.toMatch(/Pooled estimate|quality flag|Weight/);
    expect(cohortCharts(r, { units: 'metric', width: 600, t: es }).map((c) => c.title)).toEqual([
      'Agua ahorrada en cada ensayo y en conjunto',
      'Cambio en la eficiencia en el uso del agua (EUA) en cada ensayo y en conjunto',
      'Diferencia de cosecha por planta en cada ensayo y en conjunto',
      'Agua aplicada durante la temporada, todos los huertos',
    ]);
  });

  it('labels weeks with Spanish month abbreviations and translated treatment names, same values', () => {
    const r = cohort();
    const specEn = cohortProgressSpec(r, { units: 'metric', width: 600, t: en })!;
    const specEs = cohortProgressSpec(r, { units: 'metric', width: 600, t: es })!;
    expect(numbersOf(specEs)).toEqual(numbersOf(specEn));
    const line = (specEs.layer as Layer[])[0]!;
    expect((line.data.values as { weekLabel: string }[]).map((v) => v.weekLabel)).toContain('1 jun');
    expect((line.data.values as { treatmentName: string }[]).some((v) => v.treatmentName === 'superficie')).toBe(true);
    expect(weekLabel('2026-12-28', es)).toBe('28 dic');
    expect(weekLabel('2026-12-28')).toBe('28 Dec');
  });

  it('compiles in Spanish with Vega-Lite without a warning', () => {
    const warnings: unknown[] = [];
    const logger = {
      level: () => logger,
      error: (...a: unknown[]) => (warnings.push(a), logger),
      warn: (...a: unknown[]) => (warnings.push(a), logger),
      info: () => logger,
      debug: () => logger,
    };
    const specs = [
      ...cohortCharts(cohort(), { units: 'metric', width: 600, t: es }).map((c) => c.spec),
      forestPlotSpec(cohort(), 'waterLogRatio', { units: 'us', width: 'container', compact: true, t: es })!,
    ];
    for (const spec of specs) compile(spec as unknown as TopLevelSpec, { logger });
    expect(warnings).toEqual([]);
  });
});
