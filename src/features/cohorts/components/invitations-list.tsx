import type { Invitation } from '@shared/schemas/cohorts';
import { Alert } from '@/components/ui/alert';
import { formatDate } from '@/lib/format';
import { useCohortInvitations } from '../api/get-cohort-invitations';
import { memberRoleLabels } from './labels';

function status(inv: Invitation, now: number): { text: string; tone: string } {
  if (inv.acceptedAt) return { text: `Accepted ${formatDate(inv.acceptedAt)}`, tone: 'bg-sage-50 text-sage-800 border-sage-200' };
  if (new Date(inv.expiresAt).getTime() <= now) return { text: `Expired ${formatDate(inv.expiresAt)}`, tone: 'bg-sand-100 text-ink-muted border-sand-300' };
  return { text: `Waiting · until ${formatDate(inv.expiresAt)}`, tone: 'bg-white text-ink border-sand-300' };
}

/** Invitations the lead has sent: who, as what, and whether they were used. */
export function InvitationsList({ cohortId }: { cohortId: string }) {
  const invitations = useCohortInvitations(cohortId);
  if (invitations.isPending) return <p role="status" className="text-ink-muted">Loading invitations…</p>;
  if (invitations.isError) return <Alert tone="error">Could not load the invitations: {invitations.error.message}</Alert>;
  if (invitations.data.length === 0) return <p className="text-sm text-ink-muted">No invitations sent yet.</p>;
  const now = Date.now();
  return (
    <ul className="divide-y divide-sand-200 rounded-lg border border-sand-200" aria-label="Invitations sent">
      {invitations.data.map((inv) => {
        const s = status(inv, now);
        return (
          <li key={inv.id} className="space-y-1 px-3 py-2.5">
            <p className="font-medium [overflow-wrap:anywhere]">{inv.email}</p>
            <p className="flex flex-wrap items-center gap-2 text-sm text-ink-muted">
              {memberRoleLabels[inv.role]}
              <span className={`rounded-full border px-2 py-0.5 text-xs font-medium ${s.tone}`}>{s.text}</span>
            </p>
          </li>
        );
      })}
    </ul>
  );
}
