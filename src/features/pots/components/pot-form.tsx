import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { CONE_IDS } from '@shared/agronomy/pyrometric-cones';
import { clayBodySchema, potConditionSchema, potMakeSchema, potShapeSchema, type CreatePotInput, type Pot } from '@shared/schemas/pots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { InputField, SelectField, TextareaField } from '@/components/ui/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUnits } from '@/lib/units';
import { potFormDefaults, potFormSchema, type PotFormValues } from './pot-form-schema';
import { coneDegrees, coneExplanation } from './pot-labels';
import { PlotOptions } from './plot-options';
import type { PlotChoice, RenderCaution } from './types';
import { usePotMessages } from './schema-messages';

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
  const { t } = useTranslation('pots');
  const { t: tc } = useTranslation('common');
  const m = usePotMessages();
  const schema = useMemo(() => potFormSchema(units, t), [units, t]);
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
        <InputField id={`${idPrefix}-label`} label={t(($) => $.form.label)} placeholder={t(($) => $.form.labelPlaceholder)} autoComplete="off" {...register('label')} error={m(e.label?.message)} />
        <InputField
          id={`${idPrefix}-capacity`}
          label={t(($) => $.form.capacity, { unit: units.label('volume') })}
          inputMode="decimal"
          className="text-right"
          {...register('capacityL')}
          error={m(e.capacityL?.message)}
        />
        <InputField
          id={`${idPrefix}-widest`}
          label={t(($) => $.form.widest, { unit: len })}
          inputMode="decimal"
          className="text-right"
          hint={t(($) => $.form.widestHint)}
          {...register('widestDiameterCm')}
          error={m(e.widestDiameterCm?.message)}
        />
        <InputField
          id={`${idPrefix}-neck`}
          label={t(($) => $.form.neck, { unit: len })}
          inputMode="decimal"
          className="text-right"
          {...register('neckDiameterCm')}
          error={m(e.neckDiameterCm?.message)}
        />
        <InputField id={`${idPrefix}-height`} label={t(($) => $.form.height, { unit: len })} inputMode="decimal" className="text-right" {...register('heightCm')} error={m(e.heightCm?.message)} />
        <SelectField id={`${idPrefix}-shape`} label={t(($) => $.form.shape)} {...register('shape')} error={m(e.shape?.message)}>
          {potShapeSchema.options.map((s) => (
            <option key={s} value={s}>
              {t(($) => $.shapes[s])}
            </option>
          ))}
        </SelectField>
        <SelectField id={`${idPrefix}-make`} label={t(($) => $.form.make)} {...register('make')} error={m(e.make?.message)}>
          {potMakeSchema.options.map((m) => (
            <option key={m} value={m}>
              {t(($) => $.makes[m])}
            </option>
          ))}
        </SelectField>
        <SelectField id={`${idPrefix}-clay`} label={t(($) => $.form.clay)} {...register('clayBody')} error={m(e.clayBody?.message)}>
          {clayBodySchema.options.map((c) => (
            <option key={c} value={c}>
              {t(($) => $.clays[c])}
            </option>
          ))}
        </SelectField>
        <SelectField
          id={`${idPrefix}-cone`}
          label={t(($) => $.form.cone)}
          {...register('firingCone')}
          error={m(e.firingCone?.message)}
          hint={cone ? coneExplanation(cone, units.system, t) : t(($) => $.form.coneHint)}
        >
          <option value="">{t(($) => $.form.coneUnknown)}</option>
          {CONE_IDS.map((c) => (
            <option key={c} value={c}>
              {t(($) => $.cone.option, { cone: c, degrees: coneDegrees(c, units.system) })}
            </option>
          ))}
        </SelectField>
        <InputField id={`${idPrefix}-installed`} type="date" label={t(($) => $.form.installed)} {...register('installedOn')} error={m(e.installedOn?.message)} />
        <SelectField id={`${idPrefix}-plot`} label={t(($) => $.form.where)} {...register('plotId')} error={m(e.plotId?.message)}>
          <PlotOptions choices={plotChoices} current={pot} />
        </SelectField>
        <SelectField id={`${idPrefix}-condition`} label={t(($) => $.form.condition)} {...register('condition')} error={m(e.condition?.message)}>
          {potConditionSchema.options.map((k) => (
            <option key={k} value={k}>
              {t(($) => $.conditions[k])}
            </option>
          ))}
        </SelectField>
      </div>
      <TextareaField id={`${idPrefix}-notes`} label={t(($) => $.form.notes)} placeholder={t(($) => $.form.notesPlaceholder)} {...register('notes')} error={m(e.notes?.message)} />
      {plot && plot.treatment && plot.treatment !== 'olla' ? (
        <Alert tone="warning">
          {t(($) => $.form.otherTreatment, { plot: plot.label, treatment: plot.treatment === 'surface' ? t(($) => $.treatments.surface) : plot.treatment })}
        </Alert>
      ) : null}
      {twin ? renderCaution('twinPotAdhesive', { headingLevel: 4 }) : null}
      {cone ? renderCaution('kilnFiring', { headingLevel: 4 }) : null}
      {plot && !plot.lid ? renderCaution('openPotMosquitoes', { headingLevel: 4 }) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? t(($) => $.form.saving) : submitLabel}
        </Button>
        <Button variant="secondary" size="lg" onClick={onCancel} disabled={formState.isSubmitting}>
          {tc(($) => $.actions.cancel)}
        </Button>
      </div>
    </form>
  );
}
