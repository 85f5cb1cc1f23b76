import type { Request } from 'express';
import { toLang, translator } from '@shared/i18n/translate';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { AppError } from '../lib/app-error';
import { findExportTable } from '../services/export-tables';
import { bundleService } from '../services/bundle.service';
import { exportService } from '../services/export.service';

function checkTable(table: string) {
  if (table !== 'data-dictionary' && !findExportTable(table)) throw AppError.notFound('Export table');
}

/** The reader's language: `?lang=en|es` when given (a student may want the other one), else the account's. */
function readerT(req: Request) {
  const asked = typeof req.query.lang === 'string' ? req.query.lang : undefined;
  if (asked !== undefined && asked !== 'en' && asked !== 'es') throw AppError.validation('lang must be "en" or "es".').because('lang_invalid');
  return translator(toLang(asked ?? req.user?.language));
}

export function exportRoutes(ctx: AppContext): RouteSpec[] {
  const svc = exportService(ctx);
  const bundles = bundleService(ctx);
  return [
    route(
      'get',
      '/trials/:trialId/report.zip',
      access.reader('trial', 'trialId'),
      handle(async (req, res) => bundles.streamTrialBundle(res, String(req.params.trialId), readerT(req))),
    ),
    route(
      'get',
      '/cohorts/:cohortId/report.zip',
      access.cohortMember(),
      handle(async (req, res) => bundles.streamCohortBundle(res, String(req.params.cohortId), req.user!.id, readerT(req))),
    ),
    route(
      'get',
      '/trials/:trialId/export/:table.csv',
      access.reader('trial', 'trialId'),
      handle(async (req, res) => {
        const trialId = String(req.params.trialId);
        const table = String(req.params.table);
        checkTable(table);
        const scope = { kind: 'trial' as const, trialId };
        const file = `seepwise-trial-${trialId.slice(0, 8)}-${table}.csv`;
        if (table === 'data-dictionary') {
          res.setHeader('Content-Disposition', `attachment; filename="${file}"`);
          res.type('text/csv; charset=utf-8').send(svc.dictionaryCsv(scope, readerT(req)));
          return;
        }
        await svc.streamTable(res, scope, table, file);
      }),
    ),
    route(
      'get',
      '/cohorts/:cohortId/export/:table.csv',
      access.cohortMember(),
      handle(async (req, res) => {
        const cohortId = String(req.params.cohortId);
        const table = String(req.params.table);
        checkTable(table);
        const scope = { kind: 'cohort' as const, cohortId };
        const file = `seepwise-cohort-${cohortId.slice(0, 8)}-${table}.csv`;
        if (table === 'data-dictionary') {
          res.setHeader('Content-Disposition', `attachment; filename="${file}"`);
          res.type('text/csv; charset=utf-8').send(svc.dictionaryCsv(scope, readerT(req)));
          return;
        }
        await svc.streamTable(res, scope, table, file);
      }),
    ),
  ];
}
