/** Display helpers: dates and numbers in the reader's language (src/i18n), join codes in two easy-to-read halves. */
import { currentLocale } from '@/i18n';

const cache = new Map<string, Intl.DateTimeFormat | Intl.NumberFormat>();

function dateFormat(key: string, options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat {
  const locale = currentLocale();
  const id = `${locale}|d|${key}`;
  let f = cache.get(id) as Intl.DateTimeFormat | undefined;
  if (!f) cache.set(id, (f = new Intl.DateTimeFormat(locale, options)));
  return f;
}

/** A number with at most `digits` decimals, grouped and punctuated for the reader's language. */
export function numberFormat(digits: number, minDigits = 0): Intl.NumberFormat {
  const locale = currentLocale();
  const id = `${locale}|n|${digits}|${minDigits}`;
  let f = cache.get(id) as Intl.NumberFormat | undefined;
  if (!f) cache.set(id, (f = new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: Math.min(minDigits, digits) })));
  return f;
}

export function formatNumber(n: number | null | undefined, digits = 1, minDigits = 0): string {
  return n === null || n === undefined || !Number.isFinite(n) ? '—' : numberFormat(digits, minDigits).format(n);
}

const DAY: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric' };

/**
 * A calendar day ('2026-04-10') stays that day in every time zone; an instant shows in local time,
 * or in `timeZone` when given (a garden's records show the garden's clock and day).
 */
export function formatDate(iso: string, timeZone?: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  if (/^\d{4}-\d{2}-\d{2}$/.test(iso)) return dateFormat('day-utc', { ...DAY, timeZone: 'UTC' }).format(d);
  return timeZone ? dateFormat(`day|${timeZone}`, { ...DAY, timeZone }).format(d) : dateFormat('day', DAY).format(d);
}

export function formatDateTime(iso: string, timeZone?: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const options: Intl.DateTimeFormatOptions = { ...DAY, hour: '2-digit', minute: '2-digit' };
  return timeZone ? dateFormat(`datetime|${timeZone}`, { ...options, timeZone }).format(d) : dateFormat('datetime', options).format(d);
}

/** "K7QM4XPA" → "K7QM-4XPA": easier to read aloud and to copy by hand. */
export function formatJoinCode(code: string): string {
  return code.length === 8 ? `${code.slice(0, 4)}-${code.slice(4)}` : code;
}

/** "1 member", "3 members". English only: translated screens use i18next plurals (`key_one` / `key_other`). */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
