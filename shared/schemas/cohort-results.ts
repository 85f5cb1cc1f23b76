import { z } from 'zod';

/**
 * Pooled cohort results: `GET /api/cohorts/:cohortId/results` and the lead's exclusions.
 * Every person appears by their cohort pseudonym only; locations are whole degrees.
 */

/** Query-string booleans: only the words "true" and "false" (z.coerce.boolean would read "false" as true). */
const queryFlag = z.enum(['true', 'false'], 'Use true or false.').transform((v) => v === 'true');

export const cohortResultsQuerySchema = z.object({
  /** τ² estimator: DerSimonian-Laird (default) or REML. */
  method: z.enum(['DL', 'REML'], 'Use DL or REML.').default('DL'),
  /** Confidence level of every interval. */
  confidence: z.coerce.number().min(0.5, 'Confidence is between 0.5 and 0.999.').max(0.999, 'Confidence is between 0.5 and 0.999.').default(0.95),
  /** Let single-pair trials contribute through their season totals, with an imputed variance. */
  includeSinglePairs: queryFlag.default(false),
  /** Leave trials with quality flags out of the main pooled estimate (the sensitivity block shows both). */
  excludeFlagged: queryFlag.default(false),
});
export type CohortResultsQuery = z.infer<typeof cohortResultsQuerySchema>;

export const createExclusionInputSchema = z.object({
  trialId: z.uuid('Not a valid trial id.'),
  reason: z.string().trim().min(3, 'Say why the trial is left out (at least 3 characters); the cohort sees the reason.').max(500),
});
export type CreateExclusionInput = z.infer<typeof createExclusionInputSchema>;

export const exclusionParamsSchema = z.object({ cohortId: z.uuid(), trialId: z.uuid('Not a valid trial id.') });

/** The three per-trial effects: olla against surface watering, from the trial's own pairs. */
export const effectKeys = ['waterLogRatio', 'wueLogRatio', 'harvestPerPlantDiff'] as const;
export const effectKeySchema = z.enum(effectKeys);
export type EffectKey = z.infer<typeof effectKeySchema>;

/** Trial features the pooled water saving may depend on (subgroup analyses). */
export const moderatorKeys = ['potCapacity', 'potShape', 'clayBody', 'potMake', 'crop', 'soilTexture', 'setting', 'mulch', 'lid'] as const;
export const moderatorKeySchema = z.enum(moderatorKeys);
export type ModeratorKey = z.infer<typeof moderatorKeySchema>;

const interval = z.tuple([z.number(), z.number()]);

/**
 * Stable codes for the sentences the analysis makes, so a reader sees them in their own language
 * (the client words them in `cohortResults`, the report bundle in shared/locales/<lang>/report.json).
 * The English text fields beside them stay for API consumers.
 */
export const trialEffectNoteCodes = [
  'no_complete_pair',
  'single_pair',
  'same_value',
  'single_pair_imputed',
  'excluded',
  'flagged_left_out',
  'single_pair_opt_in',
  'single_pair_no_donor',
] as const;
export type TrialEffectNoteCode = (typeof trialEffectNoteCodes)[number];
export const subgroupNoteCodes = ['no_trials', 'one_level'] as const;
export const cohortNoteCodes = ['pseudonyms', 'per_trial', 'pooling', 'flags', 'progress'] as const;
export type CohortNoteCode = (typeof cohortNoteCodes)[number];

export const qualityFlagSchema = z.object({
  kind: z.enum(['out-of-line', 'wrong-unit', 'mixed-moisture-methods', 'closed-without-harvest']),
  /** English sentence for API consumers; readers get their own words from the fields below. */
  message: z.string(),
  /** mixed-moisture-methods: the soil-moisture method codes logged (empty otherwise). */
  methods: z.array(z.string()),
  /** out-of-line: which effect, and the modified z-score (null when the cohort's MAD is 0, i.e. infinite). */
  effect: effectKeySchema.nullable(),
  robustZ: z.number().nullable(),
  /** wrong-unit: the weeks whose litres per event look like a gallon/litre mix-up, per kind of water event. */
  weeks: z.array(
    z.object({
      series: z.enum(['olla_refill', 'surface']),
      weekStart: z.string(),
      litresPerEvent: z.number(),
      ratioToMedian: z.number(),
      suggestedLitresPerEvent: z.number(),
      kind: z.enum(['looks-like-gallons-converted-twice', 'looks-like-gallons-typed-as-litres']),
    }),
  ),
});
export type QualityFlag = z.infer<typeof qualityFlagSchema>;

export const trialEffectSchema = z.object({
  /** Complete pairs with this measurement. */
  pairs: z.number(),
  /** Mean of the per-pair values (pairs ≥ 2), or the season-totals value (one pair); null when not computable. */
  estimate: z.number().nullable(),
  /** Sampling variance used for pooling: var/n from the pairs, or the imputed single-pair variance. */
  variance: z.number().nullable(),
  /** Sample variance of one pair's value (s²), the basis of the single-pair rule. */
  perPairVariance: z.number().nullable(),
  source: z.enum(['pairs', 'season-totals']).nullable(),
  /** True when the trial is in this effect's main pooled estimate. */
  pooled: z.boolean(),
  /** Why it is not pooled, when it is not (English, for API consumers). */
  note: z.string().nullable(),
  /** The same note as a stable code. */
  noteCode: z.enum(trialEffectNoteCodes).nullable(),
});
export type TrialEffect = z.infer<typeof trialEffectSchema>;

export const exclusionSchema = z.object({
  trialId: z.uuid(),
  pseudonym: z.string(),
  reason: z.string(),
  createdAt: z.string(),
  /** True when the caller recorded it (the lead's identity is never shown). */
  excludedByMe: z.boolean(),
});
export type Exclusion = z.infer<typeof exclusionSchema>;

export const cohortTrialRowSchema = z.object({
  trialId: z.uuid(),
  pseudonym: z.string(),
  /** The caller's own trial. */
  mine: z.boolean(),
  crop: z.string(),
  status: z.string(),
  plantingDate: z.string(),
  endDate: z.string().nullable(),
  /** Garden location rounded to whole degrees (about 110 km). */
  region: z.object({ latitudeDeg: z.number(), longitudeDeg: z.number(), label: z.string() }),
  soilTexture: z.string(),
  /** Distinct capacities of the pots in the trial's olla plots, litres. */
  potCapacitiesL: z.array(z.number()),
  potCount: z.number(),
  moderators: z.record(moderatorKeySchema, z.string()),
  /** Blocks holding both an olla and a surface plot. */
  pairs: z.number(),
  completeness: z.object({
    /** Planting date to the end date or today, inclusive. */
    expectedDays: z.number(),
    /** Of those, days with at least one refill or watering record. */
    daysWithWater: z.number(),
    share: z.number().nullable(),
    harvestRecords: z.number(),
    /** Pairs where a plot has no harvest record. */
    pairsMissingHarvest: z.number(),
  }),
  flags: z.array(qualityFlagSchema),
  exclusion: exclusionSchema.omit({ trialId: true, pseudonym: true }).nullable(),
  effects: z.record(effectKeySchema, trialEffectSchema),
});
export type CohortTrialRow = z.infer<typeof cohortTrialRowSchema>;

/** An estimate on the effect's own scale with its reader-facing form (saving %, WUE change %, kg per plant). */
const displaySchema = z.object({ estimate: z.number(), ci: interval, predictionInterval: interval.nullable() });

export const pooledEstimateSchema = z.object({
  k: z.number(),
  method: z.enum(['DL', 'REML']),
  estimate: z.number(),
  se: z.number(),
  ci: interval,
  pValue: z.number(),
  tau2: z.number(),
  q: z.number(),
  df: z.number(),
  pQ: z.number().nullable(),
  /** Percent. */
  i2: z.number(),
  /** Null when k < 3 (t on k − 2 df does not exist). */
  predictionInterval: interval.nullable(),
  converged: z.boolean(),
  display: displaySchema,
});
export type PooledEstimate = z.infer<typeof pooledEstimateSchema>;

/**
 * One pooled trial of the forest plot: what pooling adds to the trial's own effect. The rest is in
 * the trial's row (`trials[]`, same `trialId`), not repeated here: its pseudonym, `effects[effect]`
 * (estimate and variance on the effect's own scale — the variance used for pooling, imputed for a
 * single-pair trial —, pairs, source) and its flags (`flagged` = at least one flag).
 * `forestTrials()` (shared/charts/cohort-charts.ts) joins the two.
 */
export const forestRowSchema = z.object({
  trialId: z.uuid(),
  /** Random-effects weight, percent (null when nothing could be pooled). */
  weightPercent: z.number().nullable(),
  /** The trial's estimate and its confidence interval (estimate ± z·√variance) on the reader-facing scale. */
  display: displaySchema.omit({ predictionInterval: true }),
});
export type ForestRow = z.infer<typeof forestRowSchema>;

export const subgroupLevelSchema = z.object({
  level: z.string(),
  k: z.number(),
  estimate: z.number(),
  se: z.number(),
  ci: interval,
  tau2: z.number(),
  display: displaySchema.omit({ predictionInterval: true }),
  /** Fewer than 3 trials. */
  smallSample: z.boolean(),
});

export const subgroupAnalysisSchema = z.object({
  moderator: moderatorKeySchema,
  levels: z.array(subgroupLevelSchema),
  /** Q between subgroups (chi-square, df = levels − 1); levels named "unknown" are left out of the test. */
  test: z.object({ q: z.number(), df: z.number(), pValue: z.number().nullable(), levels: z.array(z.string()) }).nullable(),
  warning: z.string().nullable(),
  note: z.string().nullable(),
  /** `note` as a stable code: no trials at all, or fewer than 2 known levels. */
  noteCode: z.enum(subgroupNoteCodes).nullable(),
});
export type SubgroupAnalysis = z.infer<typeof subgroupAnalysisSchema>;

/** The pooled estimate without one trial (its pseudonym and crop are in the trial's row, `trials[]`, same id). */
export const leaveOneOutRowSchema = z.object({
  omittedTrialId: z.uuid(),
  /** On the effect's own scale. */
  estimate: z.number(),
  tau2: z.number(),
  /** Percent. */
  i2: z.number(),
  /** The estimate and its confidence interval on the reader-facing scale. */
  display: displaySchema.omit({ predictionInterval: true }),
});
export type LeaveOneOutRow = z.infer<typeof leaveOneOutRowSchema>;

export const effectResultSchema = z.object({
  effect: effectKeySchema,
  label: z.string(),
  scale: z.enum(['log-ratio', 'difference']),
  /** How `display` values read, e.g. "Water saved, % of surface watering". */
  displayLabel: z.string(),
  k: z.number(),
  pooled: pooledEstimateSchema.nullable(),
  /** Why there is no pooled estimate (English, for API consumers). */
  reason: z.string().nullable(),
  /** The same as a stable code: fewer than 2 trials carry the effect (`k` says how many). */
  reasonCode: z.enum(['too_few_trials']).nullable(),
  forest: z.array(forestRowSchema),
  subgroups: z.array(subgroupAnalysisSchema),
  sensitivity: z.object({
    leaveOneOut: z.array(leaveOneOutRowSchema),
    leaveOneOutNote: z.string().nullable(),
    /** `leaveOneOutNote` as a stable code (needs k ≥ 3). */
    leaveOneOutNoteCode: z.enum(['too_few_trials']).nullable(),
    /** Every eligible, non-excluded trial, flagged or not. */
    withFlagged: pooledEstimateSchema.nullable(),
    withoutFlagged: pooledEstimateSchema.nullable(),
    flaggedTrials: z.number(),
  }),
  singlePairs: z.object({
    /** Trials with exactly one complete pair for this effect. */
    eligible: z.number(),
    included: z.number(),
    imputedVariance: z.number().nullable(),
    rule: z.string(),
  }),
});
export type EffectResult = z.infer<typeof effectResultSchema>;

export const progressRowSchema = z.object({
  weekStart: z.string(),
  isoWeek: z.string(),
  treatment: z.enum(['olla', 'surface']),
  litres: z.number(),
  cumulativeLitres: z.number(),
  /** Cumulative litres over the treatment's total plot area in the trials counted (1 L/m² = 1 mm). */
  cumulativeMm: z.number().nullable(),
  /** Trials with water logged that week. */
  trials: z.number(),
});
export type ProgressRow = z.infer<typeof progressRowSchema>;

export const cohortResultsSchema = z.object({
  cohortId: z.uuid(),
  asOf: z.string(),
  options: z.object({ method: z.enum(['DL', 'REML']), confidence: z.number(), includeSinglePairs: z.boolean(), excludeFlagged: z.boolean() }),
  counts: z.object({ sharedTrials: z.number(), excluded: z.number(), flagged: z.number() }),
  trials: z.array(cohortTrialRowSchema),
  exclusions: z.array(exclusionSchema),
  effects: z.object({ waterLogRatio: effectResultSchema, wueLogRatio: effectResultSchema, harvestPerPlantDiff: effectResultSchema }),
  progress: z.array(progressRowSchema),
  /** How the results were made, in English (API consumers); `noteCodes` are the same notes as codes, in order. */
  notes: z.array(z.string()),
  noteCodes: z.array(z.enum(cohortNoteCodes)),
});
export type CohortResults = z.infer<typeof cohortResultsSchema>;
