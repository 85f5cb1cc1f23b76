import { effectAxis, trialLabels } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectKey, PooledEstimate } from '@shared/schemas/cohort-results';
import { useUnits } from '@/lib/units';
import { measureLabels, num, plural, shift } from './format';

function PooledBox({
  label,
  q,
  value,
  interval,
  conf,
}: {
  label: string;
  q: PooledEstimate | null;
  value: (x: number) => string;
  interval: (ci: readonly [number, number]) => string;
  conf: number;
}) {
  return (
    <div className="rounded-lg border border-sand-200 bg-white p-3">
      <p className="text-sm text-ink-muted">{label}</p>
      {q ? (
        <>
          <p className="text-xl font-semibold">{value(q.display.estimate)}</p>
          <p className="text-sm text-ink-muted">
            {conf} % CI {interval(q.display.ci)} · {plural(q.k, 'trial')}
          </p>
        </>
      ) : (
        <p className="text-ink-muted">Not enough trials to pool</p>
      )}
    </div>
  );
}

const inside = (x: number, ci: readonly [number, number]) => x >= ci[0] && x <= ci[1];

/** How much the answer leans on single trials and on the flagged ones. */
export function Sensitivity({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  const units = useUnits();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system });
  const labels = trialLabels(results);
  const digits = axis.unit === '%' ? 0 : 2;
  const unit = axis.unit === '%' ? '%' : axis.unit;
  const shiftUnit = axis.unit === '%' ? 'points' : axis.unit;
  const v = (x: number) => `${num(axis.convert(x), digits)}\u00a0${unit}`;
  const iv = (ci: readonly [number, number]) => `${num(axis.convert(ci[0]), digits)} to ${num(axis.convert(ci[1]), digits)}`;
  const conf = Math.round(results.options.confidence * 100);
  const p = e.pooled;
  const s = e.sensitivity;
  const name = measureLabels[effect].toLowerCase();

  const loo = p
    ? [...s.leaveOneOut]
        .map((r) => ({ ...r, shift: axis.convert(r.display.estimate) - axis.convert(p.display.estimate) }))
        .sort((a, b) => Math.abs(b.shift) - Math.abs(a.shift))
    : [];
  const top = loo[0];
  const outside = p ? loo.filter((r) => !inside(r.display.estimate, p.display.ci)) : [];

  const flaggedSentence = (() => {
    if (s.flaggedTrials === 0) return 'No pooled trial has a quality flag, so there is nothing to compare.';
    if (!s.withFlagged || !s.withoutFlagged) return `${plural(s.flaggedTrials, 'trial')} with a quality flag; without them too few trials are left to pool.`;
    const d = axis.convert(s.withoutFlagged.display.estimate) - axis.convert(s.withFlagged.display.estimate);
    return `Leaving out the ${plural(s.flaggedTrials, 'flagged trial')} moves the pooled ${name} by ${shift(d, digits, shiftUnit)}${
      inside(s.withoutFlagged.display.estimate, s.withFlagged.display.ci)
        ? ', which stays inside the confidence interval with them: the answer does not hinge on the flagged trials.'
        : ', outside the confidence interval with them: check those entries before relying on either number.'
    }`;
  })();

  return (
    <div className="space-y-4">
      <div className="space-y-2">
        <h4 className="font-semibold">With and without flagged trials</h4>
        {s.flaggedTrials > 0 ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <PooledBox label="All trials, flagged or not" q={s.withFlagged} value={v} interval={iv} conf={conf} />
            <PooledBox label="Without flagged trials" q={s.withoutFlagged} value={v} interval={iv} conf={conf} />
          </div>
        ) : null}
        <p className="text-sm">{flaggedSentence}</p>
      </div>

      <div className="space-y-2">
        <h4 className="font-semibold">Leave one trial out</h4>
        {!p || !loo.length ? (
          <p className="text-sm text-ink-muted">Leave-one-out needs at least 3 pooled trials (now {e.k}).</p>
        ) : (
          <>
            <p className="text-sm">
              Each row pools every trial but one. Leaving out <strong>{labels[top!.omittedTrialId] ?? top!.pseudonym}</strong> moves the pooled {name} most:
              from {v(p.display.estimate)} to {v(top!.display.estimate)} ({shift(top!.shift, digits, shiftUnit)}).
              {outside.length === 0
                ? ' Every estimate with one trial left out stays inside the pooled confidence interval: no single trial carries the result.'
                : ` Without ${outside.map((r) => labels[r.omittedTrialId] ?? r.pseudonym).join(', ')} the estimate leaves the pooled confidence interval: the result leans on ${outside.length === 1 ? 'that trial' : 'those trials'}, so look at ${outside.length === 1 ? 'it' : 'them'} closely.`}
            </p>
            <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={`Pooled ${name} with each trial left out (scrolls sideways)`}>
              <table className="w-full text-sm">
                <caption className="sr-only">Pooled {name} with each trial left out, largest change first</caption>
                <thead className="bg-sand-100 text-left">
                  <tr>
                    <th scope="col" className="px-3 py-2 font-medium">
                      Trial left out
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      Pooled without it
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      {conf} % CI
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      Change
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      I²
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {loo.map((r) => (
                    <tr key={r.omittedTrialId} className="border-t border-sand-100">
                      <th scope="row" className="px-3 py-2 text-left font-medium">
                        {labels[r.omittedTrialId] ?? r.pseudonym}
                      </th>
                      <td className="num whitespace-nowrap px-3 py-2">{v(r.display.estimate)}</td>
                      <td className="num whitespace-nowrap px-3 py-2">{iv(r.display.ci)}</td>
                      <td className="num whitespace-nowrap px-3 py-2">{shift(r.shift, digits, shiftUnit)}</td>
                      <td className="num whitespace-nowrap px-3 py-2">{num(r.i2, 0)} %</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </>
        )}
      </div>
    </div>
  );
}
