import { z } from 'zod';
import { patchSchemaOf } from './common';
import { treatmentNameSchema } from './trials';

export const plotSettingSchema = z.enum(['in_ground', 'raised_bed', 'container']);
export type PlotSetting = z.infer<typeof plotSettingSchema>;

const plotBase = z.object({
  label: z.string().trim().min(1, 'Give the plot a label.').max(40),
  /** Null until assigned (by hand or by the randomiser). */
  treatment: treatmentNameSchema.nullable().default(null),
  /** The pair (paired design) or block (RCBD) the plot belongs to. */
  blockKey: z.string().trim().min(1, 'Say which pair or block the plot is in.').max(40),
  areaM2: z.number().positive('Area must be more than zero.').max(10000, 'Plots over 1 ha are not garden plots.'),
  setting: plotSettingSchema.default('in_ground'),
  mulch: z.boolean().default(false),
  lid: z.boolean().default(true),
  plantCount: z.number().int().min(0).max(100000).default(1),
});
export const createPlotInputSchema = plotBase;
export const updatePlotInputSchema = patchSchemaOf(plotBase);
export type CreatePlotInput = z.infer<typeof createPlotInputSchema>;
export type UpdatePlotInput = z.infer<typeof updatePlotInputSchema>;

export const plotSchema = plotBase.extend({ id: z.uuid(), trialId: z.uuid(), potIds: z.array(z.uuid()), createdAt: z.string() });
export type Plot = z.infer<typeof plotSchema>;
