import { z } from 'zod';
import { isoDateSchema, optionalText, patchSchemaOf } from './common';

/** Crops with FAO-56 Table 12 coefficients (ids match shared/agronomy/crop-coefficients.ts), or another crop. */
export const cropIds = ['tomato', 'sweet-pepper', 'squash-zucchini', 'sweet-melon', 'watermelon', 'lettuce', 'green-beans', 'cucumber', 'other'] as const;
export const cropSchema = z.enum(cropIds);
export type Crop = z.infer<typeof cropSchema>;
export const cropLabels: Record<Crop, string> = {
  tomato: 'Tomato',
  'sweet-pepper': 'Sweet pepper',
  'squash-zucchini': 'Squash / zucchini',
  'sweet-melon': 'Melon',
  watermelon: 'Watermelon',
  lettuce: 'Lettuce',
  'green-beans': 'Green beans',
  cucumber: 'Cucumber',
  other: 'Other crop',
};

export const trialDesignSchema = z.enum(['paired', 'rcbd']);
export type TrialDesign = z.infer<typeof trialDesignSchema>;
export const trialStatusSchema = z.enum(['draft', 'active', 'closed']);
export type TrialStatus = z.infer<typeof trialStatusSchema>;

/** Treatment names: the two standard ones plus any named by the grower. */
export const treatmentNameSchema = z
  .string()
  .trim()
  .min(1)
  .max(40)
  .regex(/^[\p{L}\p{N} _-]+$/u, 'Use letters, digits, spaces, - and _ in treatment names.');
export const OLLA = 'olla';
export const SURFACE = 'surface';

/** Kc overrides per stage (editable from the FAO-56 Table 12 defaults). */
export const kcOverridesSchema = z
  .object({ ini: z.number().min(0.1).max(1.5), mid: z.number().min(0.1).max(1.5), end: z.number().min(0.1).max(1.5) })
  .partial();

const trialBase = z.object({
  title: z.string().trim().min(1, 'Give the trial a title.').max(120),
  crop: cropSchema,
  cropName: optionalText(60),
  variety: optionalText(80),
  plantingDate: isoDateSchema,
  endDate: isoDateSchema.nullable().default(null),
  design: trialDesignSchema.default('paired'),
  /** Treatments compared; paired designs have exactly olla and surface. */
  treatments: z.array(treatmentNameSchema).min(2).max(8).default([OLLA, SURFACE]),
  question: optionalText(2000),
  protocolNotes: optionalText(8000),
  kcOverrides: kcOverridesSchema.default({}),
  /** Soil moisture stress thresholds per method (values below are stress for VWC and probe index, above for tensiometer kPa). */
  stressThresholds: z
    .object({ vwc: z.number().min(0).max(100), tensiometer: z.number().min(0).max(100), probe_index: z.number().min(1).max(10) })
    .partial()
    .default({}),
});

function checkTrial(v: { crop?: Crop; cropName?: string; plantingDate?: string; endDate?: string | null; design?: TrialDesign; treatments?: string[] }, ctx: z.RefinementCtx) {
  if (v.crop === 'other' && !v.cropName) ctx.addIssue({ code: 'custom', path: ['cropName'], message: 'Name the crop.' });
  if (v.plantingDate && v.endDate && v.endDate < v.plantingDate) ctx.addIssue({ code: 'custom', path: ['endDate'], message: 'The end date is before the planting date.' });
  if (v.treatments) {
    const lower = v.treatments.map((t) => t.toLowerCase());
    if (new Set(lower).size !== lower.length) ctx.addIssue({ code: 'custom', path: ['treatments'], message: 'Treatment names must differ.' });
    if (v.design === 'paired' && (lower.length !== 2 || !lower.includes(OLLA) || !lower.includes(SURFACE))) {
      ctx.addIssue({ code: 'custom', path: ['treatments'], message: 'A paired trial compares exactly "olla" and "surface".' });
    }
  }
}

export const createTrialInputSchema = trialBase.superRefine(checkTrial);
export type CreateTrialInput = z.infer<typeof createTrialInputSchema>;
export const updateTrialInputSchema = patchSchemaOf(trialBase)
  .extend({ endDate: isoDateSchema.nullable().optional() })
  .superRefine(checkTrial);
export type UpdateTrialInput = z.infer<typeof updateTrialInputSchema>;

export const trialStatusInputSchema = z.object({ status: trialStatusSchema });

export const trialSchema = z.object({
  id: z.uuid(),
  gardenId: z.uuid(),
  gardenName: z.string(),
  /** The garden's IANA time zone: the trial's days are days there. */
  timeZone: z.string(),
  title: z.string(),
  crop: cropSchema,
  cropName: z.string(),
  variety: z.string(),
  plantingDate: z.string(),
  endDate: z.string().nullable(),
  design: trialDesignSchema,
  treatments: z.array(z.string()),
  question: z.string(),
  protocolNotes: z.string(),
  kcOverrides: kcOverridesSchema,
  stressThresholds: z.record(z.string(), z.number()),
  status: trialStatusSchema,
  randomisationSeed: z.string().nullable(),
  /** 'owner' sees everything; 'reader' is a cohort member reading a shared trial. */
  access: z.enum(['owner', 'reader']),
  plotCount: z.number(),
  lastLoggedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Trial = z.infer<typeof trialSchema>;

/** Randomised assignment of treatments within each pair or block. */
export const randomiseInputSchema = z.object({ seed: z.string().trim().min(1).max(64).optional() });

export const shareTrialInputSchema = z.object({ cohortId: z.uuid() });
