import { useTranslation } from 'react-i18next';
import type { VisualizationSpec } from 'vega-embed';
import { cohortProgressSpec } from '@shared/charts/cohort-charts';
import type { CohortResults } from '@shared/schemas/cohort-results';
import { Chart } from '@/components/charts/chart';
import { formatDate } from '@/lib/format';
import { useUnits } from '@/lib/units';
import { sharedT } from './format';

interface WeekRow {
  weekStart: string;
  isoWeek: string;
  olla?: CohortResults['progress'][number];
  surface?: CohortResults['progress'][number];
}

/** Water over the season across the cohort: cumulative per treatment by ISO week, chart and table. */
export function ProgressChart({ results }: { results: CohortResults }) {
  const units = useUnits();
  const { t } = useTranslation('cohortResults');
  const st = sharedT();
  const spec = cohortProgressSpec(results, { units: units.system, width: 'container', t: st });
  if (!spec) return <p className="text-ink-muted">{t(($) => $.progress.none)}</p>;

  const weeks = new Map<string, WeekRow>();
  for (const r of results.progress) {
    const w = weeks.get(r.weekStart) ?? { weekStart: r.weekStart, isoWeek: r.isoWeek };
    w[r.treatment] = r;
    weeks.set(r.weekStart, w);
  }
  const rows = [...weeks.values()].sort((a, b) => a.weekStart.localeCompare(b.weekStart));
  const last = (t: 'olla' | 'surface') => results.progress.filter((r) => r.treatment === t).at(-1);
  const o = last('olla');
  const s = last('surface');
  const depth = (mm: number | null | undefined) => units.fmt(mm, 'length-small', units.system === 'us' ? 1 : 0);
  const byDepth = results.progress.every((r) => r.cumulativeMm !== null);
  const takeaway =
    o && s && byDepth
      ? t(($) => $.progress.takeaway, { week: formatDate(rows.at(-1)!.weekStart), olla: depth(o.cumulativeMm), surface: depth(s.cumulativeMm) })
      : t(($) => $.progress.takeawayPlain);
  // Carry each treatment's running total through weeks in which it logged nothing.
  let lastOlla: WeekRow['olla'];
  let lastSurface: WeekRow['surface'];

  return (
    <Chart
      title={st('charts.cohort.titles.progress')}
      takeaway={takeaway}
      spec={spec as VisualizationSpec}
      fileName="cohort-water-progress"
      alternative={
        <table className="w-full text-sm">
          <caption className="sr-only">{t(($) => $.progress.caption)}</caption>
          <thead className="text-ink-muted">
            <tr>
              <th scope="col" className="py-1 pr-4 text-left font-medium">
                {t(($) => $.progress.week)}
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-medium">
                {t(($) => $.progress.ollaSoFar)}
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-medium">
                {t(($) => $.progress.surfaceSoFar)}
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-medium">
                {t(($) => $.progress.ollaDepth)}
              </th>
              <th scope="col" className="py-1 pr-4 text-right font-medium">
                {t(($) => $.progress.surfaceDepth)}
              </th>
              <th scope="col" className="py-1 text-right font-medium">
                {t(($) => $.progress.trialsLogging)}
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((w) => {
              lastOlla = w.olla ?? lastOlla;
              lastSurface = w.surface ?? lastSurface;
              return (
                <tr key={w.weekStart} className="border-t border-sand-100">
                  <th scope="row" className="py-1 pr-4 text-left font-normal">
                    {w.isoWeek} <span className="text-ink-muted">({formatDate(w.weekStart)})</span>
                  </th>
                  <td className="num py-1 pr-4">{units.fmt(lastOlla?.cumulativeLitres, 'volume', 0)}</td>
                  <td className="num py-1 pr-4">{units.fmt(lastSurface?.cumulativeLitres, 'volume', 0)}</td>
                  <td className="num py-1 pr-4">{depth(lastOlla?.cumulativeMm)}</td>
                  <td className="num py-1 pr-4">{depth(lastSurface?.cumulativeMm)}</td>
                  <td className="num py-1">
                    {w.olla?.trials ?? 0} / {w.surface?.trials ?? 0}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      }
    />
  );
}
