import { useTranslation } from 'react-i18next';
import type { PotCondition } from '@shared/schemas/pots';
import { cn } from '@/lib/utils';

const tone: Record<PotCondition, string> = {
  sound: 'border-sage-300 bg-sage-50 text-sage-800',
  cracked: 'border-red-300 bg-red-50 text-red-900',
  clogged: 'border-amber-300 bg-amber-50 text-amber-900',
  retired: 'border-sand-300 bg-sand-100 text-ink-muted',
};

/** The pot's condition in words (colour only repeats it). */
export function ConditionBadge({ condition, className }: { condition: PotCondition; className?: string }) {
  const { t } = useTranslation('pots');
  return <span className={cn('inline-flex items-center rounded-full border px-2.5 py-0.5 text-sm font-medium', tone[condition], className)}>{t(($) => $.conditions[condition])}</span>;
}
