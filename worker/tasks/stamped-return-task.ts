// Stamped-return jobs (queue 'stamp-return'): { returnId } → the stamped PDF stored and the package returned.
// The job id is derived from the decision, so issuing twice queues one job; a retry of a
// finished return changes nothing. When the last attempt fails the reviewer sees why and
// can issue it again.
import { appUrl } from '../../server/config';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type StampedReturnJob } from '../../server/lib/queues';
import { dispatchMail } from '../../server/modules/mail/service';
import path from 'node:path';
import { signerFor, type Signer } from '../../server/lib/pdf-tools/signer';
import { buildReturn, markReturnFailed } from '../../server/modules/returns/service';
import type { TaskDefinition } from './task';

/** `signer` defaults to the configured one (SIGNING_P12_FILE, else the desk's own). */
export function stampedReturnTask(
  ctx: AppContext,
  concurrency: number,
  signer?: Signer,
): TaskDefinition<StampedReturnJob> {
  return {
    queue: QUEUE_NAMES.stampedReturn,
    concurrency,
    fromIntents: true,
    async run(job) {
      const outcome = await buildReturn(
        ctx.dataSource,
        ctx.storage,
        job.data.returnId,
        appUrl(ctx.config),
        (percent, step) => job.updateProgress({ percent, step }),
        {
          signer: signer ?? (await signerFor(ctx.config)),
          workDir: path.join(ctx.config.DATA_DIR, 'work'),
        },
      );
      if (!outcome.skipped) await dispatchMail(ctx.queues, outcome.mailIds);
      return { skipped: outcome.skipped };
    },
    onFinalFailure: (data, reason) => markReturnFailed(ctx.dataSource, data.returnId, reason),
  };
}
