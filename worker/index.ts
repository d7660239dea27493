// The worker process: takes jobs off the BullMQ queues WORKER_QUEUES names (all by default;
// each queue its own BullMQ Worker with its own concurrency), runs the job hand-off's relay
// for those queues (at start and every few seconds) so no job waits for ever between the
// database and the queue, and closes on SIGTERM within a time limit: running jobs get that
// long to finish, and any still running then are picked up again by BullMQ's stalled-job check.
import 'reflect-metadata';
import type { Worker } from 'bullmq';
import { connect, handleProcessEvents, StartupError } from '../server/bootstrap';
import { loadConfig } from '../server/config';
import { signerFor } from '../server/lib/pdf-tools/signer';
import { logger } from '../server/lib/logger';
import { createRedis } from '../server/lib/redis';
import type { Intent } from '../server/modules/jobs/intents';
import { startRelay, type FinalFailure } from '../server/modules/jobs/relay';
import { checkRunTask } from './tasks/check-run-task';
import { mailTask } from './tasks/mail-task';
import { remindersTask, scheduleReminders } from './tasks/reminders-task';
import { stampedReturnTask } from './tasks/stamped-return-task';
import { closeWithParent, startStampProcess } from './stamp-process';
import { startTask, type TaskDefinition } from './tasks/task';

/** How often the relay looks for job intents without a job. */
const RELAY_INTERVAL_MS = 5_000;
/** How long SIGTERM waits for running jobs (the start command waits a little longer). */
const CLOSE_LIMIT_MS = 10_000;

let close: (code: number) => Promise<void> = async (code) => process.exit(code);
handleProcessEvents('worker', (code) => close(code));

async function main() {
  // A stamping child closes when its parent goes.
  closeWithParent(() => void close(0));
  const config = loadConfig();
  const want = new Set(config.WORKER_QUEUES);
  // Stamping beside other queues runs in a child process of its own (stamp-process.ts says why).
  const stamper =
    want.has('stamp') && want.size > 1 ? startStampProcess(process.argv[1], () => void close(1)) : null;
  if (stamper) want.delete('stamp');
  const stamperReady = stamper
    ? new Promise<void>((resolve) => stamper.child.once('message', () => resolve()))
    : Promise.resolve();
  // The signing certificate is read (or the desk's own made) before any job can need it.
  const signer = want.has('stamp') ? await signerFor(config) : null;
  if (signer)
    logger.info(
      { certificateSha256: signer.fingerprint, subject: signer.subject },
      'stamped returns are signed',
    );
  const ctx = await connect(config);
  const connection = createRedis(config.REDIS_URL, { forWorker: true });
  connection.on('error', () => undefined);
  const tasks: Array<TaskDefinition<Record<string, string>>> = [];
  if (want.has('check')) tasks.push(checkRunTask(ctx, config.CHECK_CONCURRENCY));
  if (signer) tasks.push(stampedReturnTask(ctx, config.STAMP_CONCURRENCY, signer));
  if (want.has('reminders')) tasks.push(remindersTask(ctx));
  if (want.has('mail') && config.SMTP_URL)
    tasks.push(mailTask(ctx, config.SMTP_URL, config.MAIL_CONCURRENCY));
  else if (want.has('mail')) logger.warn('SMTP_URL is not set: mail is recorded but not sent');
  const workers: Worker[] = tasks.map((t) => startTask(ctx, connection, t));
  if (want.has('reminders')) await scheduleReminders(ctx);

  const finalise: FinalFailure = async (queue, payload, reason) => {
    await tasks.find((t) => t.queue === queue)?.onFinalFailure(payload, reason);
  };
  const relayed = tasks.filter((t) => t.fromIntents).map((t) => t.queue as Intent['queue']);
  const relay = startRelay(ctx.dataSource, ctx.queues, finalise, {
    intervalMs: RELAY_INTERVAL_MS,
    queues: relayed,
  });
  await relay.settled();
  await stamperReady;
  logger.info(
    {
      queues: Object.fromEntries(tasks.map((t) => [t.queue, t.concurrency])),
      ...(stamper ? { stampProcess: stamper.child.pid } : {}),
    },
    'worker ready (queue: concurrency)',
  );
  // A stamping child tells its parent.
  process.send?.('ready');

  let closing = false;
  close = async (code: number) => {
    if (closing) return;
    closing = true;
    logger.info({ code }, 'worker closing');
    const stamperStopped = stamper?.stop(CLOSE_LIMIT_MS + 2_000);
    await relay.stop();
    const closed = Promise.all(workers.map((w) => w.close())).then(() => true);
    const inTime = await Promise.race([
      closed,
      new Promise<false>((r) => setTimeout(() => r(false), CLOSE_LIMIT_MS).unref()),
    ]);
    if (!inTime) {
      logger.warn(
        { limitMs: CLOSE_LIMIT_MS },
        'jobs still running at the time limit: left to the stalled-job check of the next worker',
      );
      await Promise.all(workers.map((w) => w.close(true).catch(() => undefined)));
    }
    await stamperStopped;
    connection.disconnect();
    await ctx.close?.().catch(() => undefined);
    process.exit(code);
  };
  process.on('SIGTERM', () => void close(0));
  process.on('SIGINT', () => void close(0));
}

main().catch((error) => {
  if (error instanceof StartupError) process.stderr.write(`[worker] ${error.message}\n`);
  else logger.fatal({ err: error }, 'worker could not start');
  process.exit(1);
});
