import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Live updates and the desk's list of hand-offs.
 * - A change to a package (its row, or anything recorded in its history) is announced on the
 *   PostgreSQL channel cp_live when the change commits, with who may see the package (its
 *   contractor, the site and the site's owner, the engineer assigned now and before): every
 *   API process listens and tells its open pages (server-sent events).
 * - A hand-off mail written for a person is announced to that person, and the person marks
 *   what they have read (mail_messages.read_at).
 */
export class LiveUpdates1764724100000 implements MigrationInterface {
  name = 'LiveUpdates1764724100000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE mail_messages ADD COLUMN read_at timestamptz`);
    await q.query(
      `CREATE INDEX mail_messages_recipient_unread_idx ON mail_messages (recipient_id, created_at) WHERE read_at IS NULL`,
    );
    await q.query(`
      CREATE FUNCTION cp_live_package(pkg uuid, previous_engineer uuid) RETURNS void LANGUAGE plpgsql AS $$
      DECLARE payload text;
      BEGIN
        SELECT json_build_object(
                 't', 'package', 'id', p.id, 'site', p.site_id, 'org', p.contractor_organisation_id,
                 'owner', s.owner_organisation_id, 'engineer', p.assigned_engineer_id,
                 'previousEngineer', previous_engineer,
                 'firstDraft', (p.status = 'draft' AND p.current_revision = 1))::text
          INTO payload
          FROM lift_packages p JOIN sites s ON s.id = p.site_id WHERE p.id = pkg;
        IF payload IS NOT NULL THEN PERFORM pg_notify('cp_live', payload); END IF;
      END $$`);
    await q.query(`
      CREATE FUNCTION cp_live_package_row() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        PERFORM cp_live_package(NEW.id, CASE WHEN TG_OP = 'UPDATE' THEN OLD.assigned_engineer_id END);
        RETURN NULL;
      END $$`);
    await q.query(`
      CREATE FUNCTION cp_live_audit_row() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.package_id IS NOT NULL THEN PERFORM cp_live_package(NEW.package_id, NULL); END IF;
        RETURN NULL;
      END $$`);
    await q.query(`
      CREATE FUNCTION cp_live_mail_row() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.recipient_id IS NOT NULL THEN
          PERFORM pg_notify('cp_live', json_build_object('t', 'handoff', 'user', NEW.recipient_id)::text);
        END IF;
        RETURN NULL;
      END $$`);
    await q.query(
      `CREATE TRIGGER lift_packages_live AFTER INSERT OR UPDATE ON lift_packages FOR EACH ROW EXECUTE FUNCTION cp_live_package_row()`,
    );
    await q.query(
      `CREATE TRIGGER audit_events_live AFTER INSERT ON audit_events FOR EACH ROW EXECUTE FUNCTION cp_live_audit_row()`,
    );
    await q.query(
      `CREATE TRIGGER mail_messages_live AFTER INSERT ON mail_messages FOR EACH ROW EXECUTE FUNCTION cp_live_mail_row()`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER mail_messages_live ON mail_messages`);
    await q.query(`DROP TRIGGER audit_events_live ON audit_events`);
    await q.query(`DROP TRIGGER lift_packages_live ON lift_packages`);
    await q.query(`DROP FUNCTION cp_live_mail_row()`);
    await q.query(`DROP FUNCTION cp_live_audit_row()`);
    await q.query(`DROP FUNCTION cp_live_package_row()`);
    await q.query(`DROP FUNCTION cp_live_package(uuid, uuid)`);
    await q.query(`DROP INDEX mail_messages_recipient_unread_idx`);
    await q.query(`ALTER TABLE mail_messages DROP COLUMN read_at`);
  }
}
