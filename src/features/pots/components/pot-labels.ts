import type { TFunction } from 'i18next';
import { coneTemperature, firingBand } from '@shared/agronomy/pyrometric-cones';
import type { UnitSystem } from '@shared/units';

/**
 * Option labels (shapes, makes, clay bodies, conditions, seep settings, firing bands) live in the
 * `pots` namespace, keyed by the enum values of shared/schemas/pots.
 */

/** The cone's equivalent temperature from the Orton standard chart, in the reader's system (whole degrees, not grouped: "1060 °C"). */
export function coneDegrees(cone: string, system: UnitSystem): string {
  const t = coneTemperature(cone);
  return system === 'us' ? `${t.fahrenheit} °F` : `${t.celsius} °C`;
}

/** One line about a cone for the form: temperature, chart and what it means for seepage. */
export function coneExplanation(cone: string, system: UnitSystem, t: TFunction<'pots'>): string {
  const c = coneTemperature(cone);
  const degrees = coneDegrees(cone, system);
  const ref = coneDegrees('04', system);
  const rate = system === 'us' ? `${Math.round((c.heatingRateCPerHour * 9) / 5)} °F` : `${c.heatingRateCPerHour} °C`;
  const around = t(($) => $.cone.around, { cone, degrees, rate });
  switch (firingBand(cone)) {
    case 'underfired':
      return t(($) => $.cone.underfired, { around });
    case 'porous-earthenware':
      return cone === '04' ? t(($) => $.cone.typical, { around }) : t(($) => $.cone.porous, { around, ref });
    case 'vitrifying':
      return t(($) => $.cone.vitrifying, { around });
  }
}
