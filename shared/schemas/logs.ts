import { z } from 'zod';
import { idempotencyKeySchema, isoDateSchema, isoDateTimeSchema, optionalText, paginationQuerySchema } from './common';

export const waterKindSchema = z.enum(['olla_refill', 'surface']);
export type WaterKind = z.infer<typeof waterKindSchema>;
export const waterSourceSchema = z.enum(['mains', 'rainwater', 'greywater', 'well', 'other']);
export type WaterSource = z.infer<typeof waterSourceSchema>;

/** Upper limits that catch slips of the finger (a pot refill of 2,000 L) without refusing real data. */
export const MAX_REFILL_L = 200;
export const MAX_SURFACE_L = 5000;

export const waterEventInputSchema = z
  .object({
    plotId: z.uuid(),
    occurredAt: isoDateTimeSchema,
    kind: waterKindSchema,
    volumeL: z.number().positive('Volume must be more than zero.'),
    source: waterSourceSchema.default('mains'),
    fertiliser: z.boolean().default(false),
    potId: z.uuid().nullable().default(null),
    notes: optionalText(500),
    idempotencyKey: idempotencyKeySchema.optional(),
  })
  .superRefine((v, ctx) => {
    const max = v.kind === 'olla_refill' ? MAX_REFILL_L : MAX_SURFACE_L;
    if (v.volumeL > max) ctx.addIssue({ code: 'custom', path: ['volumeL'], message: `${v.volumeL} L is more than a ${v.kind === 'olla_refill' ? 'pot refill' : 'watering'} can be (at most ${max} L). Check the unit.` });
  });
export type WaterEventInput = z.infer<typeof waterEventInputSchema>;

/** Soil moisture methods, each on its own scale; never mixed. */
export const moistureMethodSchema = z.enum(['vwc', 'tensiometer', 'probe_index']);
export type MoistureMethod = z.infer<typeof moistureMethodSchema>;
export const moistureRanges: Record<MoistureMethod, { min: number; max: number; unit: string; label: string }> = {
  vwc: { min: 0, max: 100, unit: '%', label: 'Volumetric water content' },
  // Tensiometers read up to about 85 kPa before the water column breaks (common practice, no source); 100 allows for gauge range.
  tensiometer: { min: 0, max: 100, unit: 'kPa', label: 'Tensiometer' },
  probe_index: { min: 1, max: 10, unit: 'index', label: 'Handheld probe (1–10)' },
};

export const moistureReadingInputSchema = z
  .object({
    plotId: z.uuid(),
    takenAt: isoDateTimeSchema,
    method: moistureMethodSchema,
    depthCm: z.number().min(0).max(200, 'Deeper than 2 m is beyond a garden probe.'),
    value: z.number(),
    idempotencyKey: idempotencyKeySchema.optional(),
  })
  .superRefine((v, ctx) => {
    const r = moistureRanges[v.method];
    if (v.value < r.min || v.value > r.max) ctx.addIssue({ code: 'custom', path: ['value'], message: `${r.label} readings are between ${r.min} and ${r.max} ${r.unit}.` });
  });
export type MoistureReadingInput = z.infer<typeof moistureReadingInputSchema>;

export const harvestInputSchema = z
  .object({
    plotId: z.uuid(),
    harvestedOn: isoDateSchema,
    freshKg: z.number().min(0, 'Mass cannot be negative.').max(2000),
    count: z.number().int().min(0).max(100000).nullable().default(null),
    marketableKg: z.number().min(0).max(2000).nullable().default(null),
    notes: optionalText(500),
    idempotencyKey: idempotencyKeySchema.optional(),
  })
  .refine((h) => h.marketableKg === null || h.marketableKg <= h.freshKg, { path: ['marketableKg'], message: 'Marketable mass cannot exceed the fresh mass.' });
export type HarvestInput = z.infer<typeof harvestInputSchema>;

export const observationInputSchema = z.object({
  plotId: z.uuid().nullable().default(null),
  observedAt: isoDateTimeSchema,
  text: z.string().trim().min(1, 'Write what you saw.').max(4000),
  idempotencyKey: idempotencyKeySchema.optional(),
});
export type ObservationInput = z.infer<typeof observationInputSchema>;

export const weatherDayInputSchema = z
  .object({
    day: isoDateSchema,
    tMinC: z.number().min(-60).max(60),
    tMaxC: z.number().min(-60).max(60),
    rainMm: z.number().min(0).max(1000).default(0),
    rhMinPct: z.number().min(0).max(100).nullable().default(null),
    rhMaxPct: z.number().min(0).max(100).nullable().default(null),
    windSpeedMs: z.number().min(0).max(75).nullable().default(null),
    windHeightM: z.number().min(0.5).max(20).default(2),
    sunshineHours: z.number().min(0).max(24).nullable().default(null),
    solarRadiationMJ: z.number().min(0).max(50).nullable().default(null),
    /** Forecast values (frost warnings) are kept apart from observations. */
    forecast: z.boolean().default(false),
  })
  .superRefine((w, ctx) => {
    if (w.tMinC > w.tMaxC) ctx.addIssue({ code: 'custom', path: ['tMinC'], message: 'The minimum temperature is above the maximum.' });
    if (w.rhMinPct !== null && w.rhMaxPct !== null && w.rhMinPct > w.rhMaxPct) ctx.addIssue({ code: 'custom', path: ['rhMinPct'], message: 'Minimum humidity is above the maximum.' });
  });
export type WeatherDayInput = z.infer<typeof weatherDayInputSchema>;

export const logKinds = ['water-events', 'moisture-readings', 'harvests', 'observations'] as const;
export type LogKind = (typeof logKinds)[number];

export const listLogsQuerySchema = paginationQuerySchema.extend({
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
  plotId: z.uuid().optional(),
  sort: z.enum(['asc', 'desc']).default('desc'),
});
export type ListLogsQuery = z.infer<typeof listLogsQuerySchema>;

export const listWeatherQuerySchema = z.object({ from: isoDateSchema.optional(), to: isoDateSchema.optional() });

/** Quick entry (Round): several logs from one walk, each with its own idempotency key. */
export const roundEntrySchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('water'), entry: waterEventInputSchema }),
  z.object({ type: z.literal('moisture'), entry: moistureReadingInputSchema }),
  z.object({ type: z.literal('harvest'), entry: harvestInputSchema }),
]);
export const roundInputSchema = z.object({ entries: z.array(roundEntrySchema).min(1).max(200) });
export type RoundInput = z.infer<typeof roundInputSchema>;
