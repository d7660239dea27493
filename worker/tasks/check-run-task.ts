// check-run jobs: { revisionId } → the engine's results stored against the revision.
// Bad lift data fails at once (UnrecoverableError) with the reason the contractor sees;
// database or Redis faults are retried with backoff; when the last attempt fails the
// revision shows "check could not run" with the reason and can be run again.
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type CheckRunJob } from '../../server/lib/queues';
import { InvalidLiftData, markCheckFailed, runCheckRun } from '../../server/modules/check-runs/service';
import { startTask, UnrecoverableError, type TaskDefinition, type TaskTiming } from './task';

export function checkRunTask(ctx: AppContext, concurrency: number): TaskDefinition<CheckRunJob> {
  return {
    queue: QUEUE_NAMES.checkRun,
    concurrency,
    fromIntents: true,
    async run(job) {
      try {
        // The page reads the check's progress from its revision; the job's copy is for BullMQ's
        // tools, so the run does not wait for Redis at each step (the writes stay in order on
        // the worker's connection, before the job's completion).
        const outcome = await runCheckRun(ctx.dataSource, job.data.revisionId, (percent, step) => {
          job.updateProgress({ percent, step }).catch(() => undefined);
        });
        return { skipped: outcome.skipped };
      } catch (error) {
        if (error instanceof InvalidLiftData) throw new UnrecoverableError(error.message);
        throw error;
      }
    },
    onFinalFailure: (data, reason) => markCheckFailed(ctx.dataSource, data.revisionId, reason),
  };
}

export function startCheckRunWorker(
  ctx: AppContext,
  connection: Redis,
  concurrency: number,
  timing: TaskTiming = {},
) {
  return startTask(ctx, connection, checkRunTask(ctx, concurrency), timing);
}
