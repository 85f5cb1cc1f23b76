import 'i18next';
import type { enResources } from './resources';

/**
 * Keys and namespaces are checked against the English files, through i18next's selector API:
 * `t(($) => $.nav.home)`, `t(($) => $.pots, { count })` for `pots_one` / `pots_other`.
 */
declare module 'i18next' {
  interface CustomTypeOptions {
    enableSelector: true;
    defaultNS: 'common';
    resources: enResources;
  }
}
