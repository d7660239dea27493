import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Sessions a signed-in person holds: the session cookie's token names one row (its `sid`),
 * and signing out revokes the row, so the token stops working at once instead of at `exp`.
 */
export class Sessions1764700000000 implements MigrationInterface {
  name = 'Sessions1764700000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE sessions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      revoked_at timestamptz)`);
    await q.query(`CREATE INDEX sessions_user_idx ON sessions (user_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE sessions`);
  }
}
