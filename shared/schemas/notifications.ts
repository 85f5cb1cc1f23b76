import { z } from 'zod';

/**
 * Messages Seepwise e-mails on its own: refill reminders, frost warnings and the weekly digest
 * for cohort leads; the grower's preferences for each; the refill forecast and frost warnings
 * shown in the app.
 */
export const notificationKinds = ['refill', 'frost', 'digest'] as const;
export const notificationKindSchema = z.enum(notificationKinds);
export type NotificationKind = z.infer<typeof notificationKindSchema>;

export const MIN_THRESHOLD_PCT = 5;
export const MAX_THRESHOLD_PCT = 90;

export const notificationPreferencesSchema = z.object({
  refillReminders: z.boolean(),
  /** Remind when a pot's estimated level is below this share of its capacity. */
  refillThresholdPct: z
    .number('Enter a percentage.')
    .int('Use a whole percentage.')
    .min(MIN_THRESHOLD_PCT, `Use ${MIN_THRESHOLD_PCT} % or more.`)
    .max(MAX_THRESHOLD_PCT, `Use ${MAX_THRESHOLD_PCT} % or less.`),
  frostWarnings: z.boolean(),
  /** Only sent to cohort leads. */
  weeklyDigest: z.boolean(),
});
export type NotificationPreferences = z.infer<typeof notificationPreferencesSchema>;

export const updateNotificationPreferencesInputSchema = notificationPreferencesSchema.partial();
export type UpdateNotificationPreferencesInput = z.infer<typeof updateNotificationPreferencesInputSchema>;

/** Which preference each kind of message turns off. */
export const preferenceForKind: Record<NotificationKind, 'refillReminders' | 'frostWarnings' | 'weeklyDigest'> = {
  refill: 'refillReminders',
  frost: 'frostWarnings',
  digest: 'weeklyDigest',
};

export const unsubscribeInputSchema = z.object({
  token: z.string('The unsubscribe link has no token.').trim().min(1, 'The unsubscribe link has no token.').max(300, 'This unsubscribe link is not valid.'),
});
export type UnsubscribeInput = z.infer<typeof unsubscribeInputSchema>;

export const unsubscribeResultSchema = z.object({ kind: notificationKindSchema, message: z.string() });
export type UnsubscribeResult = z.infer<typeof unsubscribeResultSchema>;

/** Codes of PotForecast.note. */
export const potForecastNoteCodes = ['no_refill', 'no_basis'] as const;
export type PotForecastNoteCode = (typeof potForecastNoteCodes)[number];

export const potForecastSchema = z.object({
  potId: z.uuid(),
  label: z.string(),
  plotId: z.uuid(),
  plotLabel: z.string(),
  capacityL: z.number(),
  lastRefillAt: z.string().nullable(),
  lastRefillL: z.number().nullable(),
  /** Where the daily draw comes from; null when neither a seep test nor crop coefficients exist. */
  basis: z.enum(['seep-test', 'crop-need']).nullable(),
  dailyDrawL: z.number().nullable(),
  levelL: z.number().nullable(),
  levelPct: z.number().nullable(),
  thresholdAt: z.string().nullable(),
  dryAt: z.string().nullable(),
  belowThreshold: z.boolean(),
  /** Why the level is unknown, when it is (English, for API consumers). */
  note: z.string().nullable(),
  /** The same as a stable code, worded by the client: no refill logged yet, or nothing to estimate the draw from. */
  noteCode: z.enum(potForecastNoteCodes).nullable(),
});
export type PotForecast = z.infer<typeof potForecastSchema>;

export const trialForecastSchema = z.object({
  trialId: z.uuid(),
  asOf: z.string(),
  thresholdPct: z.number(),
  /** ET0 behind the crop-need basis: the garden's observed weather of the last week, or the default. */
  et0: z.object({ mmPerDay: z.number(), source: z.enum(['weather', 'default']), days: z.number() }),
  /** Most urgent first: soonest dry, then pots that never run dry at the current draw, then unknown levels. */
  pots: z.array(potForecastSchema),
});
export type TrialForecast = z.infer<typeof trialForecastSchema>;

export const frostNightSchema = z.object({ day: z.string(), tMinC: z.number(), forecast: z.boolean() });
export const frostWarningSchema = z.object({
  gardenId: z.uuid(),
  gardenName: z.string(),
  /** The garden's today, from its longitude. */
  today: z.string(),
  nights: z.array(frostNightSchema),
  /** Pots (not retired) in the plots of the garden's trials. */
  potsInGround: z.number(),
});
export type FrostWarning = z.infer<typeof frostWarningSchema>;
