import { useTranslation } from 'react-i18next';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { Card } from '@/components/ui/card';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { CopyButton } from '@/components/ui/copy-button';
import { formatJoinCode } from '@/lib/format';
import { fillSlots, SLOT } from '@/lib/slots';
import { useRotateJoinCode } from '../api/rotate-join-code';

/** The lead's join code, big enough to read out to a room, with copy and a way to replace it. */
export function JoinCodeCard({ cohort, joinUrl }: { cohort: CohortSummary; joinUrl: (code: string) => string }) {
  const { t } = useTranslation('cohorts');
  const rotate = useRotateJoinCode(cohort.id);
  const code = cohort.joinCode;
  if (!code) return null;
  const shown = formatJoinCode(code);
  const intro = cohort.closed ? t(($) => $.joinCode.introClosed, { where: SLOT }) : t(($) => $.joinCode.intro, { where: SLOT });
  return (
    <Card aria-labelledby="join-code-heading" role="region" className="space-y-4">
      <div>
        <h2 id="join-code-heading">{t(($) => $.joinCode.title)}</h2>
        <p className="mt-1 text-sm text-ink-muted">
          {fillSlots(intro, [
            <span key="where" className="font-medium text-ink">
              {t(($) => $.joinCode.where)}
            </span>,
          ])}
        </p>
      </div>
      <p data-testid="join-code" className="select-all whitespace-nowrap rounded-lg bg-sand-100 px-2 py-3 text-center font-mono text-3xl font-semibold tracking-[0.12em] text-ink sm:text-4xl sm:tracking-[0.2em]">
        {shown}
      </p>
      <div className="flex flex-wrap items-start gap-3">
        <CopyButton value={shown} label={t(($) => $.joinCode.copyCode)} />
        <CopyButton value={joinUrl(code)} label={t(($) => $.joinCode.copyLink)} />
        <ConfirmAction
          label={t(($) => $.joinCode.rotate)}
          buttonProps={{ variant: 'ghost', className: 'px-2 underline' }}
          title={t(($) => $.joinCode.rotateTitle)}
          confirmLabel={t(($) => $.joinCode.rotate)}
          onConfirm={() => rotate.mutateAsync()}
        >
          <p>
            {fillSlots(t(($) => $.joinCode.rotateBody, { code: SLOT }), [
              <span key="code" className="font-mono font-semibold text-ink">
                {shown}
              </span>,
            ])}
          </p>
          <p>{t(($) => $.joinCode.rotateBody2)}</p>
        </ConfirmAction>
      </div>
    </Card>
  );
}
