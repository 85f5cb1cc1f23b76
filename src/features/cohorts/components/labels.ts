import { licenceSchema } from '@shared/schemas/cohorts';

/** Open licences for the cohort's pooled, pseudonymised data (worded under `licences` in the cohorts namespace). */
export const licenceValues = licenceSchema.options;

export type LicenceValue = (typeof licenceValues)[number];

export const isKnownLicence = (v: string): v is LicenceValue => (licenceValues as readonly string[]).includes(v);

/** Empty input means "no limit". */
export function capacityFromInput(v: unknown): number | null {
  if (v === '' || v === null || v === undefined) return null;
  const n = typeof v === 'number' ? v : Number(String(v).trim());
  return n;
}
