import { effectAxis } from '@shared/charts/cohort-charts';
import type { CohortResults, EffectKey, ModeratorKey, SubgroupAnalysis } from '@shared/schemas/cohort-results';
import { useUnits } from '@/lib/units';
import { measureLabels, num, pText, pValue, plural } from './format';
import { levelLabel, moderatorLabels } from './labels';

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** "a, b and c". */
function listWords(items: string[]): string {
  return items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} and ${items.at(-1)}`;
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
  if (!s.test) {
    return s.levels.length === 0
      ? { short: 'Nothing to compare', long: 'No pooled trials.' }
      : { short: 'Nothing to compare', long: 'The pooled trials share one known value (or it was not recorded), so there is nothing to compare.' };
  }
  const stats = `Q = ${num(s.test.q, 2)} on ${s.test.df} df, ${pText(s.test.pValue)}`;
  if (s.test.pValue !== null && s.test.pValue < 0.05) {
    return { short: 'Groups differ', long: `The groups differ more than chance alone would easily explain (${stats}).` };
  }
  return {
    short: 'No clear difference',
    long: `No clear difference between the groups (${stats}); with few trials per group that is not proof they are alike.`,
  };
}

/**
 * "What changes the outcome": the measure pooled within each level of every recorded feature of
 * the trials, with the between-subgroup test and warnings where a level has fewer than 3 trials.
 */
export function Subgroups({ results, effect }: { results: CohortResults; effect: EffectKey }) {
  const units = useUnits();
  const e = results.effects[effect];
  const axis = effectAxis(effect, { units: units.system });
  const digits = axis.unit === '%' ? 0 : 2;
  const unit = axis.unit === '%' ? '%' : axis.unit;
  const conf = Math.round(results.options.confidence * 100);

  if (e.k < 2) {
    return <p className="text-ink-muted">Subgroups need a pooled estimate first: at least 2 trials with a {measureLabels[effect].toLowerCase()} result.</p>;
  }
  const tested = e.subgroups.filter((s) => s.test);
  const untested = e.subgroups.filter((s) => !s.test && s.levels.length > 0);
  const confounded = sameSplits(results, effect, tested);

  return (
    <div className="space-y-4">
      <div className="max-w-3xl space-y-2 text-sm">
        <p>
          Each feature splits the {plural(e.k, 'pooled trial')} into groups, pools each group on its own and tests whether the groups differ more than chance
          would explain.
        </p>
        <p className="text-ink-muted">
          Read these as leads, not proof: gardens chose their own pots, crops and soils, so a difference may come from something else that goes with the
          feature. Each test also has a one-in-twenty chance of looking clear by chance alone
          {tested.length > 1 ? `, and ${tested.length} features are tested here` : ''}.
        </p>
        {confounded.map((group) => (
          <p key={group.join()} className="text-amber-900">
            ⚠ {capitalise(listWords(group.map((m) => moderatorLabels[m].toLowerCase())))} split the trials into exactly the same groups, so their effects cannot
            be told apart here.
          </p>
        ))}
        {untested.length ? (
          <p className="text-ink-muted">
            Nothing to compare for{' '}
            {listWords(
              untested.map((u) => `${moderatorLabels[u.moderator].toLowerCase()} (${u.levels.map((l) => levelLabel(u.moderator, l.level)).join(', ')})`),
            )}
            : the pooled trials do not differ in {untested.length === 1 ? 'it' : 'these'}, or it was not recorded.
          </p>
        ) : null}
      </div>
      {tested.length === 0 ? <p>None of the recorded features differs between the pooled trials yet, so there is nothing to compare.</p> : null}

      {tested.length ? (
        <div className="overflow-x-auto rounded-card border border-sand-200 bg-white">
          <table className="w-full text-sm">
            <caption className="sr-only">Does the {measureLabels[effect].toLowerCase()} depend on these features?</caption>
            <thead className="bg-sand-100 text-left">
              <tr>
                <th scope="col" className="px-3 py-2 font-medium">
                  Feature
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  Groups
                </th>
                <th scope="col" className="px-3 py-2 text-right font-medium">
                  p
                </th>
                <th scope="col" className="px-3 py-2 font-medium">
                  In words
                </th>
              </tr>
            </thead>
            <tbody>
              {tested.map((s) => (
                <tr key={s.moderator} className="border-t border-sand-100">
                  <th scope="row" className="px-3 py-2 text-left font-medium">
                    <a className="underline decoration-sand-400 underline-offset-2 hover:text-terracotta-700" href={`#subgroup-${s.moderator}`}>
                      {moderatorLabels[s.moderator]}
                    </a>
                  </th>
                  <td className="num px-3 py-2">{s.levels.length}</td>
                  <td className="num px-3 py-2">{s.test ? pValue(s.test.pValue) : '—'}</td>
                  <td className="px-3 py-2">
                    {verdict(s).short}
                    {s.warning ? <span className="text-amber-900"> · small groups</span> : null}
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
                {moderatorLabels[s.moderator]}
              </h4>
              <p className="text-sm">{v.long}</p>
              <div className="overflow-x-auto">
                <table className="w-full text-sm">
                  <caption className="sr-only">
                    {measureLabels[effect]} by {moderatorLabels[s.moderator].toLowerCase()}
                  </caption>
                  <thead className="text-left text-ink-muted">
                    <tr>
                      <th scope="col" className="py-1 pr-3 font-medium">
                        Group
                      </th>
                      <th scope="col" className="py-1 pr-3 text-right font-medium">
                        Trials
                      </th>
                      <th scope="col" className="py-1 pr-3 text-right font-medium">
                        Pooled
                      </th>
                      <th scope="col" className="py-1 text-right font-medium">
                        {conf} % CI
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {s.levels.map((l) => (
                      <tr key={l.level} className="border-t border-sand-100">
                        <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                          {levelLabel(s.moderator, l.level)}
                          {l.smallSample ? (
                            <span className="ml-1 text-amber-900" title="Fewer than 3 trials">
                              ⚠<span className="sr-only">fewer than 3 trials</span>
                            </span>
                          ) : null}
                          {l.level === 'unknown' && s.test ? <span className="block text-xs text-ink-muted">not in the test</span> : null}
                        </th>
                        <td className="num whitespace-nowrap py-1.5 pr-3">{l.k}</td>
                        <td className="num whitespace-nowrap py-1.5 pr-3">
                          {num(axis.convert(l.display.estimate), digits)} {unit}
                        </td>
                        <td className="num whitespace-nowrap py-1.5">
                          {num(axis.convert(l.display.ci[0]), digits)} to {num(axis.convert(l.display.ci[1]), digits)}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              {s.warning ? (
                <p className="text-sm text-amber-900">
                  ⚠ Fewer than 3 trials in {s.levels.filter((l) => l.smallSample).length === 1 ? 'one group' : 'some groups'}: those estimates are unstable and
                  the test has little power.
                </p>
              ) : null}
            </section>
          );
        })}
      </div>
    </div>
  );
}
