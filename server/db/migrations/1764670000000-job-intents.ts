import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The job hand-off's outbox: a row per job the database has promised (a check run, a
 * stamped return, a message), written in the same transaction as the change, so a job is
 * never lost between the commit and the queue. The worker's relay queues every pending row
 * that has no live job; the row records how the job ended.
 */
export class JobIntents1764670000000 implements MigrationInterface {
  name = 'JobIntents1764670000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE job_intents (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      queue varchar(40) NOT NULL,
      job_id varchar(200) NOT NULL UNIQUE,
      subject_id uuid NOT NULL,
      payload jsonb NOT NULL,
      state varchar(20) NOT NULL DEFAULT 'pending' CHECK (state IN ('pending', 'done', 'failed')),
      last_error varchar(1000),
      created_at timestamptz NOT NULL DEFAULT now(),
      finished_at timestamptz)`);
    await q.query(`CREATE INDEX job_intents_pending_idx ON job_intents (created_at) WHERE state = 'pending'`);
    await q.query(`CREATE INDEX job_intents_subject_idx ON job_intents (queue, subject_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE job_intents`);
  }
}
