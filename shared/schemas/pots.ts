import { z } from 'zod';
import { CONE_IDS } from '../agronomy/pyrometric-cones';
import { isoDateSchema, optionalText, patchSchemaOf } from './common';

export const potShapeSchema = z.enum(['globe', 'bottle', 'cylinder', 'twin_pot']);
export type PotShape = z.infer<typeof potShapeSchema>;
export const potMakeSchema = z.enum(['wheel_thrown', 'coil_built', 'slip_cast', 'joined_terracotta']);
export type PotMake = z.infer<typeof potMakeSchema>;
export const potConditionSchema = z.enum(['sound', 'cracked', 'clogged', 'retired']);
export type PotCondition = z.infer<typeof potConditionSchema>;
export const clayBodySchema = z.enum(['earthenware', 'terracotta', 'stoneware', 'mixed', 'unknown']);
export type ClayBody = z.infer<typeof clayBodySchema>;

export const potShapeLabels: Record<PotShape, string> = { globe: 'Globe', bottle: 'Bottle', cylinder: 'Cylinder', twin_pot: 'Twin pot' };
export const potMakeLabels: Record<PotMake, string> = {
  wheel_thrown: 'Wheel-thrown',
  coil_built: 'Coil-built',
  slip_cast: 'Slip-cast',
  joined_terracotta: 'Two terracotta pots joined',
};

const potBase = z.object({
  label: z.string().trim().min(1, 'Give the pot a label.').max(40),
  capacityL: z.number().positive('Capacity must be more than zero.').max(200, 'Pots over 200 L are not garden ollas.'),
  heightCm: z.number().positive().max(200).nullable().default(null),
  widestDiameterCm: z.number().positive('Diameter must be more than zero.').max(150),
  neckDiameterCm: z.number().positive().max(100).nullable().default(null),
  shape: potShapeSchema,
  clayBody: clayBodySchema.default('unknown'),
  make: potMakeSchema,
  /** Pyrometric cone the pot was fired to, when known. */
  firingCone: z.enum(CONE_IDS).nullable().default(null),
  installedOn: isoDateSchema.nullable().default(null),
  plotId: z.uuid().nullable().default(null),
  condition: potConditionSchema.default('sound'),
  notes: optionalText(2000),
});
export const createPotInputSchema = potBase.refine((p) => p.neckDiameterCm === null || p.neckDiameterCm <= p.widestDiameterCm, {
  path: ['neckDiameterCm'],
  message: 'The neck cannot be wider than the widest part of the pot.',
});
export const updatePotInputSchema = patchSchemaOf(potBase);
export type CreatePotInput = z.infer<typeof createPotInputSchema>;
export type UpdatePotInput = z.infer<typeof updatePotInputSchema>;

export const seepSettingSchema = z.enum(['air', 'saturated_sand', 'in_bed']);
export type SeepSetting = z.infer<typeof seepSettingSchema>;
export const seepSettingLabels: Record<SeepSetting, string> = { air: 'In air', saturated_sand: 'In saturated sand', in_bed: 'In the bed' };

export const createSeepTestInputSchema = z.object({
  testedOn: isoDateSchema,
  setting: seepSettingSchema,
  litresLost: z.number().min(0, 'Litres lost cannot be negative.').max(200),
  hours: z.number().positive('The test must last some time.').max(24 * 14, 'Seep tests longer than two weeks are not plausible.'),
  notes: optionalText(1000),
});
export type CreateSeepTestInput = z.infer<typeof createSeepTestInputSchema>;

export const seepTestSchema = createSeepTestInputSchema.extend({ id: z.uuid(), potId: z.uuid(), litresPerDay: z.number(), createdAt: z.string() });
export type SeepTest = z.infer<typeof seepTestSchema>;

export const potSchema = potBase.extend({
  id: z.uuid(),
  plotLabel: z.string().nullable(),
  trialId: z.uuid().nullable(),
  latestSeepLitresPerDay: z.number().nullable(),
  seepTests: z.array(seepTestSchema),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Pot = z.infer<typeof potSchema>;
