// check-run jobs: { revisionId } → the engine's results stored against the revision.
// Bad lift data fails at once (UnrecoverableError) with the reason the contractor sees;
// database or Redis faults are retried with backoff by BullMQ.
import { UnrecoverableError, Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type CheckRunJob } from '../../server/lib/queues';
import { InvalidLiftData, runCheck } from '../../server/modules/check-runs/service';

export function startCheckRunWorker(
  ctx: AppContext,
  connection: Redis,
  concurrency: number,
  timing: { stalledInterval?: number; lockDuration?: number } = {},
) {
  return new Worker<CheckRunJob>(
    QUEUE_NAMES.checkRun,
    async (job) => {
      try {
        const outcome = await runCheck(ctx.dataSource, job.data.revisionId, (percent, step) =>
          job.updateProgress({ percent, step }),
        );
        return { skipped: outcome.skipped };
      } catch (error) {
        if (error instanceof InvalidLiftData) throw new UnrecoverableError(error.message);
        throw error;
      }
    },
    {
      connection,
      prefix: ctx.config.REDIS_PREFIX,
      concurrency,
      stalledInterval: timing.stalledInterval ?? 15_000,
      lockDuration: timing.lockDuration ?? 30_000,
      maxStalledCount: 2,
    },
  );
}
