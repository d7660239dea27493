import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A deliberate decision (issue 12, item 4): what the engineer overrode and why, the password
 * step-up that confirmed it, and the version of the inputs and results it was made on (sha-256
 * of their canonical JSON and the engine's version). Earlier decisions keep nulls and an empty
 * list: they were recorded before any of this was asked.
 */
export class DeliberateDecision1764720100000 implements MigrationInterface {
  name = 'DeliberateDecision1764720100000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE decisions ADD COLUMN override_reason text`);
    await q.query(`ALTER TABLE decisions ADD COLUMN overridden jsonb NOT NULL DEFAULT '[]'`);
    await q.query(`ALTER TABLE decisions ADD COLUMN inputs_sha256 char(64)`);
    await q.query(`ALTER TABLE decisions ADD COLUMN results_sha256 char(64)`);
    await q.query(`ALTER TABLE decisions ADD COLUMN engine_version varchar(40)`);
    await q.query(`ALTER TABLE decisions ADD COLUMN confirmed_at timestamptz`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const column of [
      'confirmed_at',
      'engine_version',
      'results_sha256',
      'inputs_sha256',
      'overridden',
      'override_reason',
    ])
      await q.query(`ALTER TABLE decisions DROP COLUMN ${column}`);
  }
}
