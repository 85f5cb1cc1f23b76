import { pseudonymLabel } from '@shared/charts/cohort-charts';
import { toLang, translator } from '@shared/i18n/translate';
import { i18n } from '@/i18n';

/**
 * A cohort pseudonym in the page's language: the stored "Grower K7" (stable in exports) reads
 * "Cultivador K7" in Spanish. Same words as the charts and the report bundle (shared/locales charts).
 */
export function shownPseudonym(pseudonym: string): string {
  return pseudonymLabel(pseudonym, translator(toLang(i18n.resolvedLanguage)));
}
