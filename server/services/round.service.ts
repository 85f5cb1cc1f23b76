import type { RoundInput } from '@shared/schemas/logs';
import type { AppContext } from '../context';
import { logsService } from './logs.service';
import { assertTrialWritable } from './trials.service';

/**
 * The Round: the phone screen for the daily walk. One read gives every plot and pot of a trial
 * with the last volumes as defaults; one write saves a batch of entries in one transaction.
 */
export function roundService(ctx: AppContext) {
  const logs = logsService(ctx);
  return {
    async get(trialId: string) {
      const plots = (await ctx.ds.query(
        `SELECT p.id, p.label, p.treatment, p.block_key AS "blockKey", p.area_m2 AS "areaM2",
                (SELECT w.volume_l FROM water_events w WHERE w.plot_id = p.id AND w.kind = 'surface' ORDER BY w.occurred_at DESC LIMIT 1) AS "lastSurfaceL",
                (SELECT max(w.occurred_at) FROM water_events w WHERE w.plot_id = p.id) AS "lastWateredAt"
           FROM plots p WHERE p.trial_id = $1 ORDER BY p.block_key, p.label`,
        [trialId],
      )) as { id: string; lastWateredAt: Date | null }[];
      const pots = (await ctx.ds.query(
        `SELECT o.id, o.label, o.plot_id AS "plotId", o.capacity_l AS "capacityL", o.condition,
                last.volume_l AS "lastRefillL", last.occurred_at AS "lastRefillAt",
                (SELECT s.litres_lost * 24 / s.hours FROM seep_tests s WHERE s.pot_id = o.id ORDER BY s.tested_on DESC, s.created_at DESC LIMIT 1) AS "seepLPerDay"
           FROM pots o
           JOIN plots p ON p.id = o.plot_id
           LEFT JOIN LATERAL (
             SELECT w.volume_l, w.occurred_at FROM water_events w WHERE w.pot_id = o.id AND w.kind = 'olla_refill' ORDER BY w.occurred_at DESC LIMIT 1
           ) last ON true
          WHERE p.trial_id = $1 AND o.condition <> 'retired'
          ORDER BY p.block_key, p.label, o.label`,
        [trialId],
      )) as { lastRefillAt: Date | null }[];
      const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
      return {
        plots: plots.map((p) => ({ ...p, lastWateredAt: iso(p.lastWateredAt) })),
        pots: pots.map((p) => ({ ...p, lastRefillAt: iso(p.lastRefillAt) })),
      };
    },

    /** Saves every entry or none; entries already saved (same idempotency key) are reported, not duplicated. */
    async save(trialId: string, userId: string, input: RoundInput) {
      return ctx.ds.transaction(async (tx) => {
        await assertTrialWritable(tx, trialId);
        const results: { type: string; id: string; created: boolean }[] = [];
        for (const e of input.entries) {
          const kind = e.type === 'water' ? 'water-events' : e.type === 'moisture' ? 'moisture-readings' : 'harvests';
          const { row, created } = await logs.insert(tx, kind, trialId, userId, e.entry as Record<string, unknown>);
          results.push({ type: e.type, id: row.id, created });
        }
        return results;
      });
    },
  };
}
