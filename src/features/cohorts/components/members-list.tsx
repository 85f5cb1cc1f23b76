import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { formatDate } from '@/lib/format';
import { shownPseudonym } from '@/lib/pseudonym';
import { useCohortMembers } from '../api/get-cohort-members';
import { useRemoveMember } from '../api/remove-member';

/** Members by pseudonym and role. The lead may remove a member after confirming. */
export function MembersList({ cohortId, canRemove }: { cohortId: string; canRemove: boolean }) {
  const { t } = useTranslation('cohorts');
  const { t: tc } = useTranslation();
  const members = useCohortMembers(cohortId);
  const remove = useRemoveMember(cohortId);
  if (members.isPending) return <p role="status" className="text-ink-muted">{t(($) => $.members.loading)}</p>;
  if (members.isError) return <Alert tone="error">{t(($) => $.members.loadFailed, { message: members.error.message })}</Alert>;
  if (members.data.length === 0) {
    return <p className="text-ink-muted">{canRemove ? t(($) => $.members.noneLead) : t(($) => $.members.none)}</p>;
  }
  const contributors = members.data.filter((m) => m.role === 'contributor').length;
  const observers = members.data.length - contributors;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-muted">
        {t(($) => $.members.counts, {
          contributors: t(($) => $.members.contributors, { count: contributors }),
          observers: t(($) => $.members.observers, { count: observers }),
        })}
      </p>
      <ul className="divide-y divide-sand-200 rounded-lg border border-sand-200" aria-label={t(($) => $.members.label)}>
        {members.data.map((m) => (
          <li key={m.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-3 py-3">
            <div className="min-w-0 flex-1">
              <p className="font-medium">
                {shownPseudonym(m.pseudonym)}
                {m.isMe ? <span className="ml-2 rounded bg-terracotta-50 px-1.5 py-0.5 text-xs font-medium text-terracotta-800">{tc(($) => $.you)}</span> : null}
              </p>
              <p className="text-sm text-ink-muted">
                {t(($) => $.members.line, { role: t(($) => $.roles[m.role]), hint: t(($) => $.roleHints[m.role]), date: formatDate(m.joinedAt) })}
              </p>
            </div>
            {canRemove ? (
              <ConfirmAction
                label={t(($) => $.members.remove)}
                ariaLabel={t(($) => $.members.removeLabel, { name: shownPseudonym(m.pseudonym) })}
                buttonProps={{ size: 'md', className: 'min-w-24' }}
                title={t(($) => $.members.removeTitle, { name: shownPseudonym(m.pseudonym) })}
                confirmLabel={t(($) => $.members.removeConfirm)}
                tone="danger"
                onConfirm={() => remove.mutateAsync(m.id)}
              >
                <p>{m.role === 'contributor' ? t(($) => $.members.removeBodyContributor, { name: shownPseudonym(m.pseudonym) }) : t(($) => $.members.removeBody, { name: shownPseudonym(m.pseudonym) })}</p>
                <p>{t(($) => $.members.removeBody2)}</p>
              </ConfirmAction>
            ) : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
