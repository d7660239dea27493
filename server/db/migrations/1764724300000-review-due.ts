import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Review due dates: each site gives a review a turnaround in working days and a margin before
 * the planned lift; each package keeps the due date its latest submission was given
 * (shared/rules/review-due.ts), with an index for each direction of the queue's sort on it
 * (a package without one sorts last, as the planned lift date does). Submitted packages get
 * their due date from their latest submission under the default times.
 */
export class ReviewDue1764724300000 implements MigrationInterface {
  name = 'ReviewDue1764724300000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `ALTER TABLE sites ADD COLUMN review_turnaround_days int NOT NULL DEFAULT 5
         CONSTRAINT sites_review_turnaround_days_check CHECK (review_turnaround_days BETWEEN 1 AND 60)`,
    );
    await q.query(
      `ALTER TABLE sites ADD COLUMN review_margin_days int NOT NULL DEFAULT 2
         CONSTRAINT sites_review_margin_days_check CHECK (review_margin_days BETWEEN 0 AND 30)`,
    );
    await q.query(`ALTER TABLE lift_packages ADD COLUMN review_due_on date`);
    await q.query(
      `CREATE INDEX lift_packages_review_due_asc_idx ON lift_packages ((coalesce(review_due_on, 'infinity'::date)), reference)`,
    );
    await q.query(
      `CREATE INDEX lift_packages_review_due_desc_idx ON lift_packages ((coalesce(review_due_on, '-infinity'::date)), reference)`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX lift_packages_review_due_desc_idx`);
    await q.query(`DROP INDEX lift_packages_review_due_asc_idx`);
    await q.query(`ALTER TABLE lift_packages DROP COLUMN review_due_on`);
    await q.query(`ALTER TABLE sites DROP COLUMN review_margin_days`);
    await q.query(`ALTER TABLE sites DROP COLUMN review_turnaround_days`);
  }
}
