import { coneTemperature, firingBand, type FiringBand } from '@shared/agronomy/pyrometric-cones';
import type { ClayBody, PotCondition } from '@shared/schemas/pots';
import type { UnitSystem } from '@shared/units';

export const clayBodyLabels: Record<ClayBody, string> = {
  earthenware: 'Earthenware',
  terracotta: 'Terracotta',
  stoneware: 'Stoneware',
  mixed: 'Mixed',
  unknown: 'Not known',
};

export const conditionLabels: Record<PotCondition, string> = { sound: 'Sound', cracked: 'Cracked', clogged: 'Clogged', retired: 'Retired' };

export const bandLabels: Record<FiringBand, string> = {
  underfired: 'below the earthenware range',
  'porous-earthenware': 'porous low-fire band',
  vitrifying: 'vitrifying, seeps little',
};

/** The cone's equivalent temperature from the Orton standard chart, in the reader's system. */
export function coneDegrees(cone: string, system: UnitSystem): string {
  const t = coneTemperature(cone);
  return system === 'us' ? `${t.fahrenheit} °F` : `${t.celsius} °C`;
}

/** One line about a cone for the form: temperature, chart and what it means for seepage. */
export function coneExplanation(cone: string, system: UnitSystem): string {
  const t = coneTemperature(cone);
  const degrees = coneDegrees(cone, system);
  const ref = coneDegrees('04', system);
  const rate = system === 'us' ? `${Math.round((t.heatingRateCPerHour * 9) / 5)} °F` : `${t.heatingRateCPerHour} °C`;
  const around = `Cone ${cone} is about ${degrees} (Orton standard chart, heated at ${rate}/h).`;
  switch (firingBand(cone)) {
    case 'underfired':
      return `${around} Below the usual earthenware range: the clay is barely sintered and may soften in wet soil.`;
    case 'porous-earthenware':
      return cone === '04'
        ? `${around} The typical olla firing, in the porous low-fire band (cone 010 to 02): the wall seeps as an olla needs.`
        : `${around} In the porous low-fire band (cone 010 to 02; ollas are typically fired near cone 04, ${ref}): the wall seeps as an olla needs.`;
    case 'vitrifying':
      return `${around} Hot enough to vitrify the clay: the pores close and seepage slows or stops.`;
  }
}
