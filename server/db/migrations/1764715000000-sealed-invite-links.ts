import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * An invitation's stored message keeps a placeholder instead of its link; the link is sealed in
 * `sealed_link` until the message is sent (then cleared). Messages staged before this change keep
 * their text as it was.
 */
export class SealedInviteLinks1764715000000 implements MigrationInterface {
  name = 'SealedInviteLinks1764715000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE mail_messages ADD COLUMN sealed_link text`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE mail_messages DROP COLUMN sealed_link`);
  }
}
