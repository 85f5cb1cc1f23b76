/**
 * The paired comparison in plain words, with its numbers and its caveats, in the reader's
 * language and units. Pure: used by the Results tab and the report bundle alike.
 */
import { KG_PER_POUND, M2_PER_SQUARE_FOOT, MM_PER_INCH, type UnitSystem } from '../units';
import type { Comparison, PairedMetric } from './trial-analysis';

export type { Lang } from '../i18n/translate';
import type { Lang } from '../i18n/translate';

interface Fmt {
  lang: Lang;
  units: UnitSystem;
}

function num(v: number, digits: number, lang: Lang): string {
  return new Intl.NumberFormat(lang === 'es' ? 'es' : 'en', { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(v);
}

/** "p = 0.034" or "p < 0.001". */
function pText(p: number, lang: Lang): string {
  if (!Number.isFinite(p)) return lang === 'es' ? 'p no calculable' : 'p not computable';
  if (p < 0.001) return `p < ${num(0.001, 3, lang)}`;
  return `p = ${num(p, 3, lang)}`;
}

/** Water depth for display: mm or inches. */
function depth(mm: number, f: Fmt): string {
  return f.units === 'us' ? `${num(mm / MM_PER_INCH, 2, f.lang)} in` : `${num(mm, 0, f.lang)} mm`;
}

/** Harvest per area for display: kg/m² or lb/ft². */
function yieldPerArea(kgPerM2: number, f: Fmt): string {
  return f.units === 'us' ? `${num((kgPerM2 / KG_PER_POUND) * M2_PER_SQUARE_FOOT, 3, f.lang)} lb/ft²` : `${num(kgPerM2, 2, f.lang)} kg/m²`;
}

function treatmentWord(name: string, lang: Lang): string {
  if (name === 'olla') return lang === 'es' ? 'las parcelas con olla' : 'the olla plots';
  if (name === 'surface') return lang === 'es' ? 'las parcelas regadas en superficie' : 'the surface-watered plots';
  return lang === 'es' ? `las parcelas «${name}»` : `the "${name}" plots`;
}

function waterSentence(m: PairedMetric, c: Comparison, f: Fmt): string | null {
  const t = treatmentWord(c.treatment, f.lang);
  const ctl = treatmentWord(c.control, f.lang);
  if (m.kind === 'descriptive') {
    if (!m.description) return null;
    const [tv, cv] = [m.description.treatmentTotal, m.description.controlTotal];
    return f.lang === 'es'
      ? `Con un solo par, Seepwise muestra solo los totales: ${t} recibieron ${depth(tv, f)} y ${ctl} ${depth(cv, f)}. Con un par no hay variación entre réplicas, así que no es posible ninguna prueba; los días no son réplicas.`
      : `With a single pair, Seepwise shows the totals only: ${t} received ${depth(tv, f)} and ${ctl} ${depth(cv, f)}. No test across replicates is possible with one pair, and days are not replicates.`;
  }
  const r = m.result;
  if (r.constantDifferences) {
    const amount = depth(Math.abs(r.meanDifference), f);
    const dir = r.meanDifference < 0 ? (f.lang === 'es' ? 'menos' : 'less') : f.lang === 'es' ? 'más' : 'more';
    return f.lang === 'es'
      ? `En los ${r.n} pares, ${t} recibieron exactamente ${amount} ${dir} agua que sus gemelas: sin variación entre pares no hay prueba ni intervalo con sentido. Revisa que el riego en superficie también esté anotado.`
      : `In all ${r.n} pairs, ${t} received exactly ${amount} ${dir} water than their twins: with no spread between pairs there is no meaningful test or interval. Check that the surface watering is logged too.`;
  }
  const conf = Math.round(r.confidence * 100);
  const less = r.meanDifference < 0;
  const amount = depth(Math.abs(r.meanDifference), f);
  const [lo, hi] = r.ci;
  const includesZero = lo <= 0 && hi >= 0;
  const ci = `${depth(lo, f)} … ${depth(hi, f)}`;
  if (f.lang === 'es') {
    return (
      `En ${r.n} pares, ${t} recibieron de media ${amount} ${less ? 'menos' : 'más'} agua que sus gemelas de control ` +
      `(intervalo de confianza del ${conf} % para la diferencia: ${ci}; prueba t pareada ${pText(r.pValue, 'es')}; Wilcoxon de rangos con signo ${pText(r.wilcoxon.pValue, 'es')}).` +
      (includesZero ? ' El intervalo incluye el cero: estos datos no distinguen la diferencia de ninguna.' : '')
    );
  }
  return (
    `Across ${r.n} pairs, ${t} received on average ${amount} ${less ? 'less' : 'more'} water than their control twins ` +
    `(${conf}% confidence interval for the difference: ${ci}; paired t-test ${pText(r.pValue, 'en')}; Wilcoxon signed-rank ${pText(r.wilcoxon.pValue, 'en')}).` +
    (includesZero ? ' The interval includes zero: these data cannot tell the difference apart from none.' : '')
  );
}

function harvestSentence(m: PairedMetric, f: Fmt): string | null {
  if (m.kind === 'descriptive') {
    if (!m.description) return null;
    const d = m.description.meanDifference;
    return f.lang === 'es'
      ? `Cosecha por superficie: diferencia de ${yieldPerArea(d, f)} en el único par (sin prueba posible).`
      : `Harvest per area: a difference of ${yieldPerArea(d, f)} in the single pair (no test possible).`;
  }
  const r = m.result;
  if (r.constantDifferences) return null;
  const conf = Math.round(r.confidence * 100);
  const [lo, hi] = r.ci;
  const includesZero = lo <= 0 && hi >= 0;
  const sign = r.meanDifference >= 0 ? '+' : '−';
  const diff = `${sign}${yieldPerArea(Math.abs(r.meanDifference), f)}`;
  if (f.lang === 'es') {
    return `Cosecha por superficie: diferencia media ${diff} (IC ${conf} %: ${yieldPerArea(lo, f)} … ${yieldPerArea(hi, f)}; ${pText(r.pValue, 'es')}).${includesZero ? ' No se distingue una diferencia en la cosecha.' : ''}`;
  }
  return `Harvest per area: mean difference ${diff} (${conf}% CI ${yieldPerArea(lo, f)} … ${yieldPerArea(hi, f)}; ${pText(r.pValue, 'en')}).${includesZero ? ' No difference in harvest can be told apart.' : ''}`;
}

/** Sentences describing one comparison: water, saving, harvest, then the caveats. */
export function describeComparison(c: Comparison, f: Fmt): string[] {
  const out: string[] = [];
  const w = waterSentence(c.metrics.waterMm, c, f);
  if (w) out.push(w);
  if (c.waterSavingPercent !== null) {
    const pct = num(Math.abs(c.waterSavingPercent), 0, f.lang);
    const saving = c.waterSavingPercent >= 0;
    out.push(
      f.lang === 'es'
        ? `Sobre la temporada, eso es ${saving ? 'un ahorro' : 'un gasto adicional'} del ${pct} % en lámina de agua.`
        : `Over the season that is a ${pct}% ${saving ? 'saving' : 'increase'} in water depth.`,
    );
  }
  const h = harvestSentence(c.metrics.harvestKgPerM2, f);
  if (h) out.push(h);
  const n = c.metrics.waterMm.n;
  if (c.metrics.waterMm.kind === 'test' && !c.metrics.waterMm.result.constantDifferences) {
    const conf = Math.round(c.metrics.waterMm.result.confidence * 100);
    out.push(
      f.lang === 'es'
        ? `El intervalo es el rango de diferencias medias compatibles con estos ${n} pares al ${conf} % de confianza. Un huerto durante una temporada es un solo sitio: agruparlo con otros huertos en un grupo da una respuesta más general.`
        : `The interval is the range of average differences compatible with these ${n} pairs at ${conf}% confidence. One garden over one season is one site; pooling with other gardens in a cohort gives a more general answer.`,
    );
    if (n < 5) {
      out.push(f.lang === 'es' ? `Con solo ${n} pares el intervalo es ancho; más pares lo estrechan.` : `With only ${n} pairs the interval is wide; more pairs would narrow it.`);
    }
    if (n <= 6 && c.metrics.waterMm.result.wilcoxon.exact) {
      // The exact two-sided signed-rank p-value cannot go below 2 / 2^n (all differences one way).
      const floor = num(2 / 2 ** n, 3, f.lang);
      out.push(
        f.lang === 'es'
          ? `Con ${n} pares, la prueba de Wilcoxon no puede dar un p menor que ${floor} aunque todos los pares vayan en el mismo sentido.`
          : `With ${n} pairs the Wilcoxon test cannot give a p-value below ${floor}, even when every pair points the same way.`,
      );
    }
  }
  return out;
}
