import { useEffect } from 'react';
import { setLanguage, type Language } from './index';

/** Signed in, the account's language setting wins over the device's and the browser's. */
export function useAccountLanguage(language: Language | undefined) {
  useEffect(() => {
    if (language) void setLanguage(language);
  }, [language]);
}
