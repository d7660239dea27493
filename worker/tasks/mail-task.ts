// mail jobs: { messageId } → one message sent over SMTP. Retried with backoff by BullMQ;
// the last failed attempt leaves the message marked failed for admins to see.
import { Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type MailJob } from '../../server/lib/queues';
import { sendStaged } from '../../server/modules/mail/sender';

export function startMailWorker(ctx: AppContext, connection: Redis, smtpUrl: string) {
  return new Worker<MailJob>(
    QUEUE_NAMES.mail,
    async (job) => {
      const attempts = job.opts.attempts ?? 1;
      return sendStaged(ctx.dataSource, smtpUrl, ctx.config.MAIL_FROM, job.data.messageId, {
        number: job.attemptsMade + 1,
        last: job.attemptsMade + 1 >= attempts,
      });
    },
    { connection, prefix: ctx.config.REDIS_PREFIX, concurrency: 4 },
  );
}
