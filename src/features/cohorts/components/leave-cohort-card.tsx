import type { CohortSummary } from '@shared/schemas/cohorts';
import { Card } from '@/components/ui/card';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { useLeaveCohort } from '../api/leave-cohort';

/** A member leaves a cohort (after confirming); the lead cannot leave their own. */
export function LeaveCohortCard({ cohort, onLeft }: { cohort: CohortSummary; onLeft: () => void }) {
  const leave = useLeaveCohort(cohort.id);
  return (
    <Card role="region" aria-labelledby="leave-heading" className="space-y-3">
      <h2 id="leave-heading">Leave this cohort</h2>
      <p className="text-sm text-ink-muted">
        {cohort.myRole === 'contributor' ? 'Your trials stop being shared with the cohort. ' : ''}You can only come back with a join code or a new invitation, and you
        would get a new pseudonym.
      </p>
      <ConfirmAction
        label="Leave cohort"
        buttonProps={{ variant: 'secondary', size: 'lg', className: 'w-full sm:w-auto' }}
        title={`Leave ${cohort.name}?`}
        confirmLabel="Leave cohort"
        tone="danger"
        onConfirm={async () => {
          await leave.mutateAsync();
          onLeft();
        }}
      >
        <p>You stop seeing this cohort at once{cohort.myPseudonym ? `, and ${cohort.myPseudonym} leaves its member list` : ''}.</p>
        <p>To come back you need the join code or a new invitation from the lead.</p>
      </ConfirmAction>
    </Card>
  );
}
