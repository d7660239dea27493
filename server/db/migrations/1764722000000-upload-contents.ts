import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * What an uploaded PDF carries besides its pages' content (annotations by kind and page,
 * JavaScript, actions, embedded files, form fields, XFA), found when the upload is checked
 * and told to the contractor: none of it is carried into the stamped return. Files stored
 * before have none (null: not known).
 */
export class UploadContents1764722000000 implements MigrationInterface {
  name = 'UploadContents1764722000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE uploaded_files ADD COLUMN contents jsonb`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE uploaded_files DROP COLUMN contents`);
  }
}
