import i18n from 'i18next';
import LanguageDetector from 'i18next-browser-languagedetector';
import resourcesToBackend from 'i18next-resources-to-backend';
import { initReactI18next } from 'react-i18next';
import enCommon from '@/locales/en/common.json';

/**
 * The client's translations (i18next + react-i18next).
 *
 * - Languages: English and Spanish (`LANGUAGES`), English as the fallback.
 * - Which one: a signed-in person's account setting (AppShell calls `useAccountLanguage`), else the
 *   language last chosen on this device (the switch on the public pages), else the browser's.
 * - Strings live in `src/locales/<lang>/<namespace>.json`, one namespace per feature. Only English
 *   `common` ships with the first page; every other file is its own small chunk, fetched the first
 *   time a screen asks for its namespace (`useTranslation('trials')` suspends until then).
 * - Keys are typed from the English files (src/i18n/i18next.d.ts): a missing English key fails the
 *   type-check, and tests/unit/locales.test.ts checks that Spanish has exactly the same keys and
 *   placeholders. Spanish plurals need `_one`, `_many` and `_other` (CLDR gives Spanish a "many" form).
 * - Numbers and dates follow the language (src/lib/format.ts reads `currentLocale()`).
 */
export const LANGUAGES = ['en', 'es'] as const;
export type Language = (typeof LANGUAGES)[number];

/** localStorage key of the language chosen on this device before signing in. */
export const LANGUAGE_STORAGE_KEY = 'seepwise.language';

void i18n
  .use(LanguageDetector)
  .use(resourcesToBackend((lng: string, ns: string) => import(`../locales/${lng}/${ns}.json`)))
  .use(initReactI18next)
  .init({
    resources: { en: { common: enCommon } },
    partialBundledLanguages: true,
    fallbackLng: 'en',
    supportedLngs: [...LANGUAGES],
    nonExplicitSupportedLngs: true,
    load: 'languageOnly',
    ns: ['common'],
    defaultNS: 'common',
    fallbackNS: 'common',
    interpolation: { escapeValue: false },
    detection: { order: ['localStorage', 'navigator'], lookupLocalStorage: LANGUAGE_STORAGE_KEY, caches: [] },
    react: { useSuspense: true },
    returnNull: false,
  });

i18n.on('languageChanged', (lng) => {
  if (typeof document !== 'undefined') document.documentElement.lang = lng.startsWith('es') ? 'es' : 'en';
});

/** The language in use, as one of ours. */
export function currentLanguage(): Language {
  return i18n.resolvedLanguage === 'es' ? 'es' : 'en';
}

/** BCP 47 locale for Intl formatting: the language, with the browser's region when it speaks the same language. */
export function currentLocale(): string {
  const lang = currentLanguage();
  const browser = typeof navigator !== 'undefined' ? navigator.languages ?? [navigator.language] : [];
  return browser.find((l) => l.toLowerCase().startsWith(`${lang}-`)) ?? lang;
}

/** Switches language on this device (and remembers it for the next visit before signing in). */
export async function setLanguage(lang: Language, remember = true) {
  if (remember) {
    try {
      localStorage.setItem(LANGUAGE_STORAGE_KEY, lang);
    } catch {
      /* private mode: the choice lasts for this visit */
    }
  }
  if (i18n.resolvedLanguage !== lang) await i18n.changeLanguage(lang);
}

export { i18n };
