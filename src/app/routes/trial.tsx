import { useState } from 'react';
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
import { cropLabels } from '@shared/schemas/trials';
import { cn } from '@/lib/utils';

type Tab = 'results' | 'records' | 'import' | 'setup' | 'sharing' | 'history';

function ExportLinks({ trialId }: { trialId: string }) {
  const files = ['water-events', 'moisture-readings', 'harvests', 'weather-days', 'plots', 'data-dictionary'];
  return (
    <section aria-labelledby="export-heading" className="mt-6 space-y-2">
      <h2 id="export-heading">Download as CSV</h2>
      <p className="text-sm text-ink-muted">One row per observation, ISO 8601 dates, SI units in the column names; the data dictionary describes every column.</p>
      <ul className="flex flex-wrap gap-2">
        <li>
          <a className="inline-flex min-h-10 items-center rounded-lg bg-terracotta-600 px-3 text-sm font-medium text-white hover:bg-terracotta-700" href={`/api/trials/${trialId}/report.zip`} download>
            Report bundle (ZIP: data, charts, methods)
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
  if (trial.isPending) return <p role="status">Loading the trial…</p>;
  if (trial.isError) return <Alert tone="error">{trial.error.message}</Alert>;
  const t = trial.data;
  const owner = t.access === 'owner';
  const tabs: { id: Tab; label: string }[] = [
    { id: 'results', label: 'Results' },
    { id: 'records', label: 'Records' },
    ...(owner && t.status !== 'closed' ? ([{ id: 'import', label: 'Import' }] as const) : []),
    { id: 'setup', label: 'Setup' },
    ...(owner ? ([{ id: 'sharing', label: 'Sharing' }, { id: 'history', label: 'History' }] as const) : []),
  ];
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-3">
        <div>
          <p className="text-sm text-ink-muted">
            {owner ? (
              <Link className="underline" to={paths.garden(t.gardenId)}>
                {t.gardenName}
              </Link>
            ) : (
              'Shared with your cohort'
            )}
          </p>
          <h1>{t.title}</h1>
          <p className="text-ink-muted">
            {t.crop === 'other' ? t.cropName : cropLabels[t.crop]}
            {t.variety ? ` · ${t.variety}` : ''} · planted {t.plantingDate}
            {t.endDate ? ` · ends ${t.endDate}` : ''}
          </p>
        </div>
        {owner && t.status === 'active' ? (
          <Link to={paths.round(t.id)} className="ml-auto inline-flex min-h-12 items-center rounded-lg bg-terracotta-600 px-5 text-lg font-medium text-white hover:bg-terracotta-700">
            Today&apos;s round
          </Link>
        ) : null}
      </div>
      {t.question ? <p className="rounded-card border-l-4 border-terracotta-300 bg-white px-4 py-3 italic">“{t.question}”</p> : null}
      <StatusBar trial={t} />
      <div role="tablist" aria-label="Trial sections" className="flex flex-wrap gap-1 border-b border-sand-200">
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
            {owner && t.status === 'active' ? <RefillForecastTable trialId={t.id} /> : null}
            <ResultsTab trialId={t.id} treatments={t.treatments} />
          </div>
        ) : null}
        {tab === 'records' ? <LogsPanel trialId={t.id} plots={plots.data ?? []} editable={owner && t.status !== 'closed'} /> : null}
        {tab === 'import' && user ? <ImportWizard trialId={t.id} userId={user.id} /> : null}
        {tab === 'records' ? <ExportLinks trialId={t.id} /> : null}
        {tab === 'setup' ? (
          <div className="space-y-6">
            <PlotsPanel trial={t} />
            {owner && t.status !== 'closed' ? (
              <section aria-labelledby="details-heading" className="space-y-3">
                <div className="flex items-center gap-3">
                  <h2 id="details-heading">Trial details</h2>
                  <Button variant="secondary" size="sm" onClick={() => setEditing((v) => !v)}>
                    {editing ? 'Cancel' : 'Edit'}
                  </Button>
                </div>
                {editing ? (
                  <TrialForm trial={t} submitLabel="Save changes" onSubmit={(input) => update.mutateAsync(input).then(() => setEditing(false))} />
                ) : (
                  <dl className="grid gap-2 text-sm sm:grid-cols-2">
                    <div>
                      <dt className="text-ink-muted">Protocol notes</dt>
                      <dd className="whitespace-pre-wrap">{t.protocolNotes || '—'}</dd>
                    </div>
                    <div>
                      <dt className="text-ink-muted">Treatments</dt>
                      <dd>{t.treatments.join(' vs ')}</dd>
                    </div>
                  </dl>
                )}
              </section>
            ) : null}
          </div>
        ) : null}
        {tab === 'sharing' && owner ? <SharePanel trialId={t.id} cohorts={cohorts.data ?? []} /> : null}
        {tab === 'history' && owner ? <AuditList trialId={t.id} /> : null}
      </div>
    </div>
  );
}
