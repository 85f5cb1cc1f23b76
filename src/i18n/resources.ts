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
import type guides from '@/locales/en/guides.json';
import type home from '@/locales/en/home.json';
import type notifications from '@/locales/en/notifications.json';
import type offline from '@/locales/en/offline.json';

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
};
