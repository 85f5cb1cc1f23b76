import { useTranslation } from 'react-i18next';
import { Link } from 'react-router-dom';
import type { Trial } from '@shared/schemas/trials';
import { formatDate } from '@/lib/format';
import { StatusBadge } from './status-bar';

/** Trials at a glance: state, crop, plots and what was last logged. */
export function TrialCards({ trials, trialPath, roundPath }: { trials: Trial[]; trialPath: (id: string) => string; roundPath: (id: string) => string }) {
  const { t } = useTranslation('trials');
  if (!trials.length) return <p className="text-ink-muted">{t(($) => $.cards.none)}</p>;
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {trials.map((tr) => (
        <li key={tr.id} className="rounded-card border border-sand-200 bg-white p-4">
          <div className="flex items-start gap-2">
            <Link to={trialPath(tr.id)} className="text-lg font-semibold text-ink underline decoration-sand-300 underline-offset-4 hover:decoration-terracotta-500">
              {tr.title}
            </Link>
            <span className="ml-auto">
              <StatusBadge status={tr.status} />
            </span>
          </div>
          <p className="mt-1 text-sm text-ink-muted">
            {tr.crop === 'other' ? tr.cropName : t(($) => $.crops[tr.crop])}
            {tr.variety ? ` · ${tr.variety}` : ''} · {t(($) => $.cards.planted, { date: formatDate(tr.plantingDate) })} · {t(($) => $.cards.plots, { count: tr.plotCount })}
            {tr.gardenName ? ` · ${tr.gardenName}` : ''}
          </p>
          <p className="mt-1 text-sm">{tr.lastLoggedAt ? t(($) => $.cards.lastLogged, { date: formatDate(tr.lastLoggedAt, tr.timeZone) }) : t(($) => $.cards.nothingLogged)}</p>
          {tr.status === 'active' && tr.access === 'owner' ? (
            <Link to={roundPath(tr.id)} className="mt-3 inline-flex min-h-11 items-center rounded-lg bg-terracotta-600 px-4 font-medium text-white hover:bg-terracotta-700">
              {t(($) => $.cards.startRound)}
            </Link>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
