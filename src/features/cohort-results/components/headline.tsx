import type { CohortResults, EffectResult } from '@shared/schemas/cohort-results';
import { Card } from '@/components/ui/card';
import { useUnits } from '@/lib/units';
import { num, pct, plural, range } from './format';
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

function waterSentences(e: EffectResult, conf: number): string[] {
  const p = e.pooled;
  if (!p) return [`No pooled water saving yet: it needs at least 2 trials with two or more pairs of pot and surface beds with water records (now ${e.k}).`];
  const est = p.display.estimate;
  const [lo, hi] = p.display.ci;
  const out = [
    `Across ${plural(p.k, 'trial')} (${plural(new Set(e.forest.map((f) => f.pseudonym)).size, 'grower')}), the pots used about ${pct(Math.abs(est))} ${est >= 0 ? 'less' : 'more'} water than surface watering on the same bed area.`,
    `The ${conf} % confidence interval, ${range(p.display.ci, '%')} saved, is the range of average savings the data are compatible with. ` +
      (lo > 0
        ? 'All of it is a saving.'
        : hi < 0
          ? 'All of it means the pots used more water.'
          : 'It includes 0, so the data cannot yet tell whether the pots save water on average.'),
  ];
  if (p.display.predictionInterval) {
    out.push(
      `In one new garden like these, the saving would likely fall between ${num(p.display.predictionInterval[0])} and ${num(p.display.predictionInterval[1])} % (the ${conf} % prediction interval). It is wider than the confidence interval because gardens really differ, not only by chance.`,
    );
  } else {
    out.push('A prediction interval (where one new garden would likely fall) needs at least 3 trials.');
  }
  if (p.k < FEW_TRIALS) out.push(`With only ${plural(p.k, 'trial')}, how much gardens differ is itself a rough guess, so every interval here is a first look.`);
  return out;
}

/** The answer in one card: water saved, harvest and water-use efficiency, each with its interval and its caveats. */
export function Headline({ results }: { results: CohortResults }) {
  const units = useUnits();
  const conf = Math.round(results.options.confidence * 100);
  const water = results.effects.waterLogRatio;
  const harvest = results.effects.harvestPerPlantDiff;
  const wue = results.effects.wueLogRatio;
  const mass = (kg: number, signed = false) => `${num(units.show(kg, 'mass'), 2, signed)} ${units.label('mass')}`;

  const waterStat = water.pooled
    ? {
        value: water.pooled.display.estimate >= 0 ? pct(water.pooled.display.estimate) : `${pct(-water.pooled.display.estimate)} more`,
        lines: [
          `${conf} % CI ${range(water.pooled.display.ci, '%')}`,
          water.pooled.display.predictionInterval ? `New garden: ${range(water.pooled.display.predictionInterval, '%')}` : 'New garden: needs 3 trials',
          `${plural(water.pooled.k, 'trial')}`,
        ],
      }
    : { value: '—', lines: [`${plural(water.k, 'trial')} so far; pooling needs 2`] };

  const harvestStat = harvest.pooled
    ? {
        value: `${mass(harvest.pooled.display.estimate, true)}`,
        lines: [
          `${conf} % CI ${mass(harvest.pooled.display.ci[0], false)} to ${mass(harvest.pooled.display.ci[1], false)}`,
          `per plant, pots − surface · ${plural(harvest.pooled.k, 'trial')}`,
        ],
      }
    : { value: '—', lines: [`${plural(harvest.k, 'trial')} with harvests on both beds of two pairs; pooling needs 2`] };

  const wueStat = wue.pooled
    ? {
        value: pct(wue.pooled.display.estimate, 0, true),
        lines: [`${conf} % CI ${range(wue.pooled.display.ci, '%')}`, `harvest per litre, pots against surface · ${plural(wue.pooled.k, 'trial')}`],
      }
    : { value: '—', lines: [`${plural(wue.k, 'trial')} so far; pooling needs 2`] };

  const harvestSentence = (() => {
    const p = harvest.pooled;
    if (!p) return 'Harvest cannot be pooled yet: it needs at least 2 trials where every plot of two or more pairs has a harvest record.';
    const [lo, hi] = p.display.ci;
    const d = p.display.estimate;
    return (
      `Harvest: the pot beds gave ${mass(Math.abs(d))} ${d >= 0 ? 'more' : 'less'} per plant than the surface beds (${conf} % CI ${mass(lo)} to ${mass(hi)}, ${plural(p.k, 'trial')}). ` +
      (lo > 0
        ? 'That is clearly more harvest with pots.'
        : hi < 0
          ? 'That is clearly less harvest with pots.'
          : 'The interval includes 0: no clear difference in harvest either way.')
    );
  })();

  // Which shared trials are not in the water estimate, and why, counted.
  const reasons = new Map<string, number>();
  for (const t of results.trials) {
    const why = whyNotPooled(t, 'waterLogRatio', results.options);
    if (why) reasons.set(why, (reasons.get(why) ?? 0) + 1);
  }
  const inWater = results.trials.length - [...reasons.values()].reduce((a, b) => a + b, 0);

  return (
    <Card role="region" aria-labelledby="headline-heading" className="space-y-4">
      <h3 id="headline-heading">What the pots did, across all gardens</h3>
      <div className="grid gap-3 sm:grid-cols-3">
        <Stat label="Water saved by the pots" value={waterStat.value} lines={waterStat.lines} tone="olla" />
        <Stat label="Harvest per plant, pots − surface" value={harvestStat.value} lines={harvestStat.lines} tone="neutral" />
        <Stat label="Water-use efficiency change" value={wueStat.value} lines={wueStat.lines} tone="neutral" />
      </div>
      <div className="max-w-3xl space-y-2">
        {waterSentences(water, conf).map((s) => (
          <p key={s}>{s}</p>
        ))}
        <p>{harvestSentence}</p>
        <p className="text-sm text-ink-muted">
          {inWater} of {plural(results.trials.length, 'shared trial')} count in the water estimate
          {reasons.size
            ? `; not counted: ${[...reasons.entries()].map(([why, n]) => `${n} × ${why.charAt(0).toLowerCase()}${why.slice(1)}`).join('; ')}.`
            : '.'}{' '}
          Results are computed from the records up to {results.asOf}.
        </p>
      </div>
    </Card>
  );
}
