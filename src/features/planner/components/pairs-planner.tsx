import { useMemo } from 'react';
import type { TFunction } from 'i18next';
import { useForm, useWatch } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { pairedSampleSize, pairedSampleSizeFractional } from '@shared/analysis/power';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField, SelectField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { useTrialSpread, type TrialSpread } from '../api/get-trial-spread';
import { numberMessages } from './bed-planner';
import { checkField, fieldMessages, formatNumber, typedNumber } from './typed-number';
import type { PlannerTrial } from './types';

type Units = ReturnType<typeof useUnits>;

export function pairsSchema(t: TFunction<'planner'>) {
  const levelMessage = t(($) => $.pairs.levelRange);
  const powerMessage = t(($) => $.pairs.powerRange);
  return z
    .object({
      unit: z.enum(['depth', 'percent']),
      saving: z.string(),
      source: z.enum(['typed', 'trial']),
      sd: z.string(),
      trialId: z.string(),
      alpha: z.string(),
      power: z.string(),
    })
    .transform((v, ctx) => {
      const saving = checkField(
        ctx,
        typedNumber(numberMessages(t, t(($) => $.pairs.whatSaving)), (n) => {
          const above = n.positive(t(($) => $.pairs.savingPositive));
          return v.unit === 'percent' ? above.max(100, t(($) => $.pairs.savingMax)) : above;
        }),
        v.saving,
        'saving',
      );
      const sd =
        v.source === 'typed'
          ? checkField(ctx, typedNumber(numberMessages(t, t(($) => $.pairs.whatSpread)), (n) => n.positive(t(($) => $.pairs.spreadPositive))), v.sd, 'sd')
          : null;
      const alpha = checkField(ctx, typedNumber(numberMessages(t, t(($) => $.pairs.whatAlpha)), (n) => n.min(0.001, levelMessage).max(0.2, levelMessage)), v.alpha, 'alpha');
      const power = checkField(ctx, typedNumber(numberMessages(t, t(($) => $.pairs.whatPower)), (n) => n.min(50, powerMessage).max(99, powerMessage)), v.power, 'power');
      if (saving === null || alpha === null || power === null || (v.source === 'typed' && sd === null)) return z.NEVER;
      return { unit: v.unit, saving, source: v.source, sd, trialId: v.trialId || null, alpha, power };
    });
}

type PairsValues = z.input<ReturnType<typeof pairsSchema>>;

/** English: "a 90% chance", "an 80% chance", "an 11% chance": numbers said with a vowel sound first take "an". */
const article = (text: string) => (/^8/.test(text) || /^(11|18)(\D|$)/.test(text) ? 'an' : 'a');

/** The trial's spread in the unit the saving is typed in, or why there is none (in the reader's language). */
function spreadIn(spread: TrialSpread, unit: 'depth' | 'percent', units: Units, t: TFunction<'planner'>): { value: number; text: string } | { reason: string } {
  if (spread.kind === 'none') {
    if (spread.reason === 'notTestable') return { reason: t(($) => $.pairs.notTestable, { detail: spread.detail ?? '' }).trim() };
    return { reason: spread.reason === 'noPair' ? t(($) => $.pairs.noPair) : t(($) => $.pairs.noSpread) };
  }
  if (unit === 'percent') {
    if (!(spread.controlMeanMm > 0)) return { reason: t(($) => $.pairs.noControlWater) };
    const pct = (spread.sdMm / spread.controlMeanMm) * 100;
    return { value: pct, text: t(($) => $.pairs.spreadShare, { pct: formatNumber(pct, 1), control: spread.control, depth: units.fmt(spread.sdMm, 'length-small', 1) }) };
  }
  const value = units.show(spread.sdMm, 'length-small');
  return { value, text: units.fmt(spread.sdMm, 'length-small', units.system === 'us' ? 2 : 1) };
}

/** (c) How many pairs do I need: pairedSampleSize for the expected saving and its spread. */
export function PairsPlanner({ trials }: { trials: PlannerTrial[] }) {
  const units = useUnits();
  const { t } = useTranslation('planner');
  const schema = useMemo(() => pairsSchema(t), [t]);
  const us = units.system === 'us';
  const defaults = useMemo<PairsValues>(
    () => ({ unit: 'depth', saving: us ? '1.2' : '30', source: 'typed', sd: us ? '1.6' : '40', trialId: '', alpha: '0.05', power: '80' }),
    [us],
  );
  const { register, control } = useForm<PairsValues>({ defaultValues: defaults });
  const values = useWatch({ control });
  const parsed = useMemo(() => schema.safeParse({ ...defaults, ...values }), [schema, defaults, values]);
  const unit = values.unit ?? defaults.unit;
  const source = values.source ?? defaults.source;
  const spread = useTrialSpread(source === 'trial' && values.trialId ? values.trialId : null);
  const unitLabel = unit === 'percent' ? '%' : units.label('length-small');
  const withUnit = (n: number) => (unit === 'percent' ? `${formatNumber(n, 2)}%` : `${formatNumber(n, 2)} ${unitLabel}`);

  const trialSpread = source === 'trial' && spread.data ? spreadIn(spread.data, unit, units, t) : null;
  const sd = !parsed.success ? null : parsed.data.source === 'typed' ? parsed.data.sd : trialSpread && 'value' in trialSpread ? trialSpread.value : null;

  const result = useMemo(() => {
    if (!parsed.success || sd === null) return null;
    const input = { meanDifference: parsed.data.saving, sdDifference: sd, alpha: parsed.data.alpha, power: parsed.data.power / 100 };
    try {
      return { n: pairedSampleSize(input), exact: pairedSampleSizeFractional(input), ...parsed.data, sd };
    } catch (err) {
      return { error: err instanceof Error ? err.message : t(($) => $.pairs.cannot) };
    }
  }, [parsed, sd, t]);
  // Messages come from the live parse of the whole form, so a rule across fields shows too.
  const e = fieldMessages(parsed);

  return (
    <section aria-labelledby="pairs-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="pairs-heading">{t(($) => $.pairs.title)}</h2>
        <p className="text-sm text-ink-muted">{t(($) => $.pairs.intro)}</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label={t(($) => $.pairs.formLabel)} className="space-y-3">
          <ChoiceGroup legend={t(($) => $.pairs.sayAs)}>
            <Choice label={t(($) => $.pairs.depth, { unit: units.label('length-small') })} hint={t(($) => $.pairs.depthHint)} value="depth" {...register('unit')} />
            <Choice label={t(($) => $.pairs.percent)} value="percent" {...register('unit')} />
          </ChoiceGroup>
          <InputField id="pairs-saving" label={t(($) => $.pairs.saving, { unit: unitLabel })} inputMode="decimal" className="text-right" {...register('saving')} error={e.saving} />
          <ChoiceGroup legend={t(($) => $.pairs.spreadLegend)}>
            <Choice label={t(($) => $.pairs.knowSpread)} value="typed" {...register('source')} />
            <Choice label={t(($) => $.pairs.useTrial)} hint={t(($) => $.pairs.useTrialHint)} value="trial" {...register('source')} />
          </ChoiceGroup>
          {source === 'typed' ? (
            <InputField
              id="pairs-sd"
              label={t(($) => $.pairs.sd, { unit: unitLabel })}
              inputMode="decimal"
              className="text-right"
              hint={t(($) => $.pairs.sdHint)}
              {...register('sd')}
              error={e.sd}
            />
          ) : (
            <SelectField
              id="pairs-trial"
              label={t(($) => $.pairs.trial)}
              {...register('trialId')}
              error={e.trialId}
              hint={trials.length ? undefined : t(($) => $.pairs.noTrials)}
            >
              <option value="">{t(($) => $.pairs.chooseTrial)}</option>
              {trials.map((tr) => (
                <option key={tr.id} value={tr.id}>
                  {tr.title}
                  {tr.closed ? t(($) => $.pairs.closed) : ''}
                </option>
              ))}
            </SelectField>
          )}
          {source === 'trial' && values.trialId ? (
            <p className="text-sm" role="status">
              {spread.isPending
                ? t(($) => $.pairs.reading)
                : spread.isError
                  ? t(($) => $.pairs.readError, { error: spread.error.message })
                  : trialSpread && 'reason' in trialSpread
                    ? trialSpread.reason
                    : trialSpread && spread.data?.kind === 'spread'
                      ? t(($) => $.pairs.spreadFrom, { pairs: spread.data.pairs, treatment: spread.data.treatment, control: spread.data.control, spread: trialSpread.text })
                      : null}
            </p>
          ) : null}
          <div className="grid grid-cols-2 gap-3">
            <InputField id="pairs-alpha" label={t(($) => $.pairs.alpha)} inputMode="decimal" className="text-right" {...register('alpha')} error={e.alpha} />
            <InputField id="pairs-power" label={t(($) => $.pairs.power)} inputMode="decimal" className="text-right" {...register('power')} error={e.power} />
          </div>
        </form>
        <div className="min-w-0 space-y-3" aria-live="polite">
          {result && 'n' in result ? (
            <>
              <p className="text-3xl font-semibold" id="pairs-count">
                <span className="num">{result.n}</span> {t(($) => $.pairs.count, { count: result.n })}
              </p>
              <p id="pairs-sentence">
                {t(($) => (article(formatNumber(result.power, 1)) === 'an' ? $.pairs.sentenceAn : $.pairs.sentenceA), {
                  n: result.n,
                  power: formatNumber(result.power, 1),
                  saving: withUnit(result.saving),
                  sd: withUnit(result.sd),
                  alpha: formatNumber(result.alpha, 3),
                })}
              </p>
              <p className="text-sm text-ink-muted">
                {t(($) => $.pairs.beds, { beds: result.n * 2, n: result.n, exact: formatNumber(result.exact, 2) })}
              </p>
              {result.n > 30 ? (
                <p className="text-sm">{t(($) => $.pairs.cohort)}</p>
              ) : null}
            </>
          ) : result && 'error' in result ? (
            <p role="alert" className="font-medium text-red-800">
              {result.error}
            </p>
          ) : (
            <p className="text-ink-muted">{source === 'trial' ? t(($) => $.pairs.chooseOrType) : t(($) => $.pairs.correct)}</p>
          )}
        </div>
      </div>
    </section>
  );
}
