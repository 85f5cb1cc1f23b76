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
import type { TrialStatus } from '@shared/schemas/trials';
import type { AccessGate } from '../http/access';
import { TRIAL_WRITE_LOCK, trialClosed } from './trials.service';

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

function fromClause(cfg: LogKindConfig, source = cfg.table) {
  return `FROM ${source} l LEFT JOIN plots pl ON pl.id = l.plot_id LEFT JOIN users u ON u.id = l.entered_by`;
}

type LogRow = Record<string, unknown> & { id: string };

function presentLog(row: LogRow): LogRow {
  const out: LogRow = { ...row };
  for (const [k, v] of Object.entries(out)) if (v instanceof Date) out[k] = v.toISOString();
  delete out.idempotencyKey;
  return out;
}

const plotRequired = () => AppError.validation('Choose a plot.', [{ path: 'plotId', message: 'Choose a plot.', reason: 'plot_required' }]).because('plot_required');
const plotNotInTrial = () =>
  AppError.validation('That plot is not part of this trial.', [{ path: 'plotId', message: 'That plot is not part of this trial.', reason: 'plot_not_in_trial' }]).because(
    'plot_not_in_trial',
  );
const potNotInPlot = () =>
  AppError.validation('That pot does not sit in this plot.', [{ path: 'potId', message: 'That pot does not sit in this plot.', reason: 'pot_not_in_plot' }]).because('pot_not_in_plot');

/**
 * A date-only log's day, or a time PostgreSQL cannot read (year 0, which ISO allows): those go into
 * the date checks as text (the latter as its UTC day, refused anyway: it is before any planting).
 */
const dayAsText = (cfg: LogKindConfig, raw: string) => cfg.dateOnly || /^0000-/.test(raw);

/** The UTC day a log falls on, as YYYY-MM-DD (see dayAsText). */
function logDay(cfg: LogKindConfig, input: Record<string, unknown>) {
  const raw = input[cfg.timeField] as string;
  return cfg.dateOnly ? raw : new Date(raw).toISOString().slice(0, 10);
}

function dateOutsideTrial(cfg: LogKindConfig, day: string, plantingDate: string, endDate: string | null) {
  const ends = endDate ? `ends ${endDate}` : 'still running';
  return AppError.validation('The date is outside the trial.', [
    { path: cfg.timeField, message: `${day} is outside this trial (planted ${plantingDate}, ${ends}); future dates are refused too.`, reason: 'date_outside_trial' },
  ]).because('date_outside_trial');
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
            ${dayAsText(cfg, raw) ? '$3::text' : "to_char($3::timestamptz AT TIME ZONE g.time_zone, 'YYYY-MM-DD')"} AS day
       FROM trials t JOIN gardens g ON g.id = t.garden_id WHERE t.id = $1`,
    [trialId, now, dayAsText(cfg, raw) ? logDay(cfg, input) : raw],
  )) as { planting_date: string; end_date: string | null; tomorrow: string; day: string }[];
  if (!t) throw AppError.notFound('Trial');
  const { day, tomorrow } = t;
  const last = t.end_date && t.end_date < tomorrow ? t.end_date : tomorrow;
  if (day < t.planting_date || day > last) throw dateOutsideTrial(cfg, day, t.planting_date, t.end_date);
}

async function assertPlotInTrial(em: EntityManager, trialId: string, plotId: unknown, required: boolean) {
  if (plotId === null || plotId === undefined) {
    if (required) throw plotRequired();
    return;
  }
  const [p] = (await em.query('SELECT trial_id FROM plots WHERE id = $1', [plotId])) as { trial_id: string }[];
  if (!p || p.trial_id !== trialId) throw plotNotInTrial();
}

async function assertPotOnPlot(em: EntityManager, input: Record<string, unknown>) {
  if (!input.potId) return;
  const [p] = (await em.query('SELECT plot_id FROM pots WHERE id = $1', [input.potId])) as { plot_id: string | null }[];
  if (!p || p.plot_id !== input.plotId) throw potNotInPlot();
}

/** What the write statement reports beside the record: the trial's state and each check's outcome (`_created` null: no record). */
interface WriteOutcome {
  _status: TrialStatus;
  _plantingDate: string;
  _endDate: string | null;
  /** The log's day in the garden's zone, as compared. */
  _day: string;
  _plotOk: boolean;
  _dateOk: boolean;
  _potOk: boolean;
  _created: boolean | null;
}

/**
 * One statement that creates a log, or says why not: it reads the trial (and, with `ownerOnly`, only
 * a trial the user owns), checks the plot, the pot and the date, finds an earlier record with the same
 * idempotency key, inserts only when every check passes and there is none, writes the audit entry
 * when the trial is audited, and returns the record as the list shows it (plot label, who entered
 * it). A single statement is atomic on its own, so no transaction; the rollup triggers fire in it.
 * No row back: no such trial (or not the user's).
 *
 * CTE `c` locks the trial row (TRIAL_WRITE_LOCK, server/services/trials.service.ts) before anything is
 * inserted, so a close cannot commit between the status check and the insert: a locking clause may
 * stand inside a WITH query and then locks there (PostgreSQL docs, SELECT, "The Locking Clause": the
 * clauses "do not apply to WITH queries referenced by the primary query. If you want row locking to
 * occur within a WITH query, specify a locking clause within the WITH query"). If a close holds the
 * row, the statement waits, and under READ COMMITTED ("13.2.1 Read Committed Isolation Level") gets
 * the row as the close committed it, so `c.status` is 'closed' and nothing is written. `OF t`: the
 * garden and the plot and pot rows are read, not locked.
 */
function writeStatement(cfg: LogKindConfig, kind: LogKind, trialId: string, userId: string, input: Record<string, unknown>, opts: { ownerOnly: boolean; now: Date }) {
  const params: unknown[] = [trialId, userId];
  const p = (v: unknown) => `$${params.push(v)}`;
  const fields = Object.keys(cfg.columns).filter((f) => input[f] !== undefined);
  const cols = ['trial_id', 'entered_by', ...fields.map((f) => cfg.columns[f]!)];
  // PostgreSQL has no year 0, which the ISO format allows. Such a day fails the date check (it is before any
  // planting), so it is never stored; sent as NULL it cannot make the whole statement fail to parse.
  const storable = (f: string) => !(f === cfg.timeField && /^0000-/.test(String(input[f])));
  const values = ['$1', '$2', ...fields.map((f) => p(storable(f) ? input[f] : null))];
  const plotId = input.plotId;
  const plotOk = plotId === null || plotId === undefined ? String(!cfg.plotRequired) : `EXISTS (SELECT 1 FROM plots pl WHERE pl.id = ${p(plotId)} AND pl.trial_id = t.id)`;
  const potOk = kind === 'water-events' && input.potId ? `EXISTS (SELECT 1 FROM pots o WHERE o.id = ${p(input.potId)} AND o.plot_id = ${p(plotId ?? null)})` : 'true';
  // The garden's day of the log and the garden's tomorrow (days are the garden's, see assertWithinTrial),
  // compared as text, as the day and the trial's dates always were (see dayAsText for year 0).
  const raw = String(input[cfg.timeField]);
  const day = dayAsText(cfg, raw) ? `${p(logDay(cfg, input))}::text` : `to_char(${p(raw)}::timestamptz AT TIME ZONE g.time_zone, 'YYYY-MM-DD')`;
  const tomorrow = `(${p(opts.now)}::timestamptz AT TIME ZONE g.time_zone)::date + 1`;
  const dateOk = `d.day COLLATE "C" BETWEEN to_char(t.planting_date, 'YYYY-MM-DD') AND to_char(LEAST(t.end_date, ${tomorrow}), 'YYYY-MM-DD')`;
  const key = input.idempotencyKey as string | undefined;
  const keyParam = key ? p(key) : '';
  const changes = p(JSON.stringify({ ...input }));
  const sql = `
    WITH c AS (
      SELECT t.status, t.planting_date, t.end_date, d.day,
             t.status = 'closed' OR EXISTS (SELECT 1 FROM trial_shares s WHERE s.trial_id = t.id AND s.withdrawn_at IS NULL) AS must_audit,
             ${plotOk} AS plot_ok, ${dateOk} AS date_ok, ${potOk} AS pot_ok
        FROM trials t JOIN gardens g ON g.id = t.garden_id CROSS JOIN LATERAL (SELECT ${day} AS day) d
       WHERE t.id = $1${opts.ownerOnly ? ' AND t.owner_id = $2' : ''}
         ${TRIAL_WRITE_LOCK} OF t
    ),${key ? `
    prior AS (SELECT * FROM ${cfg.table} WHERE trial_id = $1 AND idempotency_key = ${keyParam}),` : ''}
    ins AS (
      INSERT INTO ${cfg.table} (${cols.join(', ')})
      SELECT ${values.join(', ')} FROM c
       WHERE c.status <> 'closed' AND c.plot_ok AND c.date_ok AND c.pot_ok${key ? ' AND NOT EXISTS (SELECT 1 FROM prior)' : ''}
      ${key ? 'ON CONFLICT (trial_id, idempotency_key) WHERE idempotency_key IS NOT NULL DO NOTHING' : ''}
      RETURNING *
    ),
    logged AS (
      INSERT INTO audit_entries (trial_id, actor_id, action, entity_type, entity_id, changes)
      SELECT i.trial_id, $2, 'create', '${cfg.entityType}', i.id, ${changes} FROM ins i CROSS JOIN c WHERE c.must_audit
    )
    SELECT c.status AS "_status", c.planting_date AS "_plantingDate", c.end_date AS "_endDate", c.day AS "_day", c.plot_ok AS "_plotOk", c.date_ok AS "_dateOk", c.pot_ok AS "_potOk", r.*
      FROM c LEFT JOIN (
        SELECT true AS "_created", ${selectList(cfg)} ${fromClause(cfg, 'ins')}${
          key ? `
        UNION ALL
        SELECT false, ${selectList(cfg)} ${fromClause(cfg, 'prior')}` : ''
        }
      ) r ON true`;
  return { sql, params };
}

/**
 * The first statement of an edit or a delete of log `id`: locks its trial's row (TRIAL_WRITE_LOCK) and
 * refuses a closed trial. The trial row is locked before the log row, in the order every trial write
 * takes them (log writes, assertTrialWritable, a trial's delete), so an edit and a plot's removal
 * (which deletes its logs) or a write cannot wait for each other in a cycle. The log's trial is
 * read without a lock: a log never moves to another trial. A close that holds the trial row makes this
 * wait; afterwards it reads the status the close committed (READ COMMITTED, see writeStatement).
 */
async function lockWritableTrialOf(tx: EntityManager, cfg: LogKindConfig, id: string) {
  const [t] = (await tx.query(`SELECT t.status FROM trials t WHERE t.id = (SELECT l.trial_id FROM ${cfg.table} l WHERE l.id = $1) ${TRIAL_WRITE_LOCK}`, [id])) as {
    status: TrialStatus;
  }[];
  if (!t) throw AppError.notFound('Record');
  if (t.status === 'closed') throw trialClosed();
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

    /**
     * Creates one log in one statement (writeStatement); a repeated idempotency key returns the first
     * record instead. Refusals, in this order: a closed trial; then, unless the key was seen before,
     * the plot, the date and the pot. `ownerOnly`: write only into a trial the user owns (no row: a
     * not-found error, which the route answers through its access check); `gate` is settled once the
     * statement has shown that. Inside a transaction (the Round) pass its manager.
     */
    async insert(
      em: EntityManager,
      kind: LogKind,
      trialId: string,
      userId: string,
      input: Record<string, unknown>,
      opts: { ownerOnly?: boolean; gate?: AccessGate } = {},
    ): Promise<{ row: LogRow; created: boolean }> {
      const cfg = logKinds[kind];
      const { sql, params } = writeStatement(cfg, kind, trialId, userId, input, { ownerOnly: opts.ownerOnly ?? false, now: ctx.now() });
      const [out] = (await em.query(sql, params)) as (LogRow & WriteOutcome)[];
      if (!out) throw AppError.notFound(opts.ownerOnly ? 'trial' : 'Trial');
      if (opts.gate) opts.gate.settled = true;
      if (out._status === 'closed') throw trialClosed();
      const present = (r: LogRow) => presentLog(Object.fromEntries(Object.entries(r).filter(([k]) => !k.startsWith('_'))) as LogRow);
      if (out._created !== null) return { row: present(out), created: out._created };
      if ((input.plotId === null || input.plotId === undefined) && cfg.plotRequired) throw plotRequired();
      if (!out._plotOk) throw plotNotInTrial();
      if (!out._dateOk) throw dateOutsideTrial(cfg, out._day, out._plantingDate, out._endDate);
      if (!out._potOk) throw potNotInPlot();
      // Every check passed and nothing was written: the same key was being written at the same moment
      // (ON CONFLICT DO NOTHING waited for it). Its record is committed now.
      const [row] = (await em.query(`SELECT ${selectList(cfg)} ${fromClause(cfg)} WHERE l.trial_id = $1 AND l.idempotency_key = $2`, [trialId, input.idempotencyKey ?? null])) as LogRow[];
      if (!row) throw new Error(`${kind}: the write statement neither wrote nor refused`);
      return { row: presentLog(row), created: false };
    },

    /** A grower's new log, as the trial's owner: one statement, no transaction (see insert). */
    async create(kind: LogKind, trialId: string, userId: string, input: Record<string, unknown>, gate?: AccessGate) {
      return this.insert(ctx.ds.manager, kind, trialId, userId, input, { ownerOnly: true, gate });
    },

    async update(kind: LogKind, id: string, userId: string, patch: Record<string, unknown>) {
      const cfg = logKinds[kind];
      return ctx.ds.transaction(async (tx) => {
        await lockWritableTrialOf(tx, cfg, id);
        const [before] = (await tx.query(`SELECT l.trial_id AS "trialId", ${selectList(cfg)} ${fromClause(cfg)} WHERE l.id = $1 FOR UPDATE OF l`, [id])) as (LogRow & {
          trialId: string;
        })[];
        if (!before) throw AppError.notFound('Record');
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
        await lockWritableTrialOf(tx, cfg, id);
        const [before] = (await tx.query(`SELECT l.trial_id AS "trialId", ${selectList(cfg)} ${fromClause(cfg)} WHERE l.id = $1`, [id])) as (LogRow & { trialId: string })[];
        if (!before) throw AppError.notFound('Record');
        if (await mustAudit(tx, before.trialId)) {
          await writeAudit(tx, { trialId: before.trialId, actorId: userId, action: 'delete', entityType: cfg.entityType, entityId: id, changes: presentLog(before) });
        }
        await tx.query(`DELETE FROM ${cfg.table} WHERE id = $1`, [id]);
      });
    },
  };
}
