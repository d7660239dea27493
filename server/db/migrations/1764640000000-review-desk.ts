import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The review desk: figures the engineer accepted, carried findings, return progress. */
export class ReviewDesk1764640000000 implements MigrationInterface {
  name = 'ReviewDesk1764640000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE revisions ADD COLUMN accepted_figures jsonb NOT NULL DEFAULT '[]'::jsonb`);
    // accepted_figures is review data, not contractor input: it may change after submit.
    await q.query(`ALTER TABLE findings ADD COLUMN answered_at timestamptz`);
    await q.query(`ALTER TABLE findings ADD COLUMN closed_at timestamptz`);
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN progress int NOT NULL DEFAULT 0`);
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN error varchar(500)`);
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN pages int`);
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN ready_at timestamptz`);
    await q.query(`CREATE INDEX markups_revision_idx ON markups (revision_id, file_id, page_number)`);
    await q.query(`CREATE INDEX decisions_package_idx ON decisions (package_id, created_at DESC)`);
    await q.query(
      `CREATE INDEX stamped_returns_package_idx ON stamped_returns (package_id, created_at DESC)`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX IF EXISTS stamped_returns_package_idx`);
    await q.query(`DROP INDEX IF EXISTS decisions_package_idx`);
    await q.query(`DROP INDEX IF EXISTS markups_revision_idx`);
    await q.query(
      `ALTER TABLE stamped_returns DROP COLUMN ready_at, DROP COLUMN pages, DROP COLUMN error, DROP COLUMN progress`,
    );
    await q.query(`ALTER TABLE findings DROP COLUMN closed_at, DROP COLUMN answered_at`);
    await q.query(`ALTER TABLE revisions DROP COLUMN accepted_figures`);
  }
}
