import { effectAxis } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectKey, ModeratorKey, SubgroupAnalysis } from '@shared/schemas/cohort-results';
import { useTranslation } from 'react-i18next';
import { useUnits } from '@/lib/units';
import { crT, measureLabel, num, pText, pValue } from './format';
import { levelLabel, moderatorLabel } from './labels';

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** "a, b and c". */
function listWords(items: string[]): string {
  return items.length <= 1 ? (items[0] ?? '') : crT()(($) => $.subgroups.and, { list: items.slice(0, -1).join(', '), last: items.at(-1) });
}

/**
 * Features that split the pooled trials into the same groups (e.g. every tomato trial used globe
 * pots and no other did): their subgroup tests are the same test, and the features are confounded.
 */
function sameSplits(results: CohortResults, effect: EffectKey, tested: SubgroupAnalysis[]): ModeratorKey[][] {
  const pooled = new Set(results.effects[effect].forest.map((f) => f.trialId));
  const trials = results.trials.filter((t) => pooled.has(t.trialId));
  const bySplit = new Map<string, ModeratorKey[]>();
  for (const s of tested) {
    const groups = new Map<string, string[]>();
    for (const t of trials) {
      const level = t.moderators[s.moderator];
      if (!level || level === 'unknown') continue;
      groups.set(level, [...(groups.get(level) ?? []), t.trialId]);
    }
    const key = JSON.stringify([...groups.values()].map((g) => g.sort().join()).sort());
    bySplit.set(key, [...(bySplit.get(key) ?? []), s.moderator]);
  }
  return [...bySplit.values()].filter((g) => g.length > 1);
}

function verdict(s: SubgroupAnalysis): { short: string; long: string } {
  const t = crT();
  if (!s.test) {
    return { short: t(($) => $.subgroups.nothing), long: s.levels.length === 0 ? t(($) => $.subgroups.noPooled) : t(($) => $.subgroups.oneValue) };
  }
  const stats = t(($) => $.subgroups.stats, { q: num(s.test.q, 2), df: num(s.test.df, 0), p: pText(s.test.pValue) });
  if (s.test.pValue !== null && s.test.pValue < 0.05) {
    return { short: t(($) => $.subgroups.differ), long: t(($) => $.subgroups.differLong, { stats }) };
  }
  return { short: t(($) => $.subgroups.noClear), long: t(($) => $.subgroups.noClearLong, { stats }) };
}

/**
 * "What changes the outcome": the measure pooled within each level of every recorded feature of
 * the trials, with the between-subgroup test and warnings where a level has fewer than 3 trials.
 */
export function Subgroups({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  // `pots` and `gardens` hold the words for pot shapes, makes and soil textures that levelLabel reuses.
  const { t } = useTranslation(['cohortResults', 'pots', 'gardens']);
  const units = useUnits();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system });
  const digits = axis.unit === '%' ? 0 : 2;
  const unit = axis.unit === '%' ? '%' : axis.unit;
  const conf = Math.round(results.options.confidence * 100);

  if (e.k < 2) {
    return <p className="text-ink-muted">{t(($) => $.subgroups.needPooled, { measure: measureLabel(effect, true) })}</p>;
  }
  const tested = e.subgroups.filter((s) => s.test);
  const untested = e.subgroups.filter((s) => !s.test && s.levels.length > 0);
  const confounded = sameSplits(results, effect, tested);

  return (
    <div className="space-y-4">
      <div className="max-w-3xl space-y-2 text-sm">
        <p>{t(($) => $.subgroups.intro, { count: e.k })}</p>
        <p className="text-ink-muted">
          {t(($) => $.subgroups.leads)}
          {tested.length > 1 ? t(($) => $.subgroups.manyTests, { count: tested.length }) : ''}.
        </p>
        {confounded.map((group) => (
          <p key={group.join()} className="text-amber-900">
            {t(($) => $.subgroups.confounded, { features: capitalise(listWords(group.map((m) => moderatorLabel(m, true)))) })}
          </p>
        ))}
        {untested.length ? (
          <p className="text-ink-muted">
            {t(($) => $.subgroups.untested, {
              count: untested.length,
              features: listWords(untested.map((u) => `${moderatorLabel(u.moderator, true)} (${u.levels.map((l) => levelLabel(u.moderator, l.level, units.system)).join(', ')})`)),
            })}
          </p>
        ) : null}
      </div>
      {tested.length === 0 ? <p>{t(($) => $.subgroups.noneDiffer)}</p> : null}

      {tested.length ? (
        <div className="overflow-x-auto rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm">
            <caption className="sr-only">{t(($) => $.subgroups.caption, { measure: measureLabel(effect, true) })}</caption>
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.subgroups.feature)}
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  {t(($) => $.subgroups.groups)}
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  p
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  {t(($) => $.subgroups.inWords)}
                </th>
              </tr>
            </thead>
            <tbody>
              {tested.map((s) => (
                <tr key={s.moderator} className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    <a className="underline decoration-sand-400 underline-offset-2 hover:text-terracotta-700" href={`#subgroup-${s.moderator}`}>
                      {moderatorLabel(s.moderator)}
                    </a>
                  </th>
                  <td className="num px-3 py-2">{s.levels.length}</td>
                  <td className="num px-3 py-2">{s.test ? pValue(s.test.pValue) : '—'}</td>
                  <td className="px-3 py-2">
                    {verdict(s).short}
                    {s.warning ? <span className="text-amber-900">{t(($) => $.subgroups.smallGroups)}</span> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}

      <div className="grid gap-4 lg:grid-cols-2">
        {tested.map((s) => {
          const v = verdict(s);
          const headingId = `subgroup-${s.moderator}`;
          return (
            <section key={s.moderator} aria-labelledby={headingId} className="space-y-2 rounded-card border border-sand-200 bg-white p-4">
              <h4 id={headingId} className="scroll-mt-4 font-semibold">
                {moderatorLabel(s.moderator)}
              </h4>
              <p className="text-sm">{v.long}</p>
              <div className="overflow-x-auto">
                <table className="w-full text-sm">
                  <caption className="sr-only">
                    {t(($) => $.subgroups.byCaption, { measure: measureLabel(effect), feature: moderatorLabel(s.moderator, true) })}
                  </caption>
                  <thead className="text-left text-ink-muted">
                    <tr>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        {t(($) => $.subgroups.group)}
                      </th>
                      <th scope="col" className="py-1 pr-3 text-right font-medium">
                        {t(($) => $.subgroups.trials)}
                      </th>
                      <th scope="col" className="py-1 pr-3 text-right font-medium">
                        {t(($) => $.subgroups.pooled)}
                      </th>
                      <th scope="col" className="py-1 text-right font-medium">
                        {t(($) => $.subgroups.ci, { confidence: conf })}
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {s.levels.map((l) => (
                      <tr key={l.level} className="border-t border-sand-100">
                        <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                          {levelLabel(s.moderator, l.level, units.system)}
                          {l.smallSample ? (
                            <span className="ml-1 text-amber-900" title={t(($) => $.subgroups.fewerThan3)}>
                              ⚠<span className="sr-only">{t(($) => $.subgroups.fewerThan3Sr)}</span>
                            </span>
                          ) : null}
                          {l.level === 'unknown' && s.test ? <span className="block text-xs text-ink-muted">{t(($) => $.subgroups.notInTest)}</span> : null}
                        </th>
                        <td className="num whitespace-nowrap py-1.5 pr-3">{l.k}</td>
                        <td className="num whitespace-nowrap py-1.5 pr-3">
                          {num(axis.convert(l.display.estimate), digits)} {unit}
                        </td>
                        <td className="num whitespace-nowrap py-1.5">
                          {t(($) => $.range, { lo: num(axis.convert(l.display.ci[0]), digits), hi: num(axis.convert(l.display.ci[1]), digits) })}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              {s.warning ? (
                <p className="text-sm text-amber-900">
                  {t(($) => $.subgroups.smallWarning, { count: s.levels.filter((l) => l.smallSample).length })}
                </p>
              ) : null}
            </section>
          );
        })}
      </div>
    </div>
  );
}
