import { useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { planOllas, type Bed, type OllaPlan } from '@shared/agronomy/olla-layout';
import { InputField } from '@/components/ui/field';
import { useUnits } from '@/lib/units';
import { BedDrawing, MAX_DRAWN_POTS } from './bed-drawing';
import { fieldMessages, formatNumber, numberText, typedNumber } from './typed-number';

type Units = ReturnType<typeof useUnits>;

const MAX_BED_SIDE_M = 30;
const MIN_POT_MM = 50;
const MAX_POT_MM = 1500;

export function bedSchema(units: Units) {
  const m = units.label('length');
  const mm = units.label('length-small');
  const side = (what: string) =>
    typedNumber(`the bed ${what} in ${m}`, (n) =>
      n
        .positive(`The ${what} must be more than zero.`)
        .max(units.show(MAX_BED_SIDE_M, 'length'), `Plan beds up to ${formatNumber(units.show(MAX_BED_SIDE_M, 'length'), 0)} ${m}; split a longer row into several beds.`),
    );
  return z
    .object({
      length: side('length'),
      width: side('width'),
      diameter: typedNumber(`the pot's widest diameter in ${mm}`, (n) =>
        n
          .min(units.show(MIN_POT_MM, 'length-small'), `At least ${formatNumber(units.show(MIN_POT_MM, 'length-small'), 1)} ${mm}.`)
          .max(units.show(MAX_POT_MM, 'length-small'), `At most ${formatNumber(units.show(MAX_POT_MM, 'length-small'), 0)} ${mm}.`),
      ),
    })
    .transform((v, ctx) => {
      const bed: Bed = { lengthM: units.toSI(v.length, 'length'), widthM: units.toSI(v.width, 'length') };
      const widestDiameterM = units.toSI(v.diameter, 'length-small') / 1000;
      if (widestDiameterM > Math.min(bed.lengthM, bed.widthM) + 1e-9) {
        ctx.addIssue({ code: 'custom', path: ['diameter'], message: `A pot ${formatNumber(v.diameter, 1)} ${mm} wide does not fit inside this bed.` });
        return z.NEVER;
      }
      return { bed, widestDiameterM };
    });
}

type BedValues = z.input<ReturnType<typeof bedSchema>>;

function describe(bed: Bed, plan: OllaPlan, units: Units): string {
  const lenDigits = units.system === 'us' ? 1 : 2;
  const rows = plan.rows === 1 ? `one row of ${plan.columns}` : `${plan.rows} rows of ${plan.columns}`;
  return (
    `A bed ${units.fmt(bed.lengthM, 'length', 2)} long and ${units.fmt(bed.widthM, 'length', 2)} wide with ${plan.count} pot${plan.count === 1 ? '' : 's'} in ${rows}, ` +
    `centres ${units.fmt(plan.spacingM.x, 'length', lenDigits)} apart along the length and ${units.fmt(plan.spacingM.y, 'length', lenDigits)} across, ` +
    `the outer pots half a spacing in from the edges. Dashed circles show each pot's wetted zone, ${units.fmt(plan.wettedRadiusM, 'length', lenDigits)} around its centre.`
  );
}

/** (a) How many pots for a bed: planOllas on the bed and pot, drawn to scale. */
export function BedPlanner() {
  const units = useUnits();
  const schema = useMemo(() => bedSchema(units), [units]);
  const defaults = useMemo<BedValues>(
    () => (units.system === 'us' ? { length: '6', width: '3', diameter: '12' } : { length: '2', width: '1', diameter: numberText(300, 0) }),
    [units.system],
  );
  const { register, control } = useForm<BedValues>({ defaultValues: defaults });
  const values = useWatch({ control });
  const parsed = useMemo(() => schema.safeParse({ ...defaults, ...values }), [schema, defaults, values]);
  const result = useMemo(() => {
    if (!parsed.success) return null;
    try {
      return { ...parsed.data, plan: planOllas(parsed.data.bed, { widestDiameterM: parsed.data.widestDiameterM }) };
    } catch (err) {
      return { error: err instanceof Error ? err.message : 'This bed and pot cannot be planned.' };
    }
  }, [parsed]);
  const plan = result && 'plan' in result ? result.plan : null;
  // Messages come from the live parse of the whole form, so a rule across fields shows too.
  const e = fieldMessages(parsed);
  const lenDigits = units.system === 'us' ? 1 : 2;

  return (
    <section aria-labelledby="bed-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
      <div>
        <h2 id="bed-heading">How many pots for a bed</h2>
        <p className="text-sm text-ink-muted">Give the bed and the pot; Seepwise lays the pots on a grid so their wetted zones reach every part of the bed.</p>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,18rem)_minmax(0,1fr)]">
        <form noValidate onSubmit={(ev) => ev.preventDefault()} aria-label="Bed and pot" className="space-y-3">
          <InputField id="bed-length" label={`Bed length (${units.label('length')})`} inputMode="decimal" className="text-right" {...register('length')} error={e.length} />
          <InputField id="bed-width" label={`Bed width (${units.label('length')})`} inputMode="decimal" className="text-right" {...register('width')} error={e.width} />
          <InputField
            id="bed-pot-diameter"
            label={`Pot widest diameter (${units.label('length-small')})`}
            inputMode="decimal"
            className="text-right"
            hint="Outside, at the fattest part of the body."
            {...register('diameter')}
            error={e.diameter}
          />
        </form>
        <div className="min-w-0 space-y-3">
          <div aria-live="polite">
            {plan ? (
              <>
                <p className="text-3xl font-semibold" id="bed-pot-count">
                  <span className="num">{plan.count}</span> {plan.count === 1 ? 'pot' : 'pots'}
                </p>
                <p className="text-ink-muted">
                  {plan.rows === 1 ? 'One row' : `${plan.rows} rows`} of {plan.columns}, centres {units.fmt(plan.spacingM.x, 'length', lenDigits)} apart along the bed and{' '}
                  {units.fmt(plan.spacingM.y, 'length', lenDigits)} across.
                </p>
                <p>
                  {plan.fullCoverage
                    ? 'Their wetted zones cover the whole bed.'
                    : `They wet about ${Math.round(plan.coveredFraction * 100)}% of the bed: pots may not sit closer than one diameter centre to centre, so a bed this narrow or short keeps some dry corners. A smaller pot covers it better.`}
                </p>
              </>
            ) : result && 'error' in result ? (
              <p role="alert" className="font-medium text-red-800">
                {result.error}
              </p>
            ) : (
              <p className="text-ink-muted">Correct the marked numbers to see the layout.</p>
            )}
          </div>
          <p className="rounded-lg border border-sand-200 bg-sand-50 px-3 py-2 text-sm">
            <strong>Rule of thumb:</strong> a pot wets the soil about one pot radius beyond its wall, so its wetted zone reaches about one pot diameter from its centre.
            It is common practice, not a measurement, and the reach depends on your soil: dig beside a pot a day after filling to see yours.
          </p>
          {plan && result && 'plan' in result ? (
            <>
              {plan.count <= MAX_DRAWN_POTS ? (
                <BedDrawing bed={result.bed} plan={plan} potDiameterM={result.widestDiameterM} description={describe(result.bed, plan, units)} />
              ) : (
                <p className="text-sm text-ink-muted">{describe(result.bed, plan, units)} (Too many pots to draw clearly.)</p>
              )}
              {plan.count <= 60 ? (
                <details className="text-sm">
                  <summary className="inline-flex min-h-11 cursor-pointer items-center text-terracotta-700 underline">Where to dig each pot</summary>
                  <p className="text-ink-muted">Measured from one corner of the bed to the centre of each pot.</p>
                  <div className="mt-2 overflow-x-auto">
                    <table className="text-sm">
                      <thead>
                        <tr>
                          <th scope="col" className="pr-4 text-left">Pot</th>
                          <th scope="col" className="pr-4 text-right">Along the length</th>
                          <th scope="col" className="text-right">Across the width</th>
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
