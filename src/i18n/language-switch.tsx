import { useId } from 'react';
import { useTranslation } from 'react-i18next';
import { LANGUAGES, currentLanguage, setLanguage, type Language } from './index';

/** The language picker of the public pages (signed in, the account setting decides). */
export function LanguageSwitch({ className }: { className?: string }) {
  const { t } = useTranslation();
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="mr-2 text-sm text-ink-muted">
        {t(($) => $.language.label)}
      </label>
      <select
        id={id}
        className="min-h-10 rounded-lg border border-sand-300 bg-white px-2 text-sm"
        value={currentLanguage()}
        onChange={(e) => void setLanguage(e.target.value as Language)}
      >
        {LANGUAGES.map((l) => (
          <option key={l} value={l} lang={l}>
            {t(($) => $.language[l])}
          </option>
        ))}
      </select>
    </div>
  );
}
