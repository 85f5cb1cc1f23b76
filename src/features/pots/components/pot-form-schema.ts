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
import type { useUnits } from '@/lib/units';
import { finalCheck, numberText, optionalTypedNumber, typedNumber } from './typed-number';

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
export function potFormSchema(units: Units) {
  const vol = units.label('volume');
  const len = units.label('length-small');
  const d = digits(units);
  const most = (si: number, q: 'volume' | 'length-small', n: number) => `${new Intl.NumberFormat().format(Number(units.show(si, q).toFixed(n)))} ${units.label(q)}`;
  return z
    .object({
      label: z.string().trim().min(1, 'Give the pot a label.').max(limits.label, `Keep the label to ${limits.label} characters.`),
      capacityL: typedNumber(`the capacity in ${vol}`, (n) =>
        n.positive('Capacity must be more than zero.').max(units.show(limits.capacityL, 'volume'), `At most ${most(limits.capacityL, 'volume', d.volume)}: larger vessels are not garden ollas.`),
      ),
      heightCm: optionalTypedNumber(`the height in ${len}`, (n) =>
        n.positive('Height must be more than zero.').max(cmToDisplay(units, limits.heightCm), `At most ${most(limits.heightCm * 10, 'length-small', 0)}.`),
      ),
      widestDiameterCm: typedNumber(`the widest diameter in ${len}`, (n) =>
        n.positive('Diameter must be more than zero.').max(cmToDisplay(units, limits.widestDiameterCm), `At most ${most(limits.widestDiameterCm * 10, 'length-small', 0)}.`),
      ),
      neckDiameterCm: optionalTypedNumber(`the neck diameter in ${len}`, (n) =>
        n.positive('Neck diameter must be more than zero.').max(cmToDisplay(units, limits.neckDiameterCm), `At most ${most(limits.neckDiameterCm * 10, 'length-small', 0)}.`),
      ),
      shape: potShapeSchema,
      clayBody: clayBodySchema,
      make: potMakeSchema,
      firingCone: z.string().transform((s) => s || null),
      installedOn: z.string().transform((s) => s || null),
      plotId: z.string().transform((s) => s || null),
      condition: potConditionSchema,
      notes: z.string().max(limits.notes, `Keep notes under ${limits.notes} characters.`),
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
export function seepTestFormSchema(units: Units) {
  const vol = units.label('volume');
  return z
    .object({
      testedOn: z.string().min(1, 'Enter the date of the test.'),
      setting: seepSettingSchema,
      litresLost: typedNumber(`the water lost in ${vol}`, (n) =>
        n.min(0, 'Water lost cannot be negative.').max(units.show(limits.litresLost, 'volume'), `At most ${numberText(units.show(limits.litresLost, 'volume'), 1)} ${vol}.`),
      ),
      hours: typedNumber('how many hours the test ran', (n) =>
        n.positive('The test must last some time.').max(limits.hours, `Seep tests longer than two weeks (${limits.hours} hours) are not plausible.`),
      ),
      notes: z.string().max(1000, 'Keep notes under 1,000 characters.'),
    })
    .transform((v) => ({ ...v, litresLost: units.toSI(v.litresLost, 'volume') }))
    .pipe(finalCheck(createSeepTestInputSchema));
}

export type SeepTestFormValues = z.input<ReturnType<typeof seepTestFormSchema>>;
