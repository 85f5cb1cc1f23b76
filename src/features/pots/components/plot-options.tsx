import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
import type { Pot } from '@shared/schemas/pots';
import type { PlotChoice } from './types';

/** Plot label with its treatment, e.g. "A1 (olla)". */
export function plotChoiceLabel(p: PlotChoice, t: TFunction<'pots'>): string {
  if (!p.treatment) return t(($) => $.plotOptions.notAssigned, { plot: p.label });
  const treatment = p.treatment === 'olla' || p.treatment === 'surface' ? t(($) => $.treatments[p.treatment as 'olla' | 'surface']) : p.treatment;
  return t(($) => $.plotOptions.withTreatment, { plot: p.label, treatment });
}

/** The options of a "where it sits" select: the shelf, then the plots of each trial. */
export function PlotOptions({ choices, current }: { choices: PlotChoice[]; current?: Pot }) {
  const { t } = useTranslation('pots');
  const trials = [...new Map(choices.map((c) => [c.trialId, c])).values()];
  const missing = current?.plotId && !choices.some((c) => c.id === current.plotId);
  return (
    <>
      <option value="">{t(($) => $.plotOptions.shelf)}</option>
      {missing ? <option value={current.plotId!}>{t(($) => $.plotOptions.plot, { plot: current.plotLabel ?? t(($) => $.plotOptions.whereNow) })}</option> : null}
      {trials.map((tr) => (
        <optgroup key={tr.trialId} label={tr.trialClosed ? t(($) => $.plotOptions.closed, { title: tr.trialTitle }) : tr.trialTitle}>
          {choices
            .filter((c) => c.trialId === tr.trialId)
            .map((c) => (
              <option key={c.id} value={c.id}>
                {plotChoiceLabel(c, t)}
              </option>
            ))}
        </optgroup>
      ))}
    </>
  );
}
