import { z } from 'zod';
import { canonicalTimeZone } from '../time-zone';
import { optionalText, patchSchemaOf } from './common';

/** The 12 USDA soil texture classes (USDA Soil Survey Manual, texture triangle). */
export const soilTextures = [
  'sand',
  'loamy_sand',
  'sandy_loam',
  'loam',
  'silt_loam',
  'silt',
  'sandy_clay_loam',
  'clay_loam',
  'silty_clay_loam',
  'sandy_clay',
  'silty_clay',
  'clay',
] as const;
export const soilTextureSchema = z.enum(soilTextures);
export type SoilTexture = z.infer<typeof soilTextureSchema>;

export const soilTextureLabels: Record<SoilTexture, string> = {
  sand: 'Sand',
  loamy_sand: 'Loamy sand',
  sandy_loam: 'Sandy loam',
  loam: 'Loam',
  silt_loam: 'Silt loam',
  silt: 'Silt',
  sandy_clay_loam: 'Sandy clay loam',
  clay_loam: 'Clay loam',
  silty_clay_loam: 'Silty clay loam',
  sandy_clay: 'Sandy clay',
  silty_clay: 'Silty clay',
  clay: 'Clay',
};

/** Locations are kept to 0.1° (about 11 km): enough for sun and season, not enough to find a garden. */
export function coarsenDegrees(v: number): number {
  // Halves round away from zero, the same north and south, east and west.
  return (Math.sign(v) * Math.round(Math.abs(v) * 10)) / 10 || 0;
}

/**
 * An IANA time-zone name (America/Denver), spelled as Intl spells it. The server also asks
 * PostgreSQL (pg_timezone_names) and refuses a name it does not know with the same reason.
 */
export const timeZoneSchema = z
  .string()
  .trim()
  .min(1)
  .max(64)
  .transform((name, ctx) => {
    const canonical = canonicalTimeZone(name);
    if (canonical === null) {
      ctx.addIssue({ code: 'custom', message: 'Choose a time zone from the list (an IANA name like America/Denver).', params: { reason: 'unknown_time_zone' } });
      return z.NEVER;
    }
    return canonical;
  });

export const gardenInputSchema = z.object({
  name: z.string().trim().min(1, 'Give the garden a name.').max(100),
  latitudeDeg: z.number().min(-90, 'Latitude is between −90 and 90.').max(90, 'Latitude is between −90 and 90.').transform(coarsenDegrees),
  longitudeDeg: z.number().min(-180, 'Longitude is between −180 and 180.').max(180, 'Longitude is between −180 and 180.').transform(coarsenDegrees),
  elevationM: z.number().min(-430, 'Elevation below the Dead Sea shore is not plausible.').max(5000, 'Elevation above 5000 m is not plausible for a garden.'),
  soilTexture: soilTextureSchema,
  /** Coastal sites use kRs 0.19 in FAO-56's radiation estimate; interior 0.16. */
  coastal: z.boolean().default(false),
  notes: optionalText(4000),
  /** The garden's calendar: its days (daily sums, weeks, "today") are days in this zone. */
  timeZone: timeZoneSchema.default('UTC'),
});
export const createGardenInputSchema = gardenInputSchema;
export const updateGardenInputSchema = patchSchemaOf(gardenInputSchema);
export type CreateGardenInput = z.infer<typeof createGardenInputSchema>;
export type UpdateGardenInput = z.infer<typeof updateGardenInputSchema>;

export const gardenSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  elevationM: z.number(),
  soilTexture: soilTextureSchema,
  coastal: z.boolean(),
  notes: z.string(),
  timeZone: z.string(),
  trialCount: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Garden = z.infer<typeof gardenSchema>;
