/**
 * Number and date formats for Vega (d3-format / d3-time-format locale definitions), so axis ticks
 * and tooltips read "1.234,5" and "1 jun" in Spanish. Used by the browser (vega-embed's
 * `formatLocale` / `timeFormatLocale`) and by the server's chart renderer (View `locale`).
 *
 * Spanish values follow the d3 "es-ES" / "es-MX" locale files' layout, written from memory (common
 * practice, no source checked here); decimal comma and thousands point as CLDR's "es". CSV exports
 * never use these: numbers there keep dot decimals.
 */
import type { Lang } from '../i18n/translate';

export interface VegaNumberLocale {
  decimal: string;
  thousands: string;
  grouping: number[];
  currency: [string, string];
}
export interface VegaTimeLocale {
  dateTime: string;
  date: string;
  time: string;
  periods: [string, string];
  days: string[];
  shortDays: string[];
  months: string[];
  shortMonths: string[];
}

/** What differs between languages; everything else of a Vega locale is derived in one place (vegaLocaleOf). */
interface LocaleWords {
  decimal: string;
  thousands: string;
  currency: [string, string];
  dateTime: string;
  date: string;
  time: string;
  periods: [string, string];
  /** Sunday first, as d3-time-format expects. */
  days: string[];
  /** January first. */
  months: string[];
}

/** A Vega number + time locale from a language's words; short day and month names are the first three letters. */
function vegaLocaleOf(w: LocaleWords): { number: VegaNumberLocale; time: VegaTimeLocale } {
  const short = (names: string[]) => names.map((n) => n.slice(0, 3));
  return {
    number: { decimal: w.decimal, thousands: w.thousands, grouping: [3], currency: w.currency },
    time: {
      dateTime: w.dateTime,
      date: w.date,
      time: w.time,
      periods: w.periods,
      days: w.days,
      shortDays: short(w.days),
      months: w.months,
      shortMonths: short(w.months),
    },
  };
}

const locales: Record<Lang, { number: VegaNumberLocale; time: VegaTimeLocale }> = {
  en: vegaLocaleOf({
    decimal: '.',
    thousands: ',',
    currency: ['$', ''],
    dateTime: '%x, %X',
    date: '%-m/%-d/%Y',
    time: '%-I:%M:%S %p',
    periods: ['AM', 'PM'],
    days: ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'],
    months: ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'],
  }),
  es: vegaLocaleOf({
    decimal: ',',
    thousands: '.',
    currency: ['', '\u00a0€'],
    dateTime: '%A, %e de %B de %Y, %X',
    date: '%d/%m/%Y',
    time: '%H:%M:%S',
    periods: ['AM', 'PM'],
    days: ['domingo', 'lunes', 'martes', 'miércoles', 'jueves', 'viernes', 'sábado'],
    months: ['enero', 'febrero', 'marzo', 'abril', 'mayo', 'junio', 'julio', 'agosto', 'septiembre', 'octubre', 'noviembre', 'diciembre'],
  }),
};

/**
 * The Vega locale of a language. Axis ticks of dates still need an explicit format for the day-month
 * order (Vega's multi-scale default is month first): see dayAxis in trial-charts.ts and the
 * `charts.timeFormat` strings.
 */
export function vegaLocale(lang: Lang): { number: VegaNumberLocale; time: VegaTimeLocale } {
  return locales[lang];
}
