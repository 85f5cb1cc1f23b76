import { effectAxis, trialLabels } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectKey, PooledEstimate } from '@shared/schemas/cohort-results';
import { useTranslation } from 'react-i18next';
import { useUnits } from '@/lib/units';
import { measureLabel, num, sharedT, trials } from './format';

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
  const { t } = useTranslation('cohortResults');
  return (
    <div className="rounded-lg border border-sand-200 bg-white p-3">
      <p className="text-sm text-ink-muted">{label}</p>
      {q ? (
        <>
          <p className="text-xl font-semibold">{value(q.display.estimate)}</p>
          <p className="text-sm text-ink-muted">
            {t(($) => $.sensitivity.ci, { confidence: conf, range: interval(q.display.ci), trials: trials(q.k) })}
          </p>
        </>
      ) : (
        <p className="text-ink-muted">{t(($) => $.sensitivity.notEnough)}</p>
      )}
    </div>
  );
}

const inside = (x: number, ci: readonly [number, number]) => x >= ci[0] && x <= ci[1];

/** How much the answer leans on single trials and on the flagged ones. */
export function Sensitivity({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  const { t } = useTranslation('cohortResults');
  const units = useUnits();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system });
  const labels = trialLabels(results, sharedT());
  const digits = axis.unit === '%' ? 0 : 2;
  const unit = axis.unit === '%' ? '%' : axis.unit;
  const points = axis.unit === '%';
  /** A signed change: "+4 points", "−1 point", "+0.12 kg". */
  const shift = (d: number) => {
    const n = num(d, digits, true);
    if (!points) return `${n}\u00a0${unit}`;
    return t(($) => $.sensitivity.points, { count: Math.abs(Number(d.toFixed(digits))), value: n }).replace(' ', '\u00a0');
  };
  const v = (x: number) => `${num(axis.convert(x), digits)}\u00a0${unit}`;
  const iv = (ci: readonly [number, number]) => t(($) => $.range, { lo: num(axis.convert(ci[0]), digits), hi: num(axis.convert(ci[1]), digits) });
  const conf = Math.round(results.options.confidence * 100);
  const p = e.pooled;
  const s = e.sensitivity;
  const name = measureLabel(effect, true);

  const loo = p
    ? [...s.leaveOneOut]
        .map((r) => ({ ...r, shift: axis.convert(r.display.estimate) - axis.convert(p.display.estimate) }))
        .sort((a, b) => Math.abs(b.shift) - Math.abs(a.shift))
    : [];
  const top = loo[0];
  const outside = p ? loo.filter((r) => !inside(r.display.estimate, p.display.ci)) : [];
  // The lead sentence names the trial in bold: translate it around a marker, then put the name in its place.
  const MARK = '\u0001';
  const [leadBefore = '', leadAfter = ''] =
    p && top
      ? t(($) => $.sensitivity.looLead, { trial: MARK, measure: name, from: v(p.display.estimate), to: v(top.display.estimate), shift: shift(top.shift) }).split(MARK)
      : [];

  const flaggedSentence = (() => {
    if (s.flaggedTrials === 0) return t(($) => $.sensitivity.noFlagged);
    if (!s.withFlagged || !s.withoutFlagged) return t(($) => $.sensitivity.tooFewWithout, { count: s.flaggedTrials });
    const d = axis.convert(s.withoutFlagged.display.estimate) - axis.convert(s.withFlagged.display.estimate);
    const values = { count: s.flaggedTrials, measure: name, shift: shift(d) };
    return inside(s.withoutFlagged.display.estimate, s.withFlagged.display.ci)
      ? t(($) => $.sensitivity.flaggedMovesInside, values)
      : t(($) => $.sensitivity.flaggedMovesOutside, values);
  })();

  return (
    <div className="space-y-4">
      <div className="space-y-2">
        <h4 className="font-semibold">{t(($) => $.sensitivity.withWithout)}</h4>
        {s.flaggedTrials > 0 ? (
          <div className="grid gap-3 sm:grid-cols-2">
            <PooledBox label={t(($) => $.sensitivity.allTrials)} q={s.withFlagged} value={v} interval={iv} conf={conf} />
            <PooledBox label={t(($) => $.sensitivity.withoutFlagged)} q={s.withoutFlagged} value={v} interval={iv} conf={conf} />
          </div>
        ) : null}
        <p className="text-sm">{flaggedSentence}</p>
      </div>

      <div className="space-y-2">
        <h4 className="font-semibold">{t(($) => $.sensitivity.looHeading)}</h4>
        {!p || !loo.length ? (
          <p className="text-sm text-ink-muted">{t(($) => $.sensitivity.looNeeds, { k: e.k })}</p>
        ) : (
          <>
            <p className="text-sm">
              {leadBefore}
              <strong>{labels[top!.omittedTrialId]}</strong>
              {leadAfter}
              {outside.length === 0
                ? t(($) => $.sensitivity.looStable)
                : t(($) => $.sensitivity.looLeans, { count: outside.length, trials: outside.map((r) => labels[r.omittedTrialId]).join(', ') })}
            </p>
            <div className="overflow-x-auto rounded-card border border-sand-200 bg-white" tabIndex={0} role="region" aria-label={t(($) => $.sensitivity.tableLabel, { measure: name })}>
              <table className="w-full text-sm">
                <caption className="sr-only">{t(($) => $.sensitivity.caption, { measure: name })}</caption>
                <thead className="bg-sand-100 text-left">
                  <tr>
                    <th scope="col" className="px-3 py-2 font-medium">
                      {t(($) => $.sensitivity.trialLeftOut)}
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      {t(($) => $.sensitivity.pooledWithout)}
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      {t(($) => $.sensitivity.ciHeading, { confidence: conf })}
                    </th>
                    <th scope="col" className="px-3 py-2 text-right font-medium">
                      {t(($) => $.sensitivity.change)}
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
                        {labels[r.omittedTrialId]}
                      </th>
                      <td className="num whitespace-nowrap px-3 py-2">{v(r.display.estimate)}</td>
                      <td className="num whitespace-nowrap px-3 py-2">{iv(r.display.ci)}</td>
                      <td className="num whitespace-nowrap px-3 py-2">{shift(r.shift)}</td>
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
