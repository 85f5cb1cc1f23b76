import { useTranslation } from 'react-i18next';
import type { Invitation } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { formatDate } from '@/lib/format';
import { useCohortInvitations } from '../api/get-cohort-invitations';

type Status = 'accepted' | 'expired' | 'waiting';

function status(inv: Invitation, now: number): { kind: Status; date: string; tone: string } {
  if (inv.acceptedAt) return { kind: 'accepted', date: inv.acceptedAt, tone: 'bg-sage-50 text-sage-800 border-sage-200' };
  if (new Date(inv.expiresAt).getTime() <= now) return { kind: 'expired', date: inv.expiresAt, tone: 'bg-sand-100 text-ink-muted border-sand-300' };
  return { kind: 'waiting', date: inv.expiresAt, tone: 'bg-white text-ink border-sand-300' };
}

/** Invitations the lead has sent: who, as what, and whether they were used. */
export function InvitationsList({ cohortId }: { cohortId: string }) {
  const { t } = useTranslation('cohorts');
  const invitations = useCohortInvitations(cohortId);
  if (invitations.isPending) return <p role="status" className="text-ink-muted">{t(($) => $.invitations.loading)}</p>;
  if (invitations.isError) return <Alert tone="error">{t(($) => $.invitations.loadFailed, { message: invitations.error.message })}</Alert>;
  if (invitations.data.length === 0) return <p className="text-sm text-ink-muted">{t(($) => $.invitations.none)}</p>;
  const now = Date.now();
  return (
    <ul className="divide-y divide-sand-200 rounded-lg border border-sand-200" aria-label={t(($) => $.invitations.label)}>
      {invitations.data.map((inv) => {
        const s = status(inv, now);
        return (
          <li key={inv.id} className="space-y-1 px-3 py-2.5">
            <p className="font-medium [overflow-wrap:anywhere]">{inv.email}</p>
            <p className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
              {t(($) => $.roles[inv.role])}
              <span className={`rounded-full border px-2 py-0.5 text-xs font-medium ${s.tone}`}>{t(($) => $.invitations[s.kind], { date: formatDate(s.date) })}</span>
            </p>
          </li>
        );
      })}
    </ul>
  );
}
