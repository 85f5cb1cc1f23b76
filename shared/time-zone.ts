/**
 * A garden's calendar: IANA time-zone names and the garden's day of an instant. Pure (Intl only).
 *
 * The server buckets days in SQL (`occurred_at AT TIME ZONE g.time_zone`); these helpers are for
 * the few places that need the same answer outside SQL (the client's defaults and day labels, the
 * CSV import's wall-clock times and its "within the trial" check).
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

/** A cached formatter giving the numeric wall-clock parts of an instant in `zone` (throws RangeError for an unknown zone). */
function partsFormatter(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** The name as Intl spells it (`america/denver` → `America/Denver`, `US/Pacific` kept as ICU keeps it), or null when Intl does not know the zone. */
export function canonicalTimeZone(name: string): string | null {
  if (!/^[A-Za-z][A-Za-z0-9_+\-/]{0,63}$/.test(name)) return null;
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone: name }).resolvedOptions().timeZone;
  } catch {
    return null;
  }
}

/** Whether `name` is an IANA time-zone name this runtime knows (offset strings like "+02:00" are not names). */
export function isTimeZone(name: string): boolean {
  return canonicalTimeZone(name) !== null;
}

/** Every zone name this runtime lists, plus UTC, sorted: the choices of the garden form. */
export function timeZoneNames(): string[] {
  const listed = typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
  return [...new Set([...listed, 'UTC'])].sort();
}

/** A local date and time, as read on a clock in some zone (month 1–12). */
export interface WallClock {
  y: number;
  m: number;
  d: number;
  hh: number;
  mm: number;
  ss: number;
}

function wallClock(instantMs: number, zone: string): WallClock {
  const parts: Record<string, number> = {};
  for (const p of partsFormatter(zone).formatToParts(new Date(instantMs))) if (p.type !== 'literal') parts[p.type] = Number(p.value);
  return { y: parts.year!, m: parts.month!, d: parts.day!, hh: parts.hour! % 24, mm: parts.minute!, ss: parts.second! };
}

const pad = (n: number, w = 2) => String(n).padStart(w, '0');

/** The calendar day 'YYYY-MM-DD' of an instant in `zone` (what `(t AT TIME ZONE zone)::date` gives in PostgreSQL). */
export function dayInTimeZone(instant: Date | string | number, zone: string): string {
  const ms = instant instanceof Date ? instant.getTime() : typeof instant === 'string' ? Date.parse(instant) : instant;
  const w = wallClock(ms, zone);
  return `${pad(w.y, 4)}-${pad(w.m)}-${pad(w.d)}`;
}

/** Minutes `zone` is ahead of UTC at that instant (−420 for Pacific Daylight Time). */
export function offsetMinutesAt(instant: Date | number, zone: string): number {
  const ms = instant instanceof Date ? instant.getTime() : instant;
  const w = wallClock(ms, zone);
  const asUtc = Date.UTC(w.y, w.m - 1, w.d, w.hh, w.mm, w.ss);
  return Math.round((asUtc - Math.floor(ms / 1000) * 1000) / 60_000);
}

/**
 * The instant (ms) of a wall-clock time in `zone`. A time skipped by a spring-forward change is
 * read with the offset before the change (02:30 on a 02:00→03:00 night becomes 03:30); a time
 * that happens twice in the autumn is the first of the two. Either way the calendar day is the one asked for.
 */
export function instantOfWallClock(w: WallClock, zone: string): number {
  const asUtc = Date.UTC(w.y, w.m - 1, w.d, w.hh, w.mm, w.ss);
  // Try the offsets in force a day either side: the earlier one first, so an ambiguous time is the first occurrence.
  const candidates = [offsetMinutesAt(asUtc - 86_400_000, zone), offsetMinutesAt(asUtc + 86_400_000, zone)].sort((a, b) => b - a);
  for (const off of candidates) {
    const ms = asUtc - off * 60_000;
    if (offsetMinutesAt(ms, zone) === off) return ms;
  }
  // In a gap: use the offset before it.
  return asUtc - offsetMinutesAt(asUtc - 86_400_000, zone) * 60_000;
}

/** An instant as the garden's wall clock, 'YYYY-MM-DDTHH:mm' (the value of an `<input type="datetime-local">`). */
export function wallClockInput(instant: Date | number, zone: string): string {
  const w = wallClock(instant instanceof Date ? instant.getTime() : instant, zone);
  return `${pad(w.y, 4)}-${pad(w.m)}-${pad(w.d)}T${pad(w.hh)}:${pad(w.mm)}`;
}

/** 'YYYY-MM-DDTHH:mm[:ss]' read as the garden's wall clock, as an ISO instant (UTC); null when malformed. */
export function instantOfWallClockInput(value: string, zone: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(value);
  if (!m) return null;
  const [y, mo, d, hh, mm, ss] = [1, 2, 3, 4, 5, 6].map((i) => Number(m[i] ?? 0)) as [number, number, number, number, number, number];
  return new Date(instantOfWallClock({ y, m: mo, d, hh, mm, ss }, zone)).toISOString();
}

/** Days since 1970-01-01 of a calendar day ('YYYY-MM-DD'): calendar arithmetic, no time zone. */
export function dayNumber(day: string): number {
  return Math.round(Date.parse(`${day}T00:00:00Z`) / 86_400_000);
}

/** The calendar day ('YYYY-MM-DD') `n` days after 1970-01-01. */
export function dayOfNumber(n: number): string {
  return new Date(n * 86_400_000).toISOString().slice(0, 10);
}

/** `day` ('YYYY-MM-DD') plus `n` calendar days. */
export function addDays(day: string, n: number): string {
  return dayOfNumber(dayNumber(day) + n);
}

/** Calendar days from day `from` to day `to` ('YYYY-MM-DD'), negative when `to` comes first. */
export function daysBetween(from: string, to: string): number {
  return dayNumber(to) - dayNumber(from);
}

/**
 * Calendar days from `from` to `to` on the garden's calendar ("refilled 2 days ago"): the difference
 * of their days in `zone`, not of 24-hour periods. Yesterday at 21:00 is 1 day before today at 07:00;
 * negative when `from` is on a later day than `to`.
 */
export function calendarDaysBetween(from: Date | string | number, to: Date | string | number, zone: string): number {
  return daysBetween(dayInTimeZone(from, zone), dayInTimeZone(to, zone));
}
