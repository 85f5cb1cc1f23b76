import type { CohortSummary } from '@shared/schemas/cohorts';
import { Card } from '@/components/ui/card';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { CopyButton } from '@/components/ui/copy-button';
import { formatJoinCode } from '@/lib/format';
import { useRotateJoinCode } from '../api/rotate-join-code';

/** The lead's join code, big enough to read out to a room, with copy and a way to replace it. */
export function JoinCodeCard({ cohort, joinUrl }: { cohort: CohortSummary; joinUrl: (code: string) => string }) {
  const rotate = useRotateJoinCode(cohort.id);
  const code = cohort.joinCode;
  if (!code) return null;
  const shown = formatJoinCode(code);
  return (
    <Card aria-labelledby="join-code-heading" role="region" className="space-y-4">
      <div>
        <h2 id="join-code-heading">Join code</h2>
        <p className="mt-1 text-sm text-ink-muted">
          Anyone with this code can join from <span className="font-medium text-ink">Cohorts → Join with a code</span>
          {cohort.closed ? '. The cohort is closed just now, so the code is refused until you reopen it.' : '.'}
        </p>
      </div>
      <p data-testid="join-code" className="select-all whitespace-nowrap rounded-lg bg-sand-100 px-2 py-3 text-center font-mono text-3xl font-semibold tracking-[0.12em] text-ink sm:text-4xl sm:tracking-[0.2em]">
        {shown}
      </p>
      <div className="flex flex-wrap items-start gap-3">
        <CopyButton value={shown} label="Copy code" />
        <CopyButton value={joinUrl(code)} label="Copy join link" />
        <ConfirmAction
          label="Make a new code"
          buttonProps={{ variant: 'ghost', className: 'px-2 underline' }}
          title="Make a new join code?"
          confirmLabel="Make a new code"
          onConfirm={() => rotate.mutateAsync()}
        >
          <p>
            The code <span className="font-mono font-semibold text-ink">{shown}</span> stops working at once, and any link that carries it too. People who already
            joined stay members.
          </p>
          <p>Use this when a code has reached people it should not have. Hand the new code to anyone still waiting to join.</p>
        </ConfirmAction>
      </div>
    </Card>
  );
}
