import { createHash } from 'node:crypto';
import type { ImportKind, RowError } from '@shared/import/csv-import';
import { harvestInputSchema, moistureReadingInputSchema, waterEventInputSchema, weatherDayInputSchema } from '@shared/schemas/logs';
import type { z } from 'zod';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { assertTrialWritable } from './trials.service';

/** How many row errors are listed in one answer; the total is always given. */
const MAX_LISTED_ERRORS = 500;
const CHUNK = 5000;

type Row = Record<string, unknown> & { line?: number };

const schemas: Record<ImportKind, z.ZodType> = {
  'water-events': waterEventInputSchema,
  'moisture-readings': moistureReadingInputSchema,
  harvests: harvestInputSchema,
  'weather-days': weatherDayInputSchema,
};

/** Column arrays for one INSERT ... SELECT FROM unnest(...) per kind. */
const inserts: Record<Exclude<ImportKind, 'weather-days'>, { table: string; cols: [string, string, string][] }> = {
  'water-events': {
    table: 'water_events',
    cols: [
      ['plot_id', 'uuid', 'plotId'],
      ['occurred_at', 'timestamptz', 'occurredAt'],
      ['kind', 'text', 'kind'],
      ['volume_l', 'float8', 'volumeL'],
      ['source', 'text', 'source'],
      ['fertiliser', 'bool', 'fertiliser'],
      ['notes', 'text', 'notes'],
    ],
  },
  'moisture-readings': {
    table: 'moisture_readings',
    cols: [
      ['plot_id', 'uuid', 'plotId'],
      ['taken_at', 'timestamptz', 'takenAt'],
      ['method', 'text', 'method'],
      ['depth_cm', 'float8', 'depthCm'],
      ['value', 'float8', 'value'],
    ],
  },
  harvests: {
    table: 'harvests',
    cols: [
      ['plot_id', 'uuid', 'plotId'],
      ['harvested_on', 'date', 'harvestedOn'],
      ['fresh_kg', 'float8', 'freshKg'],
      ['marketable_kg', 'float8', 'marketableKg'],
      ['count', 'int4', 'count'],
      ['notes', 'text', 'notes'],
    ],
  },
};

const timeField: Record<ImportKind, string> = { 'water-events': 'occurredAt', 'moisture-readings': 'takenAt', harvests: 'harvestedOn', 'weather-days': 'day' };

/**
 * A fingerprint per row: the same content (and its occurrence number among identical rows of
 * the file) gives the same key, so importing a file again adds nothing.
 */
function fingerprints(kind: ImportKind, rows: Row[]): string[] {
  const seen = new Map<string, number>();
  return rows.map((r) => {
    const { line: _line, ...content } = r;
    const canonical = JSON.stringify(Object.keys(content).sort().map((k) => [k, content[k]]));
    const n = (seen.get(canonical) ?? 0) + 1;
    seen.set(canonical, n);
    return `imp_${createHash('sha256').update(`${kind}|${canonical}|${n}`).digest('hex').slice(0, 56)}`;
  });
}

export function importService(ctx: AppContext) {
  return {
    /**
     * Validates every row (schema, plot of this trial, date within the trial) and writes all of
     * them in one transaction, or nothing and the full list of problems.
     */
    async importRows(trialId: string, userId: string, kind: ImportKind, rows: Row[]) {
      const [trial] = (await ctx.ds.query('SELECT garden_id, planting_date, end_date, status FROM trials WHERE id = $1', [trialId])) as {
        garden_id: string;
        planting_date: string;
        end_date: string | null;
        status: string;
      }[];
      if (!trial) throw AppError.notFound('Trial');
      if (trial.status === 'closed') throw new AppError('conflict', 'This trial is closed and read-only. Reopen it to import.');
      const plots = (await ctx.ds.query('SELECT id, label FROM plots WHERE trial_id = $1', [trialId])) as { id: string; label: string }[];
      const plotByLabel = new Map(plots.map((p) => [p.label.toLowerCase(), p.id]));
      const tomorrow = new Date(ctx.now().getTime() + 36 * 3600 * 1000).toISOString().slice(0, 10);
      const lastDay = trial.end_date && trial.end_date < tomorrow ? trial.end_date : tomorrow;

      const errors: RowError[] = [];
      const valid: Row[] = [];
      const schema = schemas[kind];
      rows.forEach((raw, i) => {
        const line = typeof raw.line === 'number' ? raw.line : i + 2;
        const input: Row = { ...raw };
        delete input.line;
        if (kind !== 'weather-days') {
          const label = String(input.plotLabel ?? '').trim().toLowerCase();
          const plotId = plotByLabel.get(label);
          delete input.plotLabel;
          if (!plotId) {
            errors.push({
              line,
              column: 'plot',
              reason: `No plot "${String(raw.plotLabel ?? '')}" in this trial (plots: ${plots.map((p) => p.label).join(', ')}).`,
              code: 'unknownPlot',
              params: { plot: String(raw.plotLabel ?? ''), plots: plots.map((p) => p.label).join(', ') },
            });
            return;
          }
          input.plotId = plotId;
        }
        const parsed = schema.safeParse(input);
        if (!parsed.success) {
          for (const issue of parsed.error.issues) errors.push({ line, column: issue.path.join('.') || '', reason: issue.message });
          return;
        }
        const value = parsed.data as Row;
        const when = String(value[timeField[kind]]);
        const day = when.length > 10 ? new Date(when).toISOString().slice(0, 10) : when;
        if (day < trial.planting_date || day > lastDay) {
          errors.push({
            line,
            column: timeField[kind],
            reason: `${day} is outside this trial (planted ${trial.planting_date}${trial.end_date ? `, ends ${trial.end_date}` : ''}).`,
            code: 'outsideTrial',
            params: { day, planted: trial.planting_date, ends: trial.end_date ?? '' },
          });
          return;
        }
        valid.push({ ...value, line });
      });
      if (errors.length) {
        throw AppError.validation(`${errors.length} problem${errors.length === 1 ? '' : 's'} found: nothing was imported. Fix the file and try again.`, {
          total: errors.length,
          rows: errors.slice(0, MAX_LISTED_ERRORS),
        });
      }
      if (!valid.length) throw AppError.validation('The file has no rows to import.');

      const keys = fingerprints(kind, valid);
      let inserted = 0;
      await ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, trialId);
        for (let start = 0; start < valid.length; start += CHUNK) {
          const chunk = valid.slice(start, start + CHUNK);
          const chunkKeys = keys.slice(start, start + CHUNK);
          if (kind === 'weather-days') {
            const cols: [string, string, string][] = [
              ['day', 'date', 'day'],
              ['t_min_c', 'float8', 'tMinC'],
              ['t_max_c', 'float8', 'tMaxC'],
              ['rain_mm', 'float8', 'rainMm'],
              ['rh_min_pct', 'float8', 'rhMinPct'],
              ['rh_max_pct', 'float8', 'rhMaxPct'],
              ['wind_speed_ms', 'float8', 'windSpeedMs'],
              ['wind_height_m', 'float8', 'windHeightM'],
              ['sunshine_hours', 'float8', 'sunshineHours'],
              ['solar_radiation_mj', 'float8', 'solarRadiationMJ'],
              ['forecast', 'bool', 'forecast'],
            ];
            const params = cols.map(([, , f]) => chunk.map((r) => r[f] ?? null));
            const res = (await tx.query(
              `INSERT INTO weather_days (garden_id, entered_by, ${cols.map((c) => c[0]).join(', ')})
               SELECT $1, $2, ${cols.map((_, i) => `u.c${i}`).join(', ')}
                 FROM unnest(${cols.map((c, i) => `$${i + 3}::${c[1]}[]`).join(', ')}) AS u(${cols.map((_, i) => `c${i}`).join(', ')})
               ON CONFLICT (garden_id, day, forecast) DO NOTHING
               RETURNING id`,
              [trial.garden_id, userId, ...params],
            )) as unknown[];
            inserted += res.length;
            continue;
          }
          const spec = inserts[kind];
          const params = spec.cols.map(([, , f]) => chunk.map((r) => r[f] ?? null));
          const res = (await tx.query(
            `INSERT INTO ${spec.table} (trial_id, entered_by, idempotency_key, ${spec.cols.map((c) => c[0]).join(', ')})
             SELECT $1, $2, u.k, ${spec.cols.map((_, i) => `u.c${i}`).join(', ')}
               FROM unnest($3::text[], ${spec.cols.map((c, i) => `$${i + 4}::${c[1]}[]`).join(', ')}) AS u(k, ${spec.cols.map((_, i) => `c${i}`).join(', ')})
             ON CONFLICT (trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL DO NOTHING
             RETURNING id`,
            [trialId, userId, chunkKeys, ...params],
          )) as unknown[];
          inserted += res.length;
        }
      });
      return { received: valid.length, inserted, alreadyImported: valid.length - inserted };
    },
  };
}
