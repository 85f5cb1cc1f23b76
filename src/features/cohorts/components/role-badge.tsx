import { useTranslation } from 'react-i18next';
import type { CohortSummary } from '@shared/schemas/cohorts';
import { cn } from '@/lib/utils';

const tones: Record<CohortSummary['myRole'], string> = {
  lead: 'bg-terracotta-50 text-terracotta-800 border-terracotta-200',
  contributor: 'bg-sand-100 text-ink border-sand-300',
  observer: 'bg-white text-ink-muted border-sand-300',
};

export function RoleBadge({ role, className }: { role: CohortSummary['myRole']; className?: string }) {
  const { t } = useTranslation('cohorts');
  return <span className={cn('inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium', tones[role], className)}>{t(($) => $.roles[role])}</span>;
}

export function ClosedBadge() {
  const { t } = useTranslation('cohorts');
  return <span className="inline-flex items-center rounded-full border border-amber-300 bg-amber-50 px-2 py-0.5 text-xs font-medium text-amber-900">{t(($) => $.closedBadge)}</span>;
}
