// The relay of the job hand-off, run by the worker at start and then periodically: every
// pending intent without a live job is queued (the API's own attempt timed out, or its
// process died after the commit); an intent whose job completed is closed; one whose job
// failed for good (its last failure not yet recorded, e.g. the worker died first) gets the
// task's final-failure handling. Records that need work but have no intent at all (the
// demo seed, rows from before intents existed) get one first.
import type { DataSource } from 'typeorm';
import { logger } from '../../lib/logger';
import { JOB_NAMES, withTimeout, type Queues } from '../../lib/queues';
import { markIntentDone, markIntentFailed, queueOf, type Intent } from './intents';

export type FinalFailure = (
  queue: Intent['queue'],
  payload: Record<string, string>,
  reason: string,
) => Promise<void>;

export interface RelayReport {
  adopted: number;
  queued: number;
  live: number;
  closed: number;
  failed: number;
}

const REDIS_MS = 2000;

/** Intents for records that wait for a job but have none. */
export async function adoptOrphans(ds: DataSource): Promise<number> {
  // Each queue: its job id prefix, the records waiting for a job and the payload's key.
  const waiting = [
    {
      queue: 'check-run',
      jobId: `'check-' || t.id`,
      from: 'revisions',
      when: `t.state = 'submitted' AND t.check_status IN ('queued', 'running')`,
      key: 'revisionId',
    },
    {
      queue: 'stamp-return',
      jobId: `'stamp-' || t.decision_id`,
      from: 'stamped_returns',
      when: `t.state = 'pending'`,
      key: 'returnId',
    },
    {
      queue: 'mail',
      jobId: `'mail-' || t.id`,
      from: 'mail_messages',
      when: `t.status = 'queued'`,
      key: 'messageId',
    },
  ];
  const statements = waiting.map(
    (w) => `INSERT INTO job_intents (queue, job_id, subject_id, payload)
     SELECT '${w.queue}', ${w.jobId}, t.id, jsonb_build_object('${w.key}', t.id)
     FROM ${w.from} t
     WHERE ${w.when}
       AND NOT EXISTS (SELECT 1 FROM job_intents i WHERE i.queue = '${w.queue}' AND i.subject_id = t.id)
     ON CONFLICT (job_id) DO NOTHING RETURNING id`,
  );
  let adopted = 0;
  for (const sql of statements) adopted += ((await ds.query(sql)) as unknown[]).length;
  return adopted;
}

/** One pass over the pending intents. Throws when Redis does not answer (the next pass retries). */
export async function relayOnce(
  ds: DataSource,
  queues: Queues,
  finalise: FinalFailure,
  opts: { queues?: Array<Intent['queue']> } = {},
): Promise<RelayReport> {
  const report: RelayReport = { adopted: await adoptOrphans(ds), queued: 0, live: 0, closed: 0, failed: 0 };
  const only = opts.queues ?? ['check-run', 'stamp-return', 'mail'];
  const rows: Array<{ queue: Intent['queue']; job_id: string; payload: Record<string, string> }> =
    await ds.query(
      `SELECT queue, job_id, payload FROM job_intents WHERE state = 'pending' AND queue = ANY($1)
     ORDER BY created_at LIMIT 1000`,
      [only],
    );
  for (const row of rows) {
    const queue = queueOf(queues, row.queue);
    const job = await withTimeout(queue.getJob(row.job_id), REDIS_MS, 'relay');
    if (!job) {
      await withTimeout(
        queue.add(JOB_NAMES[row.queue], row.payload, { jobId: row.job_id }),
        REDIS_MS,
        'relay',
      );
      report.queued++;
      continue;
    }
    const state = await withTimeout(job.getState(), REDIS_MS, 'relay');
    if (state === 'completed') {
      await markIntentDone(ds, row.job_id);
      report.closed++;
    } else if (state === 'failed') {
      await finalise(row.queue, row.payload, job.failedReason || 'the job failed');
      await markIntentFailed(ds, row.job_id, job.failedReason || 'the job failed');
      report.failed++;
    } else report.live++;
  }
  return report;
}

/** Runs the relay now and then every intervalMs until stop(). */
export function startRelay(
  ds: DataSource,
  queues: Queues,
  finalise: FinalFailure,
  opts: { intervalMs?: number; queues?: Array<Intent['queue']> } = {},
) {
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  let stopped = false;
  let lastProblem = '';
  const pass = async () => {
    try {
      const report = await relayOnce(ds, queues, finalise, opts);
      if (report.adopted || report.queued || report.closed || report.failed)
        logger.info(report, 'relay queued the jobs that were waiting');
      if (lastProblem) logger.info('relay: the database and Redis answer again');
      lastProblem = '';
    } catch (error) {
      const message = (error as Error).message;
      // One line per outage, not one per pass.
      if (message !== lastProblem) logger.warn({ err: error }, 'relay pass failed; it runs again shortly');
      lastProblem = message;
    }
  };
  const loop = () => {
    running = pass().finally(() => {
      running = null;
      if (!stopped) timer = setTimeout(loop, opts.intervalMs ?? 10_000);
    });
  };
  loop();
  return {
    /** The first pass (or the one under way) finished. */
    settled: () => running ?? Promise.resolve(),
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await running;
    },
  };
}
