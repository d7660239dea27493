// The daily reminder run, a BullMQ job scheduler (REMINDER_CRON in REMINDER_TIME_ZONE).
// Its messages go through the job hand-off like every other message.
import { appUrl } from '../../server/config';
import type { AppContext } from '../../server/context';
import { logger } from '../../server/lib/logger';
import { QUEUE_NAMES } from '../../server/lib/queues';
import { stageReminders } from '../../server/modules/mail/reminders';
import { dispatchMail } from '../../server/modules/mail/service';
import type { TaskDefinition } from './task';

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

export function remindersTask(ctx: AppContext): TaskDefinition<Record<string, never>> {
  return {
    queue: QUEUE_NAMES.reminders,
    concurrency: 1,
    fromIntents: false,
    async run() {
      const ids = await stageReminders(
        ctx.dataSource,
        todayIn(ctx.config.REMINDER_TIME_ZONE),
        ctx.config.REMINDER_DAYS,
        appUrl(ctx.config),
      );
      await dispatchMail(ctx.queues, ids);
      return { reminders: ids.length };
    },
    async onFinalFailure(_data, reason) {
      // Messages already staged are sent by the relay; the next run stages the next day's.
      logger.error({ reason }, 'the daily reminder run failed for good; the next run tries again');
    },
  };
}
