import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { Trial, TrialStatus } from '@shared/schemas/trials';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { useSetTrialStatus } from '../api/trial-mutations';

const statusTone: Record<TrialStatus, string> = {
  draft: 'bg-sand-200 text-ink',
  active: 'bg-sage-100 text-sage-800',
  closed: 'bg-slate-100 text-slate-800',
};

export function StatusBadge({ status }: { status: TrialStatus }) {
  const { t } = useTranslation('trials');
  return <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold ${statusTone[status]}`}>{t(($) => $.status[status])}</span>;
}

export function StatusBar({ trial }: { trial: Trial }) {
  const { t } = useTranslation('trials');
  const setStatus = useSetTrialStatus(trial.id);
  const [confirm, setConfirm] = useState<TrialStatus | null>(null);
  const next: { to: TrialStatus; label: string }[] =
        trial.status === 'draft'
      ? [{ to: 'active', label: t(($) => $.status.start) }]
      : trial.status === 'active'
        ? [{ to: 'closed', label: t(($) => $.status.close) }]
        : [{ to: 'active', label: t(($) => $.status.reopen) }];
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-card border border-sand-200 bg-white px-4 py-3">
      <StatusBadge status={trial.status} />
      <p className="text-sm text-ink-muted">{t(($) => $.status.help[trial.status])}</p>
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
        title={
          confirm === 'closed'
            ? t(($) => $.status.confirmClose)
            : confirm === 'active' && trial.status === 'closed'
              ? t(($) => $.status.confirmReopen)
              : t(($) => $.status.confirmStart)
        }
        confirmLabel={t(($) => $.status.yes)}
        pending={setStatus.isPending}
        onCancel={() => setConfirm(null)}
        onConfirm={() => confirm && setStatus.mutate(confirm, { onSettled: () => setConfirm(null) })}
      >
        {confirm === 'closed'
          ? t(($) => $.status.bodyClose)
          : confirm === 'active' && trial.status === 'closed'
            ? t(($) => $.status.bodyReopen)
            : t(($) => $.status.bodyStart)}
      </ConfirmDialog>
    </div>
  );
}
