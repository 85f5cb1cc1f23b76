import type { CreatePotInput, CreateSeepTestInput, Pot, SeepTest, UpdatePotInput } from '@shared/schemas/pots';
import { createPotInputSchema } from '@shared/schemas/pots';
import type { AppContext } from '../context';
import { PotEntity } from '../entities/pot.entity';
import { SeepTestEntity } from '../entities/seep-test.entity';
import { AppError } from '../lib/app-error';
import { zodIssues } from '../middleware/validate';
import { TRIAL_WRITE_LOCK } from './trials.service';

export function presentSeepTest(s: SeepTestEntity): SeepTest {
  return {
    id: s.id,
    potId: s.potId,
    testedOn: s.testedOn,
    setting: s.setting,
    litresLost: s.litresLost,
    hours: s.hours,
    litresPerDay: (s.litresLost * 24) / s.hours,
    notes: s.notes,
    createdAt: s.createdAt.toISOString(),
  };
}

export function potsService(ctx: AppContext) {
  const pots = ctx.ds.getRepository(PotEntity);
  const seeps = ctx.ds.getRepository(SeepTestEntity);

  async function assertOwnPlot(ownerId: string, plotId: string | null | undefined) {
    if (!plotId) return;
    const [row] = (await ctx.ds.query(`SELECT t.owner_id FROM plots p JOIN trials t ON t.id = p.trial_id WHERE p.id = $1`, [plotId])) as { owner_id: string }[];
    if (row?.owner_id !== ownerId) {
      throw AppError.validation('That plot is not one of yours.', [{ path: 'plotId', message: 'Choose one of your own plots.', reason: 'plot_not_yours' }]).because('plot_not_yours');
    }
  }

  async function present(rows: PotEntity[]): Promise<Pot[]> {
    if (!rows.length) return [];
    const ids = rows.map((r) => r.id);
    const tests = await seeps.createQueryBuilder('s').where('s.pot_id = ANY(:ids)', { ids }).orderBy('s.tested_on', 'ASC').addOrderBy('s.created_at', 'ASC').getMany();
    const plots = (await ctx.ds.query(`SELECT p.id, p.label, p.trial_id FROM plots p WHERE p.id = ANY($1::uuid[])`, [rows.map((r) => r.plotId).filter(Boolean)])) as {
      id: string;
      label: string;
      trial_id: string;
    }[];
    return rows.map((p) => {
      const own = tests.filter((t) => t.potId === p.id).map(presentSeepTest);
      const plot = plots.find((x) => x.id === p.plotId);
      return {
        id: p.id,
        label: p.label,
        capacityL: p.capacityL,
        heightCm: p.heightCm,
        widestDiameterCm: p.widestDiameterCm,
        neckDiameterCm: p.neckDiameterCm,
        shape: p.shape,
        clayBody: p.clayBody,
        make: p.make,
        firingCone: p.firingCone as Pot['firingCone'],
        installedOn: p.installedOn,
        plotId: p.plotId,
        plotLabel: plot?.label ?? null,
        trialId: plot?.trial_id ?? null,
        condition: p.condition,
        notes: p.notes,
        latestSeepLitresPerDay: own.length ? own[own.length - 1]!.litresPerDay : null,
        seepTests: own,
        createdAt: p.createdAt.toISOString(),
        updatedAt: p.updatedAt.toISOString(),
      };
    });
  }

  return {
    async list(ownerId: string, trialId?: string): Promise<Pot[]> {
      const qb = pots.createQueryBuilder('p').where('p.owner_id = :ownerId', { ownerId }).orderBy('p.label', 'ASC');
      if (trialId) qb.andWhere('p.plot_id IN (SELECT id FROM plots WHERE trial_id = :trialId)', { trialId });
      return present(await qb.getMany());
    },
    async get(id: string): Promise<Pot> {
      const p = await pots.findOneBy({ id });
      if (!p) throw AppError.notFound('Pot');
      return (await present([p]))[0]!;
    },
    async create(ownerId: string, input: CreatePotInput): Promise<Pot> {
      await assertOwnPlot(ownerId, input.plotId);
      const { identifiers } = await pots.insert({ ...input, ownerId });
      return this.get(identifiers[0]!.id as string);
    },
    async update(id: string, ownerId: string, input: UpdatePotInput): Promise<Pot> {
      const before = await pots.findOneByOrFail({ id });
      const merged = createPotInputSchema.safeParse({ ...before, ...input });
      if (!merged.success) throw AppError.validation('Some fields need attention.', zodIssues(merged.error)).because('invalid_fields');
      await assertOwnPlot(ownerId, input.plotId);
      if (Object.keys(input).length) await pots.update(id, input);
      return this.get(id);
    },
    /**
     * Deletes a pot; its logged refills stay in their trials without it (ON DELETE SET NULL, whose
     * rollup trigger then updates those trials' rows). Lock order as every log write: the trial rows
     * first (TRIAL_WRITE_LOCK, by id), then the pot. Deleting the pot first would hold it while
     * waiting for a trial that a refill naming this pot holds while it waits for the pot: a deadlock
     * (tests/api/log-writes.test.ts "a pot deleted while a refill names it").
     */
    async remove(id: string): Promise<void> {
      await ctx.ds.transaction(async (tx) => {
        await tx.query(`SELECT 1 FROM trials WHERE id IN (SELECT trial_id FROM water_events WHERE pot_id = $1) ORDER BY id ${TRIAL_WRITE_LOCK}`, [id]);
        await tx.getRepository(PotEntity).delete(id);
      });
    },
    async addSeepTest(potId: string, input: CreateSeepTestInput): Promise<SeepTest> {
      const { identifiers } = await seeps.insert({ ...input, potId });
      return presentSeepTest(await seeps.findOneByOrFail({ id: identifiers[0]!.id as string }));
    },
    async removeSeepTest(id: string): Promise<void> {
      await seeps.delete(id);
    },
  };
}
