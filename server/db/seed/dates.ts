/**
 * Calendar helpers for the demo season. Days are ISO dates ('2026-07-14'); instants are UTC ISO
 * strings. Saltbush Bend keeps a clock six hours behind UTC through the growing season
 * (an invented town; the offset only places morning and evening walks at believable hours).
 */
import { addDays, daysBetween } from '@shared/time-zone';

/** Calendar arithmetic on ISO days is the app's own (shared/time-zone.ts). */
export { addDays, daysBetween };

export const LOCAL_UTC_OFFSET_HOURS = -6;
/**
 * The gardens' IANA time zone: Saltbush Bend is invented, but its longitude (about 105° W) and its
 * summer clock (UTC−6) are those of US Mountain Daylight Time, the zone's clock through the whole
 * season (April to September; summer time runs March to November).
 */
export const DEMO_TIME_ZONE = 'America/Denver';

/** Every day from `from` to `to`, both included. */
export function eachDay(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = from; d <= to; d = addDays(d, 1)) out.push(d);
  return out;
}

export function dayOfYear(day: string): number {
  return daysBetween(`${day.slice(0, 4)}-01-01`, day) + 1;
}

/** A local wall-clock time in Saltbush Bend as a UTC ISO instant. */
export function localTime(day: string, hour: number, minute = 0): string {
  const ms = Date.parse(`${day}T00:00:00Z`) + ((hour - LOCAL_UTC_OFFSET_HOURS) * 60 + minute) * 60_000;
  return new Date(ms).toISOString();
}

export function addMinutes(instant: string, minutes: number): string {
  return new Date(Date.parse(instant) + minutes * 60_000).toISOString();
}

export function within(day: string, range: { from: string; to: string } | undefined): boolean {
  return range !== undefined && day >= range.from && day <= range.to;
}
