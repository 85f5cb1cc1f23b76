/**
 * pg-boss on the app's own PostgreSQL (schema `pgboss`): queues, cron schedules and workers for
 * the notification jobs and the cohort rollup sweep. Jobs live in the database, so a job queued before a restart runs after
 * it; the ledger (send-ledger.ts) makes a job that runs twice send once.
 *
 * `npm start` starts it after the migrations and stops it before the database. Tests start it
 * against their own database with `work: false` and process queues with `drain()`.
 */
import PgBoss from 'pg-boss';
import type { NotificationContext } from '../services/reminders.service';
import { runDigestSweep, runFrostSweep, runRefillSweep, sendUserNotifications } from './notifications';
import { runRollupSweep } from './rollup-sweep';
import { QUEUES, SCHEDULES, sendJobSchema, type QueueName, type SendJob } from './queues';

export interface JobRunnerOptions {
  connectionString: string;
  /** Register the cron schedules and let pg-boss fire them (default true). */
  schedule?: boolean;
  /** Poll the queues and run jobs in this process (default true). */
  work?: boolean;
  /** Seconds between polls when a queue is empty (default 5). */
  pollingIntervalSeconds?: number;
}

export interface JobRunner {
  boss: PgBoss;
  /** Queues one user's send job; a job already waiting for the same user and kind is not doubled. */
  enqueueSend: (job: SendJob) => Promise<string | null>;
  /** Runs every job waiting in a queue now, in this process; returns how many ran. */
  drain: (queue: QueueName) => Promise<number>;
  stop: () => Promise<void>;
}

/** Retry and expiry per queue: sweeps are cheap to repeat; sends back off while SMTP is down. */
const queueOptions: Record<QueueName, Omit<PgBoss.Queue, 'name'>> = {
  [QUEUES.refillSweep]: { policy: 'short', retryLimit: 2, retryDelay: 60, expireInSeconds: 600 },
  [QUEUES.frostSweep]: { policy: 'short', retryLimit: 2, retryDelay: 60, expireInSeconds: 600 },
  [QUEUES.digestSweep]: { policy: 'short', retryLimit: 5, retryDelay: 300, retryBackoff: true, expireInSeconds: 1800 },
  [QUEUES.send]: { policy: 'short', retryLimit: 6, retryDelay: 60, retryBackoff: true, expireInSeconds: 300 },
  [QUEUES.rollupSweep]: { policy: 'short', retryLimit: 1, retryDelay: 60, expireInSeconds: 600 },
};

export async function startJobRunner(ctx: NotificationContext, opts: JobRunnerOptions): Promise<JobRunner> {
  const schedule = opts.schedule ?? true;
  const boss = new PgBoss({
    connectionString: opts.connectionString,
    schema: 'pgboss',
    application_name: 'seepwise-jobs',
    max: 4,
    schedule,
    supervise: opts.work ?? true,
  });
  boss.on('error', (err) => ctx.logger.warn({ err: err.message }, 'job queue error'));
  await boss.start();
  for (const [name, options] of Object.entries(queueOptions)) await boss.createQueue(name, { name, ...options });

  const enqueueSend = (job: SendJob) => boss.send(QUEUES.send, job, { singletonKey: `${job.kind}:${job.userId}` });

  const handlers: Record<QueueName, (data: unknown) => Promise<unknown>> = {
    [QUEUES.refillSweep]: () => runRefillSweep(ctx, ctx.now(), enqueueSend),
    [QUEUES.frostSweep]: () => runFrostSweep(ctx, ctx.now(), enqueueSend),
    [QUEUES.digestSweep]: () => runDigestSweep(ctx, ctx.now(), enqueueSend),
    [QUEUES.send]: (data) => {
      const job = sendJobSchema.safeParse(data);
      if (!job.success) throw new Error(`A notifications-send job needs { userId, kind } (got ${JSON.stringify(data)}).`);
      return sendUserNotifications(ctx, job.data, ctx.now());
    },
    [QUEUES.rollupSweep]: async () => {
      const n = await runRollupSweep(ctx.ds);
      if (n > 0) ctx.logger.info({ trials: n }, 'cohort rollups refreshed');
      return n;
    },
  };

  if (schedule) {
    for (const s of SCHEDULES) await boss.schedule(s.queue, s.cron, {}, { tz: 'UTC' });
    // Once at start too: rollups left stale by a migration or a restart need not wait for the minute.
    await boss.send(QUEUES.rollupSweep, {}, { singletonKey: 'start' });
  }
  if (opts.work ?? true) {
    for (const name of Object.values(QUEUES)) {
      await boss.work(name, { batchSize: 1, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 5 }, async (jobs) => {
        for (const job of jobs) await handlers[name](job.data);
      });
    }
  }

  return {
    boss,
    enqueueSend,
    async drain(queue) {
      let ran = 0;
      for (;;) {
        const jobs = await boss.fetch<unknown>(queue, { batchSize: 10 });
        if (!jobs.length) return ran;
        for (const job of jobs) {
          try {
            await handlers[queue](job.data);
            await boss.complete(queue, job.id);
          } catch (err) {
            await boss.fail(queue, job.id, { message: err instanceof Error ? err.message : String(err) });
          }
          ran += 1;
        }
      }
    },
    async stop() {
      // Waits up to 10 s for running jobs; an unfinished send keeps its claim and is retried after the stale window.
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
