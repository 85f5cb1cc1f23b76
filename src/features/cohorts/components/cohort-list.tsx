import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { paths } from '@/config/paths';
import { shownPseudonym } from '@/lib/pseudonym';
import { ClosedBadge, RoleBadge } from './role-badge';

/** How the caller appears in a cohort, in one short line. */
export function useMyPlaceText() {
  const { t } = useTranslation('cohorts');
  return (c: CohortSummary): string => {
    if (c.myRole === 'lead') return t(($) => $.place.lead);
    return c.myPseudonym ? t(($) => $.place.pseudonym, { pseudonym: shownPseudonym(c.myPseudonym) }) : t(($) => $.place.member);
  };
}

/** The caller's cohorts as a list of links, each with role, pseudonym and size. */
export function CohortList({ cohorts, headingLevel = 'h3' }: { cohorts: CohortSummary[]; headingLevel?: 'h2' | 'h3' }) {
  const { t } = useTranslation('cohorts');
  const myPlaceText = useMyPlaceText();
  const Heading = headingLevel;
  return (
    <ul className="divide-y divide-sand-200 rounded-card border border-sand-200 bg-white" aria-label={t(($) => $.list.label)}>
      {cohorts.map((c) => (
        <li key={c.id}>
          <Link
            to={paths.cohort(c.id)}
            className="group flex min-h-16 flex-col gap-1 px-4 py-3 hover:bg-sand-50 focus-visible:bg-sand-50 sm:flex-row sm:items-center sm:gap-4"
          >
            <div className="min-w-0 flex-1">
              <Heading className="truncate text-base font-semibold text-terracotta-700 group-hover:underline">{c.name}</Heading>
              <p className="text-sm text-ink-muted">
                {t(($) => $.kinds[c.kind])} · {t(($) => $.members, { count: c.memberCount })} · {myPlaceText(c)}
              </p>
            </div>
            <div className="flex flex-wrap items-center gap-2">
              {c.closed ? <ClosedBadge /> : null}
              <RoleBadge role={c.myRole} />
            </div>
          </Link>
        </li>
      ))}
    </ul>
  );
}
