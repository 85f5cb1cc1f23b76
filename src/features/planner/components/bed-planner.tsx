import { useMemo } from 'react';
import type { TFunction } from 'i18next';
import { useForm, useWatch } from 'react-hook-form';
import { useTranslation } from 'react-i18next';
import { z } from 'zod';
import { planOllas, type Bed, type OllaPlan } from '@shared/agronomy/olla-layout';
import { Choice, ChoiceGroup } from '@/components/ui/choice-group';
import { InputField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { BedDrawing, MAX_DRAWN_POTS } from './bed-drawing';
import { fieldMessages, formatNumber, numberText, typedNumber } from './typed-number';

type Units = ReturnType<typeof useUnits>;

const MAX_BED_SIDE_M = 30;
const MIN_POT_MM = 50;
const MAX_POT_MM = 1500;

/** A typed-number box's messages about `what`, in the reader's language. */
export function numberMessages(t: TFunction<'planner'>, what: string) {
  return { enter: t(($) => $.number.enter, { what }), notNumber: t(($) => $.number.notNumber, { what }) };
}

export function bedSchema(units: Units, t: TFunction<'planner'>) {
  const m = units.label('length');
  const mm = units.label('length-small');
  const side = (what: string, positive: string) =>
    typedNumber(numberMessages(t, what), (n) =>
      n
        .positive(positive)
        .max(units.show(MAX_BED_SIDE_M, 'length'), t(($) => $.bed.maxSide, { max: formatNumber(units.show(MAX_BED_SIDE_M, 'length'), 0), unit: m })),
    );
  return z
    .object({
      length: side(t(($) => $.bed.whatLength, { unit: m }), t(($) => $.bed.lengthPositive)),
      width: side(t(($) => $.bed.whatWidth, { unit: m }), t(($) => $.bed.widthPositive)),
      diameter: typedNumber(numberMessages(t, t(($) => $.bed.whatDiameter, { unit: mm })), (n) =>
        n
          .min(units.show(MIN_POT_MM, 'length-small'), t(($) => $.bed.atLeast, { min: formatNumber(units.show(MIN_POT_MM, 'length-small'), 1), unit: mm }))
          .max(units.show(MAX_POT_MM, 'length-small'), t(($) => $.bed.atMost, { max: formatNumber(units.show(MAX_POT_MM, 'length-small'), 0), unit: mm })),
      ),
    })
    .transform((v, ctx) => {
      const bed: Bed = { lengthM: units.toSI(v.length, 'length'), widthM: units.toSI(v.width, 'length') };
      const widestDiameterM = units.toSI(v.diameter, 'length-small') / 1000;
      if (widestDiameterM > Math.min(bed.lengthM, bed.widthM) + 1e-9) {
        ctx.addIssue({ code: 'custom', path: ['diameter'], message: t(($) => $.bed.doesNotFit, { size: formatNumber(v.diameter, 1), unit: mm }) });
        return z.NEVER;
      }
      return { bed, widestDiameterM };
    });
}

type BedValues = z.input<ReturnType<typeof bedSchema>> & { coverage: Coverage };

/** How much of the bed the wetted zones must reach (planOllas `minCoverage`). */
const coverages = { whole: 1, most: 0.9, middle: 0.8 } as const;
type Coverage = keyof typeof coverages;

function describe(bed: Bed, plan: OllaPlan, units: Units, t: TFunction<'planner'>): string {
  const lenDigits = units.system === 'us' ? 1 : 2;
  const rows = plan.rows === 1 ? t(($) => $.bed.describeOneRow, { columns: plan.columns }) : t(($) => $.bed.describeRows, { rows: plan.rows, columns: plan.columns });
  return t(($) => $.bed.describe, {
    count: plan.count,
    length: units.fmt(bed.lengthM, 'length', 2),
    width: units.fmt(bed.widthM, 'length', 2),
    rows,
    x: units.fmt(plan.spacingM.x, 'length', lenDigits),
    y: units.fmt(plan.spacingM.y, 'length', lenDigits),
    radius: units.fmt(plan.wettedRadiusM, 'length', lenDigits),
  });
}

/** (a) How many pots for a bed: planOllas on the bed and pot, drawn to scale. */
export function BedPlanner() {
  const units = useUnits();
  const { t } = useTranslation('planner');
  const schema = useMemo(() => bedSchema(units, t), [units, t]);
  const defaults = useMemo<BedValues>(
    () => ({ ...(units.system === 'us' ? { length: '6', width: '3', diameter: '12' } : { length: '2', width: '1', diameter: numberText(300, 0) }), coverage: 'whole' as Coverage }),
    [units.system],
  );
  const { register, control } = useForm<BedValues>({ defaultValues: defaults });
  const values = useWatch({ control });
  const parsed = useMemo(() => schema.safeParse({ ...defaults, ...values }), [schema, defaults, values]);
  const coverage: Coverage = values.coverage && values.coverage in coverages ? values.coverage : 'whole';
  const result = useMemo(() => {
    if (!parsed.success) return null;
    try {
      return { ...parsed.data, plan: planOllas(parsed.data.bed, { widestDiameterM: parsed.data.widestDiameterM }, { minCoverage: coverages[coverage] }) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : t(($) => $.bed.cannotPlan) };
    }
  }, [parsed, t, coverage]);
  const plan = result && 'plan' in result ? result.plan : null;
  // Messages come from the live parse of the whole form, so a rule across fields shows too.
  const e = fieldMessages(parsed);
  const lenDigits = units.system === 'us' ? 1 : 2;

  return (
    <section aria-labelledby="bed-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="bed-heading">{t(($) => $.bed.title)}</h2>
        <p className="text-sm text-ink-muted">{t(($) => $.bed.intro)}</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,18rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label={t(($) => $.bed.formLabel)} className="space-y-3">
          <InputField id="bed-length" label={t(($) => $.bed.length, { unit: units.label('length') })} inputMode="decimal" className="text-right" {...register('length')} error={e.length} />
          <InputField id="bed-width" label={t(($) => $.bed.width, { unit: units.label('length') })} inputMode="decimal" className="text-right" {...register('width')} error={e.width} />
          <InputField
            id="bed-pot-diameter"
            label={t(($) => $.bed.diameter, { unit: units.label('length-small') })}
            inputMode="decimal"
            className="text-right"
            hint={t(($) => $.bed.diameterHint)}
            {...register('diameter')}
            error={e.diameter}
          />
          <ChoiceGroup legend={t(($) => $.bed.coverage)}>
            {(Object.keys(coverages) as Coverage[]).map((c) => (
              <Choice key={c} value={c} label={t(($) => $.bed.coverageChoice[c])} hint={t(($) => $.bed.coverageHint[c])} {...register('coverage')} />
            ))}
          </ChoiceGroup>
        </form>
        <div className="min-w-0 space-y-3">
          <div aria-live="polite">
            {plan ? (
              <>
                <p className="text-3xl font-semibold" id="bed-pot-count">
                  <span className="num">{plan.count}</span> {t(($) => $.bed.pots, { count: plan.count })}
                </p>
                <p className="text-ink-muted">
                  {t(($) => (plan.rows === 1 ? $.bed.oneRow : $.bed.rows), {
                    rows: plan.rows,
                    columns: plan.columns,
                    x: units.fmt(plan.spacingM.x, 'length', lenDigits),
                    y: units.fmt(plan.spacingM.y, 'length', lenDigits),
                  })}
                </p>
                <p>
                  {plan.fullCoverage
                    ? t(($) => $.bed.fullCoverage)
                    : plan.coveredFraction + 1e-9 >= coverages[coverage]
                      ? t(($) => $.bed.coveredShare, { pct: formatNumber(Math.floor(plan.coveredFraction * 100), 0) })
                      : t(($) => $.bed.partCoverage, { pct: formatNumber(plan.coveredFraction * 100, 0) })}
                </p>
              </>
            ) : result && 'error' in result ? (
              <p role="alert" className="font-medium text-red-800">
                {result.error}
              </p>
            ) : (
              <p className="text-ink-muted">{t(($) => $.correct)}</p>
            )}
          </div>
          <p className="rounded-lg border border-sand-200 bg-sand-50 px-3 py-2 text-sm">
            <strong>{t(($) => $.ruleOfThumb)}</strong> {t(($) => $.bed.rule)}
          </p>
          {plan && result && 'plan' in result ? (
            <>
              {plan.count <= MAX_DRAWN_POTS ? (
                <BedDrawing bed={result.bed} plan={plan} potDiameterM={result.widestDiameterM} description={describe(result.bed, plan, units, t)} />
              ) : (
                <p className="text-sm text-ink-muted">{describe(result.bed, plan, units, t)} {t(($) => $.bed.tooMany)}</p>
              )}
              {plan.count <= 60 ? (
                <details className="text-sm">
                  <summary className="inline-flex min-h-11 cursor-pointer items-center text-terracotta-700 underline">{t(($) => $.bed.whereToDig)}</summary>
                  <p className="text-ink-muted">{t(($) => $.bed.measured)}</p>
                  <div className="relative mt-2 overflow-x-auto">
                    <table className="text-sm">
                      <thead>
                        <tr>
                          <th scope="col" className="pr-4 text-left">
                            {t(($) => $.bed.colPot)}
                          </th>
                          <th scope="col" className="pr-4 text-right">
                            {t(($) => $.bed.colAlong)}
                          </th>
                          <th scope="col" className="text-right">
                            {t(($) => $.bed.colAcross)}
                          </th>
                        </tr>
                      </thead>
                      <tbody>
                        {plan.positions.map((p, i) => (
                          <tr key={i}>
                            <td className="pr-4">{i + 1}</td>
                            <td className="num pr-4">{units.fmt(p.x, 'length', lenDigits)}</td>
                            <td className="num">{units.fmt(p.y, 'length', lenDigits)}</td>
                          </tr>
                        ))}
                      </tbody>
                    </table>
                  </div>
                </details>
              ) : null}
            </>
          ) : null}
        </div>
      </div>
    </section>
  );
}
