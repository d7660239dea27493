import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * One lift plan per revision, held by the database as well as by the upload's lock on the
 * revision row: a partial unique index over the revision's lift-plan rows. A revision that
 * somehow holds several keeps its newest and loses the others' rows first (their stored files
 * are left for storage's own clean-up: a migration does not reach the file store).
 */
export class OneLiftPlan1764720200000 implements MigrationInterface {
  name = 'OneLiftPlan1764720200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `DELETE FROM uploaded_files f USING uploaded_files newer
       WHERE f.kind = 'lift_plan' AND newer.kind = 'lift_plan' AND newer.revision_id = f.revision_id
         AND (newer.created_at, newer.id) > (f.created_at, f.id)`,
    );
    await q.query(
      `CREATE UNIQUE INDEX uploaded_files_one_lift_plan_key ON uploaded_files (revision_id) WHERE kind = 'lift_plan'`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX uploaded_files_one_lift_plan_key`);
  }
}
