import { forestTrials } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectResult } from '@shared/schemas/cohort-results';
import { useTranslation } from 'react-i18next';
import { Card } from '@/components/ui/card';
import { formatDate } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { crT, growers, num, pct, range, trials } from './format';
import { whyNotPooled } from './labels';

/** Below this many trials the between-garden spread is a rough guess (product rule, no source). */
const FEW_TRIALS = 5;

function Stat({ label, value, lines, tone }: { label: string; value: string; lines: string[]; tone: 'olla' | 'neutral' }) {
  return (
    <div className={tone === 'olla' ? 'rounded-lg border border-sage-200 bg-sage-50 p-4' : 'rounded-lg border border-sand-200 bg-sand-50 p-4'}>
      <p className="text-sm font-medium text-ink-muted">{label}</p>
      <p className="text-3xl font-semibold tabular-nums">{value}</p>
      {lines.map((l) => (
        <p key={l} className="text-sm text-ink-muted">
          {l}
        </p>
      ))}
    </div>
  );
}

/** `pooledGrowers`: members behind the pooled trials (a member may share several trials). */
function waterSentences(e: EffectResult, pooledGrowers: number, conf: number): string[] {
  const t = crT();
  const p = e.pooled;
  if (!p) return [t(($) => $.headline.waterNone, { k: e.k })];
  const est = p.display.estimate;
  const [lo, hi] = p.display.ci;
  const across = { trials: trials(p.k), growers: growers(pooledGrowers), amount: pct(Math.abs(est)) };
  const out = [
    est >= 0 ? t(($) => $.headline.waterAcross, across) : t(($) => $.headline.waterAcrossMore, across),
    `${t(($) => $.headline.waterCi, { confidence: conf, range: range(p.display.ci, '%') })} ` +
      (lo > 0 ? t(($) => $.headline.allSaving) : hi < 0 ? t(($) => $.headline.allMore) : t(($) => $.headline.includesZero)),
  ];
  if (p.display.predictionInterval) {
    out.push(t(($) => $.headline.prediction, { lo: num(p.display.predictionInterval[0]), hi: num(p.display.predictionInterval[1]), confidence: conf }));
  } else {
    out.push(t(($) => $.headline.predictionNeeds));
  }
  if (p.k < FEW_TRIALS) out.push(t(($) => $.headline.fewTrials, { trials: trials(p.k) }));
  return out;
}

/** The answer in one card: water saved, harvest and water-use efficiency, each with its interval and its caveats. */
export function Headline({ results }: { results: CohortResults }) {
  const units = useUnits();
  const { t } = useTranslation('cohortResults');
  const conf = Math.round(results.options.confidence * 100);
  const water = results.effects.waterLogRatio;
  const harvest = results.effects.harvestPerPlantDiff;
  const wue = results.effects.wueLogRatio;
  const mass = (kg: number, signed = false) => `${num(units.show(kg, 'mass'), 2, signed)} ${units.label('mass')}`;
  const ci = (r: string) => t(($) => $.headline.ci, { confidence: conf, range: r });

  const waterStat = water.pooled
    ? {
        value: water.pooled.display.estimate >= 0 ? pct(water.pooled.display.estimate) : t(($) => $.headline.more, { value: pct(-water.pooled.display.estimate) }),
        lines: [
          ci(range(water.pooled.display.ci, '%')),
          water.pooled.display.predictionInterval ? t(($) => $.headline.newGarden, { range: range(water.pooled.display.predictionInterval, '%') }) : t(($) => $.headline.newGardenNeeds),
          trials(water.pooled.k),
        ],
      }
    : { value: '—', lines: [t(($) => $.headline.soFar, { trials: trials(water.k) })] };

  const harvestStat = harvest.pooled
    ? {
        value: `${mass(harvest.pooled.display.estimate, true)}`,
        lines: [
          ci(t(($) => $.range, { lo: mass(harvest.pooled.display.ci[0], false), hi: mass(harvest.pooled.display.ci[1], false) })),
          t(($) => $.headline.perPlant, { trials: trials(harvest.pooled.k) }),
        ],
      }
    : { value: '—', lines: [t(($) => $.headline.harvestNone, { trials: trials(harvest.k) })] };

  const wueStat = wue.pooled
    ? {
        value: pct(wue.pooled.display.estimate, 0, true),
        lines: [ci(range(wue.pooled.display.ci, '%')), t(($) => $.headline.perLitre, { trials: trials(wue.pooled.k) })],
      }
    : { value: '—', lines: [t(($) => $.headline.soFar, { trials: trials(wue.k) })] };

  const harvestSentence = (() => {
    const p = harvest.pooled;
    if (!p) return t(($) => $.headline.harvestCannot);
    const [lo, hi] = p.display.ci;
    const d = p.display.estimate;
    const values = { amount: mass(Math.abs(d)), confidence: conf, lo: mass(lo), hi: mass(hi), trials: trials(p.k) };
    return (
      `${d >= 0 ? t(($) => $.headline.harvestMore, values) : t(($) => $.headline.harvestLess, values)} ` +
      (lo > 0 ? t(($) => $.headline.harvestClearlyMore) : hi < 0 ? t(($) => $.headline.harvestClearlyLess) : t(($) => $.headline.harvestUnclear))
    );
  })();

  // Which shared trials are not in the water estimate, and why, counted.
  const reasons = new Map<string, number>();
  for (const trial of results.trials) {
    const why = whyNotPooled(trial, 'waterLogRatio', results.options);
    if (why) reasons.set(why, (reasons.get(why) ?? 0) + 1);
  }
  const inWater = results.trials.length - [...reasons.values()].reduce((a, b) => a + b, 0);

  return (
    <Card role="region" aria-labelledby="headline-heading" className="space-y-4">
      <h3 id="headline-heading">{t(($) => $.headline.heading)}</h3>
      <div className="grid gap-3 sm:grid-cols-3">
        <Stat label={t(($) => $.headline.waterLabel)} value={waterStat.value} lines={waterStat.lines} tone="olla" />
        <Stat label={t(($) => $.headline.harvestLabel)} value={harvestStat.value} lines={harvestStat.lines} tone="neutral" />
        <Stat label={t(($) => $.headline.wueLabel)} value={wueStat.value} lines={wueStat.lines} tone="neutral" />
      </div>
      <div className="max-w-3xl space-y-2">
        {waterSentences(water, new Set(forestTrials(results, 'waterLogRatio').map((f) => f.pseudonym)).size, conf).map((s) => (
          <p key={s}>{s}</p>
        ))}
        <p>{harvestSentence}</p>
        <p className="text-sm text-ink-muted">
          {t(($) => $.headline.counted, { count: results.trials.length, inWater: String(inWater) })}
          {reasons.size
            ? t(($) => $.headline.notCounted, {
                reasons: [...reasons.entries()].map(([why, n]) => `${n} × ${why.charAt(0).toLowerCase()}${why.slice(1)}`).join('; '),
              })
            : '.'}{' '}
          {t(($) => $.headline.asOf, { date: formatDate(results.asOf) })}
        </p>
      </div>
    </Card>
  );
}
