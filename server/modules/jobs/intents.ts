// The job hand-off. A change that needs background work writes a job intent (queue, job id
// derived from the record, payload of ids) in its own transaction; after the commit the
// API queues the job with a short time limit, and the worker's relay (relay.ts) queues any
// intent that has no live job. Because the job id comes from the record, the API and the
// relay both queuing it is harmless, and a dead Redis never holds a request.
import type { Queue } from 'bullmq';
import type { DataSource, EntityManager } from 'typeorm';
import { logger } from '../../lib/logger';
import { checkRunJobId, JOB_NAMES, withTimeout, type QueueName, type Queues } from '../../lib/queues';

export interface Intent {
  queue: Exclude<QueueName, 'reminders'>;
  jobId: string;
  /** The record the job works on (revision, stamped return, message). */
  subjectId: string;
  payload: Record<string, string>;
}

/** How long a request waits for Redis to take a job before leaving it to the relay. */
export const HAND_OFF_MS = 250;

export function checkRunIntent(revisionId: string, round = 1): Intent {
  return {
    queue: 'check-run',
    jobId: checkRunJobId(revisionId, round),
    subjectId: revisionId,
    payload: { revisionId },
  };
}

/** Round 1 is the first send; an admin's "send again" is round 2, 3… with a job id of its own. */
export function mailIntent(messageId: string, round = 1): Intent {
  const jobId = round === 1 ? `mail-${messageId}` : `mail-${messageId}-r${round}`;
  return { queue: 'mail', jobId, subjectId: messageId, payload: { messageId } };
}

/** The queue of an intent, untyped: intents carry their payload as plain ids. */
export function queueOf(queues: Queues, name: Intent['queue']): Queue {
  return { 'check-run': queues.checkRun, 'stamp-return': queues.stampedReturn, mail: queues.mail }[
    name
  ] as unknown as Queue;
}

/** Writes the intent inside the caller's transaction; writing the same job id twice is a no-op. */
export async function recordIntent(m: EntityManager, intent: Intent): Promise<void> {
  await m.query(
    `INSERT INTO job_intents (queue, job_id, subject_id, payload) VALUES ($1, $2, $3, $4)
     ON CONFLICT (job_id) DO NOTHING`,
    [intent.queue, intent.jobId, intent.subjectId, JSON.stringify(intent.payload)],
  );
}

/** The round of the next intent for a record: 1, then 2, 3… after each run asked for again. */
export async function nextRound(
  m: EntityManager,
  queue: Intent['queue'],
  subjectId: string,
): Promise<number> {
  const [row] = await m.query(
    `SELECT count(*)::int AS n FROM job_intents WHERE queue = $1 AND subject_id = $2`,
    [queue, subjectId],
  );
  return (row?.n ?? 0) + 1;
}

export interface HandOffResult {
  queued: number;
  /** Jobs Redis did not take in time: the relay queues them once it answers. */
  deferred: number;
}

/** After the commit: queues each intent's job, each bounded by timeoutMs; never throws. */
export async function handOff(
  queues: Queues,
  intents: Intent[],
  timeoutMs = HAND_OFF_MS,
): Promise<HandOffResult> {
  const results = await Promise.allSettled(
    intents.map((i) =>
      withTimeout(
        queueOf(queues, i.queue).add(JOB_NAMES[i.queue], i.payload, { jobId: i.jobId }),
        timeoutMs,
        `queue ${i.queue}`,
      ),
    ),
  );
  const failed = results.flatMap((r, n) => (r.status === 'rejected' ? [{ jobId: intents[n].jobId, r }] : []));
  if (failed.length) {
    const reason = failed[0].r.status === 'rejected' ? (failed[0].r.reason as Error).message : '';
    logger.warn({ jobs: failed.map((f) => f.jobId), reason }, 'job hand-off left to the relay');
  }
  return { queued: intents.length - failed.length, deferred: failed.length };
}

/**
 * Closes a finished job's intent without waiting for the disk: an asynchronous commit, set for
 * this one statement's own transaction (set_config(…, true)), so each job saves one fsync and
 * still costs one round trip. Safe to lose in a database crash: the intent stays pending, and
 * the relay closes an intent whose job completed, or queues it again when the job is gone
 * (every task is safe to run twice).
 */
export async function markIntentDone(ds: DataSource, jobId: string) {
  await ds.query(
    `UPDATE job_intents SET state = 'done', last_error = NULL, finished_at = now()
     FROM (SELECT set_config('synchronous_commit', 'off', true)) AS async_commit
     WHERE job_id = $1`,
    [jobId],
  );
}

/** Records a job's final failure; true when it was still pending (the first to record it). */
export async function markIntentFailed(ds: DataSource, jobId: string, reason: string): Promise<boolean> {
  // TypeORM answers an UPDATE with [rows, affected].
  const [, affected]: [unknown[], number] = await ds.query(
    `UPDATE job_intents SET state = 'failed', last_error = $2, finished_at = now()
     WHERE job_id = $1 AND state = 'pending'`,
    [jobId, reason.slice(0, 1000)],
  );
  return affected > 0;
}

export interface IntentRow {
  queue: Intent['queue'];
  jobId: string;
  state: 'pending' | 'done' | 'failed';
  lastError: string | null;
  createdAt: Date;
}

/** The latest intent for a record, if any. */
export async function latestIntent(
  m: EntityManager | DataSource,
  queue: Intent['queue'],
  subjectId: string,
): Promise<IntentRow | null> {
  const [row] = await m.query(
    `SELECT queue, job_id, state, last_error, created_at FROM job_intents
     WHERE queue = $1 AND subject_id = $2 ORDER BY created_at DESC, job_id DESC LIMIT 1`,
    [queue, subjectId],
  );
  return row
    ? {
        queue: row.queue,
        jobId: row.job_id,
        state: row.state,
        lastError: row.last_error,
        createdAt: row.created_at,
      }
    : null;
}
