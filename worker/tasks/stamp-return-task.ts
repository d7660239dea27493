// stamp-return jobs: { returnId } → the stamped PDF stored and the package returned.
// The job id is derived from the decision, so issuing twice queues one job; a retry of a
// finished return changes nothing.
import { Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import { appUrl } from '../../server/config';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type StampJob } from '../../server/lib/queues';
import { dispatchMail } from '../../server/modules/mail/service';
import { buildReturn, markReturnFailed } from '../../server/modules/returns/service';

export function startStampWorker(ctx: AppContext, connection: Redis, concurrency: number) {
  return new Worker<StampJob>(
    QUEUE_NAMES.stamp,
    async (job) => {
      let outcome: Awaited<ReturnType<typeof buildReturn>>;
      try {
        outcome = await buildReturn(
          ctx.dataSource,
          ctx.storage,
          job.data.returnId,
          appUrl(ctx.config),
          (percent, step) => job.updateProgress({ percent, step }),
        );
      } catch (error) {
        if (job.attemptsMade + 1 >= (job.opts.attempts ?? 1)) {
          await markReturnFailed(ctx.dataSource, job.data.returnId, (error as Error).message);
        }
        throw error;
      }
      if (!outcome.skipped) await dispatchMail(ctx.queues, outcome.mailIds);
      return { skipped: outcome.skipped };
    },
    { connection, prefix: ctx.config.REDIS_PREFIX, concurrency, lockDuration: 60_000 },
  );
}
