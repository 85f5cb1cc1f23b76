import type { CohortSummary, MembershipRole } from '@shared/schemas/cohorts';

export const kindLabels: Record<CohortSummary['kind'], string> = {
  programme: 'Programme',
  class: 'Class',
  network: 'Network',
};

export const kindHints: Record<CohortSummary['kind'], string> = {
  programme: 'Programme: growers recruited by an extension service or project',
  class: 'Class: students who read and export the pooled data',
  network: 'Network: a garden group or club comparing notes',
};

/** Open licences for the cohort's pooled, pseudonymised data. */
export const licenceLabels: Record<string, string> = {
  'CC-BY-4.0': 'CC BY 4.0: reuse with credit',
  'CC-BY-SA-4.0': 'CC BY-SA 4.0: reuse with credit, share alike',
  'CC0-1.0': 'CC0 1.0: public domain, no conditions',
  'CC-BY-NC-4.0': 'CC BY-NC 4.0: reuse with credit, not for profit',
};

export const licenceOptions = Object.entries(licenceLabels);

export const myRoleLabels: Record<CohortSummary['myRole'], string> = {
  lead: 'Lead',
  contributor: 'Contributor',
  observer: 'Observer',
};

export const memberRoleLabels: Record<MembershipRole, string> = {
  contributor: 'Contributor',
  observer: 'Observer',
};

export const memberRoleHints: Record<MembershipRole, string> = {
  contributor: 'shares their own trials',
  observer: 'reads and exports the pooled data',
};

/** Friendlier words for the capacity field than a schema's generic number message. */
export const capacityMessage = 'Enter a whole number from 1 to 10,000, or leave it empty for no limit.';

/** Empty input means "no limit". */
export function capacityFromInput(v: unknown): number | null {
  if (v === '' || v === null || v === undefined) return null;
  const n = typeof v === 'number' ? v : Number(String(v).trim());
  return n;
}
