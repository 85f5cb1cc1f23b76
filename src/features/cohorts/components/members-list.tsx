import { Alert } from '@/components/ui/alert';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { formatDate } from '@/lib/format';
import { useCohortMembers } from '../api/get-cohort-members';
import { useRemoveMember } from '../api/remove-member';
import { memberRoleHints, memberRoleLabels } from './labels';

/** Members by pseudonym and role. The lead may remove a member after confirming. */
export function MembersList({ cohortId, canRemove }: { cohortId: string; canRemove: boolean }) {
  const members = useCohortMembers(cohortId);
  const remove = useRemoveMember(cohortId);
  if (members.isPending) return <p role="status" className="text-ink-muted">Loading members…</p>;
  if (members.isError) return <Alert tone="error">Could not load the members: {members.error.message}</Alert>;
  if (members.data.length === 0) {
    return <p className="text-ink-muted">No members yet. {canRemove ? 'Share the join code or send an invitation to bring people in.' : ''}</p>;
  }
  const contributors = members.data.filter((m) => m.role === 'contributor').length;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-muted">
        {contributors} contributor{contributors === 1 ? '' : 's'}, {members.data.length - contributors} observer{members.data.length - contributors === 1 ? '' : 's'}.
      </p>
      <ul className="divide-y divide-sand-200 rounded-lg border border-sand-200" aria-label="Members">
        {members.data.map((m) => (
          <li key={m.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-3 py-3">
            <div className="min-w-0 flex-1">
              <p className="font-medium">
                {m.pseudonym}
                {m.isMe ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">you</span> : null}
              </p>
              <p className="text-sm text-ink-muted">
                {memberRoleLabels[m.role]}: {memberRoleHints[m.role]} · joined {formatDate(m.joinedAt)}
              </p>
            </div>
            {canRemove ? (
              <ConfirmAction
                label="Remove"
                ariaLabel={`Remove ${m.pseudonym}`}
                buttonProps={{ size: 'md', className: 'min-w-24' }}
                title={`Remove ${m.pseudonym}?`}
                confirmLabel="Remove member"
                tone="danger"
                onConfirm={() => remove.mutateAsync(m.id)}
              >
                <p>
                  {m.pseudonym} leaves the cohort at once and no longer sees it. {m.role === 'contributor' ? 'Their trials stop counting in the pooled result.' : ''}
                </p>
                <p>They can come back only with the join code or a new invitation. If they know the current code, make a new one too.</p>
              </ConfirmAction>
            ) : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
