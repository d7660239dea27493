import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Indexes for the queue's filters and the scoped look-ups every route makes. */
export class QueueIndexes1764633700000 implements MigrationInterface {
  name = 'QueueIndexes1764633700000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE INDEX lift_packages_contractor_idx ON lift_packages (contractor_organisation_id)`);
    await q.query(
      `CREATE INDEX lift_packages_site_status_idx ON lift_packages (site_id, status, planned_lift_date)`,
    );
    await q.query(`CREATE INDEX lift_packages_engineer_idx ON lift_packages (assigned_engineer_id)`);
    await q.query(`CREATE INDEX revisions_package_idx ON revisions (package_id, number DESC)`);
    await q.query(`CREATE INDEX findings_package_idx ON findings (package_id)`);
    await q.query(`CREATE INDEX audit_events_package_idx ON audit_events (package_id, created_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const index of [
      'audit_events_package_idx',
      'findings_package_idx',
      'revisions_package_idx',
      'lift_packages_engineer_idx',
      'lift_packages_site_status_idx',
      'lift_packages_contractor_idx',
    ]) {
      await q.query(`DROP INDEX IF EXISTS ${index}`);
    }
  }
}
