import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The fleet library: a contractor's cranes, their configurations, and each configuration's
 * versions with the load chart as grid cells and the manufacturer's document. A version never
 * changes once written (a trigger refuses it; only retiring it is allowed) and cannot be deleted
 * while a package uses it (the foreign key of library_uses). Verifications are per owner desk.
 */
export class FleetLibrary1764717000000 implements MigrationInterface {
  name = 'FleetLibrary1764717000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE library_cranes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id),
      fleet_number varchar(40) NOT NULL,
      make varchar(100) NOT NULL,
      model varchar(100) NOT NULL,
      type varchar(30) NOT NULL CHECK (type IN ('mobile_outriggers', 'mobile_crawler', 'gantry_a_frame')),
      fixed jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_by_id uuid NOT NULL REFERENCES users(id),
      retired_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organisation_id, fleet_number))`);
    await q.query(`CREATE TABLE library_configurations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      crane_id uuid NOT NULL REFERENCES library_cranes(id) ON DELETE CASCADE,
      name varchar(200) NOT NULL,
      current_version int NOT NULL DEFAULT 1,
      retired_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE INDEX library_configurations_crane_idx ON library_configurations (crane_id)`);
    await q.query(`CREATE TABLE library_versions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      configuration_id uuid NOT NULL REFERENCES library_configurations(id) ON DELETE CASCADE,
      number int NOT NULL CHECK (number >= 1),
      crane_snapshot jsonb NOT NULL,
      details jsonb NOT NULL,
      notes jsonb NOT NULL,
      document jsonb NOT NULL,
      chart_units jsonb NOT NULL,
      document_file jsonb,
      change_note varchar(500),
      created_by_id uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      retired_at timestamptz,
      retired_by_id uuid REFERENCES users(id),
      UNIQUE (configuration_id, number))`);
    await q.query(`CREATE TABLE library_chart_cells (
      version_id uuid NOT NULL REFERENCES library_versions(id) ON DELETE CASCADE,
      boom_length double precision NOT NULL CHECK (boom_length > 0),
      radius double precision NOT NULL CHECK (radius >= 0),
      capacity double precision NOT NULL CHECK (capacity > 0),
      PRIMARY KEY (version_id, boom_length, radius))`);
    await q.query(`CREATE TABLE library_verifications (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      version_id uuid NOT NULL REFERENCES library_versions(id) ON DELETE CASCADE,
      owner_organisation_id uuid NOT NULL REFERENCES organisations(id),
      engineer_id uuid NOT NULL REFERENCES users(id),
      package_id uuid REFERENCES lift_packages(id) ON DELETE SET NULL,
      note varchar(1000) NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (version_id, owner_organisation_id))`);
    await q.query(`CREATE TABLE library_uses (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      slot int NOT NULL CHECK (slot BETWEEN 0 AND 3),
      version_id uuid NOT NULL REFERENCES library_versions(id) ON DELETE RESTRICT,
      detached boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (revision_id, slot))`);
    await q.query(`CREATE INDEX library_uses_version_idx ON library_uses (version_id)`);
    // A version is what packages and verifications point at: its content never changes.
    await q.query(`CREATE FUNCTION library_version_frozen() RETURNS trigger AS $$
      BEGIN
        IF NEW.configuration_id IS DISTINCT FROM OLD.configuration_id OR NEW.number IS DISTINCT FROM OLD.number
          OR NEW.crane_snapshot IS DISTINCT FROM OLD.crane_snapshot OR NEW.details IS DISTINCT FROM OLD.details
          OR NEW.notes IS DISTINCT FROM OLD.notes OR NEW.document IS DISTINCT FROM OLD.document
          OR NEW.chart_units IS DISTINCT FROM OLD.chart_units
          OR (OLD.document_file IS NOT NULL AND NEW.document_file IS DISTINCT FROM OLD.document_file) THEN
          RAISE EXCEPTION 'a library version cannot change: make a new version';
        END IF;
        RETURN NEW;
      END $$ LANGUAGE plpgsql`);
    await q.query(`CREATE TRIGGER library_version_frozen BEFORE UPDATE ON library_versions
      FOR EACH ROW EXECUTE FUNCTION library_version_frozen()`);
    await q.query(`CREATE FUNCTION library_cells_frozen() RETURNS trigger AS $$
      BEGIN
        IF TG_OP = 'UPDATE' THEN
          RAISE EXCEPTION 'a library version cannot change: make a new version';
        END IF;
        IF TG_OP = 'INSERT' AND EXISTS (SELECT 1 FROM library_uses u WHERE u.version_id = NEW.version_id) THEN
          RAISE EXCEPTION 'a library version cannot change: make a new version';
        END IF;
        RETURN COALESCE(NEW, OLD);
      END $$ LANGUAGE plpgsql`);
    await q.query(`CREATE TRIGGER library_cells_frozen BEFORE INSERT OR UPDATE ON library_chart_cells
      FOR EACH ROW EXECUTE FUNCTION library_cells_frozen()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE library_uses`);
    await q.query(`DROP TABLE library_verifications`);
    await q.query(`DROP TABLE library_chart_cells`);
    await q.query(`DROP TABLE library_versions`);
    await q.query(`DROP TABLE library_configurations`);
    await q.query(`DROP TABLE library_cranes`);
    await q.query(`DROP FUNCTION library_cells_frozen()`);
    await q.query(`DROP FUNCTION library_version_frozen()`);
  }
}
