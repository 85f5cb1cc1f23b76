import { useMemo, useState } from 'react';
import type { TFunction } from 'i18next';
import { useForm, useWatch } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { refillIntervalDays, wettedAreaM2, type RefillInput } from '@shared/agronomy/olla-layout';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField, SelectField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { numberMessages } from './bed-planner';
import { checkField, fieldMessages, formatNumber, numberText, typedNumber } from './typed-number';
import type { PlannerPot, RenderCaution } from './types';

type Units = ReturnType<typeof useUnits>;

const MAX_CAPACITY_L = 200;
const MAX_SEEPAGE_L_PER_DAY = 50;
const MAX_NEED_MM_PER_DAY = 25;
const MIN_POT_MM = 50;
const MAX_POT_MM = 1500;

export function refillSchema(units: Units, t: TFunction<'planner'>) {
  const vol = units.label('volume');
  const rate = units.label('rate');
  const small = units.label('length-small');
  const capacity = typedNumber(numberMessages(t, t(($) => $.refill.whatCapacity, { unit: vol })), (n) =>
    n
      .positive(t(($) => $.refill.capacityPositive))
      .max(units.show(MAX_CAPACITY_L, 'volume'), t(($) => $.bed.atMost, { max: formatNumber(units.show(MAX_CAPACITY_L, 'volume'), 1), unit: vol })),
  );
  const seepage = typedNumber(numberMessages(t, t(($) => $.refill.whatSeepage, { unit: rate })), (n) =>
    n
      .min(0, t(($) => $.refill.seepageNegative))
      .max(units.show(MAX_SEEPAGE_L_PER_DAY, 'rate'), t(($) => $.refill.seepageMax, { max: formatNumber(units.show(MAX_SEEPAGE_L_PER_DAY, 'rate'), 1), unit: rate })),
  );
  const need = typedNumber(numberMessages(t, t(($) => $.refill.whatNeed, { unit: small })), (n) =>
    n
      .min(0, t(($) => $.refill.needNegative))
      .max(units.show(MAX_NEED_MM_PER_DAY, 'length-small'), t(($) => $.refill.needMax, { max: formatNumber(units.show(MAX_NEED_MM_PER_DAY, 'length-small'), 2), unit: small })),
  );
  const diameter = typedNumber(numberMessages(t, t(($) => $.refill.whatDiameter, { unit: small })), (n) =>
    n
      .min(units.show(MIN_POT_MM, 'length-small'), t(($) => $.bed.atLeast, { min: formatNumber(units.show(MIN_POT_MM, 'length-small'), 1), unit: small }))
      .max(units.show(MAX_POT_MM, 'length-small'), t(($) => $.bed.atMost, { max: formatNumber(units.show(MAX_POT_MM, 'length-small'), 0), unit: small })),
  );
  return z
    .object({ mode: z.enum(['seepage', 'need']), capacity: z.string(), seepage: z.string(), need: z.string(), diameter: z.string() })
    .transform((v, ctx): { input: RefillInput; diameterM: number | null } => {
      const c = checkField(ctx, capacity, v.capacity, 'capacity');
      if (v.mode === 'seepage') {
        const s = checkField(ctx, seepage, v.seepage, 'seepage');
        if (c === null || s === null) return z.NEVER;
        return { input: { capacityL: units.toSI(c, 'volume'), seepageLPerDay: units.toSI(s, 'rate') }, diameterM: null };
      }
      const nd = checkField(ctx, need, v.need, 'need');
      const d = checkField(ctx, diameter, v.diameter, 'diameter');
      if (c === null || nd === null || d === null) return z.NEVER;
      const diameterM = units.toSI(d, 'length-small') / 1000;
      return { input: { capacityL: units.toSI(c, 'volume'), cropNeedMmPerDay: units.toSI(nd, 'length-small'), wettedAreaM2: wettedAreaM2(diameterM) }, diameterM };
    });
}

type RefillValues = z.input<ReturnType<typeof refillSchema>>;

/** (b) How often to refill: capacity over the daily draw (measured seepage, or crop need over the wetted zone). */
export function RefillPlanner({ pots, renderCaution }: { pots: PlannerPot[]; renderCaution: RenderCaution }) {
  const units = useUnits();
  const { t } = useTranslation('planner');
  const schema = useMemo(() => refillSchema(units, t), [units, t]);
  const us = units.system === 'us';
  const defaults = useMemo<RefillValues>(
    () => ({ mode: 'seepage', capacity: us ? '2' : '8', seepage: us ? '0.5' : '2', need: us ? '0.2' : '5', diameter: us ? '12' : '300' }),
    [us],
  );
  const { register, control, setValue } = useForm<RefillValues>({ defaultValues: defaults });
  const values = useWatch({ control });
  const [fromPot, setFromPot] = useState('');
  const [potNote, setPotNote] = useState<string | null>(null);
  const parsed = useMemo(() => schema.safeParse({ ...defaults, ...values }), [schema, defaults, values]);
  const result = useMemo(() => {
    if (!parsed.success) return null;
    try {
      return { ...parsed.data, interval: refillIntervalDays(parsed.data.input) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : t(($) => $.refill.cannot) };
    }
  }, [parsed, t]);
  // Messages come from the live parse of the whole form, so a rule across fields shows too.
  const e = fieldMessages(parsed);
  const mode = values.mode ?? defaults.mode;

  const fillFrom = (id: string) => {
    setFromPot(id);
    const pot = pots.find((p) => p.id === id);
    if (!pot) return setPotNote(null);
    const opts = { shouldValidate: true, shouldDirty: true } as const;
    setValue('capacity', numberText(units.show(pot.capacityL, 'volume'), us ? 2 : 1), opts);
    setValue('diameter', numberText(units.show(pot.widestDiameterCm * 10, 'length-small'), us ? 1 : 0), opts);
    if (pot.latestSeepLitresPerDay !== null) {
      setValue('seepage', numberText(units.show(pot.latestSeepLitresPerDay, 'rate'), 2), opts);
      setPotNote(t(($) => $.refill.filledFrom, { pot: pot.label }));
    } else {
      setPotNote(t(($) => $.refill.filledFromNoTest, { pot: pot.label }));
    }
  };

  const interval = result && 'interval' in result ? result.interval : null;
  const headline = (days: number) => {
    if (!Number.isFinite(days)) return t(($) => $.refill.never);
    if (days < 1) return t(($) => $.refill.hours, { n: formatNumber(Math.max(1, Math.round(days * 24)), 0) });
    return t(($) => $.refill.days, { n: formatNumber(days, days < 10 ? 1 : 0) });
  };

  return (
    <section aria-labelledby="refill-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="refill-heading">{t(($) => $.refill.title)}</h2>
        <p className="text-sm text-ink-muted">{t(($) => $.refill.intro)}</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label={t(($) => $.refill.formLabel)} className="space-y-3">
          {pots.length ? (
            <SelectField id="refill-from-pot" label={t(($) => $.refill.fromPot)} value={fromPot} onChange={(ev) => fillFrom(ev.target.value)} hint={potNote ?? undefined}>
              <option value="">{t(($) => $.refill.typeMyself)}</option>
              {pots.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.label}
                </option>
              ))}
            </SelectField>
          ) : null}
          <InputField id="refill-capacity" label={t(($) => $.refill.capacity, { unit: units.label('volume') })} inputMode="decimal" className="text-right" {...register('capacity')} error={e.capacity} />
          <ChoiceGroup legend={t(($) => $.refill.drawLegend)} error={e.mode}>
            <Choice label={t(($) => $.refill.measured)} hint={t(($) => $.refill.measuredHint)} value="seepage" {...register('mode')} />
            <Choice label={t(($) => $.refill.need)} hint={t(($) => $.refill.needHint)} value="need" {...register('mode')} />
          </ChoiceGroup>
          {mode === 'seepage' ? (
            <InputField id="refill-seepage" label={t(($) => $.refill.seepage, { unit: units.label('rate') })} inputMode="decimal" className="text-right" {...register('seepage')} error={e.seepage} />
          ) : (
            <>
              <InputField
                id="refill-need"
                label={t(($) => $.refill.needField, { unit: units.label('length-small') })}
                inputMode="decimal"
                className="text-right"
                hint={t(($) => $.refill.needFieldHint)}
                {...register('need')}
                error={e.need}
              />
              <InputField
                id="refill-diameter"
                label={t(($) => $.refill.diameter, { unit: units.label('length-small') })}
                inputMode="decimal"
                className="text-right"
                {...register('diameter')}
                error={e.diameter}
              />
            </>
          )}
        </form>
        <div className="min-w-0 space-y-3">
          <div aria-live="polite">
            {interval && result && 'input' in result ? (
              <>
                <p className="text-2xl font-semibold sm:text-3xl" id="refill-headline">
                  {headline(interval.days)}
                </p>
                <p className="text-ink-muted">
                  {t(($) => $.refill.holds, { capacity: units.fmt(result.input.capacityL, 'volume', us ? 2 : 1), draw: units.fmt(interval.dailyDrawL, 'rate', 2) })}
                  {interval.basis === 'measured-seepage'
                    ? t(($) => $.refill.measuredBasis)
                    : t(($) => $.refill.needBasis, {
                        need: units.fmt(result.input.cropNeedMmPerDay ?? 0, 'length-small', us ? 2 : 1),
                        area: units.fmt(result.input.wettedAreaM2 ?? 0, 'area', 2),
                      })}
                </p>
              </>
            ) : result && 'error' in result ? (
              <p role="alert" className="font-medium text-red-800">
                {result.error}
              </p>
            ) : (
              <p className="text-ink-muted">{t(($) => $.refill.correct)}</p>
            )}
          </div>
          {mode === 'need' ? (
            <p className="rounded-lg border border-sand-200 bg-sand-50 px-3 py-2 text-sm">
              <strong>{t(($) => $.ruleOfThumb)}</strong> {t(($) => $.refill.wettedRule)}
            </p>
          ) : null}
          <p className="text-sm text-ink-muted">
            {t(($) => $.refill.hotWeather)}
          </p>
          {renderCaution('openPotMosquitoes', { headingLevel: 3 })}
        </div>
      </div>
    </section>
  );
}
