import { useState, type ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { Card } from '@/components/ui/card';
import { useCohortResults } from '../api/get-cohort-results';
import { useDeleteExclusion } from '../api/delete-exclusion';
import { useResultsOptions } from '../hooks/use-results-options';
import { ExcludeDialog, type ExcludeTarget } from './exclude-dialog';
import { ExportLinks } from './export-links';
import { ForestPlot } from './forest-plot';
import { measureLabels } from './format';
import { Headline } from './headline';
import { ProgressChart } from './progress-chart';
import { ResultsOptions } from './results-options';
import { Sensitivity } from './sensitivity';
import { Subgroups } from './subgroups';
import { ExclusionsList, TrialsTable } from './trials-table';

const parts = [
  { id: 'results-forest', label: 'Forest plot' },
  { id: 'results-trials', label: 'Trials' },
  { id: 'results-subgroups', label: 'What changes it' },
  { id: 'results-sensitivity', label: 'Sensitivity' },
  { id: 'results-progress', label: 'Season' },
  { id: 'results-downloads', label: 'Downloads' },
] as const;

function Part({ id, title, intro, children }: { id: string; title: string; intro?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-heading`} className="space-y-3">
      <h3 id={`${id}-heading`} className="scroll-mt-4" tabIndex={-1}>
        {title}
      </h3>
      {intro ? <div className="max-w-3xl text-sm text-ink-muted">{intro}</div> : null}
      {children}
    </section>
  );
}

/**
 * The cohort's pooled results, for every member: the answer in words, the forest plot, the
 * trials with their quality flags (and, for the lead, exclusions with reasons), what changes the
 * outcome, sensitivity, the season's water, and the CSV downloads. Pseudonyms only.
 */
export function CohortResultsSection({ cohortId, canExclude }: { cohortId: string; canExclude: boolean }) {
  const { query, measure, set } = useResultsOptions();
  const results = useCohortResults(cohortId, query);
  const include = useDeleteExclusion(cohortId);
  const [excluding, setExcluding] = useState<ExcludeTarget | null>(null);
  const data = results.data;
  const updating = results.isFetching && results.isPlaceholderData;

  // Until a trial is shared there is nothing to pool: a line saying so, no empty section with headings.
  if (results.isPending) {
    return (
      <p role="status" className="text-ink-muted">
        Loading the pooled results…
      </p>
    );
  }
  if (results.isSuccess && results.data.trials.length === 0) {
    return (
      <Card className="bg-sand-50">
        <p className="text-ink-muted">
          <strong className="font-semibold text-ink">No trials shared yet.</strong> The pooled result across the gardens appears here once contributors share
          their trials (from a trial’s Sharing tab); it needs two trials, each with two or more pairs of pot and surface beds with water records.
        </p>
      </Card>
    );
  }

  let body: ReactNode;
  if (results.isError) {
    body = <Alert tone="error">Could not load the pooled results: {results.error.message}</Alert>;
  } else {
    const r = data!;
    body = (
      <div className="space-y-8">
        {/* The answer first; the switches that change it right below. */}
        <Headline results={r} />
        <Card role="group" aria-label="How the trials are pooled" className="bg-sand-50">
          <ResultsOptions query={query} measure={measure} results={r} onChange={set} />
        </Card>

        <nav aria-label="Parts of the pooled results" className="text-sm">
          <ul className="flex flex-wrap gap-x-4 gap-y-1">
            {parts.map((p) => (
              <li key={p.id}>
                <a className="inline-flex min-h-10 items-center font-medium text-terracotta-700 underline" href={`#${p.id}-heading`}>
                  {p.label}
                </a>
              </li>
            ))}
          </ul>
        </nav>

        <Part id="results-forest" title={`${measureLabels[measure]}: each trial and pooled`}>
          <ForestPlot results={r} effect={measure} />
        </Part>

        <Part
          id="results-trials"
          title="Trials"
          intro={
            <>
              Every shared trial by its grower’s pseudonym and crop; regions are rounded to whole degrees (about 110 km). Quality flags are prompts to check the
              entries, never corrections. {canExclude ? 'As lead you can leave a trial out, with a reason the whole cohort sees, and put it back.' : ''}
            </>
          }
        >
          <TrialsTable
            results={r}
            measure={measure}
            actions={
              canExclude
                ? {
                    onExclude: setExcluding,
                    onInclude: (trialId) => include.mutate(trialId),
                    includingId: include.isPending ? (include.variables ?? null) : null,
                  }
                : null
            }
          />
          {include.isError ? <Alert tone="error">Could not put the trial back: {include.error.message}</Alert> : null}
          <h4 className="pt-2 font-semibold">Left out by the lead</h4>
          <ExclusionsList results={r} />
        </Part>

        <Part id="results-subgroups" title={`What changes the ${measureLabels[measure].toLowerCase()}`}>
          <Subgroups results={r} effect={measure} />
        </Part>

        <Part id="results-sensitivity" title="Sensitivity: how firm is the answer?">
          <Sensitivity results={r} effect={measure} />
        </Part>

        <Part
          id="results-progress"
          title="Water over the season"
          intro="Every shared trial the lead has not left out, flagged or not: this describes what was logged, week by week."
        >
          <ProgressChart results={r} />
        </Part>

        <Part id="results-downloads" title="Downloads">
          <ExportLinks cohortId={cohortId} />
        </Part>

        <details className="rounded-card border border-sand-200 bg-white p-4 text-sm">
          <summary className="cursor-pointer font-medium text-terracotta-700">How these numbers are made</summary>
          <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-muted">
            {r.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
            <li>
              Single-pair trials (when included) borrow, as variance, the median per-pair variance of the trials with two or more pairs. This is a pragmatic
              choice, not a published rule.
            </li>
            <li>Subgroups are pooled each with its own τ²; the test between subgroups leaves out “not recorded”.</li>
            <li>
              Quality flags: results far from the cohort’s median (modified z-score beyond ±3.5, from 4 trials up), weeks that look like a gallon / litre
              mix-up, several soil moisture methods in one trial, and trials closed without a harvest.
            </li>
          </ul>
        </details>
      </div>
    );
  }

  return (
    <section aria-labelledby="pooled-heading" aria-busy={updating || undefined} className="space-y-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="pooled-heading">Pooled results</h2>
        {updating ? (
          <p role="status" className="text-sm text-ink-muted">
            Updating…
          </p>
        ) : null}
      </div>
      {body}
      {canExclude ? <ExcludeDialog cohortId={cohortId} target={excluding} onClose={() => setExcluding(null)} /> : null}
    </section>
  );
}
