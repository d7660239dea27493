// The BullMQ queues the API puts work on and the worker takes it from. Jobs carry ids
// only; a job id derived from the record makes a repeated request harmless.
import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';

export const QUEUE_NAMES = {
  checkRun: 'check-run',
  stampedReturn: 'stamp-return',
  mail: 'mail',
  reminders: 'reminders',
} as const;

// Type aliases rather than interfaces, so they are plain string records for the task wrapper.
export type CheckRunJob = { revisionId: string };

export type StampedReturnJob = { returnId: string };

export type MailJob = { messageId: string };

export type QueueName = (typeof QUEUE_NAMES)[keyof typeof QUEUE_NAMES];

export interface Queues {
  mail: Queue<MailJob>;
  reminders: Queue;
  checkRun: Queue<CheckRunJob>;
  stampedReturn: Queue<StampedReturnJob>;
  close(): Promise<void>;
}

/** Transient faults retry with backoff; finished jobs are kept a while for the record. */
const JOB_DEFAULTS = {
  attempts: 5,
  backoff: { type: 'exponential', delay: 2000 },
  removeOnComplete: { age: 7 * 24 * 3600, count: 10_000 },
  removeOnFail: { age: 30 * 24 * 3600 },
} as const;

export interface QueueOptions {
  /** First retry pause (doubling after each attempt); tests shorten it. */
  backoffMs?: number;
}

export function createQueues(connection: Redis, prefix: string, opts: QueueOptions = {}): Queues {
  const defaults = {
    ...JOB_DEFAULTS,
    backoff: { type: 'exponential', delay: opts.backoffMs ?? JOB_DEFAULTS.backoff.delay },
  };
  const checkRun = new Queue<CheckRunJob>(QUEUE_NAMES.checkRun, {
    connection,
    prefix,
    defaultJobOptions: defaults,
  });
  const stampedReturn = new Queue<StampedReturnJob>(QUEUE_NAMES.stampedReturn, {
    connection,
    prefix,
    defaultJobOptions: defaults,
  });
  const mail = new Queue<MailJob>(QUEUE_NAMES.mail, {
    connection,
    prefix,
    // Mail servers fail for minutes at a time: more attempts, longer backoff.
    defaultJobOptions: {
      ...defaults,
      attempts: 8,
      backoff: { type: 'exponential', delay: opts.backoffMs ?? 5000 },
    },
  });
  const reminders = new Queue(QUEUE_NAMES.reminders, { connection, prefix, defaultJobOptions: defaults });
  return {
    checkRun,
    stampedReturn,
    mail,
    reminders,
    async close() {
      await Promise.all([checkRun.close(), stampedReturn.close(), mail.close(), reminders.close()]);
    },
  };
}

/**
 * The job id of a revision's check run: repeated submits and relays cannot run it twice.
 * A run asked for again after a final failure is round 2, 3…, with its own id.
 */
export function checkRunJobId(revisionId: string, round = 1): string {
  return round > 1 ? `check-${revisionId}-r${round}` : `check-${revisionId}`;
}

/** Names of the jobs on each queue (BullMQ's job name, shown in its tools). */
export const JOB_NAMES: Record<QueueName, string> = {
  'check-run': 'check-run',
  'stamp-return': 'stamp-return',
  mail: 'send',
  reminders: 'daily-reminders',
};

/** Rejects after ms: a call to a Redis that is down must not hold a request. */
export function withTimeout<T>(promise: Promise<T>, ms: number, what: string): Promise<T> {
  let timer: NodeJS.Timeout;
  return Promise.race([
    promise,
    new Promise<T>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`${what}: no answer from Redis within ${ms} ms`)), ms);
    }),
  ]).finally(() => clearTimeout(timer));
}
