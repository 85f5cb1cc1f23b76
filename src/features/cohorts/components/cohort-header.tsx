import { useTranslation } from 'react-i18next';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { formatDate, formatNumber } from '@/lib/format';
import { useMyPlaceText } from './cohort-list';
import { isKnownLicence } from './labels';
import { ClosedBadge, RoleBadge } from './role-badge';

/** The cohort's name, description and facts, and where the caller stands in it. */
export function CohortHeader({ cohort }: { cohort: CohortSummary }) {
  const { t } = useTranslation('cohorts');
  const place = useMyPlaceText()(cohort);
  const licence = isKnownLicence(cohort.licence) ? (t(($) => $.licences[cohort.licence as 'CC0-1.0']).split(':')[0] ?? cohort.licence) : cohort.licence;
  return (
    <header className="space-y-3">
      <div className="flex flex-wrap items-center gap-2">
        <span className="text-sm font-medium uppercase tracking-wide text-ink-muted">{t(($) => $.kindCohort, { kind: t(($) => $.kinds[cohort.kind]) })}</span>
        <RoleBadge role={cohort.myRole} />
        {cohort.closed ? <ClosedBadge /> : null}
      </div>
      <h1 className="break-words">{cohort.name}</h1>
      {cohort.description ? <p className="max-w-3xl whitespace-pre-line text-ink-muted">{cohort.description}</p> : null}
      <dl className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <div className="flex gap-1">
          <dt className="text-ink-muted">{t(($) => $.header.members)}</dt>
          <dd className="font-medium">
            {cohort.capacity !== null ? t(($) => $.header.membersOf, { n: formatNumber(cohort.memberCount, 0), capacity: formatNumber(cohort.capacity, 0) }) : cohort.memberCount}
          </dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-ink-muted">{t(($) => $.header.licence)}</dt>
          <dd className="font-medium">{licence}</dd>
        </div>
        <div className="flex gap-1">
          <dt className="text-ink-muted">{t(($) => $.header.started)}</dt>
          <dd className="font-medium">{formatDate(cohort.createdAt)}</dd>
        </div>
      </dl>
      <p className="text-sm text-ink">
        {cohort.myRole !== 'lead'
          ? t(($) => $.header.memberNote, { place })
          : cohort.memberCount === 0
            ? t(($) => $.header.leadEmpty, { place })
            : t(($) => $.header.leadMembers, { place, count: cohort.memberCount })}
      </p>
    </header>
  );
}
