/**
 * Types only: every English namespace, so keys are checked at compile time. Add two lines here
 * when you add a namespace file (src/locales/en/<ns>.json and src/locales/es/<ns>.json). Nothing
 * here reaches the bundle; the files load on demand (src/i18n/index.ts).
 */
import type analysis from '@/locales/en/analysis.json';
import type charts from '@/locales/en/charts.json';
import type cohortResults from '@/locales/en/cohortResults.json';
import type common from '@/locales/en/common.json';

export type enResources = {
  common: typeof common;
  analysis: typeof analysis;
  charts: typeof charts;
  cohortResults: typeof cohortResults;
};
