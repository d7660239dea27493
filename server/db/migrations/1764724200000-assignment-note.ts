import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A coordinator's note to the engineer with an assignment (shown in the history and the mail). */
export class AssignmentNote1764724200000 implements MigrationInterface {
  name = 'AssignmentNote1764724200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE assignments ADD COLUMN note varchar(500)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE assignments DROP COLUMN note`);
  }
}
