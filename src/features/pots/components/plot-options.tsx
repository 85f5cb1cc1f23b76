import type { Pot } from '@shared/schemas/pots';
import type { PlotChoice } from './types';

/** Plot label with its treatment, e.g. "A1 (olla)". */
export function plotChoiceLabel(p: PlotChoice): string {
  return p.treatment ? `${p.label} (${p.treatment})` : `${p.label} (not assigned yet)`;
}

/** The options of a "where it sits" select: the shelf, then the plots of each trial. */
export function PlotOptions({ choices, current }: { choices: PlotChoice[]; current?: Pot }) {
  const trials = [...new Map(choices.map((c) => [c.trialId, c])).values()];
  const missing = current?.plotId && !choices.some((c) => c.id === current.plotId);
  return (
    <>
      <option value="">On the shelf (not in a plot)</option>
      {missing ? <option value={current.plotId!}>Plot {current.plotLabel ?? 'where it is now'}</option> : null}
      {trials.map((t) => (
        <optgroup key={t.trialId} label={`${t.trialTitle}${t.trialClosed ? ' (closed)' : ''}`}>
          {choices
            .filter((c) => c.trialId === t.trialId)
            .map((c) => (
              <option key={c.id} value={c.id}>
                {plotChoiceLabel(c)}
              </option>
            ))}
        </optgroup>
      ))}
    </>
  );
}
