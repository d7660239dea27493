// The worker process: takes jobs off the BullMQ queues and closes cleanly on SIGTERM,
// letting running jobs finish (a killed worker's job is picked up again by BullMQ's
// stalled-job check).
import 'reflect-metadata';
import type { Worker } from 'bullmq';
import { connect, StartupError } from '../server/bootstrap';
import { loadConfig } from '../server/config';
import { logger } from '../server/lib/logger';
import { createRedis } from '../server/lib/redis';
import { enqueueCheck } from '../server/modules/packages/drafts';
import { Revision } from '../server/modules/packages/package.entity';
import { startCheckRunWorker } from './tasks/check-run-task';
import { startStampWorker } from './tasks/stamp-return-task';
import { startMailWorker } from './tasks/mail-task';
import { scheduleReminders, startRemindersWorker } from './tasks/reminders-task';
import { requeueWaitingMail } from '../server/modules/mail/service';

async function main() {
  const config = loadConfig();
  const ctx = await connect(config);
  const connection = createRedis(config.REDIS_URL, { forWorker: true });
  const workers: Worker[] = [
    startCheckRunWorker(ctx, connection, config.CHECK_CONCURRENCY),
    startStampWorker(ctx, connection, 1),
    startRemindersWorker(ctx, connection),
  ];
  if (config.SMTP_URL) workers.push(startMailWorker(ctx, connection, config.SMTP_URL));
  else logger.warn('SMTP_URL is not set: mail is recorded but not sent');
  await scheduleReminders(ctx);
  const mailRequeued = config.SMTP_URL ? await requeueWaitingMail(ctx.dataSource, ctx.queues, 0) : 0;
  for (const w of workers) {
    w.on('error', (err) => logger.error({ err, queue: w.name }, 'worker error'));
    w.on('failed', (job, err) => logger.warn({ err, queue: w.name, jobId: job?.id }, 'job failed'));
    w.on('completed', (job) => logger.info({ queue: w.name, jobId: job.id }, 'job completed'));
  }
  // Revisions submitted while Redis was unreachable (or seeded) wait in 'queued': queue them
  // again. The job id derived from the revision makes this harmless when they are queued.
  const waiting = await ctx.dataSource
    .getRepository(Revision)
    .find({ where: { state: 'submitted', checkStatus: 'queued' } });
  for (const r of waiting) await enqueueCheck(ctx.queues, r.id);
  logger.info(
    {
      queues: workers.map((w) => w.name),
      concurrency: config.CHECK_CONCURRENCY,
      requeued: waiting.length,
      mailRequeued,
    },
    'worker ready',
  );
  let closing = false;
  const shutdown = async (signal: string) => {
    if (closing) return;
    closing = true;
    logger.info({ signal }, 'worker closing');
    await Promise.all(workers.map((w) => w.close()));
    connection.disconnect();
    await ctx.close?.();
    process.exit(0);
  };
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}

process.on('unhandledRejection', (reason) => logger.error({ err: reason }, 'unhandled rejection'));

main().catch((error) => {
  if (error instanceof StartupError) process.stderr.write(`[worker] ${error.message}\n`);
  else logger.fatal({ err: error }, 'worker could not start');
  process.exit(1);
});
