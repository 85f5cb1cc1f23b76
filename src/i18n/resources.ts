/**
 * Types only: every English namespace, so keys are checked at compile time. Add two lines here
 * when you add a namespace file (src/locales/en/<ns>.json and src/locales/es/<ns>.json). Nothing
 * here reaches the bundle; the files load on demand (src/i18n/index.ts).
 */
import type common from '@/locales/en/common.json';
import type gardens from '@/locales/en/gardens.json';
import type importNs from '@/locales/en/import.json';
import type logs from '@/locales/en/logs.json';
import type planner from '@/locales/en/planner.json';
import type pots from '@/locales/en/pots.json';
import type round from '@/locales/en/round.json';
import type trials from '@/locales/en/trials.json';

export type enResources = {
  common: typeof common;
  gardens: typeof gardens;
  trials: typeof trials;
  logs: typeof logs;
  round: typeof round;
  pots: typeof pots;
  planner: typeof planner;
  import: typeof importNs;
};
