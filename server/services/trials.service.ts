import { randomBytes } from 'node:crypto';
import { randomiseWithinBlocks } from '@shared/analysis/randomise';
import type { CreatePlotInput, Plot, UpdatePlotInput } from '@shared/schemas/plots';
import type { CreateTrialInput, Trial, TrialStatus, UpdateTrialInput } from '@shared/schemas/trials';
import { createTrialInputSchema } from '@shared/schemas/trials';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../context';
import { PlotEntity } from '../entities/plot.entity';
import { TrialEntity } from '../entities/trial.entity';
import { AppError } from '../lib/app-error';
import { zodIssues } from '../middleware/validate';
import { diff, mustAudit, writeAudit } from './audit';

const trialSelect = `
  SELECT t.*, g.name AS garden_name, g.time_zone,
         (SELECT count(*)::int FROM plots p WHERE p.trial_id = t.id) AS plot_count,
         GREATEST(
           (SELECT max(occurred_at) FROM water_events w WHERE w.trial_id = t.id),
           (SELECT max(taken_at) FROM moisture_readings m WHERE m.trial_id = t.id),
           -- A harvest has a day, not an instant: the start of that day on the garden's clock.
           (SELECT max(harvested_on)::timestamp AT TIME ZONE g.time_zone FROM harvests h WHERE h.trial_id = t.id)
         ) AS last_logged_at
    FROM trials t JOIN gardens g ON g.id = t.garden_id`;

interface TrialRow {
  id: string;
  garden_id: string;
  garden_name: string;
  time_zone: string;
  owner_id: string;
  title: string;
  crop: Trial['crop'];
  crop_name: string;
  variety: string;
  planting_date: string;
  end_date: string | null;
  design: Trial['design'];
  treatments: string[];
  question: string;
  protocol_notes: string;
  kc_overrides: Trial['kcOverrides'];
  stress_thresholds: Record<string, number>;
  status: TrialStatus;
  randomisation_seed: string | null;
  plot_count: number;
  last_logged_at: Date | null;
  created_at: Date;
  updated_at: Date;
}

function presentTrial(r: TrialRow, access: 'owner' | 'reader'): Trial {
  return {
    id: r.id,
    gardenId: r.garden_id,
    // Cohort readers never see the garden's own name (it can identify the grower).
    gardenName: access === 'owner' ? r.garden_name : '',
    timeZone: r.time_zone,
    title: r.title,
    crop: r.crop,
    cropName: r.crop_name,
    variety: r.variety,
    plantingDate: r.planting_date,
    endDate: r.end_date,
    design: r.design,
    treatments: r.treatments,
    question: r.question,
    protocolNotes: r.protocol_notes,
    kcOverrides: r.kc_overrides,
    stressThresholds: r.stress_thresholds,
    status: r.status,
    randomisationSeed: r.randomisation_seed,
    access,
    plotCount: r.plot_count,
    lastLoggedAt: r.last_logged_at ? new Date(r.last_logged_at).toISOString() : null,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

export function presentPlot(p: PlotEntity, potIds: string[] = []): Plot {
  return {
    id: p.id,
    trialId: p.trialId,
    label: p.label,
    treatment: p.treatment,
    blockKey: p.blockKey,
    areaM2: p.areaM2,
    setting: p.setting,
    mulch: p.mulch,
    lid: p.lid,
    plantCount: p.plantCount,
    potIds,
    createdAt: p.createdAt.toISOString(),
  };
}

/**
 * The row lock every write to a trial's records takes on the trial row, first, and holds until its
 * transaction ends; closing (or reopening) a trial takes the same lock (setStatus). PostgreSQL's
 * row-level lock table (docs, "13.3.2 Row-Level Locks") has FOR NO KEY UPDATE conflict with itself,
 * FOR SHARE and FOR UPDATE, but not with FOR KEY SHARE (what foreign-key checks take), so:
 * - a close waits for writes in progress and a write waits for a close in progress; under READ
 *   COMMITTED the waiting SELECT … FOR NO KEY UPDATE then returns the row as the other transaction
 *   committed it ("13.2.1 Read Committed Isolation Level": the would-be updater waits, then the
 *   WHERE clause is re-evaluated on the updated version, and SELECT FOR UPDATE/SHARE lock and return
 *   that version), so a write sees 'closed' and is refused; nothing lands in a closed trial.
 * - It is the lock an UPDATE of the trial's non-key columns takes ("13.3.2": FOR NO KEY UPDATE "is
 *   also acquired by any UPDATE that does not acquire a FOR UPDATE lock"; `status` and `data_version`
 *   are in no unique index). A log write's rollup trigger (migration CohortLogRollups) updates
 *   `trials.data_version` in the same transaction, so taking FOR NO KEY UPDATE up front means the
 *   transaction never upgrades its lock. FOR SHARE would be weaker but deadlocks: two writes to one
 *   trial both get FOR SHARE, then each one's trigger UPDATE waits for the other's share lock.
 * - The trial row comes first: a transaction locks it before any log, plot or pot row, so two writers
 *   (or a writer and a close, which locks nothing else) cannot wait for each other in a cycle.
 * FOR UPDATE (the close's lock before) would also block foreign-key checks of rows being inserted
 * for the trial (audit entries, shares), which need not wait. See DEVELOPERS.md "Decisions".
 */
export const TRIAL_WRITE_LOCK = 'FOR NO KEY UPDATE';

/**
 * Closed trials are read-only until their owner reopens them. Locks the trial row (TRIAL_WRITE_LOCK)
 * until the transaction ends, so the trial cannot be closed before the caller's writes commit: call
 * it inside the transaction, before the transaction touches any other row.
 */
export async function assertTrialWritable(em: EntityManager, trialId: string) {
  const [row] = (await em.query(`SELECT status FROM trials WHERE id = $1 ${TRIAL_WRITE_LOCK}`, [trialId])) as { status: TrialStatus }[];
  if (!row) throw AppError.notFound('Trial');
  if (row.status === 'closed') throw trialClosed();
}

export const trialClosed = () => new AppError('conflict', 'This trial is closed and read-only. Reopen it to make changes.').because('trial_closed');

const allowedTransitions: Record<TrialStatus, TrialStatus[]> = { draft: ['active', 'closed'], active: ['closed', 'draft'], closed: ['active'] };

/**
 * Why a status change is refused, as a reason the client words with what to do. The only move
 * the table refuses is closed → draft (a closed trial's record is finished; reopening it makes it
 * active, and an active trial may go back to draft); any other refused pair keeps the general reason.
 */
function statusChangeRefused(from: TrialStatus, to: TrialStatus): AppError {
  if (from === 'closed' && to === 'draft') {
    return new AppError('conflict', 'A closed trial cannot go back to draft. Reopen it first: it becomes active, and an active trial can be set back to draft.').because('status_closed_to_draft', { from, to });
  }
  return new AppError('conflict', `A ${from} trial cannot become ${to}.`).because('status_change_invalid', { from, to });
}

export function trialsService(ctx: AppContext) {
  const trials = ctx.ds.getRepository(TrialEntity);
  const plots = ctx.ds.getRepository(PlotEntity);

  async function loadRow(id: string): Promise<TrialRow> {
    const rows = (await ctx.ds.query(`${trialSelect} WHERE t.id = $1`, [id])) as TrialRow[];
    if (!rows[0]) throw AppError.notFound('Trial');
    return rows[0];
  }

  return {
    async list(ownerId: string, gardenId?: string): Promise<Trial[]> {
      const rows = (await ctx.ds.query(`${trialSelect} WHERE t.owner_id = $1 AND ($2::uuid IS NULL OR t.garden_id = $2) ORDER BY t.planting_date DESC, t.title`, [
        ownerId,
        gardenId ?? null,
      ])) as TrialRow[];
      return rows.map((r) => presentTrial(r, 'owner'));
    },

    async get(id: string, access: 'owner' | 'reader'): Promise<Trial> {
      return presentTrial(await loadRow(id), access);
    },

    async create(gardenId: string, ownerId: string, input: CreateTrialInput): Promise<Trial> {
      const { identifiers } = await trials.insert({ ...input, gardenId, ownerId });
      return this.get(identifiers[0]!.id as string, 'owner');
    },

    async update(id: string, actorId: string, input: UpdateTrialInput): Promise<Trial> {
      await ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, id);
        const repo = tx.getRepository(TrialEntity);
        const before = await repo.findOneByOrFail({ id });
        // Check the merged record as a whole (e.g. an end date before the planting date).
        const merged = createTrialInputSchema.safeParse({ ...before, ...input });
        if (!merged.success) throw AppError.validation('Some fields need attention.', zodIssues(merged.error)).because('invalid_fields');
        if (Object.keys(input).length === 0) return;
        await repo.update(id, input);
        if (await mustAudit(tx, id)) {
          const changes = diff(before as unknown as Record<string, unknown>, input as Record<string, unknown>);
          if (Object.keys(changes).length) await writeAudit(tx, { trialId: id, actorId, action: 'update', entityType: 'trial', entityId: id, changes });
        }
      });
      return this.get(id, 'owner');
    },

    async setStatus(id: string, actorId: string, status: TrialStatus): Promise<Trial> {
      await ctx.ds.transaction(async (tx) => {
        // The writers' lock (TRIAL_WRITE_LOCK), the weakest that conflicts with itself: the close waits for
        // log writes in progress, and writes that come after it wait and then see the new status. The
        // close locks no other row (its audit entry is a new row), so it is never part of a deadlock.
        const [row] = (await tx.query(`SELECT status FROM trials WHERE id = $1 ${TRIAL_WRITE_LOCK}`, [id])) as { status: TrialStatus }[];
        if (!row) throw AppError.notFound('Trial');
        if (row.status === status) return;
        if (!allowedTransitions[row.status].includes(status)) {
          throw statusChangeRefused(row.status, status);
        }
        await tx.query('UPDATE trials SET status = $2, updated_at = now() WHERE id = $1', [id, status]);
        await writeAudit(tx, { trialId: id, actorId, action: 'status', entityType: 'trial', entityId: id, changes: { status: [row.status, status] } });
      });
      return this.get(id, 'owner');
    },

    async remove(id: string): Promise<void> {
      const [{ shared }] = (await ctx.ds.query(`SELECT EXISTS (SELECT 1 FROM trial_shares WHERE trial_id = $1 AND withdrawn_at IS NULL) AS shared`, [id])) as [
        { shared: boolean },
      ];
      if (shared) throw new AppError('conflict', 'This trial is shared with a cohort. Withdraw it from every cohort before deleting it.').because('trial_shared_delete');
      await trials.delete(id);
    },

    async listPlots(trialId: string): Promise<Plot[]> {
      const rows = await plots.find({ where: { trialId }, order: { blockKey: 'ASC', label: 'ASC' } });
      const pots = (await ctx.ds.query(`SELECT id, plot_id FROM pots WHERE plot_id = ANY($1::uuid[]) ORDER BY label`, [rows.map((r) => r.id)])) as { id: string; plot_id: string }[];
      return rows.map((p) => presentPlot(p, pots.filter((x) => x.plot_id === p.id).map((x) => x.id)));
    },

    async createPlot(trialId: string, actorId: string, input: CreatePlotInput): Promise<Plot> {
      return ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, trialId);
        await assertTreatmentKnown(tx, trialId, input.treatment);
        try {
          const { identifiers } = await tx.getRepository(PlotEntity).insert({ ...input, trialId });
          const plot = await tx.getRepository(PlotEntity).findOneByOrFail({ id: identifiers[0]!.id as string });
          if (await mustAudit(tx, trialId)) await writeAudit(tx, { trialId, actorId, action: 'create', entityType: 'plot', entityId: plot.id, changes: { ...input } });
          return presentPlot(plot);
        } catch (err) {
          if ((err as { code?: string }).code === '23505') throw plotLabelTaken();
          throw err;
        }
      });
    },

    async updatePlot(plotId: string, actorId: string, input: UpdatePlotInput): Promise<Plot> {
      return ctx.ds.transaction(async (tx) => {
        const repo = tx.getRepository(PlotEntity);
        const before = await repo.findOneByOrFail({ id: plotId });
        await assertTrialWritable(tx, before.trialId);
        if (input.treatment !== undefined) await assertTreatmentKnown(tx, before.trialId, input.treatment);
        if (Object.keys(input).length) {
          try {
            await repo.update(plotId, input);
          } catch (err) {
            if ((err as { code?: string }).code === '23505') throw plotLabelTaken();
            throw err;
          }
        }
        if (await mustAudit(tx, before.trialId)) {
          const changes = diff(before as unknown as Record<string, unknown>, input as Record<string, unknown>);
          if (Object.keys(changes).length) await writeAudit(tx, { trialId: before.trialId, actorId, action: 'update', entityType: 'plot', entityId: plotId, changes });
        }
        return presentPlot(await repo.findOneByOrFail({ id: plotId }));
      });
    },

    async removePlot(plotId: string, actorId: string): Promise<void> {
      await ctx.ds.transaction(async (tx) => {
        const repo = tx.getRepository(PlotEntity);
        const before = await repo.findOneByOrFail({ id: plotId });
        await assertTrialWritable(tx, before.trialId);
        if (await mustAudit(tx, before.trialId)) {
          await writeAudit(tx, { trialId: before.trialId, actorId, action: 'delete', entityType: 'plot', entityId: plotId, changes: presentPlot(before) as unknown as Record<string, unknown> });
        }
        await repo.delete(plotId);
      });
    },

    /** Randomises treatments within every pair or block and records the seed. */
    async randomise(trialId: string, actorId: string, seed?: string): Promise<{ seed: string; plots: Plot[] }> {
      const usedSeed = seed ?? randomBytes(6).toString('hex');
      await ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, trialId);
        const trial = await tx.getRepository(TrialEntity).findOneByOrFail({ id: trialId });
        const rows = await tx.getRepository(PlotEntity).findBy({ trialId });
        const assignment = randomiseWithinBlocks(rows, trial.treatments, usedSeed);
        for (const a of assignment) await tx.query('UPDATE plots SET treatment = $2 WHERE id = $1', [a.plotId, a.treatment]);
        await tx.query('UPDATE trials SET randomisation_seed = $2, updated_at = now() WHERE id = $1', [trialId, usedSeed]);
        if (await mustAudit(tx, trialId)) {
          await writeAudit(tx, { trialId, actorId, action: 'update', entityType: 'trial', entityId: trialId, changes: { randomisationSeed: [trial.randomisationSeed, usedSeed] } });
        }
      });
      return { seed: usedSeed, plots: await this.listPlots(trialId) };
    },

    async auditTrail(trialId: string) {
      const rows = (await ctx.ds.query(
        `SELECT a.id, a.at, a.action, a.entity_type, a.entity_id, a.changes, u.display_name AS actor
           FROM audit_entries a LEFT JOIN users u ON u.id = a.actor_id
          WHERE a.trial_id = $1 ORDER BY a.at DESC LIMIT 500`,
        [trialId],
      )) as { id: string; at: Date; action: string; entity_type: string; entity_id: string; changes: unknown; actor: string | null }[];
      return rows.map((r) => ({ id: r.id, at: r.at.toISOString(), action: r.action, entityType: r.entity_type, entityId: r.entity_id, changes: r.changes, actor: r.actor }));
    },

    async listShares(trialId: string) {
      const rows = (await ctx.ds.query(
        `SELECT s.cohort_id, c.name, s.shared_at, s.withdrawn_at FROM trial_shares s JOIN cohorts c ON c.id = s.cohort_id WHERE s.trial_id = $1 ORDER BY s.shared_at`,
        [trialId],
      )) as { cohort_id: string; name: string; shared_at: Date; withdrawn_at: Date | null }[];
      return rows.map((r) => ({ cohortId: r.cohort_id, cohortName: r.name, sharedAt: r.shared_at.toISOString(), withdrawnAt: r.withdrawn_at?.toISOString() ?? null }));
    },

    /** Shares a trial into a cohort the owner contributes to (re-sharing a withdrawn one restores it). */
    async share(trialId: string, userId: string, cohortId: string) {
      const [member] = (await ctx.ds.query(`SELECT role FROM cohort_memberships WHERE cohort_id = $1 AND user_id = $2`, [cohortId, userId])) as { role: string }[];
      if (!member) {
        throw AppError.validation('You can share only into cohorts you belong to.', [{ path: 'cohortId', message: 'You are not a member of that cohort.', reason: 'share_not_member' }]).because(
          'share_not_member',
        );
      }
      if (member.role !== 'contributor') throw AppError.forbidden('Observers read a cohort; they do not share trials into it. Ask the lead to make you a contributor.').because('observer_cannot_share');
      await ctx.ds.query(
        `INSERT INTO trial_shares (trial_id, cohort_id) VALUES ($1, $2)
         ON CONFLICT (trial_id, cohort_id) DO UPDATE SET withdrawn_at = NULL, shared_at = CASE WHEN trial_shares.withdrawn_at IS NULL THEN trial_shares.shared_at ELSE now() END`,
        [trialId, cohortId],
      );
      return this.listShares(trialId);
    },

    async withdraw(trialId: string, cohortId: string) {
      const res = (await ctx.ds.query(`UPDATE trial_shares SET withdrawn_at = now() WHERE trial_id = $1 AND cohort_id = $2 AND withdrawn_at IS NULL RETURNING id`, [
        trialId,
        cohortId,
      ])) as [unknown[], number];
      if (res[1] === 0) throw AppError.notFound('Share');
      return this.listShares(trialId);
    },
  };
}

function plotLabelTaken(): AppError {
  return AppError.validation('Plot labels must differ within a trial.', [{ path: 'label', message: 'Another plot in this trial has this label.', reason: 'plot_label_taken' }]).because(
    'plot_label_taken',
  );
}

async function assertTreatmentKnown(em: EntityManager, trialId: string, treatment: string | null | undefined) {
  if (treatment === null || treatment === undefined) return;
  const [t] = (await em.query('SELECT treatments FROM trials WHERE id = $1', [trialId])) as { treatments: string[] }[];
  if (!t?.treatments.map((x) => x.toLowerCase()).includes(treatment.toLowerCase())) {
    throw AppError.validation('That treatment is not part of this trial.', [{ path: 'treatment', message: `Choose one of: ${t?.treatments.join(', ')}.`, reason: 'treatment_unknown' }]).because(
      'treatment_unknown',
      { treatments: t?.treatments.join(', ') ?? '' },
    );
  }
}
