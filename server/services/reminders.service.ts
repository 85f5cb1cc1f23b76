/**
 * Reminders: what Seepwise tells growers and cohort leads on its own.
 *
 * - Refill forecast per pot (shared/agronomy/refill-forecast.ts) and the pots due for a refill
 *   reminder (level already below the grower's threshold).
 * - Frost nights at a garden (logged or forecast minimum ≤ 0 °C, today and the next 2 days).
 * - The weekly digest for cohort leads: new entries, quiet trials and new quality flags (the
 *   cohort Results' own flags).
 * - Preferences per user and kind, and the signed unsubscribe token that works without a session.
 *
 * Every function takes `now` explicitly (the jobs pass their own clock). Who receives e-mail is
 * decided here too: confirmed address, account not disabled, the kind switched on.
 */
import { createHmac, timingSafeEqual } from 'node:crypto';
import {
  addDays,
  cropNeedMmPerDay,
  forecastRefill,
  frostNights,
  gardenEt0,
  urgencyOrder,
  DEFAULT_REFILL_THRESHOLD_PCT,
  type FrostNight,
  type RefillForecast,
} from '@shared/agronomy/refill-forecast';
import { wettedAreaM2 } from '@shared/agronomy/olla-layout';
import { dayInTimeZone } from '@shared/time-zone';
import type { WeatherDay } from '@shared/agronomy/et0';
import {
  notificationKindSchema,
  preferenceForKind,
  type FrostWarning,
  type NotificationKind,
  type NotificationPreferences,
  type PotForecast,
  type PotForecastNoteCode,
  type TrialForecast,
  type UnsubscribeResult,
  type UpdateNotificationPreferencesInput,
} from '@shared/schemas/notifications';
import { cohortResultsQuerySchema, type QualityFlag } from '@shared/schemas/cohort-results';
import { cropLabels, type Crop } from '@shared/schemas/trials';
import type { DataSource } from 'typeorm';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { cohortResultsService } from './cohort-results.service';

/** What reminders need from the app: the jobs build the same from `npm start`'s runtime. */
export type NotificationContext = Pick<AppContext, 'ds' | 'env' | 'logger' | 'mailer' | 'publicUrl' | 'now'>;

const DAY_MS = 86_400_000;
/** A trial with nothing logged for this long is "quiet" in the weekly digest. */
export const QUIET_DAYS = 7;

export const defaultPreferences: NotificationPreferences = {
  refillReminders: true,
  refillThresholdPct: DEFAULT_REFILL_THRESHOLD_PCT,
  frostWarnings: true,
  weeklyDigest: true,
};

/** The preferences column that switches each kind off. */
const preferenceColumn: Record<NotificationKind, string> = {
  refill: 'refill_reminders',
  frost: 'frost_warnings',
  digest: 'weekly_digest',
};

/** SQL condition: `u` may receive `kind` by e-mail (`np` is its LEFT JOINed preferences row). */
export function recipientSql(kind: NotificationKind): string {
  return `u.disabled_at IS NULL AND u.email_verified_at IS NOT NULL AND COALESCE(np.${preferenceColumn[kind]}, true)`;
}

// ——— Unsubscribe tokens ———

const TOKEN_VERSION = 'u1';

function tokenSignature(secret: string, userId: string, kind: NotificationKind): string {
  // A purpose prefix keeps these signatures apart from anything else signed with SESSION_SECRET.
  return createHmac('sha256', secret).update(`seepwise:unsubscribe:${TOKEN_VERSION}:${userId}:${kind}`).digest('base64url');
}

/** `u1.<userId>.<kind>.<HMAC>`: stops one kind of e-mail for one user; never expires. */
export function unsubscribeToken(secret: string, userId: string, kind: NotificationKind): string {
  return `${TOKEN_VERSION}.${userId}.${kind}.${tokenSignature(secret, userId, kind)}`;
}

/** The user and kind a token stands for, or null when it was not signed by us. */
export function readUnsubscribeToken(secret: string, token: string): { userId: string; kind: NotificationKind } | null {
  const parts = token.split('.');
  if (parts.length !== 4 || parts[0] !== TOKEN_VERSION) return null;
  const [, userId, kindText, signature] = parts as [string, string, string, string];
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(userId)) return null;
  const kind = notificationKindSchema.safeParse(kindText);
  if (!kind.success) return null;
  const expected = Buffer.from(tokenSignature(secret, userId, kind.data));
  const given = Buffer.from(signature);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  return { userId, kind: kind.data };
}

export function unsubscribeHref(ctx: Pick<NotificationContext, 'env' | 'publicUrl'>, userId: string, kind: NotificationKind): string {
  return `${ctx.publicUrl}/unsubscribe?token=${encodeURIComponent(unsubscribeToken(ctx.env.SESSION_SECRET, userId, kind))}`;
}

const unsubscribedMessage: Record<NotificationKind, string> = {
  refill: 'Refill reminders are off. Turn them back on under Account → Reminders.',
  frost: 'Frost warnings are off. Turn them back on under Account → Reminders.',
  digest: 'The weekly digest is off. Turn it back on under Account → Reminders.',
};

// ——— Preferences ———

interface PreferenceRow {
  refill_reminders: boolean;
  refill_threshold_pct: number;
  frost_warnings: boolean;
  weekly_digest: boolean;
}

function presentPreferences(row: PreferenceRow | undefined): NotificationPreferences {
  if (!row) return { ...defaultPreferences };
  return { refillReminders: row.refill_reminders, refillThresholdPct: row.refill_threshold_pct, frostWarnings: row.frost_warnings, weeklyDigest: row.weekly_digest };
}

export async function getPreferences(ds: DataSource, userId: string): Promise<NotificationPreferences> {
  const rows = (await ds.query(`SELECT refill_reminders, refill_threshold_pct, frost_warnings, weekly_digest FROM notification_preferences WHERE user_id = $1`, [userId])) as PreferenceRow[];
  return presentPreferences(rows[0]);
}

/** Writes the given fields (the rest keep their value, or the default) in one statement. */
export async function updatePreferences(ds: DataSource, userId: string, input: UpdateNotificationPreferencesInput): Promise<NotificationPreferences> {
  const v = [input.refillReminders ?? null, input.refillThresholdPct ?? null, input.frostWarnings ?? null, input.weeklyDigest ?? null];
  const rows = (await ds.query(
    `INSERT INTO notification_preferences (user_id, refill_reminders, refill_threshold_pct, frost_warnings, weekly_digest)
     VALUES ($1, COALESCE($2::boolean, $6::boolean), COALESCE($3::int, $7::int), COALESCE($4::boolean, $6::boolean), COALESCE($5::boolean, $6::boolean))
     ON CONFLICT (user_id) DO UPDATE SET
       refill_reminders = COALESCE($2::boolean, notification_preferences.refill_reminders),
       refill_threshold_pct = COALESCE($3::int, notification_preferences.refill_threshold_pct),
       frost_warnings = COALESCE($4::boolean, notification_preferences.frost_warnings),
       weekly_digest = COALESCE($5::boolean, notification_preferences.weekly_digest),
       updated_at = now()
     RETURNING refill_reminders, refill_threshold_pct, frost_warnings, weekly_digest`,
    [userId, ...v, true, DEFAULT_REFILL_THRESHOLD_PCT],
  )) as PreferenceRow[];
  return presentPreferences(rows[0]);
}

/** Turns one kind off for the token's user. Works without a session; a bad token is a 400 and writes nothing. */
export async function unsubscribe(ctx: Pick<NotificationContext, 'ds' | 'env'>, token: string): Promise<UnsubscribeResult> {
  const read = readUnsubscribeToken(ctx.env.SESSION_SECRET, token);
  if (!read) {
    throw AppError.validation('This unsubscribe link is not valid. Copy the whole link from the e-mail, or change your reminders under Account after signing in.', [
      { path: 'token', message: 'This unsubscribe link is not valid.', reason: 'unsubscribe_link_invalid' },
    ]).because('unsubscribe_link_invalid');
  }
  const exists = (await ctx.ds.query(`SELECT 1 FROM users WHERE id = $1`, [read.userId])) as unknown[];
  if (exists.length) await updatePreferences(ctx.ds, read.userId, { [preferenceForKind[read.kind]]: false });
  return { kind: read.kind, message: unsubscribedMessage[read.kind] };
}

// ——— Refill forecast ———

interface PotRow {
  pot_id: string;
  pot_label: string;
  capacity_l: number;
  widest_diameter_cm: number;
  plot_id: string;
  plot_label: string;
  trial_id: string;
  trial_title: string;
  crop: string;
  kc_overrides: { ini?: number; mid?: number; end?: number };
  planting_date: string;
  owner_id: string;
  garden_id: string;
  garden_name: string;
  latitude_deg: number;
  longitude_deg: number;
  time_zone: string;
  elevation_m: number;
  coastal: boolean;
  threshold_pct: number;
  last_refill_l: number | null;
  last_refill_at: Date | null;
  refill_count: number;
  seep_l_per_day: number | null;
}

/**
 * Pots in plots of trials, with what the forecast needs: the last refill logged up to `now`
 * (and whether it was the pot's first), the latest seep test, the trial's crop and the garden.
 */
function potsSql(where: string): string {
  return `
    SELECT o.id AS pot_id, o.label AS pot_label, o.capacity_l, o.widest_diameter_cm,
           p.id AS plot_id, p.label AS plot_label,
           t.id AS trial_id, t.title AS trial_title, t.crop, t.kc_overrides, to_char(t.planting_date, 'YYYY-MM-DD') AS planting_date, t.owner_id,
           g.id AS garden_id, g.name AS garden_name, g.latitude_deg, g.longitude_deg, g.elevation_m, g.coastal, g.time_zone,
           COALESCE(np.refill_threshold_pct, ${DEFAULT_REFILL_THRESHOLD_PCT}) AS threshold_pct,
           last.volume_l AS last_refill_l, last.occurred_at AS last_refill_at,
           (SELECT count(*)::int FROM water_events w WHERE w.pot_id = o.id AND w.kind = 'olla_refill' AND w.occurred_at <= $1) AS refill_count,
           (SELECT s.litres_lost * 24 / s.hours FROM seep_tests s WHERE s.pot_id = o.id AND s.tested_on <= ($1::timestamptz AT TIME ZONE g.time_zone)::date
             ORDER BY s.tested_on DESC, s.created_at DESC LIMIT 1) AS seep_l_per_day
      FROM pots o
      JOIN plots p ON p.id = o.plot_id
      JOIN trials t ON t.id = p.trial_id
      JOIN gardens g ON g.id = t.garden_id
      JOIN users u ON u.id = t.owner_id
      LEFT JOIN notification_preferences np ON np.user_id = u.id
      LEFT JOIN LATERAL (
        SELECT w.volume_l, w.occurred_at FROM water_events w
         WHERE w.pot_id = o.id AND w.kind = 'olla_refill' AND w.occurred_at <= $1
         ORDER BY w.occurred_at DESC, w.created_at DESC LIMIT 1
      ) last ON true
     WHERE o.condition <> 'retired' AND ${where}
     ORDER BY p.block_key, p.label, o.label`;
}

type Et0 = ReturnType<typeof gardenEt0>;

/** Observed weather of the gardens around `now`, for each garden's ET0 of the last week. */
async function gardenEt0s(ds: DataSource, gardens: { id: string; latitudeDeg: number; timeZone: string; elevationM: number; coastal: boolean }[], now: Date): Promise<Map<string, { et0: Et0; today: string }>> {
  const out = new Map<string, { et0: Et0; today: string }>();
  if (!gardens.length) return out;
  // A garden's today is within a day of the UTC date: fetch a window wide enough for every zone.
  const utcToday = now.toISOString().slice(0, 10);
  const rows = (await ds.query(
    `SELECT garden_id AS "gardenId", to_char(day, 'YYYY-MM-DD') AS date, t_min_c AS "tMinC", t_max_c AS "tMaxC", rh_min_pct AS "rhMinPct", rh_max_pct AS "rhMaxPct",
            wind_speed_ms AS "windSpeedMs", wind_height_m AS "windHeightM", sunshine_hours AS "sunshineHours", solar_radiation_mj AS "solarRadiationMJ"
       FROM weather_days WHERE garden_id = ANY($1) AND NOT forecast AND day BETWEEN $2 AND $3`,
    [gardens.map((g) => g.id), addDays(utcToday, -8), addDays(utcToday, 1)],
  )) as ({ gardenId: string; date: string; tMinC: number; tMaxC: number } & Record<string, number | null | string>)[];
  for (const g of gardens) {
    const today = dayInTimeZone(now, g.timeZone);
    const days: (WeatherDay & { date: string })[] = rows
      .filter((r) => r.gardenId === g.id)
      .map((r) => ({
        date: r.date,
        tMinC: r.tMinC,
        tMaxC: r.tMaxC,
        rhMinPct: (r.rhMinPct as number | null) ?? undefined,
        rhMaxPct: (r.rhMaxPct as number | null) ?? undefined,
        windSpeedMs: (r.windSpeedMs as number | null) ?? undefined,
        windHeightM: r.windHeightM as number,
        sunshineHours: (r.sunshineHours as number | null) ?? undefined,
        solarRadiationMJ: (r.solarRadiationMJ as number | null) ?? undefined,
      }));
    out.set(g.id, { et0: gardenEt0(days, { latitudeDeg: g.latitudeDeg, elevationM: g.elevationM, coastal: g.coastal }, today), today });
  }
  return out;
}

export interface PotOutlook {
  row: PotRow;
  forecast: RefillForecast;
  /** The garden's date now (its time zone). */
  today: string;
  et0: Et0;
  note: string | null;
  noteCode: PotForecastNoteCode | null;
}

/** English words of the forecast note codes (the API's `note`; the client words `noteCode` itself). */
const FORECAST_NOTES: Record<PotForecastNoteCode, string> = {
  no_refill: 'No refill logged yet: log one on the Round and the forecast starts from it.',
  no_basis: 'No seep test, and this crop has no FAO-56 coefficients: run a seep test on the Pot shelf.',
};

/** Forecasts for pot rows; `thresholdPct` overrides each row's own (the owner's) threshold. */
async function outlooks(ds: DataSource, rows: PotRow[], now: Date, thresholdPct?: number): Promise<PotOutlook[]> {
  const gardens = [...new Map(rows.map((r) => [r.garden_id, { id: r.garden_id, latitudeDeg: r.latitude_deg, timeZone: r.time_zone, elevationM: r.elevation_m, coastal: r.coastal }])).values()];
  const et0s = await gardenEt0s(ds, gardens, now);
  return rows.map((row) => {
    const { et0, today } = et0s.get(row.garden_id)!;
    const need = cropNeedMmPerDay({ crop: row.crop, kcOverrides: row.kc_overrides, plantingDate: row.planting_date, onDate: today, et0MmPerDay: et0.et0MmPerDay });
    const forecast = forecastRefill({
      capacityL: row.capacity_l,
      lastRefill: row.last_refill_at ? { at: row.last_refill_at, volumeL: row.last_refill_l ?? 0, firstFill: row.refill_count <= 1 } : null,
      seepLPerDay: row.seep_l_per_day,
      cropNeed: need ? { etcMmPerDay: need.etcMmPerDay, wettedAreaM2: wettedAreaM2(row.widest_diameter_cm / 100) } : null,
      thresholdPct: thresholdPct ?? row.threshold_pct,
      now,
    });
    const noteCode: PotForecastNoteCode | null = !row.last_refill_at ? 'no_refill' : forecast.basis === null ? 'no_basis' : null;
    return { row, forecast, today, et0, note: noteCode && FORECAST_NOTES[noteCode], noteCode };
  });
}

/** The refill forecast of every pot of a trial, most urgent first, at the owner's threshold. */
export async function trialForecast(ds: DataSource, trialId: string, userId: string, now: Date): Promise<TrialForecast> {
  const trial = (await ds.query(`SELECT g.id, g.latitude_deg, g.time_zone, g.elevation_m, g.coastal FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`, [trialId])) as {
    id: string;
    latitude_deg: number;
    time_zone: string;
    elevation_m: number;
    coastal: boolean;
  }[];
  const garden = trial[0];
  if (!garden) throw AppError.notFound('Trial');
  const { refillThresholdPct } = await getPreferences(ds, userId);
  const rows = (await ds.query(potsSql('t.id = $2'), [now, trialId])) as PotRow[];
  const list = await outlooks(ds, rows, now, refillThresholdPct);
  const et0 =
    list[0]?.et0 ??
    (await gardenEt0s(ds, [{ id: garden.id, latitudeDeg: garden.latitude_deg, timeZone: garden.time_zone, elevationM: garden.elevation_m, coastal: garden.coastal }], now)).get(garden.id)!.et0;
  const pots: PotForecast[] = list
    .sort((a, b) => urgencyOrder(a.forecast, b.forecast))
    .map(({ row, forecast, note, noteCode }) => ({
      potId: row.pot_id,
      label: row.pot_label,
      plotId: row.plot_id,
      plotLabel: row.plot_label,
      capacityL: row.capacity_l,
      lastRefillAt: row.last_refill_at ? new Date(row.last_refill_at).toISOString() : null,
      lastRefillL: row.last_refill_l,
      basis: forecast.basis,
      dailyDrawL: forecast.dailyDrawL,
      levelL: forecast.levelL,
      levelPct: forecast.levelPct,
      thresholdAt: forecast.thresholdAt,
      dryAt: forecast.dryAt,
      belowThreshold: forecast.belowThreshold,
      note,
      noteCode,
    }));
  return { trialId, asOf: now.toISOString(), thresholdPct: refillThresholdPct, et0: { mmPerDay: et0.et0MmPerDay, source: et0.source, days: et0.days }, pots };
}

/** One pot due for a reminder: its level is below the owner's threshold today. */
export interface RefillItem {
  userId: string;
  potId: string;
  potLabel: string;
  trialId: string;
  trialTitle: string;
  gardenName: string;
  /** The garden's date: one reminder per pot per such day. */
  day: string;
  thresholdPct: number;
  levelL: number;
  levelPct: number;
  dry: boolean;
  dryAt: string | null;
  /** The garden's date of dryAt. */
  dryOn: string | null;
  basis: 'seep-test' | 'crop-need';
}

/** Pots of active trials whose level is below their owner's threshold, for owners who get refill reminders (one owner when given). */
export async function dueRefills(ds: DataSource, now: Date, userId?: string): Promise<RefillItem[]> {
  const where = `t.status = 'active' AND ${recipientSql('refill')}${userId ? ' AND t.owner_id = $2' : ''}`;
  const rows = (await ds.query(potsSql(where), userId ? [now, userId] : [now])) as PotRow[];
  const list = await outlooks(ds, rows, now);
  return list
    .filter(({ forecast }) => forecast.belowThreshold && forecast.basis !== null && forecast.levelL !== null)
    .sort((a, b) => urgencyOrder(a.forecast, b.forecast))
    .map(({ row, forecast, today }) => ({
      userId: row.owner_id,
      potId: row.pot_id,
      potLabel: row.pot_label,
      trialId: row.trial_id,
      trialTitle: row.trial_title,
      gardenName: row.garden_name,
      day: today,
      thresholdPct: row.threshold_pct,
      levelL: forecast.levelL!,
      levelPct: forecast.levelPct!,
      dry: forecast.dry,
      dryAt: forecast.dryAt,
      dryOn: forecast.dryAt ? dayInTimeZone(forecast.dryAt, row.time_zone) : null,
      basis: forecast.basis!,
    }));
}

// ——— Frost ———

export interface FrostItem {
  userId: string;
  gardenId: string;
  gardenName: string;
  today: string;
  nights: FrostNight[];
  potsInGround: number;
}

/**
 * Gardens with pots in the ground and a frost night from today to 2 days ahead (one user's, or
 * those of everyone who gets frost warnings when `recipientsOnly`).
 */
export async function frostGardens(ds: DataSource, now: Date, opts: { userId?: string; recipientsOnly: boolean }): Promise<FrostItem[]> {
  const conditions = [opts.recipientsOnly ? recipientSql('frost') : 'true', opts.userId ? 'g.owner_id = $1' : 'true'];
  const gardens = (await ds.query(
    `SELECT g.id, g.name, g.time_zone, g.owner_id,
            (SELECT count(*)::int FROM pots o JOIN plots p ON p.id = o.plot_id JOIN trials t ON t.id = p.trial_id
              WHERE t.garden_id = g.id AND o.condition <> 'retired') AS pots_in_ground
       FROM gardens g
       JOIN users u ON u.id = g.owner_id
       LEFT JOIN notification_preferences np ON np.user_id = u.id
      WHERE ${conditions.join(' AND ')}
      ORDER BY g.name, g.id`,
    opts.userId ? [opts.userId] : [],
  )) as { id: string; name: string; time_zone: string; owner_id: string; pots_in_ground: number }[];
  const withPots = gardens.filter((g) => g.pots_in_ground > 0);
  if (!withPots.length) return [];
  const utcToday = now.toISOString().slice(0, 10);
  const weather = (await ds.query(
    `SELECT garden_id AS "gardenId", to_char(day, 'YYYY-MM-DD') AS day, t_min_c AS "tMinC", forecast FROM weather_days
      WHERE garden_id = ANY($1) AND day BETWEEN $2 AND $3`,
    [withPots.map((g) => g.id), addDays(utcToday, -1), addDays(utcToday, 3)],
  )) as { gardenId: string; day: string; tMinC: number; forecast: boolean }[];
  const out: FrostItem[] = [];
  for (const g of withPots) {
    const today = dayInTimeZone(now, g.time_zone);
    const nights = frostNights(
      weather.filter((w) => w.gardenId === g.id),
      today,
    );
    if (nights.length) out.push({ userId: g.owner_id, gardenId: g.id, gardenName: g.name, today, nights, potsInGround: g.pots_in_ground });
  }
  return out;
}

export function presentFrostWarning(f: FrostItem): FrostWarning {
  return { gardenId: f.gardenId, gardenName: f.gardenName, today: f.today, nights: f.nights, potsInGround: f.potsInGround };
}

// ——— Weekly digest ———

export interface DigestFlag {
  /** Trial, kind and (out-of-line) effect: what "new since the last digest" compares. */
  key: string;
  kind: QualityFlag['kind'];
  /** The cohort results' own explanation (English). */
  message: string;
}

export interface DigestTrial {
  trialId: string;
  /** The owner's pseudonym in the cohort and the crop: never a name or a trial title. */
  label: string;
  status: string;
  entries: number;
  lastLogAt: Date | null;
  quiet: boolean;
  flags: DigestFlag[];
}

export interface DigestCohort {
  leadId: string;
  cohortId: string;
  cohortName: string;
  trials: DigestTrial[];
}

const cropLabelsEs: Record<Crop, string> = {
  tomato: 'Tomate',
  'sweet-pepper': 'Pimiento',
  'squash-zucchini': 'Calabaza / calabacín',
  'sweet-melon': 'Melón',
  watermelon: 'Sandía',
  lettuce: 'Lechuga',
  'green-beans': 'Judías verdes',
  cucumber: 'Pepino',
  other: 'Otro cultivo',
};

/**
 * The quality flags of a cohort's shared trials, as the cohort's Results show them
 * (server/services/cohort-results.service.ts: out of line, wrong unit, mixed moisture methods,
 * closed without harvest), keyed by trial. A failure there leaves the digest without flags
 * rather than without a digest.
 */
async function cohortFlags(ctx: Pick<NotificationContext, 'ds' | 'logger'>, cohortId: string, leadId: string, now: Date): Promise<Map<string, DigestFlag[]>> {
  const out = new Map<string, DigestFlag[]>();
  try {
    // The results service reads only the database and the clock; the digest passes its own `now`.
    const service = cohortResultsService({ ds: ctx.ds, now: () => now } as Pick<AppContext, 'ds' | 'now'> as AppContext);
    const results = await service.results(cohortId, leadId, cohortResultsQuerySchema.parse({}));
    for (const t of results.trials) {
      out.set(
        t.trialId,
        t.flags.map((f) => ({ key: `${t.trialId}:${f.kind}${f.effect ? `:${f.effect}` : ''}`, kind: f.kind, message: f.message })),
      );
    }
  } catch (err) {
    ctx.logger.warn({ err, cohortId }, 'digest: cohort quality flags could not be computed');
  }
  return out;
}

/**
 * Shared trials of the open cohorts each lead leads (shared, not withdrawn, owner still a
 * member: the same trials as the cohort's Results), with the entries in the 7 days to `now`,
 * whether each is quiet, and (when `flags`) its quality flags. Entries count by the time they
 * describe (when the water went in, the reading was taken...), up to `now`. Quiet: an active
 * trial whose latest entry (or, with none, its sharing) is QUIET_DAYS or more before `now`.
 */
export async function digestCohorts(ctx: Pick<NotificationContext, 'ds' | 'logger'>, now: Date, opts: { leadId?: string; flags: boolean }): Promise<DigestCohort[]> {
  const since = new Date(now.getTime() - QUIET_DAYS * DAY_MS);
  const rows = (await ctx.ds.query(
    `SELECT c.id AS cohort_id, c.name AS cohort_name, c.lead_id, u.language AS lead_language,
            t.id AS trial_id, t.crop, t.crop_name, t.status, s.shared_at, m.pseudonym,
            COALESCE(logs.entries, 0)::int AS entries, logs.last_at
       FROM cohorts c
       JOIN users u ON u.id = c.lead_id
       LEFT JOIN notification_preferences np ON np.user_id = u.id
       JOIN trial_shares s ON s.cohort_id = c.id AND s.withdrawn_at IS NULL
       JOIN trials t ON t.id = s.trial_id
       JOIN gardens g ON g.id = t.garden_id
       JOIN cohort_memberships m ON m.cohort_id = c.id AND m.user_id = t.owner_id
       LEFT JOIN LATERAL (
         SELECT count(*) FILTER (WHERE l.at > $2) AS entries, max(l.at) AS last_at
           FROM (SELECT occurred_at AS at FROM water_events WHERE trial_id = t.id
                 UNION ALL SELECT taken_at FROM moisture_readings WHERE trial_id = t.id
                 UNION ALL SELECT (harvested_on + time '12:00') AT TIME ZONE g.time_zone FROM harvests WHERE trial_id = t.id
                 UNION ALL SELECT observed_at FROM observations WHERE trial_id = t.id) l
          WHERE l.at <= $1
       ) logs ON true
      WHERE c.closed_at IS NULL AND ${recipientSql('digest')} ${opts.leadId ? 'AND c.lead_id = $3' : ''}
      ORDER BY c.lead_id, c.name, c.id, m.pseudonym, t.planting_date, t.id`,
    opts.leadId ? [now, since, opts.leadId] : [now, since],
  )) as {
    cohort_id: string;
    cohort_name: string;
    lead_id: string;
    lead_language: 'en' | 'es';
    trial_id: string;
    crop: Crop;
    crop_name: string;
    status: string;
    shared_at: Date;
    pseudonym: string;
    entries: number;
    last_at: Date | null;
  }[];
  const cohorts = new Map<string, DigestCohort>();
  for (const r of rows) {
    const key = `${r.lead_id}:${r.cohort_id}`;
    let cohort = cohorts.get(key);
    if (!cohort) {
      cohort = { leadId: r.lead_id, cohortId: r.cohort_id, cohortName: r.cohort_name, trials: [] };
      cohorts.set(key, cohort);
    }
    const crop = r.crop === 'other' && r.crop_name ? r.crop_name : r.lead_language === 'es' ? cropLabelsEs[r.crop] : cropLabels[r.crop];
    const quiet = r.status === 'active' && new Date(r.last_at ?? r.shared_at).getTime() <= since.getTime();
    cohort.trials.push({ trialId: r.trial_id, label: `${r.pseudonym} — ${crop}`, status: r.status, entries: r.entries, lastLogAt: r.last_at, quiet, flags: [] });
  }
  const list = [...cohorts.values()];
  if (opts.flags) {
    for (const cohort of list) {
      const flags = await cohortFlags(ctx, cohort.cohortId, cohort.leadId, now);
      for (const t of cohort.trials) t.flags = flags.get(t.trialId) ?? [];
    }
  }
  return list;
}

/** The Monday (UTC) of the week `now` falls in: one digest per cohort per such week (a cohort spans gardens in several zones; its digest week stays UTC). */
export function weekOf(now: Date): string {
  const day = now.getUTCDay(); // 0 = Sunday
  const monday = new Date(now.getTime() - ((day + 6) % 7) * DAY_MS);
  return monday.toISOString().slice(0, 10);
}
