// mail jobs: { messageId } → one message sent over SMTP. Retried with backoff; when the
// last attempt fails the message is marked failed on the outbox page, where admins see it.
import type { Redis } from 'ioredis';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES, type MailJob } from '../../server/lib/queues';
import { sendStaged } from '../../server/modules/mail/sender';
import { startTask, type TaskDefinition, type TaskTiming } from './task';

export function mailTask(ctx: AppContext, smtpUrl: string, concurrency = 4): TaskDefinition<MailJob> {
  return {
    queue: QUEUE_NAMES.mail,
    concurrency,
    fromIntents: true,
    async run(job) {
      const attempts = job.opts.attempts ?? 1;
      const opts = { smtpUrl, from: ctx.config.MAIL_FROM, secret: ctx.config.JWT_SECRET };
      return sendStaged(ctx.dataSource, opts, job.data.messageId, {
        number: job.attemptsMade + 1,
        last: job.attemptsMade + 1 >= attempts,
      });
    },
    async onFinalFailure(data, reason) {
      // sendStaged marks its own last attempt; this covers a job that never got that far.
      await ctx.dataSource.query(
        `UPDATE mail_messages SET status = 'failed', last_error = coalesce(last_error, $2)
         WHERE id = $1 AND status = 'queued'`,
        [data.messageId, reason.slice(0, 1000)],
      );
    },
  };
}

export function startMailWorker(
  ctx: AppContext,
  connection: Redis,
  smtpUrl: string,
  timing: TaskTiming = {},
) {
  return startTask(ctx, connection, mailTask(ctx, smtpUrl), timing);
}
