import {
  harvestInputSchema,
  moistureReadingInputSchema,
  observationInputSchema,
  waterEventInputSchema,
  type HarvestInput,
  type ListLogsQuery,
  type LogKind,
  type MoistureReadingInput,
  type ObservationInput,
  type WaterEventInput,
} from '@shared/schemas/logs';
import type { z } from 'zod';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../context';
import { AppError } from '../lib/app-error';
import { zodIssues } from '../middleware/validate';
import { diff, mustAudit, writeAudit } from './audit';
import { assertTrialWritable } from './trials.service';

type LogInput = WaterEventInput | MoistureReadingInput | HarvestInput | ObservationInput;

/** How one kind of log maps to its table: columns (camelCase field → SQL column) and its date field. */
interface LogKindConfig {
  table: string;
  entityType: string;
  schema: z.ZodType<LogInput>;
  /** The input field holding the moment of the log, checked against the trial's dates. */
  timeField: string;
  timeColumn: string;
  /** Is the time a calendar date (harvests) or an instant? */
  dateOnly: boolean;
  columns: Record<string, string>;
  plotRequired: boolean;
}

const common = { plotId: 'plot_id', idempotencyKey: 'idempotency_key' };

export const logKinds: Record<LogKind, LogKindConfig> = {
  'water-events': {
    table: 'water_events',
    entityType: 'water_event',
    schema: waterEventInputSchema as z.ZodType<LogInput>,
    timeField: 'occurredAt',
    timeColumn: 'occurred_at',
    dateOnly: false,
    plotRequired: true,
    columns: { ...common, occurredAt: 'occurred_at', kind: 'kind', volumeL: 'volume_l', source: 'source', fertiliser: 'fertiliser', potId: 'pot_id', notes: 'notes' },
  },
  'moisture-readings': {
    table: 'moisture_readings',
    entityType: 'moisture_reading',
    schema: moistureReadingInputSchema as z.ZodType<LogInput>,
    timeField: 'takenAt',
    timeColumn: 'taken_at',
    dateOnly: false,
    plotRequired: true,
    columns: { ...common, takenAt: 'taken_at', method: 'method', depthCm: 'depth_cm', value: 'value' },
  },
  harvests: {
    table: 'harvests',
    entityType: 'harvest',
    schema: harvestInputSchema as z.ZodType<LogInput>,
    timeField: 'harvestedOn',
    timeColumn: 'harvested_on',
    dateOnly: true,
    plotRequired: true,
    columns: { ...common, harvestedOn: 'harvested_on', freshKg: 'fresh_kg', count: 'count', marketableKg: 'marketable_kg', notes: 'notes' },
  },
  observations: {
    table: 'observations',
    entityType: 'observation',
    schema: observationInputSchema as z.ZodType<LogInput>,
    timeField: 'observedAt',
    timeColumn: 'observed_at',
    dateOnly: false,
    plotRequired: false,
    columns: { ...common, observedAt: 'observed_at', text: 'text' },
  },
};

/** SELECT list that returns a log with camelCase keys, plus its plot label and who entered it. */
function selectList(cfg: LogKindConfig) {
  const cols = Object.entries(cfg.columns).map(([field, col]) => `l.${col} AS "${field}"`);
  return `l.id, ${cols.join(', ')}, pl.label AS "plotLabel", u.display_name AS "enteredBy", l.created_at AS "createdAt"`;
}

function fromClause(cfg: LogKindConfig) {
  return `FROM ${cfg.table} l LEFT JOIN plots pl ON pl.id = l.plot_id LEFT JOIN users u ON u.id = l.entered_by`;
}

type LogRow = Record<string, unknown> & { id: string };

function presentLog(row: LogRow): LogRow {
  const out: LogRow = { ...row };
  for (const [k, v] of Object.entries(out)) if (v instanceof Date) out[k] = v.toISOString();
  delete out.idempotencyKey;
  return out;
}

/**
 * The log's date must fall within the trial: from planting to the end date (or tomorrow, for an
 * open trial). Days are the garden's: the time's day and "tomorrow" are taken in its time zone.
 */
async function assertWithinTrial(em: EntityManager, trialId: string, cfg: LogKindConfig, input: Record<string, unknown>, now: Date) {
  const raw = input[cfg.timeField] as string;
  const [t] = (await em.query(
    `SELECT to_char(t.planting_date, 'YYYY-MM-DD') AS planting_date, to_char(t.end_date, 'YYYY-MM-DD') AS end_date,
            to_char(($2::timestamptz AT TIME ZONE g.time_zone)::date + 1, 'YYYY-MM-DD') AS tomorrow,
            ${cfg.dateOnly ? '$3::text' : "to_char($3::timestamptz AT TIME ZONE g.time_zone, 'YYYY-MM-DD')"} AS day
       FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`,
    [trialId, now, raw],
  )) as { planting_date: string; end_date: string | null; tomorrow: string; day: string }[];
  if (!t) throw AppError.notFound('Trial');
  const { day, tomorrow } = t;
  const last = t.end_date && t.end_date < tomorrow ? t.end_date : tomorrow;
  if (day < t.planting_date || day > last) {
    const ends = t.end_date ? `ends ${t.end_date}` : 'still running';
    throw AppError.validation('The date is outside the trial.', [
      { path: cfg.timeField, message: `${day} is outside this trial (planted ${t.planting_date}, ${ends}); future dates are refused too.`, reason: 'date_outside_trial' },
    ]).because('date_outside_trial');
  }
}

async function assertPlotInTrial(em: EntityManager, trialId: string, plotId: unknown, required: boolean) {
  if (plotId === null || plotId === undefined) {
    if (required) throw AppError.validation('Choose a plot.', [{ path: 'plotId', message: 'Choose a plot.', reason: 'plot_required' }]).because('plot_required');
    return;
  }
  const [p] = (await em.query('SELECT trial_id FROM plots WHERE id = $1', [plotId])) as { trial_id: string }[];
  if (!p || p.trial_id !== trialId) {
    throw AppError.validation('That plot is not part of this trial.', [{ path: 'plotId', message: 'That plot is not part of this trial.', reason: 'plot_not_in_trial' }]).because(
      'plot_not_in_trial',
    );
  }
}

async function assertPotOnPlot(em: EntityManager, input: Record<string, unknown>) {
  if (!input.potId) return;
  const [p] = (await em.query('SELECT plot_id FROM pots WHERE id = $1', [input.potId])) as { plot_id: string | null }[];
  if (!p || p.plot_id !== input.plotId) {
    throw AppError.validation('That pot does not sit in this plot.', [{ path: 'potId', message: 'That pot does not sit in this plot.', reason: 'pot_not_in_plot' }]).because('pot_not_in_plot');
  }
}

export function logsService(ctx: AppContext) {
  /**
   * `before`, on an edit: the record as stored. A refill names the pot where it sat that day; a pot
   * moved to another plot since must not make its old refills uneditable, so the pot's current
   * place is checked only when the edit changes the pot or the plot.
   */
  async function checkAll(em: EntityManager, kind: LogKind, trialId: string, input: Record<string, unknown>, before?: Record<string, unknown>) {
    const cfg = logKinds[kind];
    await assertPlotInTrial(em, trialId, input.plotId, cfg.plotRequired);
    await assertWithinTrial(em, trialId, cfg, input, ctx.now());
    const potMoved = !before || before.potId !== input.potId || before.plotId !== input.plotId;
    if (kind === 'water-events' && potMoved) await assertPotOnPlot(em, input);
  }

  return {
    async list(kind: LogKind, trialId: string, q: ListLogsQuery) {
      const cfg = logKinds[kind];
      const where: string[] = ['l.trial_id = $1'];
      const params: unknown[] = [trialId];
      if (q.plotId) where.push(`l.plot_id = $${params.push(q.plotId)}`);
      // from/to are the garden's days: a time column is compared with that day's midnight in the garden's zone.
      const zone = '(SELECT g.time_zone FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1)';
      const dayStart = (p: string) => (cfg.dateOnly ? p : `(${p}::timestamp AT TIME ZONE ${zone})`);
      if (q.from) where.push(`l.${cfg.timeColumn} >= ${dayStart(`$${params.push(q.from)}::date`)}`);
      if (q.to) where.push(`l.${cfg.timeColumn} < ${dayStart(`($${params.push(q.to)}::date + 1)`)}`);
      const whereSql = where.join(' AND ');
      const dir = q.sort === 'asc' ? 'ASC' : 'DESC';
      const [{ total }] = (await ctx.ds.query(`SELECT count(*)::int AS total FROM ${cfg.table} l WHERE ${whereSql}`, params)) as [{ total: number }];
      const rows = (await ctx.ds.query(
        `SELECT ${selectList(cfg)} ${fromClause(cfg)} WHERE ${whereSql} ORDER BY l.${cfg.timeColumn} ${dir}, l.created_at ${dir}, l.id LIMIT ${q.pageSize} OFFSET ${(q.page - 1) * q.pageSize}`,
        params,
      )) as LogRow[];
      return { rows: rows.map(presentLog), meta: { total, page: q.page, pageSize: q.pageSize } };
    },

    /** Inserts one log inside a transaction; a repeated idempotency key returns the first record instead. */
    async insert(em: EntityManager, kind: LogKind, trialId: string, userId: string, input: Record<string, unknown>): Promise<{ row: LogRow; created: boolean }> {
      const cfg = logKinds[kind];
      if (input.idempotencyKey) {
        const existing = (await em.query(`SELECT ${selectList(cfg)} ${fromClause(cfg)} WHERE l.trial_id = $1 AND l.idempotency_key = $2`, [
          trialId,
          input.idempotencyKey,
        ])) as LogRow[];
        if (existing[0]) return { row: presentLog(existing[0]), created: false };
      }
      await checkAll(em, kind, trialId, input);
      const fields = Object.keys(cfg.columns).filter((f) => input[f] !== undefined);
      const cols = ['trial_id', 'entered_by', ...fields.map((f) => cfg.columns[f]!)];
      const values = [trialId, userId, ...fields.map((f) => input[f])];
      const placeholders = values.map((_, i) => `$${i + 1}`);
      const conflict = input.idempotencyKey ? 'ON CONFLICT (trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL DO NOTHING' : '';
      const inserted = (await em.query(`INSERT INTO ${cfg.table} (${cols.join(', ')}) VALUES (${placeholders.join(', ')}) ${conflict} RETURNING id`, values)) as { id: string }[];
      const id = inserted[0]?.id;
      const row = (await em.query(
        `SELECT ${selectList(cfg)} ${fromClause(cfg)} WHERE ${id ? 'l.id = $1' : 'l.trial_id = $1 AND l.idempotency_key = $2'}`,
        id ? [id] : [trialId, input.idempotencyKey],
      )) as LogRow[];
      if (id && (await mustAudit(em, trialId))) {
        await writeAudit(em, { trialId, actorId: userId, action: 'create', entityType: cfg.entityType, entityId: id, changes: { ...input } });
      }
      return { row: presentLog(row[0]!), created: Boolean(id) };
    },

    async create(kind: LogKind, trialId: string, userId: string, input: Record<string, unknown>) {
      return ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, trialId);
        return this.insert(tx, kind, trialId, userId, input);
      });
    },

    async update(kind: LogKind, id: string, userId: string, patch: Record<string, unknown>) {
      const cfg = logKinds[kind];
      return ctx.ds.transaction(async (tx) => {
        const [before] = (await tx.query(`SELECT l.trial_id AS "trialId", ${selectList(cfg)} ${fromClause(cfg)} WHERE l.id = $1 FOR UPDATE OF l`, [id])) as (LogRow & {
          trialId: string;
        })[];
        if (!before) throw AppError.notFound('Record');
        await assertTrialWritable(tx, before.trialId);
        const current: Record<string, unknown> = {};
        for (const f of Object.keys(cfg.columns)) current[f] = before[f] instanceof Date ? (before[f] as Date).toISOString() : before[f];
        delete current.idempotencyKey;
        // Validate the record as it will be, with the kind's full schema.
        const merged = cfg.schema.safeParse({ ...current, ...patch });
        if (!merged.success) throw AppError.validation('Some fields need attention.', zodIssues(merged.error)).because('invalid_fields');
        const next = merged.data as Record<string, unknown>;
        await checkAll(tx, kind, before.trialId, next, current);
        // Own columns only: `'constructor' in cfg.columns` is true too, and would reach the SQL as a column name.
        const fields = Object.keys(patch).filter((f) => Object.hasOwn(cfg.columns, f) && f !== 'idempotencyKey');
        if (fields.length) {
          const sets = fields.map((f, i) => `${cfg.columns[f]} = $${i + 2}`);
          await tx.query(`UPDATE ${cfg.table} SET ${sets.join(', ')} WHERE id = $1`, [id, ...fields.map((f) => next[f])]);
        }
        if (await mustAudit(tx, before.trialId)) {
          const changes = diff(current, Object.fromEntries(fields.map((f) => [f, next[f]])));
          if (Object.keys(changes).length) await writeAudit(tx, { trialId: before.trialId, actorId: userId, action: 'update', entityType: cfg.entityType, entityId: id, changes });
        }
        const [row] = (await tx.query(`SELECT ${selectList(cfg)} ${fromClause(cfg)} WHERE l.id = $1`, [id])) as LogRow[];
        return presentLog(row!);
      });
    },

    async remove(kind: LogKind, id: string, userId: string) {
      const cfg = logKinds[kind];
      await ctx.ds.transaction(async (tx) => {
        const [before] = (await tx.query(`SELECT l.trial_id AS "trialId", ${selectList(cfg)} ${fromClause(cfg)} WHERE l.id = $1`, [id])) as (LogRow & { trialId: string })[];
        if (!before) throw AppError.notFound('Record');
        await assertTrialWritable(tx, before.trialId);
        if (await mustAudit(tx, before.trialId)) {
          await writeAudit(tx, { trialId: before.trialId, actorId: userId, action: 'delete', entityType: cfg.entityType, entityId: id, changes: presentLog(before) });
        }
        await tx.query(`DELETE FROM ${cfg.table} WHERE id = $1`, [id]);
      });
    },
  };
}
