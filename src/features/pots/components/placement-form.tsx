import { useState, type FormEvent } from 'react';
import { useTranslation } from 'react-i18next';
import { potConditionSchema, type Pot, type PotCondition } from '@shared/schemas/pots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { useUpdatePot } from '../api/update-pot';
import { PlotOptions } from './plot-options';
import type { PlotChoice, RenderCaution } from './types';

/** Move a pot into one of the grower's plots or back to the shelf, and mark its condition. */
export function PlacementForm({ pot, plotChoices, renderCaution, onDone }: { pot: Pot; plotChoices: PlotChoice[]; renderCaution: RenderCaution; onDone: (message: string) => void }) {
  const { t } = useTranslation('pots');
  const { t: tc } = useTranslation('common');
  const update = useUpdatePot();
  const [plotId, setPlotId] = useState(pot.plotId ?? '');
  const [condition, setCondition] = useState<PotCondition>(pot.condition);
  const [error, setError] = useState<string | null>(null);
  const plot = plotChoices.find((p) => p.id === plotId);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    try {
      const updated = await update.mutateAsync({ pot, changes: { plotId: plotId || null, condition } });
      const where = updated.plotLabel ? t(($) => $.place.inPlot, { plot: updated.plotLabel }) : t(($) => $.place.onShelf);
      onDone(t(($) => $.place.done, { pot: updated.label, where, condition: t(($) => $.conditionsLower[updated.condition]) }));
    } catch (err) {
      setError(err instanceof Error ? err.message : t(($) => $.errors.failed));
    }
  };
  const p = `place-${pot.id}`;
  return (
    <form onSubmit={(e) => void submit(e)} className="space-y-3 rounded-lg border border-sand-200 bg-sand-50 p-3" aria-label={t(($) => $.place.label, { pot: pot.label })}>
      {error ? <Alert tone="error">{error}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField id={`${p}-plot`} label={t(($) => $.form.where)} value={plotId} onChange={(e) => setPlotId(e.target.value)}>
          <PlotOptions choices={plotChoices} current={pot} />
        </SelectField>
        <SelectField id={`${p}-condition`} label={t(($) => $.form.condition)}
          value={condition}
          onChange={(e) => setCondition(e.target.value as PotCondition)}
          hint={t(($) => $.conditionHints[condition])}
        >
          {potConditionSchema.options.map((c) => (
            <option key={c} value={c}>
              {t(($) => $.conditions[c])}
            </option>
          ))}
        </SelectField>
      </div>
      {plot && plot.treatment && plot.treatment !== 'olla' ? (
        <Alert tone="warning">
          {t(($) => $.form.otherTreatmentPlace, { plot: plot.label, treatment: plot.treatment === 'surface' ? t(($) => $.treatments.surface) : plot.treatment })}
        </Alert>
      ) : null}
      {plot && !plot.lid ? renderCaution('openPotMosquitoes', { headingLevel: 4 }) : null}
      {plotChoices.length === 0 ? <p className="text-sm text-ink-muted">{t(($) => $.place.noPlots)}</p> : null}
      <Button type="submit" size="lg" disabled={update.isPending || (plotId === (pot.plotId ?? '') && condition === pot.condition)}>
        {update.isPending ? t(($) => $.form.saving) : tc(($) => $.actions.save)}
      </Button>
    </form>
  );
}
