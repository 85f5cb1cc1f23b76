import { hash } from 'node:crypto';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { ImportKind, RowError } from '@shared/import/csv-import';
import { addDays, dayInTimeZone } from '@shared/time-zone';
import { harvestInputSchema, moistureReadingInputSchema, waterEventInputSchema, weatherDayInputSchema } from '@shared/schemas/logs';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { z } from 'zod';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { zodIssues } from '../middleware/validate';
import { assertTrialWritable } from './trials.service';

/** How many row errors are listed in one answer; the total is always given. */
const MAX_LISTED_ERRORS = 500;

type Row = Record<string, unknown>;

const schemas = {
  'water-events': waterEventInputSchema,
  'moisture-readings': moistureReadingInputSchema,
  harvests: harvestInputSchema,
  'weather-days': weatherDayInputSchema,
} satisfies Record<ImportKind, z.ZodObject>;

/** The record fields each kind reads from a row (the schema's own keys); anything else in a row is ignored. */
const fieldsOf: Record<ImportKind, string[]> = Object.fromEntries(Object.entries(schemas).map(([k, s]) => [k, Object.keys(s.shape)])) as Record<
  ImportKind,
  string[]
>;
/** The same keys in the order `Object.keys(…).sort()` gives, for the fingerprint. */
const sortedFieldsOf: Record<ImportKind, string[]> = Object.fromEntries(Object.entries(fieldsOf).map(([k, f]) => [k, [...f].sort()])) as Record<
  ImportKind,
  string[]
>;

type Column = [column: string, pgType: string, field: string];

/** Where each kind goes: the table, its columns (filled from the validated record) and the duplicate rule. */
const targets: Record<ImportKind, { table: string; cols: Column[]; conflict: string; byTrial: boolean }> = {
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
    conflict: '(trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL',
    byTrial: true,
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
    conflict: '(trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL',
    byTrial: true,
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
    conflict: '(trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL',
    byTrial: true,
  },
  'weather-days': {
    table: 'weather_days',
    cols: [
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
    ],
    conflict: '(garden_id, day, forecast)',
    byTrial: false,
  },
};

const timeField: Record<ImportKind, string> = { 'water-events': 'occurredAt', 'moisture-readings': 'takenAt', harvests: 'harvestedOn', 'weather-days': 'day' };

/**
 * A fingerprint per row: the same content (and its occurrence number among identical rows of
 * the file) gives the same key, so importing a file again adds nothing. The canonical text is
 * exactly `JSON.stringify(Object.keys(record).sort().map((k) => [k, record[k]]))` of the
 * validated record, built from the schema's keys in sorted order instead of sorting each row's
 * keys, so keys written by earlier versions still match (tests/unit/import-fingerprint.test.ts).
 */
export function importFingerprints(kind: ImportKind, records: Row[]): string[] {
  const keys = sortedFieldsOf[kind];
  const seen = new Map<string, number>();
  const out = new Array<string>(records.length);
  for (let r = 0; r < records.length; r++) {
    const rec = records[r]!;
    const pairs: [string, unknown][] = [];
    for (const k of keys) if (k in rec) pairs.push([k, rec[k]]);
    const canonical = JSON.stringify(pairs);
    const n = (seen.get(canonical) ?? 0) + 1;
    seen.set(canonical, n);
    out[r] = `imp_${hash('sha256', `${kind}|${canonical}|${n}`).slice(0, 56)}`;
  }
  return out;
}

/** One value in PostgreSQL's COPY text format. */
function copyText(v: unknown): string {
  if (v === null || v === undefined) return '\\N';
  if (typeof v === 'boolean') return v ? 't' : 'f';
  if (typeof v === 'number') return String(v);
  const s = String(v);
  return /[\\\t\n\r]/.test(s) ? s.replace(/[\\\t\n\r]/g, (c) => (c === '\\' ? '\\\\' : c === '\t' ? '\\t' : c === '\n' ? '\\n' : '\\r')) : s;
}

/** The rows as COPY text, in pieces of about 256 kB. */
function* copyChunks(records: Row[], keys: string[] | null, cols: Column[]): Generator<string> {
  let buf = '';
  for (let r = 0; r < records.length; r++) {
    const rec = records[r]!;
    let line = keys ? `${keys[r]!}\t` : '';
    for (let c = 0; c < cols.length; c++) line += (c ? '\t' : '') + copyText(rec[cols[c]![2]]);
    buf += `${line}\n`;
    if (buf.length > 262_144) {
      yield buf;
      buf = '';
    }
  }
  if (buf) yield buf;
}

const isPlainRow = (v: unknown): v is Row => typeof v === 'object' && v !== null && !Array.isArray(v);

export function importService(ctx: AppContext) {
  return {
    /**
     * Validates every row (schema, plot of this trial, date within the trial) and writes all of
     * them in one transaction, or nothing and the full list of problems. The valid rows go into a
     * temporary table by COPY, then into the log table by one INSERT … SELECT that skips rows
     * already imported.
     */
    async importRows(trialId: string, userId: string, kind: ImportKind, rows: unknown[]) {
      const [trial] = (await ctx.ds.query(
        `SELECT t.garden_id, to_char(t.planting_date, 'YYYY-MM-DD') AS planting_date, to_char(t.end_date, 'YYYY-MM-DD') AS end_date, t.status, g.time_zone
           FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`,
        [trialId],
      )) as {
        garden_id: string;
        planting_date: string;
        end_date: string | null;
        status: string;
        time_zone: string;
      }[];
      if (!trial) throw AppError.notFound('Trial');
      if (trial.status === 'closed') throw new AppError('conflict', 'This trial is closed and read-only. Reopen it to import.').because('trial_closed_import');
      const plots = (await ctx.ds.query('SELECT id, label FROM plots WHERE trial_id = $1', [trialId])) as { id: string; label: string }[];
      const plotByLabel = new Map(plots.map((p) => [p.label.toLowerCase(), p.id]));
      // Days are the garden's (its time zone): a row's day and "tomorrow", as logs.service checks one entry.
      const tomorrow = addDays(dayInTimeZone(ctx.now(), trial.time_zone), 1);
      const lastDay = trial.end_date && trial.end_date < tomorrow ? trial.end_date : tomorrow;

      const errors: RowError[] = [];
      const valid: Row[] = [];
      const schema: z.ZodType = schemas[kind];
      const fields = fieldsOf[kind];
      const byPlot = kind !== 'weather-days';
      const when = timeField[kind];
      rows.forEach((raw, i) => {
        if (!isPlainRow(raw)) {
          errors.push({ line: i + 2, column: '', reason: 'This row is not a record of named fields.', code: 'notRecord' });
          return;
        }
        const line = typeof raw.line === 'number' ? raw.line : i + 2;
        // Only the record's own fields, read as own properties (never through the prototype).
        const input: Row = {};
        for (const f of fields) if (Object.hasOwn(raw, f)) input[f] = raw[f];
        if (byPlot) {
          const label = String(Object.hasOwn(raw, 'plotLabel') ? (raw.plotLabel ?? '') : '');
          const plotId = plotByLabel.get(label.trim().toLowerCase());
          if (!plotId) {
            errors.push({
              line,
              column: 'plot',
              reason: `No plot "${label}" in this trial (plots: ${plots.map((p) => p.label).join(', ')}).`,
              code: 'unknownPlot',
              params: { plot: label, plots: plots.map((p) => p.label).join(', ') },
            });
            return;
          }
          input.plotId = plotId;
        }
        const parsed = schema.safeParse(input);
        if (!parsed.success) {
          for (const issue of zodIssues(parsed.error)) errors.push({ line, column: issue.path, reason: issue.message, code: 'invalidValue', issue: issue.issue });
          return;
        }
        const value = parsed.data as Row;
        // PostgreSQL text cannot hold a NUL character; say so instead of failing the whole COPY.
        for (const f of fields) {
          const v = value[f];
          if (typeof v === 'string' && v.includes('\0')) {
            errors.push({ line, column: f, reason: 'This cell contains a NUL character, which cannot be stored.', code: 'nulCharacter' });
            return;
          }
        }
        const at = String(value[when]);
        const day = at.length > 10 ? dayInTimeZone(at, trial.time_zone) : at;
        if (day < trial.planting_date || day > lastDay) {
          errors.push({
            line,
            column: when,
            reason: `${day} is outside this trial (planted ${trial.planting_date}${trial.end_date ? `, ends ${trial.end_date}` : ''}).`,
            code: 'outsideTrial',
            params: { day, planted: trial.planting_date, ends: trial.end_date ?? '' },
          });
          return;
        }
        valid.push(value);
      });
      if (errors.length) {
        throw AppError.validation(`${errors.length} problem${errors.length === 1 ? '' : 's'} found: nothing was imported. Fix the file and try again.`, {
          total: errors.length,
          rows: errors.slice(0, MAX_LISTED_ERRORS),
        }).because('import_rows_invalid', { count: errors.length });
      }
      if (!valid.length) throw AppError.validation('The file has no rows to import.').because('import_empty');

      const target = targets[kind];
      const keys = target.byTrial ? importFingerprints(kind, valid) : null;
      const runner = ctx.ds.createQueryRunner();
      // PostgresQueryRunner.connect() resolves with its pooled pg client: COPY needs the client itself.
      const client = (await runner.connect()) as PoolClient;
      try {
        await runner.startTransaction();
        await assertTrialWritable(runner.manager, trialId);
        const staged = target.cols.map(([, type], i) => `c${i} ${type}`).join(', ');
        await client.query(`CREATE TEMP TABLE import_rows (${keys ? 'k text NOT NULL, ' : ''}${staged}) ON COMMIT DROP`);
        await pipeline(Readable.from(copyChunks(valid, keys, target.cols)), client.query(copyFrom(`COPY import_rows FROM STDIN`)));
        const colList = target.cols.map((c) => c[0]).join(', ');
        const staging = target.cols.map((_, i) => `s.c${i}`).join(', ');
        let inserted: number;
        if (target.byTrial) {
          // The plots were checked by label before the transaction; one join confirms, set-wise, that
          // every plot still belongs to this trial (a plot deleted meanwhile is a clear conflict).
          const [gone] = (
            await client.query(
              `SELECT count(*)::int AS n FROM (SELECT DISTINCT c0 FROM import_rows) s LEFT JOIN plots p ON p.id = s.c0 AND p.trial_id = $1 WHERE p.id IS NULL`,
              [trialId],
            )
          ).rows as {
            n: number;
          }[];
          if (gone!.n) throw new AppError('conflict', 'A plot of this trial was removed during the import. Nothing was imported; try again.').because('plot_removed_during_import');
          const res = await client.query(
            `INSERT INTO ${target.table} (trial_id, entered_by, idempotency_key, ${colList})
             SELECT $1, $2, s.k, ${staging} FROM import_rows s
             ON CONFLICT ${target.conflict} DO NOTHING`,
            [trialId, userId],
          );
          inserted = res.rowCount ?? 0;
        } else {
          const res = await client.query(
            `INSERT INTO ${target.table} (garden_id, entered_by, ${colList})
             SELECT $1, $2, ${staging} FROM import_rows s
             ON CONFLICT ${target.conflict} DO NOTHING`,
            [trial.garden_id, userId],
          );
          inserted = res.rowCount ?? 0;
        }
        await runner.commitTransaction();
        return { received: valid.length, inserted, alreadyImported: valid.length - inserted };
      } catch (err) {
        if (runner.isTransactionActive) await runner.rollbackTransaction().catch(() => {});
        throw err;
      } finally {
        await runner.release();
      }
    },
  };
}
