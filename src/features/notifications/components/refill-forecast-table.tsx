import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { formatDateTime, formatNumber } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { useTrialForecast } from '../api/get-trial-forecast';

/** The server's note codes (server/services/reminders.service.ts) and their keys under `forecast.notes`. */
const NOTES = { no_refill: 'noRefill', no_basis: 'noBasis' } as const;

/** A trial's pots, most urgent first: level, litres left, when each runs dry and what the estimate rests on. */
export function RefillForecastTable({ trialId }: { trialId: string }) {
  const { t } = useTranslation('notifications');
  const forecast = useTrialForecast(trialId);
  const units = useUnits();
  if (forecast.isPending) return <p role="status">{t(($) => $.forecast.working)}</p>;
  if (forecast.isError) return <Alert tone="error">{forecast.error.message}</Alert>;
  const { pots, thresholdPct, et0 } = forecast.data;
  if (!pots.length) return <p className="text-ink-muted">{t(($) => $.forecast.none)}</p>;
  return (
    <div className="space-y-2">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="mb-2 text-left text-ink-muted">
            {et0.source === 'weather'
              ? t(($) => $.forecast.captionWeather, { pct: formatNumber(thresholdPct, 0), et0: formatNumber(et0.mmPerDay, 1, 1) })
              : t(($) => $.forecast.captionAssumed, { pct: formatNumber(thresholdPct, 0) })}
          </caption>
          <thead>
            <tr className="border-b border-sand-200 text-left">
              <th scope="col" className="py-2 pr-3">{t(($) => $.forecast.pot)}</th>
              <th scope="col" className="py-2 pr-3 text-right">{t(($) => $.forecast.level)}</th>
              <th scope="col" className="py-2 pr-3 text-right">{t(($) => $.forecast.left)}</th>
              <th scope="col" className="py-2 pr-3">{t(($) => $.forecast.dryAt)}</th>
              <th scope="col" className="py-2">{t(($) => $.forecast.basis)}</th>
            </tr>
          </thead>
          <tbody>
            {pots.map((p) => (
              <tr key={p.potId} className="border-b border-sand-100 align-top">
                <th scope="row" className="py-2 pr-3 text-left font-medium">
                  {p.label} <span className="font-normal text-ink-muted">({p.plotLabel})</span>
                  {p.noteCode ? <span className="block text-xs font-normal text-ink-muted">{t(($) => $.forecast.notes[NOTES[p.noteCode!]])}</span> : null}
                </th>
                <td className={`py-2 pr-3 text-right ${p.belowThreshold ? 'font-semibold text-terracotta-700' : ''}`}>{p.levelPct === null ? '—' : `${formatNumber(p.levelPct, 0)} %`}</td>
                <td className="py-2 pr-3 text-right">{units.fmt(p.levelL, 'volume')}</td>
                <td className="py-2 pr-3">{p.dryAt ? formatDateTime(p.dryAt) : '—'}</td>
                <td className="py-2">{p.basis ? t(($) => $.forecast.bases[p.basis!]) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
