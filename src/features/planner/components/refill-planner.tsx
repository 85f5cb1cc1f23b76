import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { refillIntervalDays, wettedAreaM2, type RefillInput } from '@shared/agronomy/olla-layout';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField, SelectField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { checkField, fieldMessages, formatNumber, numberText, typedNumber } from './typed-number';
import type { PlannerPot, RenderCaution } from './types';

type Units = ReturnType<typeof useUnits>;

const MAX_CAPACITY_L = 200;
const MAX_SEEPAGE_L_PER_DAY = 50;
const MAX_NEED_MM_PER_DAY = 25;
const MIN_POT_MM = 50;
const MAX_POT_MM = 1500;

export function refillSchema(units: Units) {
  const vol = units.label('volume');
  const rate = units.label('rate');
  const small = units.label('length-small');
  const capacity = typedNumber(`the capacity in ${vol}`, (n) =>
    n.positive('Capacity must be more than zero.').max(units.show(MAX_CAPACITY_L, 'volume'), `At most ${formatNumber(units.show(MAX_CAPACITY_L, 'volume'), 1)} ${vol}.`),
  );
  const seepage = typedNumber(`the seepage in ${rate}`, (n) =>
    n.min(0, 'Seepage cannot be negative.').max(units.show(MAX_SEEPAGE_L_PER_DAY, 'rate'), `At most ${formatNumber(units.show(MAX_SEEPAGE_L_PER_DAY, 'rate'), 1)} ${rate}: check the seep test.`),
  );
  const need = typedNumber(`the crop water need in ${small}/day`, (n) =>
    n
      .min(0, 'The water need cannot be negative.')
      .max(units.show(MAX_NEED_MM_PER_DAY, 'length-small'), `At most ${formatNumber(units.show(MAX_NEED_MM_PER_DAY, 'length-small'), 2)} ${small}/day: even desert summers stay below that.`),
  );
  const diameter = typedNumber(`the pot's widest diameter in ${small}`, (n) =>
    n
      .min(units.show(MIN_POT_MM, 'length-small'), `At least ${formatNumber(units.show(MIN_POT_MM, 'length-small'), 1)} ${small}.`)
      .max(units.show(MAX_POT_MM, 'length-small'), `At most ${formatNumber(units.show(MAX_POT_MM, 'length-small'), 0)} ${small}.`),
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
  const schema = useMemo(() => refillSchema(units), [units]);
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
      return { error: err instanceof Error ? err.message : 'These numbers cannot be worked out.' };
    }
  }, [parsed]);
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
      setPotNote(`Filled from ${pot.label}: its capacity, diameter and latest seep test.`);
    } else {
      setPotNote(`Filled from ${pot.label}: its capacity and diameter. It has no seep test yet, so use the crop water need or test it on the Pot shelf.`);
    }
  };

  const interval = result && 'interval' in result ? result.interval : null;
  const headline = (days: number) => {
    if (!Number.isFinite(days)) return 'The pot never empties at that draw';
    if (days < 1) return `Refill about every ${formatNumber(Math.max(1, Math.round(days * 24)), 0)} hours`;
    return `Refill about every ${formatNumber(days, days < 10 ? 1 : 0)} days`;
  };

  return (
    <section aria-labelledby="refill-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="refill-heading">How often to refill</h2>
        <p className="text-sm text-ink-muted">Days from full to empty: what the pot holds, divided by what it gives up each day.</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label="Pot and daily draw" className="space-y-3">
          {pots.length ? (
            <SelectField id="refill-from-pot" label="Start from a pot on your shelf (optional)" value={fromPot} onChange={(ev) => fillFrom(ev.target.value)} hint={potNote ?? undefined}>
              <option value="">Type the numbers myself</option>
              {pots.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.label}
                </option>
              ))}
            </SelectField>
          ) : null}
          <InputField id="refill-capacity" label={`Capacity (${units.label('volume')})`} inputMode="decimal" className="text-right" {...register('capacity')} error={e.capacity} />
          <ChoiceGroup legend="What sets the daily draw" error={e.mode}>
            <Choice label="Measured seepage" hint="From a seep test of this pot in the bed." value="seepage" {...register('mode')} />
            <Choice label="Crop water need" hint="ETc per day, over the pot's wetted zone." value="need" {...register('mode')} />
          </ChoiceGroup>
          {mode === 'seepage' ? (
            <InputField id="refill-seepage" label={`Seepage (${units.label('rate')})`} inputMode="decimal" className="text-right" {...register('seepage')} error={e.seepage} />
          ) : (
            <>
              <InputField
                id="refill-need"
                label={`Crop water need (${units.label('length-small')}/day)`}
                inputMode="decimal"
                className="text-right"
                hint="ETc: reference evapotranspiration × crop coefficient. A trial's Results tab shows it for your garden."
                {...register('need')}
                error={e.need}
              />
              <InputField
                id="refill-diameter"
                label={`Pot widest diameter (${units.label('length-small')})`}
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
                  The pot holds {units.fmt(result.input.capacityL, 'volume', us ? 2 : 1)} and gives up {units.fmt(interval.dailyDrawL, 'rate', 2)}
                  {interval.basis === 'measured-seepage'
                    ? ' (its measured seepage).'
                    : ` (${units.fmt(result.input.cropNeedMmPerDay ?? 0, 'length-small', us ? 2 : 1)} a day over a wetted zone of ${units.fmt(result.input.wettedAreaM2 ?? 0, 'area', 2)}).`}
                </p>
              </>
            ) : result && 'error' in result ? (
              <p role="alert" className="font-medium text-red-800">
                {result.error}
              </p>
            ) : (
              <p className="text-ink-muted">Correct the marked numbers to see the interval.</p>
            )}
          </div>
          {mode === 'need' ? (
            <p className="rounded-lg border border-sand-200 bg-sand-50 px-3 py-2 text-sm">
              <strong>Rule of thumb:</strong> a pot wets the soil about one pot radius beyond its wall, so the wetted zone is a circle one pot diameter in radius. The
              crop draws on that zone only.
            </p>
          ) : null}
          <p className="text-sm text-ink-muted">
            Rule of thumb: in hot weather growers refill every day or two. Seepage changes with the soil&apos;s moisture and the season, so compare this figure with your own
            refills in the Round.
          </p>
          {renderCaution('openPotMosquitoes', { headingLevel: 3 })}
        </div>
      </div>
    </section>
  );
}
