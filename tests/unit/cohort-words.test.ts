/**
 * The cohort results' codes worded in the reader's language (shared/analysis/cohort-words.ts) and
 * the cohort report bundle's methods text in English and Spanish (shared/report/cohort-report.ts).
 * The pooling sends codes next to its English sentences; the same numbers come out in both
 * languages, only the words and the decimal mark change (CLDR "es": decimal comma).
 * 1 US gallon = 3.785411784 L (NIST Handbook 44, Appendix C).
 */
import { describe, expect, it } from 'vitest';
import { analyseCohort, type BlockAggregate, type CohortTrialAggregate } from '@shared/analysis/cohort-effects';
import { cohortNotes, flagSentence, moderatorLevelLabel, noPooledReason, potCapacityLevelLabel, trialEffectNote } from '@shared/analysis/cohort-words';
import { pseudonymLabel } from '@shared/charts/cohort-charts';
import { translator } from '@shared/i18n/translate';
import { cohortReportMarkdown } from '@shared/report/cohort-report';
import type { CohortResults } from '@shared/schemas/cohort-results';

const en = translator('en');
const es = translator('es');
const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

function trial(n: number, pseudonym: string, extra: Partial<CohortTrialAggregate> = {}): CohortTrialAggregate {
  return {
    trialId: uuid(n),
    pseudonym,
    mine: false,
    crop: 'tomato',
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
    meanPotCapacityL: 8,
    potCapacitiesL: [8],
    potShapes: ['globe'],
    clayBodies: ['terracotta'],
    potMakes: ['wheel_thrown'],
    exclusion: null,
    ...extra,
  };
}

function block(n: number, key: string, ollaL: number, surfaceL: number): BlockAggregate {
  return {
    trialId: uuid(n),
    blockKey: key,
    ollaPlots: 1,
    ollaAreaM2: 2,
    ollaPlants: 3,
    ollaL,
    ollaHarvestKg: 2.2,
    ollaPlotsWithoutHarvest: 0,
    surfacePlots: 1,
    surfaceAreaM2: 2,
    surfacePlants: 3,
    surfaceL,
    surfaceHarvestKg: 2,
    surfacePlotsWithoutHarvest: 0,
  };
}

function results(trials: CohortTrialAggregate[], blocks: BlockAggregate[]): CohortResults {
  return analyseCohort({
    cohortId: uuid(99),
    asOf: '2026-10-01',
    trials,
    blocks,
    water: [],
    progress: [],
    options: { method: 'DL', confidence: 0.95, includeSinglePairs: false, excludeFlagged: false },
  });
}

const cohort = () =>
  results(
    [trial(1, 'Grower K7', { moistureMethods: ['vwc', 'probe_index'] }), trial(2, 'Grower B12'), trial(3, 'Grower R31'), trial(4, 'Grower T44')],
    [block(1, 'A', 60, 100), block(1, 'B', 64, 100), block(2, 'A', 50, 100), block(2, 'B', 58, 100), block(3, 'A', 70, 100), block(3, 'B', 66, 100), block(4, 'A', 40, 100)],
  );

describe('cohort codes in words', () => {
  it('sends a code beside every English note, and words it in Spanish', () => {
    const r = cohort();
    // Trial 4 has one pair: left out unless single pairs are switched on.
    const single = r.trials.find((t) => t.trialId === uuid(4))!.effects.waterLogRatio;
    expect(single).toMatchObject({ pooled: false, noteCode: 'single_pair_opt_in', note: 'A single pair: included only with includeSinglePairs=true.' });
    expect(trialEffectNote(single.noteCode, es)).toBe('Un solo par: solo entra si se incluyen los ensayos de un solo par.');
    expect(r.noteCodes).toEqual(['pseudonyms', 'per_trial', 'pooling', 'flags', 'progress']);
    expect(cohortNotes(r, en)).toEqual(r.notes);
    const notesEs = cohortNotes(r, es);
    expect(notesEs[2]).toBe('Combinado con efectos aleatorios (τ² de DerSimonian-Laird, intervalos de tipo Wald); el intervalo de predicción usa t con k − 2 gl.');
    for (const [i, n] of notesEs.entries()) expect(n).not.toBe(r.notes[i]);
  });

  it('says why there is no pooled estimate, from the code and k', () => {
    const r = results([trial(1, 'Grower K7')], [block(1, 'A', 60, 100), block(1, 'B', 64, 100)]);
    const e = r.effects.waterLogRatio;
    expect(e.pooled).toBeNull();
    expect(e.reasonCode).toBe('too_few_trials');
    expect(noPooledReason(e, en)).toBe(e.reason);
    expect(noPooledReason(e, es)).toBe('Para combinar hacen falta al menos 2 ensayos con este efecto (hay 1).');
    expect(e.sensitivity.leaveOneOutNoteCode).toBe('too_few_trials');
    expect(e.subgroups.every((s) => s.noteCode === 'one_level')).toBe(true);
  });

  it('names the moisture methods of a mixed-methods flag, not their codes', () => {
    const flag = cohort().trials[0]!.flags.find((f) => f.kind === 'mixed-moisture-methods')!;
    expect(flag.methods).toEqual(['vwc', 'probe_index']);
    expect(flagSentence(flag, es)).toBe(
      'La humedad del suelo se midió con 2 métodos (Contenido volumétrico de agua (%), Sonda de mano (1–10)); sus escalas no se pueden comparar ni promediar.',
    );
    expect(flagSentence(flag, es)).not.toContain('probe_index');
  });

  it('reads pot capacity classes in words and in the reader’s units', () => {
    expect(potCapacityLevelLabel('<6 L', es)).toBe('Menos de 6\u00a0L');
    expect(potCapacityLevelLabel('6–10 L', en)).toBe('6\u00a0L to 10\u00a0L');
    // 6 L / 3.785411784 L per gal = 1.585 gal → "1.6 gal"; 10 L = 2.642 gal → "2,6 gal" in Spanish.
    expect(potCapacityLevelLabel('<6 L', en, 'us')).toBe('Under 1.6\u00a0gal');
    expect(potCapacityLevelLabel('>10 L', es, 'us')).toBe('Más de 2,6\u00a0gal');
    expect(moderatorLevelLabel('soilTexture', 'silt_loam', es)).toBe('Franco limoso');
    expect(moderatorLevelLabel('lid', 'no lid', es)).toBe('Abierta, sin tapa');
  });

  it('shows a stored pseudonym in the reader’s language and leaves anything else alone', () => {
    expect(pseudonymLabel('Grower K7', es)).toBe('Cultivador K7');
    expect(pseudonymLabel('Grower K7', en)).toBe('Grower K7');
    expect(pseudonymLabel('Observer Q3', es)).toBe('Observador Q3');
    expect(pseudonymLabel('Someone else', es)).toBe('Someone else');
  });
});

describe('cohort report in both languages', () => {
  const input = (t = en) => ({ cohortName: 'Mesa Verde gardens', licence: 'CC-BY-4.0', results: cohort(), generatedOn: '2026-10-02', files: ['data/trials.csv'], t });

  it('writes the Spanish methods text with Spanish words and the same numbers', () => {
    const mdEn = cohortReportMarkdown(input(en));
    const mdEs = cohortReportMarkdown(input(es));
    expect(mdEs).toContain('# Mesa Verde gardens: métodos y resultados');
    expect(mdEs).toContain('## Métodos');
    expect(mdEs).toContain('### Logaritmo de la razón del agua usada, olla / superficie (lámina por par)');
    expect(mdEs).toContain('- Cultivador K7: La humedad del suelo se midió con 2 métodos');
    expect(mdEs).toContain('Licencia: Creative Commons Atribución 4.0 Internacional (CC BY 4.0).');
    for (const english of ['## Methods', '## Caveats', 'No pooled estimate', 'Pooled by random effects', '- Grower K7', 'Soil moisture was read']) {
      expect(mdEs).not.toContain(english);
    }
    // Same pooled figures: the English line's numbers with decimal commas.
    const pooled = (md: string) => md.split('\n').find((l) => l.includes('k = '))!;
    const nums = (line: string, decimal: string) => (line.match(/−?\d+(?:[.,]\d+)?/g) ?? []).map((s) => Number(s.replace('−', '-').replace(decimal, '.')));
    expect(nums(pooled(mdEs), ',')).toEqual(nums(pooled(mdEn), '.'));
    expect(pooled(mdEn)).toMatch(/^Water saved by the pots, % of surface watering: \d+\.\d \(95% CI /);
  });

  it('keeps the English report as before for an English reader', () => {
    const md = cohortReportMarkdown(input(en));
    expect(md).toContain('## Methods');
    expect(md).toContain('- Grower K7: Soil moisture was read with 2 methods (Volumetric water content (%), Handheld probe (1–10))');
    expect(md).toContain('Licence: Creative Commons Attribution 4.0 International (CC BY 4.0).');
  });
});
