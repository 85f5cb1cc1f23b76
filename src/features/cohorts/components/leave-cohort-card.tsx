import { useTranslation } from 'react-i18next';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { Card } from '@/components/ui/card';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { shownPseudonym } from '@/lib/pseudonym';
import { useLeaveCohort } from '../api/leave-cohort';

/** A member leaves a cohort (after confirming); the lead cannot leave their own. */
export function LeaveCohortCard({ cohort, onLeft }: { cohort: CohortSummary; onLeft: () => void }) {
  const { t } = useTranslation('cohorts');
  const leave = useLeaveCohort(cohort.id);
  return (
    <Card role="region" aria-labelledby="leave-heading" className="space-y-3">
      <h2 id="leave-heading">{t(($) => $.leave.title)}</h2>
      <p className="text-sm text-ink-muted">{cohort.myRole === 'contributor' ? t(($) => $.leave.bodyContributor) : t(($) => $.leave.body)}</p>
      <ConfirmAction
        label={t(($) => $.leave.button)}
        buttonProps={{ variant: 'secondary', size: 'lg', className: 'w-full sm:w-auto' }}
        title={t(($) => $.leave.confirmTitle, { name: cohort.name })}
        confirmLabel={t(($) => $.leave.button)}
        tone="danger"
        onConfirm={async () => {
          await leave.mutateAsync();
          onLeft();
        }}
      >
        <p>{cohort.myPseudonym ? t(($) => $.leave.confirmBodyPseudonym, { pseudonym: shownPseudonym(cohort.myPseudonym) }) : t(($) => $.leave.confirmBody)}</p>
        <p>{t(($) => $.leave.confirmBody2)}</p>
      </ConfirmAction>
    </Card>
  );
}
