import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { CONE_IDS } from '@shared/agronomy/pyrometric-cones';
import { clayBodySchema, potMakeLabels, potMakeSchema, potShapeLabels, potShapeSchema, type CreatePotInput, type Pot } from '@shared/schemas/pots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUnits } from '@/lib/units';
import { potFormDefaults, potFormSchema, type PotFormValues } from './pot-form-schema';
import { clayBodyLabels, coneDegrees, coneExplanation, conditionLabels } from './pot-labels';
import { PlotOptions } from './plot-options';
import type { PlotChoice, RenderCaution } from './types';

interface PotFormProps {
  pot?: Pot;
  plotChoices: PlotChoice[];
  renderCaution: RenderCaution;
  submitLabel: string;
  onSubmit: (input: CreatePotInput) => Promise<unknown>;
  onCancel: () => void;
}

/** Add or edit a pot: sizes in the reader's units, stored in SI through the shared schema. */
export function PotForm({ pot, plotChoices, renderCaution, submitLabel, onSubmit, onCancel }: PotFormProps) {
  const units = useUnits();
  const schema = useMemo(() => potFormSchema(units), [units]);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, watch, formState } = useForm<PotFormValues, unknown, CreatePotInput>({
    resolver: zodResolver(schema),
    defaultValues: potFormDefaults(units, pot),
  });
  const submit = handleSubmit(async (input) => {
    setFormError(null);
    // A size the grower did not touch keeps its stored value exactly (no drift through gallons or inches).
    const d = formState.dirtyFields;
    const kept = pot
      ? {
          capacityL: d.capacityL ? input.capacityL : pot.capacityL,
          heightCm: d.heightCm ? input.heightCm : pot.heightCm,
          widestDiameterCm: d.widestDiameterCm ? input.widestDiameterCm : pot.widestDiameterCm,
          neckDiameterCm: d.neckDiameterCm ? input.neckDiameterCm : pot.neckDiameterCm,
        }
      : {};
    try {
      await onSubmit({ ...input, ...kept });
    } catch (err) {
      setFormError(applyServerErrors(err, setError));
    }
  });

  const [make, shape, cone, plotId] = watch(['make', 'shape', 'firingCone', 'plotId']);
  const plot = plotChoices.find((p) => p.id === plotId);
  const twin = make === 'joined_terracotta' || shape === 'twin_pot';
  const e = formState.errors;
  const len = units.label('length-small');
  const idPrefix = pot ? `pot-${pot.id}` : 'new-pot';

  return (
    <form onSubmit={submit} noValidate className="space-y-4" aria-label={submitLabel}>
      {formError ? <Alert tone="error">{formError}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <InputField id={`${idPrefix}-label`} label="Label" placeholder="North bed, pot 1" autoComplete="off" {...register('label')} error={e.label?.message} />
        <InputField
          id={`${idPrefix}-capacity`}
          label={`Capacity (${units.label('volume')})`}
          inputMode="decimal"
          className="text-right"
          {...register('capacityL')}
          error={e.capacityL?.message}
        />
        <InputField
          id={`${idPrefix}-widest`}
          label={`Widest diameter (${len})`}
          inputMode="decimal"
          className="text-right"
          hint="Outside, at the fattest part of the body."
          {...register('widestDiameterCm')}
          error={e.widestDiameterCm?.message}
        />
        <InputField
          id={`${idPrefix}-neck`}
          label={`Neck diameter (${len}, optional)`}
          inputMode="decimal"
          className="text-right"
          {...register('neckDiameterCm')}
          error={e.neckDiameterCm?.message}
        />
        <InputField id={`${idPrefix}-height`} label={`Height (${len}, optional)`} inputMode="decimal" className="text-right" {...register('heightCm')} error={e.heightCm?.message} />
        <SelectField id={`${idPrefix}-shape`} label="Shape" {...register('shape')} error={e.shape?.message}>
          {potShapeSchema.options.map((s) => (
            <option key={s} value={s}>
              {potShapeLabels[s]}
            </option>
          ))}
        </SelectField>
        <SelectField id={`${idPrefix}-make`} label="How it was made" {...register('make')} error={e.make?.message}>
          {potMakeSchema.options.map((m) => (
            <option key={m} value={m}>
              {potMakeLabels[m]}
            </option>
          ))}
        </SelectField>
        <SelectField id={`${idPrefix}-clay`} label="Clay body" {...register('clayBody')} error={e.clayBody?.message}>
          {clayBodySchema.options.map((c) => (
            <option key={c} value={c}>
              {clayBodyLabels[c]}
            </option>
          ))}
        </SelectField>
        <SelectField
          id={`${idPrefix}-cone`}
          label="Firing cone (optional)"
          {...register('firingCone')}
          error={e.firingCone?.message}
          hint={cone ? coneExplanation(cone, units.system) : 'The pyrometric cone the pot was fired to, if the maker says.'}
        >
          <option value="">Not known</option>
          {CONE_IDS.map((c) => (
            <option key={c} value={c}>
              Cone {c} ({coneDegrees(c, units.system)})
            </option>
          ))}
        </SelectField>
        <InputField id={`${idPrefix}-installed`} type="date" label="Buried on (optional)" {...register('installedOn')} error={e.installedOn?.message} />
        <SelectField id={`${idPrefix}-plot`} label="Where it sits" {...register('plotId')} error={e.plotId?.message}>
          <PlotOptions choices={plotChoices} current={pot} />
        </SelectField>
        <SelectField id={`${idPrefix}-condition`} label="Condition" {...register('condition')} error={e.condition?.message}>
          {Object.entries(conditionLabels).map(([k, v]) => (
            <option key={k} value={k}>
              {v}
            </option>
          ))}
        </SelectField>
      </div>
      <TextareaField id={`${idPrefix}-notes`} label="Notes (optional)" placeholder="Where it came from, lid, repairs…" {...register('notes')} error={e.notes?.message} />
      {plot && plot.treatment && plot.treatment !== 'olla' ? (
        <Alert tone="warning">
          Plot {plot.label} is a “{plot.treatment}” plot. A pot there waters the comparison bed too, and the trial no longer compares pots with {plot.treatment} watering.
        </Alert>
      ) : null}
      {twin ? renderCaution('twinPotAdhesive', { headingLevel: 4 }) : null}
      {cone ? renderCaution('kilnFiring', { headingLevel: 4 }) : null}
      {plot && !plot.lid ? renderCaution('openPotMosquitoes', { headingLevel: 4 }) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : submitLabel}
        </Button>
        <Button variant="secondary" size="lg" onClick={onCancel} disabled={formState.isSubmitting}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
