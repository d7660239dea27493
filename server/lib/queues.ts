// The BullMQ queues the API puts work on and the worker takes it from. Jobs carry ids
// only; a job id derived from the record makes a repeated request harmless.
import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';

export const QUEUE_NAMES = {
  checkRun: 'check-run',
  stamp: 'stamp-return',
  mail: 'mail',
  reminders: 'reminders',
} as const;

export interface CheckRunJob {
  revisionId: string;
}

export interface StampJob {
  returnId: string;
}

export interface MailJob {
  messageId: string;
}

export interface Queues {
  mail: Queue<MailJob>;
  reminders: Queue;
  checkRun: Queue<CheckRunJob>;
  stamp: Queue<StampJob>;
  close(): Promise<void>;
}

/** Transient faults retry with backoff; finished jobs are kept a while for the record. */
const JOB_DEFAULTS = {
  attempts: 5,
  backoff: { type: 'exponential', delay: 2000 },
  removeOnComplete: { age: 7 * 24 * 3600, count: 10_000 },
  removeOnFail: { age: 30 * 24 * 3600 },
} as const;

export function createQueues(connection: Redis, prefix: string): Queues {
  const checkRun = new Queue<CheckRunJob>(QUEUE_NAMES.checkRun, {
    connection,
    prefix,
    defaultJobOptions: JOB_DEFAULTS,
  });
  const stamp = new Queue<StampJob>(QUEUE_NAMES.stamp, {
    connection,
    prefix,
    defaultJobOptions: JOB_DEFAULTS,
  });
  const mail = new Queue<MailJob>(QUEUE_NAMES.mail, {
    connection,
    prefix,
    // Mail servers fail for minutes at a time: more attempts, longer backoff.
    defaultJobOptions: { ...JOB_DEFAULTS, attempts: 8, backoff: { type: 'exponential', delay: 5000 } },
  });
  const reminders = new Queue(QUEUE_NAMES.reminders, { connection, prefix, defaultJobOptions: JOB_DEFAULTS });
  return {
    checkRun,
    stamp,
    mail,
    reminders,
    async close() {
      await Promise.all([checkRun.close(), stamp.close(), mail.close(), reminders.close()]);
    },
  };
}

/** The one job id of a revision's check run: repeated submits and retries cannot run it twice. */
export function checkRunJobId(revisionId: string): string {
  return `check-${revisionId}`;
}
