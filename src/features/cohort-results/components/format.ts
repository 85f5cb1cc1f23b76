import type { EffectKey, PooledEstimate } from '@shared/schemas/cohort-results';
import { toLang, translator } from '@shared/i18n/translate';
import { currentLocale, i18n } from '@/i18n';

/** The shared translator (chart labels, crop names) in the language the page shows. */
export const sharedT = () => translator(toLang(i18n.resolvedLanguage));

/** The namespace's translator, for the helpers below (the section has loaded the namespace before they run). */
export const crT = () => i18n.getFixedT(null, 'cohortResults');

/** Number formatting and plain-language pieces of the cohort results. */

const cache = new Map<string, Intl.NumberFormat>();
function nf(digits: number, signed = false): Intl.NumberFormat {
  const locale = currentLocale();
  const key = `${locale}-${digits}-${signed}`;
  let f = cache.get(key);
  if (!f) {
    f = new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: digits, signDisplay: signed ? 'exceptZero' : 'auto' });
    cache.set(key, f);
  }
  return f;
}

/** A number with a real minus sign; "—" when missing. */
export function num(v: number | null | undefined, digits = 0, signed = false): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  // −0 after rounding reads as "0".
  const rounded = Number(v.toFixed(digits));
  return nf(digits, signed)
    .format(rounded === 0 ? 0 : rounded)
    .replace('-', '−');
}

/** "43 %", with a space that never breaks from its number. */
export const pct = (v: number | null | undefined, digits = 0, signed = false) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${num(v, digits, signed)}\u00a0%`;

/** "12 to 38 %": an interval with its unit once. */
export function range(iv: readonly [number, number] | null | undefined, unit: string, digits = 0): string {
  if (!iv) return '—';
  return `${crT()(($) => $.range, { lo: num(iv[0], digits), hi: num(iv[1], digits) })}${unit ? `\u00a0${unit}` : ''}`;
}

export function pValue(p: number | null | undefined): string {
  if (p === null || p === undefined || !Number.isFinite(p)) return '—';
  return p < 0.001 ? `< ${num(0.001, 3)}` : num(p, 3);
}

/** "p = 0.041" or "p < 0.001". */
export function pText(p: number | null | undefined): string {
  const v = pValue(p);
  return v.startsWith('<') ? `p ${v}` : `p = ${v}`;
}

/** English-only plural, for the parts of this page not yet translated; translated parts use `trials(n)`. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** A signed change: "+4 points", "−1 point", "+0.12 kg". */
export function shift(v: number, digits: number, unit: string): string {
  const n = num(v, digits, true);
  if (unit !== 'points') return `${n}\u00a0${unit}`;
  return `${n}\u00a0${Math.abs(Number(v.toFixed(digits))) === 1 ? 'point' : 'points'}`;
}

/** "3 trials" / "3 ensayos". */
export const trials = (count: number) => crT()(($) => $.trials, { count });
export const growers = (count: number) => crT()(($) => $.growers, { count });

/** A measure as a reader names it, in the reader's language ("Water saved"); `lower` for inside a sentence. */
export const measureLabel = (k: EffectKey, lower = false) => (lower ? crT()(($) => $.measuresLower[k]) : crT()(($) => $.measures[k]));
export const measureHint = (k: EffectKey) => crT()(($) => $.measureHints[k]);

/** The measures, as a reader names them (English; the translated parts of the page use `measureLabel`). */
export const measureLabels: Record<EffectKey, string> = {
  waterLogRatio: 'Water saved',
  wueLogRatio: 'Water-use efficiency',
  harvestPerPlantDiff: 'Harvest per plant',
};

export const measureHints: Record<EffectKey, string> = {
  waterLogRatio: 'Water the pots saved, as % of what the surface-watered beds got (per m²)',
  wueLogRatio: 'Harvest per litre of water, pots against surface, % change',
  harvestPerPlantDiff: 'Harvest per plant, pot beds minus surface beds',
};

/**
 * Heterogeneity in words, by the rough I² bands of the Cochrane Handbook (§10.10.2: 0–40 %
 * might not be important, 30–60 % moderate, 50–90 % substantial, 75–100 % considerable; the
 * bands overlap on purpose, we take their lower edges).
 */
export function heterogeneityWord(i2: number): 'low' | 'moderate' | 'substantial' | 'considerable' {
  if (i2 < 30) return 'low';
  if (i2 < 50) return 'moderate';
  if (i2 < 75) return 'substantial';
  return 'considerable';
}

export function heterogeneitySentence(p: PooledEstimate): string {
  const t = crT();
  const word = t(($) => $.heterogeneity.words[heterogeneityWord(p.i2)]);
  const share = `${num(p.i2)}\u00a0%`;
  const differ = p.i2 < 1 ? t(($) => $.heterogeneity.agree) : t(($) => $.heterogeneity.differ, { share });
  const test = p.pQ === null ? '' : p.pQ < 0.05 ? ` ${t(($) => $.heterogeneity.testClear)}` : ` ${t(($) => $.heterogeneity.testUnclear)}`;
  return `${t(($) => $.heterogeneity.sentence, { word, share })} ${differ}${test}`;
}
