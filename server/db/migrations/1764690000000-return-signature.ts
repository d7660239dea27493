import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Stamped returns are digitally signed: each keeps the SHA-256 fingerprint of the certificate
 * that signed it, which the public verification page shows. Older returns have none.
 */
export class ReturnSignature1764690000000 implements MigrationInterface {
  name = 'ReturnSignature1764690000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN signing_certificate_sha256 char(64)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE stamped_returns DROP COLUMN signing_certificate_sha256`);
  }
}
