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

const en = {
  number: { decimal: '.', thousands: ',', grouping: [3], currency: ['$', ''] },
  time: {
    dateTime: '%x, %X',
    date: '%-m/%-d/%Y',
    time: '%-I:%M:%S %p',
    periods: ['AM', 'PM'],
    days: ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'],
    shortDays: ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'],
    months: ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'],
    shortMonths: ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'],
  },
} satisfies { number: VegaNumberLocale; time: VegaTimeLocale };

const es = {
  number: { decimal: ',', thousands: '.', grouping: [3], currency: ['', '\u00a0€'] },
  time: {
    dateTime: '%A, %e de %B de %Y, %X',
    date: '%d/%m/%Y',
    time: '%H:%M:%S',
    periods: ['AM', 'PM'],
    days: ['domingo', 'lunes', 'martes', 'miércoles', 'jueves', 'viernes', 'sábado'],
    shortDays: ['dom', 'lun', 'mar', 'mié', 'jue', 'vie', 'sáb'],
    months: ['enero', 'febrero', 'marzo', 'abril', 'mayo', 'junio', 'julio', 'agosto', 'septiembre', 'octubre', 'noviembre', 'diciembre'],
    shortMonths: ['ene', 'feb', 'mar', 'abr', 'may', 'jun', 'jul', 'ago', 'sep', 'oct', 'nov', 'dic'],
  },
} satisfies { number: VegaNumberLocale; time: VegaTimeLocale };

export function vegaLocale(lang: Lang): { number: VegaNumberLocale; time: VegaTimeLocale } {
  return (lang === 'es' ? es : en) as { number: VegaNumberLocale; time: VegaTimeLocale };
}
