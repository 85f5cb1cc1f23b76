import type { TFunction } from 'i18next';
import { z } from 'zod';
import {
  clayBodySchema,
  createPotInputSchema,
  createSeepTestInputSchema,
  potConditionSchema,
  potMakeSchema,
  potShapeSchema,
  seepSettingSchema,
  type Pot,
} from '@shared/schemas/pots';
import { formatNumber } from '@/lib/format';
import type { useUnits } from '@/lib/units';
import { finalCheck, numberText, optionalTypedNumber, typedNumber, type TypedNumberMessages } from './typed-number';

type Units = ReturnType<typeof useUnits>;

/** Upper limits of the shared schemas (SI), read from them so the form can say them in the reader's units. */
const potShape = createPotInputSchema.shape;
const limits = {
  capacityL: potShape.capacityL.maxValue ?? 200,
  heightCm: potShape.heightCm.unwrap().unwrap().maxValue ?? 200,
  widestDiameterCm: potShape.widestDiameterCm.maxValue ?? 150,
  neckDiameterCm: potShape.neckDiameterCm.unwrap().unwrap().maxValue ?? 100,
  label: potShape.label.maxLength ?? 40,
  notes: potShape.notes.unwrap().maxLength ?? 2000,
  litresLost: createSeepTestInputSchema.shape.litresLost.maxValue ?? 200,
  hours: createSeepTestInputSchema.shape.hours.maxValue ?? 336,
};

/** Decimals shown for each quantity in each system (a gallon is big, an inch is coarse). */
export const digits = (units: Units) => ({ volume: units.system === 'us' ? 2 : 1, small: units.system === 'us' ? 1 : 0, rate: 2 });

const cmToDisplay = (units: Units, cm: number) => units.show(cm * 10, 'length-small');
const displayToCm = (units: Units, v: number) => units.toSI(v, 'length-small') / 10;

/**
 * The pot form holds what the grower types, in their units, under the shared schema's own
 * field names (so server field messages land on the right box): capacityL is litres or
 * gallons, the *Cm fields are millimetres or inches. On submit the values become SI and
 * pass through createPotInputSchema itself.
 */
/** A typed-number box's messages about `what`, in the reader's language. */
export function numberMessages(t: TFunction<'pots'>, what: string): TypedNumberMessages {
  return {
    enter: t(($) => $.number.enter, { what }),
    notNumber: t(($) => $.number.notNumber, { what }),
    notNumberOrEmpty: t(($) => $.number.notNumberOrEmpty, { what }),
  };
}

export function potFormSchema(units: Units, t: TFunction<'pots'>) {
  const vol = units.label('volume');
  const len = units.label('length-small');
  const d = digits(units);
  const most = (si: number, q: 'volume' | 'length-small', n: number) => `${formatNumber(units.show(si, q), n)} ${units.label(q)}`;
  const say = (what: string) => numberMessages(t, what);
  return z
    .object({
      label: z
        .string()
        .trim()
        .min(1, t(($) => $.errors.label))
        .max(limits.label, t(($) => $.errors.labelMax, { max: limits.label })),
      capacityL: typedNumber(say(t(($) => $.what.capacity, { unit: vol })), (n) =>
        n
          .positive(t(($) => $.errors.capacityPositive))
          .max(units.show(limits.capacityL, 'volume'), t(($) => $.errors.capacityMax, { max: most(limits.capacityL, 'volume', d.volume) })),
      ),
      heightCm: optionalTypedNumber(say(t(($) => $.what.height, { unit: len })), (n) =>
        n.positive(t(($) => $.errors.heightPositive)).max(cmToDisplay(units, limits.heightCm), t(($) => $.errors.atMost, { max: most(limits.heightCm * 10, 'length-small', 0) })),
      ),
      widestDiameterCm: typedNumber(say(t(($) => $.what.widest, { unit: len })), (n) =>
        n
          .positive(t(($) => $.errors.diameterPositive))
          .max(cmToDisplay(units, limits.widestDiameterCm), t(($) => $.errors.atMost, { max: most(limits.widestDiameterCm * 10, 'length-small', 0) })),
      ),
      neckDiameterCm: optionalTypedNumber(say(t(($) => $.what.neck, { unit: len })), (n) =>
        n
          .positive(t(($) => $.errors.neckPositive))
          .max(cmToDisplay(units, limits.neckDiameterCm), t(($) => $.errors.atMost, { max: most(limits.neckDiameterCm * 10, 'length-small', 0) })),
      ),
      shape: potShapeSchema,
      clayBody: clayBodySchema,
      make: potMakeSchema,
      firingCone: z.string().transform((s) => s || null),
      installedOn: z.string().transform((s) => s || null),
      plotId: z.string().transform((s) => s || null),
      condition: potConditionSchema,
      notes: z.string().max(limits.notes, t(($) => $.errors.notesMax, { max: formatNumber(limits.notes, 0) })),
    })
    .transform((v) => ({
      ...v,
      capacityL: units.toSI(v.capacityL, 'volume'),
      heightCm: v.heightCm === null ? null : displayToCm(units, v.heightCm),
      widestDiameterCm: displayToCm(units, v.widestDiameterCm),
      neckDiameterCm: v.neckDiameterCm === null ? null : displayToCm(units, v.neckDiameterCm),
    }))
    .pipe(finalCheck(createPotInputSchema));
}

export type PotFormValues = z.input<ReturnType<typeof potFormSchema>>;

/** What the form starts with: a stored pot in the reader's units, or a blank new pot. */
export function potFormDefaults(units: Units, pot?: Pot): PotFormValues {
  const d = digits(units);
  if (!pot) {
    return {
      label: '',
      capacityL: '',
      heightCm: '',
      widestDiameterCm: '',
      neckDiameterCm: '',
      shape: 'globe',
      clayBody: 'terracotta',
      make: 'wheel_thrown',
      firingCone: '',
      installedOn: '',
      plotId: '',
      condition: 'sound',
      notes: '',
    };
  }
  return {
    label: pot.label,
    capacityL: numberText(units.show(pot.capacityL, 'volume'), d.volume),
    heightCm: pot.heightCm === null ? '' : numberText(cmToDisplay(units, pot.heightCm), d.small),
    widestDiameterCm: numberText(cmToDisplay(units, pot.widestDiameterCm), d.small),
    neckDiameterCm: pot.neckDiameterCm === null ? '' : numberText(cmToDisplay(units, pot.neckDiameterCm), d.small),
    shape: pot.shape,
    clayBody: pot.clayBody,
    make: pot.make,
    firingCone: pot.firingCone ?? '',
    installedOn: pot.installedOn ?? '',
    plotId: pot.plotId ?? '',
    condition: pot.condition,
    notes: pot.notes,
  };
}

/** A seep test as typed: litres (or gallons) lost over so many hours. */
export function seepTestFormSchema(units: Units, t: TFunction<'pots'>) {
  const vol = units.label('volume');
  return z
    .object({
      testedOn: z.string().min(1, t(($) => $.errors.testDate)),
      setting: seepSettingSchema,
      litresLost: typedNumber(numberMessages(t, t(($) => $.what.lost, { unit: vol })), (n) =>
        n
          .min(0, t(($) => $.errors.lostNegative))
          .max(units.show(limits.litresLost, 'volume'), t(($) => $.errors.atMost, { max: `${formatNumber(units.show(limits.litresLost, 'volume'), 1)} ${vol}` })),
      ),
      hours: typedNumber(numberMessages(t, t(($) => $.what.hours)), (n) =>
        n.positive(t(($) => $.errors.hoursPositive)).max(limits.hours, t(($) => $.errors.hoursMax, { hours: limits.hours })),
      ),
      notes: z.string().max(1000, t(($) => $.errors.notesMax, { max: formatNumber(1000, 0) })),
    })
    .transform((v) => ({ ...v, litresLost: units.toSI(v.litresLost, 'volume') }))
    .pipe(finalCheck(createSeepTestInputSchema));
}

export type SeepTestFormValues = z.input<ReturnType<typeof seepTestFormSchema>>;
