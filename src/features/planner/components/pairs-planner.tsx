import { useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { pairedSampleSize, pairedSampleSizeFractional } from '@shared/analysis/power';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField, SelectField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { useTrialSpread, type TrialSpread } from '../api/get-trial-spread';
import { checkField, fieldMessages, formatNumber, typedNumber } from './typed-number';
import type { PlannerTrial } from './types';

type Units = ReturnType<typeof useUnits>;

const levelMessage = 'Use a level between 0.001 and 0.2; 0.05 is usual.';
const powerMessage = 'Use a chance between 50 and 99%; 80% is usual.';

export function pairsSchema() {
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
        typedNumber('the expected saving', (n) => {
          const above = n.positive('Enter a saving above zero: no number of pairs can detect no difference.');
          return v.unit === 'percent' ? above.max(100, 'A saving cannot be more than 100%.') : above;
        }),
        v.saving,
        'saving',
      );
      const sd = v.source === 'typed' ? checkField(ctx, typedNumber('the spread', (n) => n.positive('The spread must be more than zero.')), v.sd, 'sd') : null;
      const alpha = checkField(ctx, typedNumber('the significance level', (n) => n.min(0.001, levelMessage).max(0.2, levelMessage)), v.alpha, 'alpha');
      const power = checkField(ctx, typedNumber('the chance to detect it', (n) => n.min(50, powerMessage).max(99, powerMessage)), v.power, 'power');
      if (saving === null || alpha === null || power === null || (v.source === 'typed' && sd === null)) return z.NEVER;
      return { unit: v.unit, saving, source: v.source, sd, trialId: v.trialId || null, alpha, power };
    });
}

type PairsValues = z.input<ReturnType<typeof pairsSchema>>;

/** "a 90% chance", "an 80% chance", "an 11% chance": numbers said with a vowel sound first take "an". */
const article = (text: string) => (/^8/.test(text) || /^(11|18)(\D|$)/.test(text) ? 'an' : 'a');

/** The trial's spread in the unit the saving is typed in, or why there is none. */
function spreadIn(spread: TrialSpread, unit: 'depth' | 'percent', units: Units): { value: number; text: string } | { reason: string } {
  if (spread.kind === 'none') return { reason: spread.reason };
  if (unit === 'percent') {
    if (!(spread.controlMeanMm > 0)) return { reason: 'Its control plots have no water logged yet, so the spread cannot be put as a share.' };
    const pct = (spread.sdMm / spread.controlMeanMm) * 100;
    return { value: pct, text: `${formatNumber(pct, 1)}% of the ${spread.control} plots' mean water (${units.fmt(spread.sdMm, 'length-small', 1)})` };
  }
  const value = units.show(spread.sdMm, 'length-small');
  return { value, text: units.fmt(spread.sdMm, 'length-small', units.system === 'us' ? 2 : 1) };
}

/** (c) How many pairs do I need: pairedSampleSize for the expected saving and its spread. */
export function PairsPlanner({ trials }: { trials: PlannerTrial[] }) {
  const units = useUnits();
  const schema = useMemo(() => pairsSchema(), []);
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

  const trialSpread = source === 'trial' && spread.data ? spreadIn(spread.data, unit, units) : null;
  const sd = !parsed.success ? null : parsed.data.source === 'typed' ? parsed.data.sd : trialSpread && 'value' in trialSpread ? trialSpread.value : null;

  const result = useMemo(() => {
    if (!parsed.success || sd === null) return null;
    const input = { meanDifference: parsed.data.saving, sdDifference: sd, alpha: parsed.data.alpha, power: parsed.data.power / 100 };
    try {
      return { n: pairedSampleSize(input), exact: pairedSampleSizeFractional(input), ...parsed.data, sd };
    } catch (err) {
      return { error: err instanceof Error ? err.message : 'These numbers cannot be worked out.' };
    }
  }, [parsed, sd]);
  // Messages come from the live parse of the whole form, so a rule across fields shows too.
  const e = fieldMessages(parsed);

  return (
    <section aria-labelledby="pairs-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="pairs-heading">How many pairs do I need</h2>
        <p className="text-sm text-ink-muted">
          A pair is two matched beds, one with pots and one watered from the surface. The more the saving varies from pair to pair, the more pairs it takes to tell it
          from chance.
        </p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label="Expected saving and spread" className="space-y-3">
          <ChoiceGroup legend="Say the saving as">
            <Choice label={`Water depth (${units.label('length-small')})`} hint="Season water per bed area." value="depth" {...register('unit')} />
            <Choice label="Share of the control's water (%)" value="percent" {...register('unit')} />
          </ChoiceGroup>
          <InputField id="pairs-saving" label={`Expected saving (${unitLabel})`} inputMode="decimal" className="text-right" {...register('saving')} error={e.saving} />
          <ChoiceGroup legend="Spread of the pair differences">
            <Choice label="I know the spread" value="typed" {...register('source')} />
            <Choice label="Use one of my trials" hint="Its pairs' water differences so far." value="trial" {...register('source')} />
          </ChoiceGroup>
          {source === 'typed' ? (
            <InputField
              id="pairs-sd"
              label={`Standard deviation of the pair differences (${unitLabel})`}
              inputMode="decimal"
              className="text-right"
              hint="How much the saving differs from one pair to the next."
              {...register('sd')}
              error={e.sd}
            />
          ) : (
            <SelectField
              id="pairs-trial"
              label="Trial"
              {...register('trialId')}
              error={e.trialId}
              hint={trials.length ? undefined : 'You have no trials yet: type a spread instead.'}
            >
              <option value="">Choose a trial</option>
              {trials.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.title}
                  {t.closed ? ' (closed)' : ''}
                </option>
              ))}
            </SelectField>
          )}
          {source === 'trial' && values.trialId ? (
            <p className="text-sm" role="status">
              {spread.isPending
                ? 'Reading the trial…'
                : spread.isError
                  ? `Could not read the trial: ${spread.error.message}`
                  : trialSpread && 'reason' in trialSpread
                    ? trialSpread.reason
                    : trialSpread && spread.data?.kind === 'spread'
                      ? `In its ${spread.data.pairs} pairs, the ${spread.data.treatment} − ${spread.data.control} differences in water spread by ${trialSpread.text} (standard deviation).`
                      : null}
            </p>
          ) : null}
          <div className="grid grid-cols-2 gap-3">
            <InputField id="pairs-alpha" label="Significance level α" inputMode="decimal" className="text-right" {...register('alpha')} error={e.alpha} />
            <InputField id="pairs-power" label="Chance to detect (%)" inputMode="decimal" className="text-right" {...register('power')} error={e.power} />
          </div>
        </form>
        <div className="min-w-0 space-y-3" aria-live="polite">
          {result && 'n' in result ? (
            <>
              <p className="text-3xl font-semibold" id="pairs-count">
                <span className="num">{result.n}</span> pairs
              </p>
              <p id="pairs-sentence">
                About {result.n} pairs give {article(formatNumber(result.power, 1))} {formatNumber(result.power, 1)}% chance to detect a saving of {withUnit(result.saving)}{' '}
                when the pair differences spread by {withUnit(result.sd)} (standard deviation), with a two-sided paired t-test at α = {formatNumber(result.alpha, 3)}.
              </p>
              <p className="text-sm text-ink-muted">
                That is {result.n * 2} beds: {result.n} with pots and {result.n} watered from the surface. Worked out as R&apos;s power.t.test (type “paired”) does:{' '}
                {formatNumber(result.exact, 2)} pairs, rounded up.
              </p>
              {result.n > 30 ? (
                <p className="text-sm">More pairs than one garden usually holds: pooling pairs with other growers in a cohort gets there together.</p>
              ) : null}
            </>
          ) : result && 'error' in result ? (
            <p role="alert" className="font-medium text-red-800">
              {result.error}
            </p>
          ) : (
            <p className="text-ink-muted">{source === 'trial' ? 'Choose a trial with at least two complete pairs, or type a spread.' : 'Correct the marked numbers to see the pairs needed.'}</p>
          )}
        </div>
      </div>
    </section>
  );
}
