import type { CohortSummary } from '@shared/schemas/cohorts';
import { formatDate, plural } from '@/lib/format';
import { myPlaceText } from './cohort-list';
import { kindLabels, licenceLabels } from './labels';
import { ClosedBadge, RoleBadge } from './role-badge';

/** The cohort's name, description and facts, and where the caller stands in it. */
export function CohortHeader({ cohort }: { cohort: CohortSummary }) {
  return (
    <header className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm font-medium uppercase tracking-wide text-ink-muted">{kindLabels[cohort.kind]} cohort</span>
        <RoleBadge role={cohort.myRole} />
        {cohort.closed ? <ClosedBadge /> : null}
      </div>
      <h1 className="break-words">{cohort.name}</h1>
      {cohort.description ? <p className="max-w-3xl whitespace-pre-line text-ink-muted">{cohort.description}</p> : null}
      <dl className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <div className="flex gap-1">
          <dt className="text-ink-muted">Members</dt>
          <dd className="font-medium">
            {cohort.memberCount}
            {cohort.capacity !== null ? ` of ${cohort.capacity}` : ''}
          </dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-ink-muted">Licence</dt>
          <dd className="font-medium">{licenceLabels[cohort.licence]?.split(':')[0] ?? cohort.licence}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-ink-muted">Started</dt>
          <dd className="font-medium">{formatDate(cohort.createdAt)}</dd>
        </div>
      </dl>
      <p className="text-sm text-ink">
        {myPlaceText(cohort)}
        {cohort.myRole !== 'lead'
          ? '. Others in the cohort see only this pseudonym, never your name or e-mail.'
          : cohort.memberCount === 0
            ? '. No one has joined yet; members will appear to you and to each other by pseudonym only.'
            : `. Its ${cohort.memberCount === 1 ? 'member appears' : `${plural(cohort.memberCount, 'member')} appear`} to you and to each other by pseudonym only.`}
      </p>
    </header>
  );
}
