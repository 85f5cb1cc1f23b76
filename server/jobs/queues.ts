import { z } from 'zod';
import { notificationKindSchema } from '@shared/schemas/notifications';

/**
 * The pg-boss queues of Seepwise's notifications. Sweeps run on a cron schedule and enqueue
 * one send job per user and kind; the send job claims, sends and marks each item (see
 * send-ledger.ts), so a job that runs twice, or after a restart, sends once.
 */
export const QUEUES = {
  refillSweep: 'notifications-refill-sweep',
  frostSweep: 'notifications-frost-sweep',
  digestSweep: 'notifications-digest-sweep',
  send: 'notifications-send',
  /** Not a notification: refreshes the cohort log rollups of shared trials (rollup-sweep.ts). */
  rollupSweep: 'cohort-rollups-sweep',
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

/** Cron schedules, in UTC. */
export const SCHEDULES: { queue: QueueName; cron: string }[] = [
  { queue: QUEUES.refillSweep, cron: '*/15 * * * *' },
  { queue: QUEUES.frostSweep, cron: '*/15 * * * *' },
  // Mondays 07:00 UTC.
  { queue: QUEUES.digestSweep, cron: '0 7 * * 1' },
  { queue: QUEUES.rollupSweep, cron: '* * * * *' },
];

/** A claim left 'pending' this long (a crash between claim and send) may be taken again. */
export const STALE_CLAIM_MS = 15 * 60 * 1000;

export const sendJobSchema = z.object({ userId: z.uuid(), kind: notificationKindSchema });
export type SendJob = z.infer<typeof sendJobSchema>;

/** Hands a send job on: to pg-boss in the running app, or straight to the sender when called directly. */
export type Enqueue = (job: SendJob) => Promise<unknown>;
