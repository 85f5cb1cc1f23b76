/**
 * Types only: every English namespace, so keys are checked at compile time. Add two lines here
 * when you add a namespace file (src/locales/en/<ns>.json and src/locales/es/<ns>.json). Nothing
 * here reaches the bundle; the files load on demand (src/i18n/index.ts).
 */
import type account from '@/locales/en/account.json';
import type admin from '@/locales/en/admin.json';
import type analysis from '@/locales/en/analysis.json';
import type auth from '@/locales/en/auth.json';
import type charts from '@/locales/en/charts.json';
import type cohortResults from '@/locales/en/cohortResults.json';
import type cohorts from '@/locales/en/cohorts.json';
import type common from '@/locales/en/common.json';
import type gardens from '@/locales/en/gardens.json';
import type guides from '@/locales/en/guides.json';
import type home from '@/locales/en/home.json';
import type importNs from '@/locales/en/import.json';
import type logs from '@/locales/en/logs.json';
import type notifications from '@/locales/en/notifications.json';
import type offline from '@/locales/en/offline.json';
import type planner from '@/locales/en/planner.json';
import type pots from '@/locales/en/pots.json';
import type round from '@/locales/en/round.json';
import type trials from '@/locales/en/trials.json';

export type enResources = {
  common: typeof common;
  auth: typeof auth;
  account: typeof account;
  home: typeof home;
  admin: typeof admin;
  cohorts: typeof cohorts;
  notifications: typeof notifications;
  offline: typeof offline;
  guides: typeof guides;
  analysis: typeof analysis;
  charts: typeof charts;
  cohortResults: typeof cohortResults;
  gardens: typeof gardens;
  trials: typeof trials;
  logs: typeof logs;
  round: typeof round;
  pots: typeof pots;
  planner: typeof planner;
  import: typeof importNs;
};
