import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Link, useParams } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { ResultsTab } from '@/features/analysis/components/results-tab';
import { useCohorts } from '@/features/cohorts/api/get-cohorts';
import { ImportWizard } from '@/features/import/components/import-wizard';
import { LogsPanel } from '@/features/logs/components/logs-panel';
import { RefillForecastTable } from '@/features/notifications/components/refill-forecast-table';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { usePlots } from '@/features/trials/api/get-plots';
import { useTrial } from '@/features/trials/api/get-trial';
import { useUpdateTrial } from '@/features/trials/api/trial-mutations';
import { AuditList } from '@/features/trials/components/audit-list';
import { PlotsPanel } from '@/features/trials/components/plots-panel';
import { SharePanel } from '@/features/trials/components/share-panel';
import { StatusBar } from '@/features/trials/components/status-bar';
import { TrialForm } from '@/features/trials/components/trial-form';
import { formatDate } from '@/lib/format';
import { cn } from '@/lib/utils';

type Tab = 'results' | 'records' | 'import' | 'setup' | 'sharing' | 'history';

function ExportLinks({ trialId }: { trialId: string }) {
  const { t } = useTranslation('trials');
  const files = ['water-events', 'moisture-readings', 'harvests', 'weather-days', 'plots', 'data-dictionary'];
  return (
    <section aria-labelledby="export-heading" className="mt-6 space-y-2">
      <h2 id="export-heading">{t(($) => $.export.title)}</h2>
      <p className="text-sm text-ink-muted">{t(($) => $.export.intro)}</p>
      <ul className="flex flex-wrap gap-2">
        <li>
          <a className="inline-flex min-h-10 items-center rounded-lg bg-terracotta-600 px-3 text-sm font-medium text-white hover:bg-terracotta-700" href={`/api/trials/${trialId}/report.zip`} download>
            {t(($) => $.export.bundle)}
          </a>
        </li>
        {files.map((f) => (
          <li key={f}>
            <a className="inline-flex min-h-10 items-center rounded-lg border border-sand-300 bg-white px-3 text-sm font-medium hover:bg-sand-100" href={`/api/trials/${trialId}/export/${f}.csv`} download>
              {f}.csv
            </a>
          </li>
        ))}
      </ul>
    </section>
  );
}

export function TrialPage() {
  const { trialId = '' } = useParams();
  const trial = useTrial(trialId);
  const plots = usePlots(trialId);
  const cohorts = useCohorts();
  const update = useUpdateTrial(trialId);
  const [tab, setTab] = useState<Tab>('results');
  const [editing, setEditing] = useState(false);
  const user = useCurrentUser();
  const { t } = useTranslation('trials');
  const { t: tc } = useTranslation('common');
  if (trial.isPending) return <p role="status">{t(($) => $.page.loading)}</p>;
  if (trial.isError) return <Alert tone="error">{trial.error.message}</Alert>;
  const tr = trial.data;
  const owner = tr.access === 'owner';
  const tabs: { id: Tab; label: string }[] = [
    { id: 'results', label: t(($) => $.page.tabs.results) },
    { id: 'records', label: t(($) => $.page.tabs.records) },
    ...(owner && tr.status !== 'closed' ? [{ id: 'import' as const, label: t(($) => $.page.tabs.import) }] : []),
    { id: 'setup', label: t(($) => $.page.tabs.setup) },
    ...(owner ? [{ id: 'sharing' as const, label: t(($) => $.page.tabs.sharing) }, { id: 'history' as const, label: t(($) => $.page.tabs.history) }] : []),
  ];
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-3">
        <div>
          <p className="text-sm text-ink-muted">
            {owner ? (
              <Link className="underline" to={paths.garden(tr.gardenId)}>
                {tr.gardenName}
              </Link>
            ) : (
              t(($) => $.page.sharedWithCohort)
            )}
          </p>
          <h1>{tr.title}</h1>
          <p className="text-ink-muted">
            {tr.crop === 'other' ? tr.cropName : t(($) => $.crops[tr.crop])}
            {tr.variety ? ` · ${tr.variety}` : ''} · {t(($) => $.page.planted, { date: formatDate(tr.plantingDate) })}
            {tr.endDate ? ` · ${t(($) => $.page.ends, { date: formatDate(tr.endDate) })}` : ''}
          </p>
        </div>
        {owner && tr.status === 'active' ? (
          <Link to={paths.round(tr.id)} className="ml-auto inline-flex min-h-12 items-center rounded-lg bg-terracotta-600 px-5 text-lg font-medium text-white hover:bg-terracotta-700">
            {t(($) => $.page.todaysRound)}
          </Link>
        ) : null}
      </div>
      {tr.question ? <p className="rounded-card border-l-4 border-terracotta-300 bg-white px-4 py-3 italic">“{tr.question}”</p> : null}
      <StatusBar trial={tr} />
      <div role="tablist" aria-label={t(($) => $.page.sections)} className="flex flex-wrap gap-1 border-b border-sand-200">
        {tabs.map((x) => (
          <button
            key={x.id}
            type="button"
            role="tab"
            id={`tab-${x.id}`}
            aria-selected={tab === x.id}
            aria-controls={`panel-${x.id}`}
            onClick={() => setTab(x.id)}
            className={cn('min-h-11 rounded-t-lg px-4 font-medium', tab === x.id ? 'border-b-2 border-terracotta-600 text-terracotta-800' : 'text-ink-muted hover:text-ink')}
          >
            {x.label}
          </button>
        ))}
      </div>
      <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`}>
        {tab === 'results' ? (
          <div className="space-y-6">
            {owner && tr.status === 'active' ? <RefillForecastTable trialId={tr.id} /> : null}
            <ResultsTab trialId={tr.id} treatments={tr.treatments} />
          </div>
        ) : null}
        {tab === 'records' ? <LogsPanel trialId={tr.id} timeZone={tr.timeZone} plots={plots.data ?? []} editable={owner && tr.status !== 'closed'} /> : null}
        {tab === 'import' && user ? <ImportWizard trialId={tr.id} userId={user.id} timeZone={tr.timeZone} /> : null}
        {tab === 'records' ? <ExportLinks trialId={tr.id} /> : null}
        {tab === 'setup' ? (
          <div className="space-y-6">
            <PlotsPanel trial={tr} />
            {owner && tr.status !== 'closed' ? (
              <section aria-labelledby="details-heading" className="space-y-3">
                <div className="flex items-center gap-3">
                  <h2 id="details-heading">{t(($) => $.page.details)}</h2>
                  <Button variant="secondary" size="sm" onClick={() => setEditing((v) => !v)}>
                    {editing ? tc(($) => $.actions.cancel) : tc(($) => $.actions.edit)}
                  </Button>
                </div>
                {editing ? (
                  <TrialForm trial={tr} submitLabel={t(($) => $.page.saveChanges)} onSubmit={(input) => update.mutateAsync(input).then(() => setEditing(false))} />
                ) : (
                  <dl className="grid gap-2 text-sm sm:grid-cols-2">
                    <div>
                      <dt className="text-ink-muted">{t(($) => $.page.protocolNotes)}</dt>
                      <dd className="whitespace-pre-wrap">{tr.protocolNotes || '—'}</dd>
                    </div>
                    <div>
                      <dt className="text-ink-muted">{t(($) => $.page.treatments)}</dt>
                      <dd>{tr.treatments.map((x) => (x === 'olla' || x === 'surface' ? t(($) => $.treatments[x]) : x)).join(t(($) => $.page.vs))}</dd>
                    </div>
                  </dl>
                )}
              </section>
            ) : null}
          </div>
        ) : null}
        {tab === 'sharing' && owner ? <SharePanel trialId={tr.id} cohorts={cohorts.data ?? []} /> : null}
        {tab === 'history' && owner ? <AuditList trialId={tr.id} /> : null}
      </div>
    </div>
  );
}
