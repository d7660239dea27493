import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * One unit system per document, chosen by the job. A package keeps the unit system of the
 * contractor who created it (existing packages take their creator's current setting); a site may
 * set one for all its packages (null: each package's own); a stamped return fixes the one it is
 * built in when it is issued (existing returns take their package's).
 */
export class DocumentUnits1764720300000 implements MigrationInterface {
  name = 'DocumentUnits1764720300000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `ALTER TABLE lift_packages ADD COLUMN unit_system varchar(10) NOT NULL DEFAULT 'metric',
       ADD CONSTRAINT lift_packages_unit_system_check CHECK (unit_system IN ('metric', 'imperial'))`,
    );
    await q.query(
      `UPDATE lift_packages p SET unit_system = u.unit_system FROM users u WHERE u.id = p.created_by_id`,
    );
    await q.query(
      `ALTER TABLE sites ADD COLUMN unit_system varchar(10),
       ADD CONSTRAINT sites_unit_system_check CHECK (unit_system IN ('metric', 'imperial'))`,
    );
    await q.query(`ALTER TABLE stamped_returns ADD COLUMN unit_system varchar(10)`);
    await q.query(
      `UPDATE stamped_returns r SET unit_system = p.unit_system FROM lift_packages p WHERE p.id = r.package_id`,
    );
    await q.query(
      `ALTER TABLE stamped_returns ALTER COLUMN unit_system SET NOT NULL,
       ADD CONSTRAINT stamped_returns_unit_system_check CHECK (unit_system IN ('metric', 'imperial'))`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE stamped_returns DROP COLUMN unit_system`);
    await q.query(`ALTER TABLE sites DROP COLUMN unit_system`);
    await q.query(`ALTER TABLE lift_packages DROP COLUMN unit_system`);
  }
}
