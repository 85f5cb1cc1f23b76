import { Alert } from '@/components/ui/alert';
import { formatDateTime } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { useTrialForecast } from '../api/get-trial-forecast';

const basisText = { 'seep-test': 'seep test', 'crop-need': 'crop need' } as const;

/** A trial's pots, most urgent first: level, litres left, when each runs dry and what the estimate rests on. */
export function RefillForecastTable({ trialId }: { trialId: string }) {
  const forecast = useTrialForecast(trialId);
  const units = useUnits();
  if (forecast.isPending) return <p role="status">Working out the pot levels…</p>;
  if (forecast.isError) return <Alert tone="error">{forecast.error.message}</Alert>;
  const { pots, thresholdPct, et0 } = forecast.data;
  if (!pots.length) return <p className="text-ink-muted">No pots in this trial's plots yet.</p>;
  return (
    <div className="space-y-2">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="mb-2 text-left text-ink-muted">
            Estimated from the last logged refill; reminder level {thresholdPct} %. Crop need uses {et0.source === 'weather' ? `this week's weather (ET0 ${et0.mmPerDay.toFixed(1)} mm/day)` : 'an assumed 5 mm/day ET0 until you log weather'}.
          </caption>
          <thead>
            <tr className="border-b border-sand-200 text-left">
              <th scope="col" className="py-2 pr-3">Pot</th>
              <th scope="col" className="py-2 pr-3 text-right">Level</th>
              <th scope="col" className="py-2 pr-3 text-right">Left</th>
              <th scope="col" className="py-2 pr-3">Dry at</th>
              <th scope="col" className="py-2">Basis</th>
            </tr>
          </thead>
          <tbody>
            {pots.map((p) => (
              <tr key={p.potId} className="border-b border-sand-100 align-top">
                <th scope="row" className="py-2 pr-3 text-left font-medium">
                  {p.label} <span className="font-normal text-ink-muted">({p.plotLabel})</span>
                  {p.note ? <span className="block text-xs font-normal text-ink-muted">{p.note}</span> : null}
                </th>
                <td className={`py-2 pr-3 text-right ${p.belowThreshold ? 'font-semibold text-terracotta-700' : ''}`}>{p.levelPct === null ? '—' : `${Math.round(p.levelPct)} %`}</td>
                <td className="py-2 pr-3 text-right">{units.fmt(p.levelL, 'volume')}</td>
                <td className="py-2 pr-3">{p.dryAt ? formatDateTime(p.dryAt) : '—'}</td>
                <td className="py-2">{p.basis ? basisText[p.basis] : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
