import { useState, type FormEvent } from 'react';
import { potConditionSchema, type Pot, type PotCondition } from '@shared/schemas/pots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { useUpdatePot } from '../api/update-pot';
import { conditionLabels } from './pot-labels';
import { PlotOptions } from './plot-options';
import type { PlotChoice, RenderCaution } from './types';

const conditionHints: Record<PotCondition, string> = {
  sound: 'Seeps through the wall as it should.',
  cracked: 'Leaks through a crack far faster than the clay seeps; its refills no longer measure the clay.',
  clogged: 'Seeps much more slowly than it did: the wall is crusted or blocked.',
  retired: 'Out of use; kept for the record of its tests.',
};

/** Move a pot into one of the grower's plots or back to the shelf, and mark its condition. */
export function PlacementForm({ pot, plotChoices, renderCaution, onDone }: { pot: Pot; plotChoices: PlotChoice[]; renderCaution: RenderCaution; onDone: (message: string) => void }) {
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
      const where = updated.plotLabel ? `in plot ${updated.plotLabel}` : 'on the shelf';
      onDone(`${updated.label} is ${where}, ${conditionLabels[updated.condition].toLowerCase()}.`);
    } catch (err) {
      setError(err instanceof Error ? err.message : 'Something went wrong. Please try again.');
    }
  };
  const p = `place-${pot.id}`;
  return (
    <form onSubmit={(e) => void submit(e)} className="space-y-3 rounded-lg border border-sand-200 bg-sand-50 p-3" aria-label={`Move or mark ${pot.label}`}>
      {error ? <Alert tone="error">{error}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField id={`${p}-plot`} label="Where it sits" value={plotId} onChange={(e) => setPlotId(e.target.value)}>
          <PlotOptions choices={plotChoices} current={pot} />
        </SelectField>
        <SelectField id={`${p}-condition`} label="Condition" value={condition} onChange={(e) => setCondition(e.target.value as PotCondition)} hint={conditionHints[condition]}>
          {potConditionSchema.options.map((c) => (
            <option key={c} value={c}>
              {conditionLabels[c]}
            </option>
          ))}
        </SelectField>
      </div>
      {plot && plot.treatment && plot.treatment !== 'olla' ? (
        <Alert tone="warning">
          Plot {plot.label} is a “{plot.treatment}” plot: a pot there waters the comparison bed too, and the trial no longer compares pots with {plot.treatment} watering.
        </Alert>
      ) : null}
      {plot && !plot.lid ? renderCaution('openPotMosquitoes', { headingLevel: 4 }) : null}
      {plotChoices.length === 0 ? <p className="text-sm text-ink-muted">You have no plots yet: set them up in a trial, then place pots here.</p> : null}
      <Button type="submit" size="lg" disabled={update.isPending || (plotId === (pot.plotId ?? '') && condition === pot.condition)}>
        {update.isPending ? 'Saving…' : 'Save'}
      </Button>
    </form>
  );
}
