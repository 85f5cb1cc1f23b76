import { z } from 'zod';
import { importKinds } from '@shared/import/csv-import';
import type { AppContext } from '../context';
import { access } from '../http/access';
import { handle, route, type RouteSpec } from '../http/route';
import { validate } from '../middleware/validate';
import { importService } from '../services/import.service';

/** The most rows one import takes (a season of daily logs for a large trial is far less). */
export const MAX_IMPORT_ROWS = 200_000;

/**
 * The body: `{ kind, fileName?, rows }`, each row a record of the kind's fields in SI units (plots by
 * `plotLabel`, optional `line` for error messages), as `normaliseRows` in shared/import/csv-import.ts
 * makes them. Here only the envelope is checked: each row is validated once, field by field, with
 * the kind's shared schema in the service, which lists every problem with its line.
 */
const importBodySchema = z.object({
  kind: z.enum(importKinds),
  fileName: z.string().max(255).optional(),
  rows: z
    .array(z.unknown())
    .min(1, 'The file has no rows to import.')
    .max(MAX_IMPORT_ROWS, `At most ${MAX_IMPORT_ROWS.toLocaleString('en')} rows can be imported at once: split the file.`),
});

export function importRoutes(ctx: AppContext): RouteSpec[] {
  const svc = importService(ctx);
  return [
    route(
      'post',
      '/trials/:trialId/import',
      access.owner('trial', 'trialId'),
      validate(importBodySchema),
      handle(async (req, res) => {
        const body = req.body as z.infer<typeof importBodySchema>;
        const result = await svc.importRows(String(req.params.trialId), req.user!.id, body.kind, body.rows);
        res.status(result.inserted ? 201 : 200).json({ data: result });
      }),
    ),
  ];
}
