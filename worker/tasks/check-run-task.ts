// check-run jobs: { revisionId } → the engine's results stored against the revision.
// Bad lift data fails at once (UnrecoverableError) with the reason the contractor sees;
// database or Redis faults are retried with backoff; when the last attempt fails the
// revision shows "check could not run" with the reason and can be run again.
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type CheckRunJob } from '../../server/lib/queues';
import { InvalidLiftData, markCheckFailed, runCheckRun } from '../../server/modules/check-runs/service';
import { startTask, UnrecoverableError, type TaskDefinition, type TaskTiming } from './task';

/** Below this a check run's steps are not worth a Redis write each. */
const PROGRESS_AFTER_MS = 250;

export function checkRunTask(ctx: AppContext, concurrency: number): TaskDefinition<CheckRunJob> {
  return {
    queue: QUEUE_NAMES.checkRun,
    concurrency,
    fromIntents: true,
    async run(job) {
      try {
        // The page reads the check's progress from its revision; the job's copy is for BullMQ's
        // tools. A check takes milliseconds, so only a run still going after PROGRESS_AFTER_MS
        // reports its steps, and the run never waits for Redis to take them (they go out in
        // order on the worker's connection, ahead of the job's completion).
        const started = Date.now();
        const outcome = await runCheckRun(ctx.dataSource, job.data.revisionId, (percent, step) => {
          if (percent === 100 || Date.now() - started >= PROGRESS_AFTER_MS)
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
