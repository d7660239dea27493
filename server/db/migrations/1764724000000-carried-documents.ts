import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Documents carry over into a new revision: the new revision's row of a kept document names the
 * row it was carried from (the stored object is shared: stored files never change). The previous
 * revision's row stays; a removed or replaced copy in the draft loses only its own row.
 */
export class CarriedDocuments1764724000000 implements MigrationInterface {
  name = 'CarriedDocuments1764724000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE uploaded_files ADD COLUMN carried_from_id uuid`);
    await q.query(`ALTER TABLE uploaded_files ADD COLUMN carried_from_revision int`);
    await q.query(
      `ALTER TABLE uploaded_files ADD CONSTRAINT uploaded_files_carried_from_id_fkey
         FOREIGN KEY (carried_from_id) REFERENCES uploaded_files(id) ON DELETE SET NULL`,
    );
    await q.query(`CREATE INDEX uploaded_files_carried_from_idx ON uploaded_files (carried_from_id)`);
    await q.query(`CREATE INDEX uploaded_files_storage_key_idx ON uploaded_files (storage_key)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX uploaded_files_storage_key_idx`);
    await q.query(`DROP INDEX uploaded_files_carried_from_idx`);
    await q.query(`ALTER TABLE uploaded_files DROP CONSTRAINT uploaded_files_carried_from_id_fkey`);
    await q.query(`ALTER TABLE uploaded_files DROP COLUMN carried_from_revision`);
    await q.query(`ALTER TABLE uploaded_files DROP COLUMN carried_from_id`);
  }
}
