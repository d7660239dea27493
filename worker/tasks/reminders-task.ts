// The daily reminder run, a BullMQ job scheduler (REMINDER_CRON in REMINDER_TIME_ZONE).
// It also re-queues mail left waiting, so a message staged just before a crash still goes.
import { Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import { appUrl } from '../../server/config';
import type { AppContext } from '../../server/context';
import { QUEUE_NAMES } from '../../server/lib/queues';
import { stageReminders } from '../../server/modules/mail/reminders';
import { dispatchMail, requeueWaitingMail } from '../../server/modules/mail/service';

export function todayIn(timeZone: string, now = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(now);
}

export async function scheduleReminders(ctx: AppContext) {
  await ctx.queues.reminders.upsertJobScheduler(
    'daily-reminders',
    { pattern: ctx.config.REMINDER_CRON, tz: ctx.config.REMINDER_TIME_ZONE },
    { name: 'daily-reminders', data: {} },
  );
}

export function startRemindersWorker(ctx: AppContext, connection: Redis) {
  return new Worker(
    QUEUE_NAMES.reminders,
    async () => {
      const ids = await stageReminders(
        ctx.dataSource,
        todayIn(ctx.config.REMINDER_TIME_ZONE),
        ctx.config.REMINDER_DAYS,
        appUrl(ctx.config),
      );
      await dispatchMail(ctx.queues, ids);
      const requeued = await requeueWaitingMail(ctx.dataSource, ctx.queues);
      return { reminders: ids.length, requeued };
    },
    { connection, prefix: ctx.config.REDIS_PREFIX, concurrency: 1 },
  );
}
