import { createContext, useContext, useMemo, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from '@shared/units';
import { numberFormat } from './format';

interface UnitsApi {
  system: UnitSystem;
  /** Stored SI value → display number in the reader's system. */
  show: (si: number, q: Quantity) => number;
  /** Typed display value → SI for storage. */
  toSI: (display: number, q: Quantity) => number;
  label: (q: Quantity) => string;
  /** Formatted with unit, e.g. "2.6 gal". */
  fmt: (si: number | null | undefined, q: Quantity, digits?: number) => string;
}

const UnitsContext = createContext<UnitSystem>('metric');

export function UnitsProvider({ system, children }: { system: UnitSystem; children: ReactNode }) {
  return <UnitsContext.Provider value={system}>{children}</UnitsContext.Provider>;
}

/** Values are stored in SI and shown in the account's unit system (metric or US customary). */
export function useUnits(): UnitsApi {
  const system = useContext(UnitsContext);
  // Unit symbols are the same in both languages except the word in "L/day" ("L/día").
  const lang = useTranslation().i18n.resolvedLanguage?.startsWith('es') ? 'es' : 'en';
  return useMemo(
    () => ({
      system,
      show: (si, q) => toDisplay(si, q, system),
      toSI: (v, q) => fromDisplay(v, q, system),
      label: (q) => unitLabel(q, system, lang),
      fmt: (si, q, digits = 1) => (si === null || si === undefined || !Number.isFinite(si) ? '—' : `${numberFormat(digits).format(toDisplay(si, q, system))} ${unitLabel(q, system, lang)}`),
    }),
    [system, lang],
  );
}
