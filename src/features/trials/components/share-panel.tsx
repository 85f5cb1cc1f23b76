import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { formatDate } from '@/lib/format';
import { useShares, useShareTrial, useWithdrawShare } from '../api/shares';

export interface ShareableCohort {
  id: string;
  name: string;
  myRole: 'lead' | 'contributor' | 'observer';
}

/**
 * Sharing is per trial and per cohort. The cohort sees the trial under the member's pseudonym
 * with the location coarsened; withdrawing removes it from every cohort view and later export.
 */
export function SharePanel({ trialId, cohorts }: { trialId: string; cohorts: ShareableCohort[] }) {
  const { t } = useTranslation('trials');
  const shares = useShares(trialId);
  const share = useShareTrial(trialId);
  const withdraw = useWithdrawShare(trialId);
  const active = (shares.data ?? []).filter((s) => !s.withdrawnAt);
  const candidates = cohorts.filter((c) => c.myRole === 'contributor' && !active.some((s) => s.cohortId === c.id));
  const [choice, setChoice] = useState('');
  const error = share.error ?? withdraw.error;
  return (
    <section aria-labelledby="share-heading" className="space-y-3">
      <h2 id="share-heading">{t(($) => $.share.title)}</h2>
      <p className="text-sm text-ink-muted">{t(($) => $.share.intro)}</p>
      {error ? <Alert tone="error">{error.message}</Alert> : null}
      {active.length ? (
        <ul className="space-y-2">
          {active.map((s) => (
            <li key={s.cohortId} className="flex flex-wrap items-center gap-3 rounded-lg border border-sand-200 bg-white px-3 py-2">
              <span className="font-medium">{s.cohortName}</span>
              <span className="text-sm text-ink-muted">{t(($) => $.share.shared, { date: formatDate(s.sharedAt) })}</span>
              <Button variant="secondary" size="sm" className="ml-auto" onClick={() => withdraw.mutate(s.cohortId)} disabled={withdraw.isPending}>
                {t(($) => $.share.withdraw)}
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm">{t(($) => $.share.none)}</p>
      )}
      {candidates.length ? (
        <div className="flex flex-wrap items-end gap-3">
          <SelectField label={t(($) => $.share.with)} value={choice} onChange={(e) => setChoice(e.target.value)}>
            <option value="">{t(($) => $.share.choose)}</option>
            {candidates.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </SelectField>
          <Button disabled={!choice || share.isPending} onClick={() => share.mutate(choice, { onSuccess: () => setChoice('') })}>
            {t(($) => $.share.share)}
          </Button>
        </div>
      ) : cohorts.length === 0 ? (
        <p className="text-sm text-ink-muted">{t(($) => $.share.join)}</p>
      ) : null}
    </section>
  );
}
