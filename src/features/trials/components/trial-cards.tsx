import { Link } from 'react-router-dom';
import { cropLabels, type Trial } from '@shared/schemas/trials';
import { formatDate } from '@/lib/format';
import { StatusBadge } from './status-bar';

/** Trials at a glance: state, crop, plots and what was last logged. */
export function TrialCards({ trials, trialPath, roundPath }: { trials: Trial[]; trialPath: (id: string) => string; roundPath: (id: string) => string }) {
  if (!trials.length) return <p className="text-ink-muted">No trials yet.</p>;
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {trials.map((t) => (
        <li key={t.id} className="rounded-card border border-sand-200 bg-white p-4">
          <div className="flex items-start gap-2">
            <Link to={trialPath(t.id)} className="text-lg font-semibold text-ink underline decoration-sand-300 underline-offset-4 hover:decoration-terracotta-500">
              {t.title}
            </Link>
            <span className="ml-auto">
              <StatusBadge status={t.status} />
            </span>
          </div>
          <p className="mt-1 text-sm text-ink-muted">
            {t.crop === 'other' ? t.cropName : cropLabels[t.crop]}
            {t.variety ? ` · ${t.variety}` : ''} · planted {formatDate(t.plantingDate)} · {t.plotCount} plot{t.plotCount === 1 ? '' : 's'}
            {t.gardenName ? ` · ${t.gardenName}` : ''}
          </p>
          <p className="mt-1 text-sm">{t.lastLoggedAt ? `Last logged ${formatDate(t.lastLoggedAt)}` : 'Nothing logged yet'}</p>
          {t.status === 'active' && t.access === 'owner' ? (
            <Link to={roundPath(t.id)} className="mt-3 inline-flex min-h-11 items-center rounded-lg bg-terracotta-600 px-4 font-medium text-white hover:bg-terracotta-700">
              Start today&apos;s round
            </Link>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
