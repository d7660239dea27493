// The one wrapper every worker task runs in (check run, stamped return, mail, reminders):
// BullMQ retries with the backoff the queue sets, an UnrecoverableError for bad data stops
// at once, and when a job has failed for good onFinalFailure records it where people see it
// (the check run's "check could not run", the return's failed state, the outbox). The job's
// intent is closed on success and on final failure, so the relay leaves it alone.
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { logger } from '../../server/lib/logger';
import type { QueueName } from '../../server/lib/queues';
import { markIntentDone, markIntentFailed } from '../../server/modules/jobs/intents';

export interface TaskTiming {
  stalledInterval?: number;
  lockDuration?: number;
}

export interface TaskDefinition<T extends object> {
  queue: QueueName;
  concurrency: number;
  /** Whether its jobs come from job intents (the daily reminders come from a scheduler). */
  fromIntents: boolean;
  /** Longest time a job may go without renewing its lock before it counts as stalled. */
  lockDuration?: number;
  run(job: Job<T>): Promise<unknown>;
  /** Must be idempotent: the worker's failed event and the relay may both call it. */
  onFinalFailure(data: T, reason: string): Promise<void>;
}

/** Bad data: retrying cannot help. */
export { UnrecoverableError };

/** The reason a person reads: no raw validation dumps, and how many attempts were made. */
export function finalReason(error: Error, attempts: number): string {
  if (error instanceof UnrecoverableError || error.name === 'UnrecoverableError') return error.message;
  if (/stalled more than allowable limit/.test(error.message))
    return 'The worker stopped several times while running it.';
  const issues = (error as Error & { issues?: Array<{ path: PropertyKey[]; message: string }> }).issues;
  const text = issues?.length
    ? issues.map((i) => `${i.path.map(String).join('.') || '(value)'}: ${i.message}`).join('; ')
    : error.message;
  return `It did not finish after ${attempts} attempt${attempts === 1 ? '' : 's'}. Last error: ${text}`;
}

export function startTask<T extends object>(
  ctx: AppContext,
  connection: Redis,
  def: TaskDefinition<T>,
  timing: TaskTiming = {},
): Worker<T> {
  const ds = ctx.dataSource;
  const worker = new Worker<T>(
    def.queue,
    async (job) => {
      const result = await def.run(job);
      if (def.fromIntents && job.id) await markIntentDone(ds, job.id);
      return result;
    },
    {
      connection,
      prefix: ctx.config.REDIS_PREFIX,
      concurrency: def.concurrency,
      stalledInterval: timing.stalledInterval ?? 15_000,
      lockDuration: timing.lockDuration ?? def.lockDuration ?? 30_000,
      maxStalledCount: 2,
    },
  );
  worker.on('error', (err) => logger.error({ err, queue: def.queue }, 'worker error'));
  worker.on('completed', (job) => logger.info({ queue: def.queue, jobId: job.id }, 'job completed'));
  worker.on('failed', (job, err) => {
    if (!job) return void logger.warn({ err, queue: def.queue }, 'job failed');
    void (async () => {
      // A failure with attempts left is retried by BullMQ (the job waits in 'delayed').
      const state = await job.getState().catch(() => 'unknown');
      if (state !== 'failed') {
        logger.warn(
          { err, queue: def.queue, jobId: job.id, attempt: job.attemptsMade },
          'job failed, retrying',
        );
        return;
      }
      const reason = finalReason(err, job.attemptsMade);
      logger.error({ err, queue: def.queue, jobId: job.id }, 'job failed for good');
      await def.onFinalFailure(job.data, reason);
      if (def.fromIntents && job.id) await markIntentFailed(ds, job.id, reason);
    })().catch((e) =>
      logger.error({ err: e, queue: def.queue, jobId: job.id }, 'recording a final failure failed'),
    );
  });
  return worker;
}
