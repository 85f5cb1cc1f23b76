import { useMutationState, useQueryClient, type Mutation } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { RoundInput } from '@shared/schemas/logs';
import { useIsOnline } from '@/features/offline/online';
import { roundSaveKey, type RoundSaveVariables } from './save-round';

export interface RoundSendState {
  /** Records of this trial saved on the phone and not yet sent. */
  waiting: number;
  /** They wait for a connection (offline, or a try failed), rather than being sent right now. */
  queued: boolean;
  /** The last time the queue emptied: how many records went, and whether they had waited. */
  sent: { n: number; waited: boolean } | null;
  /** Pots (`pot:id`) and surface plots (`plot:id`) with a watering still waiting to be sent. */
  waitingFor: ReadonlySet<string>;
  /** Forgets refused saves once their taps are saved again or discarded. */
  clearRefused: () => void;
}

const sizeOf = (v: unknown) => (v as RoundSaveVariables | undefined)?.input.entries.length ?? 0;
/** The server's reason for a refused save; empty when it gave none (the screen then says it in the reader's language). */
const messageOf = (e: unknown): string => {
  const m = e && typeof e === 'object' && 'message' in e ? e.message : null;
  return typeof m === 'string' ? m : '';
};

/**
 * The Round's saves for one trial as the grower sees them: waiting on the phone, sent, or refused.
 * A refused save (validation, a closed trial) is not retried; `onRefused` gets its entries so they
 * go back on the screen, and it is kept until `clearRefused` (saved again, or discarded).
 */
export function useRoundSendState(trialId: string, onRefused: (input: RoundInput, message: string) => void): RoundSendState {
  const qc = useQueryClient();
  const online = useIsOnline();
  const items = useMutationState({
    filters: { mutationKey: roundSaveKey(trialId) },
    select: (m) => ({
      id: m.mutationId,
      status: m.state.status,
      paused: m.state.isPaused,
      failures: m.state.failureCount,
      n: sizeOf(m.state.variables),
      watered: ((m.state.variables as RoundSaveVariables | undefined)?.input.entries ?? []).flatMap((e) =>
        e.type === 'water' ? [e.entry.potId ? `pot:${e.entry.potId}` : `plot:${e.entry.plotId}`] : [],
      ),
    }),
  });
  const pending = items.filter((i) => i.status === 'pending');
  const waiting = pending.reduce((s, i) => s + i.n, 0);
  const queued = pending.length > 0 && (!online || pending.some((i) => i.paused || i.failures > 0));

  // Records sent while this screen is open, counted as each save succeeds.
  const sentCount = useRef(0);
  useEffect(() => {
    const key = JSON.stringify(roundSaveKey(trialId));
    return qc.getMutationCache().subscribe((ev) => {
      if (ev.type === 'updated' && ev.action.type === 'success' && JSON.stringify(ev.mutation.options.mutationKey) === key) sentCount.current += sizeOf(ev.mutation.state.variables);
    });
  }, [qc, trialId]);

  // A queue that empties: "Saved N records." straight away, "Sent" when they had to wait.
  const draining = useRef<{ waited: boolean } | null>(null);
  const [sent, setSent] = useState<RoundSendState['sent']>(null);
  const firstRun = useRef(true);
  useEffect(() => {
    const atMount = firstRun.current;
    firstRun.current = false;
    if (pending.length > 0) {
      // Saves found pending when the screen opens were made earlier (another visit, before a reload): they waited.
      draining.current = { waited: (draining.current?.waited ?? false) || queued || atMount };
      setSent(null);
    } else if (draining.current) {
      setSent(sentCount.current > 0 ? { n: sentCount.current, waited: draining.current.waited } : null);
      draining.current = null;
      sentCount.current = 0;
    }
  }, [pending.length, queued]);

  // Refused saves go back to the grower as taps, once per save while the screen is open. They stay
  // in the cache (and on the phone) until saved again or discarded, so leaving the screen loses nothing.
  const refusedRef = useRef(onRefused);
  useEffect(() => {
    refusedRef.current = onRefused;
  });
  const shown = useRef(new Set<number>());
  const refusedIds = items.filter((i) => i.status === 'error').map((i) => i.id).join(',');
  useEffect(() => {
    if (!refusedIds) return;
    const cache = qc.getMutationCache();
    for (const id of refusedIds.split(',').map(Number)) {
      const m = cache.getAll().find((x) => x.mutationId === id) as Mutation<unknown, unknown, RoundSaveVariables> | undefined;
      if (!m?.state.variables || shown.current.has(id)) continue;
      shown.current.add(id);
      refusedRef.current(m.state.variables.input, messageOf(m.state.error));
    }
  }, [qc, refusedIds]);
  /** Forgets the refused saves of this trial: their taps were saved again, or discarded. */
  const clearRefused = useCallback(() => {
    const cache = qc.getMutationCache();
    for (const m of cache.findAll({ mutationKey: roundSaveKey(trialId), status: 'error' })) cache.remove(m);
  }, [qc, trialId]);

  const waitingFor = new Set(pending.flatMap((i) => i.watered));
  return { waiting, queued, sent, waitingFor, clearRefused };
}
