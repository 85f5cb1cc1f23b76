/**
 * Translations for the strings built in shared/ and on the server: chart titles and axis labels,
 * report text, export data dictionaries. Pure (no i18next, no I/O): the dictionaries are JSON in
 * shared/locales/<lang>/<namespace>.json, read by both the client and the server, and a builder
 * takes a `Translate` function made here. The client's own screens use i18next (src/i18n); both
 * follow the same file convention, and tests/unit/shared-locales.test.ts checks key parity,
 * placeholders and plural forms the same way tests/unit/locales.test.ts does for src/locales.
 *
 * Keys are dotted paths typed from the English files: `t('charts.trial.date')`,
 * `t('charts.cohort.trials', { count: 3 })` picks `trials_one` / `trials_other` (Spanish also
 * `trials_many`) by the language's CLDR plural rules (Intl.PluralRules, as i18next does).
 */
import enAnalysis from '../locales/en/analysis.json';
import enCharts from '../locales/en/charts.json';
import enExport from '../locales/en/export.json';
import enReport from '../locales/en/report.json';
import esAnalysis from '../locales/es/analysis.json';
import esCharts from '../locales/es/charts.json';
import esExport from '../locales/es/export.json';
import esReport from '../locales/es/report.json';

export const SHARED_LANGUAGES = ['en', 'es'] as const;
export type Lang = (typeof SHARED_LANGUAGES)[number];

const en = { analysis: enAnalysis, charts: enCharts, export: enExport, report: enReport };
export type SharedStrings = typeof en;
const dictionaries: Record<Lang, SharedStrings> = { en, es: { analysis: esAnalysis, charts: esCharts, export: esExport, report: esReport } };

type StripPlural<K extends string> = K extends `${infer B}_${'zero' | 'one' | 'two' | 'few' | 'many' | 'other'}` ? B : K;
type Leaves<T, P extends string = ''> = {
  [K in keyof T & string]: T[K] extends string ? `${P}${StripPlural<K>}` : Leaves<T[K], `${P}${K}.`>;
}[keyof T & string];

/** Every key of the shared dictionaries, e.g. 'charts.trial.date'. */
export type SharedKey = Leaves<SharedStrings>;
export type TranslateParams = Record<string, string | number>;
export type Translate = ((key: SharedKey, params?: TranslateParams) => string) & { lang: Lang };

/** 'es', 'es-MX', 'ES' → 'es'; anything else → 'en'. */
export function toLang(value: string | null | undefined): Lang {
  return value && value.toLowerCase().startsWith('es') ? 'es' : 'en';
}

function lookup(tree: unknown, path: string): string | undefined {
  let node = tree;
  for (const part of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[part];
  }
  return typeof node === 'string' ? node : undefined;
}

const cache = new Map<Lang, Translate>();

/** The translator of one language; a key missing there falls back to English, then to the key itself. */
export function translator(lang: Lang = 'en'): Translate {
  const hit = cache.get(lang);
  if (hit) return hit;
  const rules = new Intl.PluralRules(lang);
  const count = new Intl.NumberFormat(lang);
  const find = (key: string, params?: TranslateParams): string | undefined => {
    const n = params?.count;
    for (const dict of [dictionaries[lang], dictionaries.en]) {
      if (typeof n === 'number') {
        const plural = lookup(dict, `${key}_${(dict === dictionaries[lang] ? rules : new Intl.PluralRules('en')).select(n)}`) ?? lookup(dict, `${key}_other`);
        if (plural !== undefined) return plural;
      }
      const s = lookup(dict, key);
      if (s !== undefined) return s;
    }
    return undefined;
  };
  const t = ((key: SharedKey, params?: TranslateParams) => {
    const s = find(key, params) ?? key;
    if (!params) return s;
    return s.replace(/\{\{\s*(\w+)\s*\}\}/g, (m, name: string) => {
      const v = params[name];
      if (v === undefined) return m;
      return typeof v === 'number' ? count.format(v) : v;
    });
  }) as Translate;
  t.lang = lang;
  cache.set(lang, t);
  return t;
}

/** The English translator: the default of every builder that takes a `t`. */
export const enT = translator('en');

const numberFormats = new Map<string, Intl.NumberFormat>();

/**
 * A number for reading in `lang` ("1,234.5" / "1234,5"), with exactly `digits` decimals and a real
 * minus sign. Never for CSV files or anything a program reads back: those keep dot decimals.
 */
export function formatNum(v: number | null | undefined, digits: number, lang: Lang): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const id = `${lang}|${digits}`;
  let f = numberFormats.get(id);
  if (!f) numberFormats.set(id, (f = new Intl.NumberFormat(lang, { minimumFractionDigits: digits, maximumFractionDigits: digits })));
  const rounded = Number(v.toFixed(digits));
  return f.format(rounded === 0 ? 0 : rounded).replace('-', '−');
}
