import { useState } from 'react';
import type { Trial, TrialStatus } from '@shared/schemas/trials';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useSetTrialStatus } from '../api/trial-mutations';

const statusText: Record<TrialStatus, { label: string; help: string; tone: string }> = {
  draft: { label: 'Draft', help: 'Set up plots, assign treatments at random, then start the trial.', tone: 'bg-sand-200 text-ink' },
  active: { label: 'Active', help: 'Log every refill, every watering and every pick.', tone: 'bg-sage-100 text-sage-800' },
  closed: { label: 'Closed', help: 'Read-only. Reopen it to correct something; changes are kept in the audit trail.', tone: 'bg-slate-100 text-slate-800' },
};

export function StatusBadge({ status }: { status: TrialStatus }) {
  return <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${statusText[status].tone}`}>{statusText[status].label}</span>;
}

export function StatusBar({ trial }: { trial: Trial }) {
  const setStatus = useSetTrialStatus(trial.id);
  const [confirm, setConfirm] = useState<TrialStatus | null>(null);
  const next: { to: TrialStatus; label: string }[] =
    trial.status === 'draft' ? [{ to: 'active', label: 'Start the trial' }] : trial.status === 'active' ? [{ to: 'closed', label: 'Close the trial' }] : [{ to: 'active', label: 'Reopen' }];
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-card border border-sand-200 bg-white px-4 py-3">
      <StatusBadge status={trial.status} />
      <p className="text-sm text-ink-muted">{statusText[trial.status].help}</p>
      {trial.access === 'owner' ? (
        <div className="ml-auto flex gap-2">
          {next.map((n) => (
            <Button key={n.to} size="sm" variant={n.to === 'closed' ? 'secondary' : 'primary'} onClick={() => setConfirm(n.to)}>
              {n.label}
            </Button>
          ))}
        </div>
      ) : null}
      {setStatus.isError ? <Alert tone="error">{setStatus.error.message}</Alert> : null}
      <ConfirmDialog
        open={confirm !== null}
        title={confirm === 'closed' ? 'Close this trial?' : confirm === 'active' && trial.status === 'closed' ? 'Reopen this trial?' : 'Start this trial?'}
        confirmLabel="Yes"
        pending={setStatus.isPending}
        onCancel={() => setConfirm(null)}
        onConfirm={() => confirm && setStatus.mutate(confirm, { onSettled: () => setConfirm(null) })}
      >
        {confirm === 'closed'
          ? 'A closed trial is read-only: its results are final until you reopen it. Log the last harvest first.'
          : confirm === 'active' && trial.status === 'closed'
            ? 'Reopening lets you correct records. Every change to a closed or shared trial is kept in the audit trail.'
            : 'Make sure each pair has one olla plot and one surface plot, assigned at random.'}
      </ConfirmDialog>
    </div>
  );
}
