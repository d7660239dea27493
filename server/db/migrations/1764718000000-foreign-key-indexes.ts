import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * An index for every foreign key column that had none. Requests walk each of them: from the
 * parent (a revision's files, a package's assignments, a user's markups) and on a parent's
 * delete, where PostgreSQL checks or cascades into the child table by that column; without an
 * index each walk reads the whole child table. tests/api/schema-drift.test.ts lists foreign
 * keys without a leading index from pg_catalog and expects none. Plain CREATE INDEX (not
 * CONCURRENTLY): migrations run in a transaction, and these tables are desk-sized.
 */
export class ForeignKeyIndexes1764718000000 implements MigrationInterface {
  name = 'ForeignKeyIndexes1764718000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX assignments_assigned_by_idx ON assignments (assigned_by_id)`);
    await q.query(`CREATE INDEX assignments_engineer_idx ON assignments (engineer_id)`);
    await q.query(`CREATE INDEX assignments_package_idx ON assignments (package_id)`);
    await q.query(`CREATE INDEX audit_events_actor_idx ON audit_events (actor_id)`);
    await q.query(`CREATE INDEX audit_events_organisation_idx ON audit_events (organisation_id)`);
    await q.query(`CREATE INDEX decisions_engineer_idx ON decisions (engineer_id)`);
    await q.query(`CREATE INDEX decisions_revision_idx ON decisions (revision_id)`);
    await q.query(`CREATE INDEX findings_created_by_idx ON findings (created_by_id)`);
    await q.query(`CREATE INDEX findings_file_idx ON findings (file_id)`);
    await q.query(`CREATE INDEX findings_markup_idx ON findings (markup_id)`);
    await q.query(`CREATE INDEX findings_revision_idx ON findings (revision_id)`);
    await q.query(`CREATE INDEX library_cranes_created_by_idx ON library_cranes (created_by_id)`);
    await q.query(`CREATE INDEX library_uses_package_idx ON library_uses (package_id)`);
    await q.query(`CREATE INDEX library_verifications_engineer_idx ON library_verifications (engineer_id)`);
    await q.query(
      `CREATE INDEX library_verifications_owner_organisation_idx ON library_verifications (owner_organisation_id)`,
    );
    await q.query(`CREATE INDEX library_verifications_package_idx ON library_verifications (package_id)`);
    await q.query(`CREATE INDEX library_versions_created_by_idx ON library_versions (created_by_id)`);
    await q.query(`CREATE INDEX library_versions_retired_by_idx ON library_versions (retired_by_id)`);
    await q.query(`CREATE INDEX lift_packages_created_by_idx ON lift_packages (created_by_id)`);
    await q.query(`CREATE INDEX mail_messages_package_idx ON mail_messages (package_id)`);
    await q.query(`CREATE INDEX mail_messages_recipient_idx ON mail_messages (recipient_id)`);
    await q.query(`CREATE INDEX markups_created_by_idx ON markups (created_by_id)`);
    await q.query(`CREATE INDEX markups_file_idx ON markups (file_id)`);
    await q.query(`CREATE INDEX organisations_desk_owner_idx ON organisations (desk_owner_id)`);
    await q.query(`CREATE INDEX revisions_submitted_by_idx ON revisions (submitted_by_id)`);
    await q.query(`CREATE INDEX site_members_user_idx ON site_members (user_id)`);
    await q.query(`CREATE INDEX sites_owner_organisation_idx ON sites (owner_organisation_id)`);
    await q.query(`CREATE INDEX stamped_returns_issued_by_idx ON stamped_returns (issued_by_id)`);
    await q.query(`CREATE INDEX stamped_returns_revision_idx ON stamped_returns (revision_id)`);
    await q.query(`CREATE INDEX uploaded_files_revision_idx ON uploaded_files (revision_id)`);
    await q.query(`CREATE INDEX uploaded_files_uploaded_by_idx ON uploaded_files (uploaded_by_id)`);
    await q.query(`CREATE INDEX users_organisation_idx ON users (organisation_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX users_organisation_idx`);
    await q.query(`DROP INDEX uploaded_files_uploaded_by_idx`);
    await q.query(`DROP INDEX uploaded_files_revision_idx`);
    await q.query(`DROP INDEX stamped_returns_revision_idx`);
    await q.query(`DROP INDEX stamped_returns_issued_by_idx`);
    await q.query(`DROP INDEX sites_owner_organisation_idx`);
    await q.query(`DROP INDEX site_members_user_idx`);
    await q.query(`DROP INDEX revisions_submitted_by_idx`);
    await q.query(`DROP INDEX organisations_desk_owner_idx`);
    await q.query(`DROP INDEX markups_file_idx`);
    await q.query(`DROP INDEX markups_created_by_idx`);
    await q.query(`DROP INDEX mail_messages_recipient_idx`);
    await q.query(`DROP INDEX mail_messages_package_idx`);
    await q.query(`DROP INDEX lift_packages_created_by_idx`);
    await q.query(`DROP INDEX library_versions_retired_by_idx`);
    await q.query(`DROP INDEX library_versions_created_by_idx`);
    await q.query(`DROP INDEX library_verifications_package_idx`);
    await q.query(`DROP INDEX library_verifications_owner_organisation_idx`);
    await q.query(`DROP INDEX library_verifications_engineer_idx`);
    await q.query(`DROP INDEX library_uses_package_idx`);
    await q.query(`DROP INDEX library_cranes_created_by_idx`);
    await q.query(`DROP INDEX findings_revision_idx`);
    await q.query(`DROP INDEX findings_markup_idx`);
    await q.query(`DROP INDEX findings_file_idx`);
    await q.query(`DROP INDEX findings_created_by_idx`);
    await q.query(`DROP INDEX decisions_revision_idx`);
    await q.query(`DROP INDEX decisions_engineer_idx`);
    await q.query(`DROP INDEX audit_events_organisation_idx`);
    await q.query(`DROP INDEX audit_events_actor_idx`);
    await q.query(`DROP INDEX assignments_package_idx`);
    await q.query(`DROP INDEX assignments_engineer_idx`);
    await q.query(`DROP INDEX assignments_assigned_by_idx`);
  }
}
