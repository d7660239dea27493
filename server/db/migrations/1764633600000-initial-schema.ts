import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Organisations, people, sites, packages, revisions, files, review records and the audit trail. */
export class InitialSchema1764633600000 implements MigrationInterface {
  name = 'InitialSchema1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`);
    await q.query(`CREATE TABLE organisations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name varchar(200) NOT NULL,
      kind varchar(20) NOT NULL CHECK (kind IN ('contractor','owner')),
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE RESTRICT,
      email varchar(254) NOT NULL,
      name varchar(200) NOT NULL,
      role varchar(20) NOT NULL CHECK (role IN ('contractor','reviewer','engineer','admin')),
      unit_system varchar(10) NOT NULL DEFAULT 'metric' CHECK (unit_system IN ('metric','imperial')),
      password_hash varchar(100),
      active boolean NOT NULL DEFAULT true,
      token_version int NOT NULL DEFAULT 0,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE UNIQUE INDEX users_email_unique ON users (lower(email))`);
    await q.query(`CREATE TABLE sites (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      owner_organisation_id uuid NOT NULL REFERENCES organisations(id),
      name varchar(200) NOT NULL,
      code varchar(20) NOT NULL UNIQUE,
      address varchar(300) NOT NULL DEFAULT '',
      time_zone varchar(60) NOT NULL DEFAULT 'UTC',
      review_policy jsonb NOT NULL DEFAULT '{}'::jsonb,
      policy_version int NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE site_members (
      site_id uuid NOT NULL REFERENCES sites(id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      PRIMARY KEY (site_id, user_id))`);
    await q.query(`CREATE TABLE lift_packages (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      reference varchar(30) NOT NULL UNIQUE,
      title varchar(200) NOT NULL,
      contractor_organisation_id uuid NOT NULL REFERENCES organisations(id),
      site_id uuid NOT NULL REFERENCES sites(id),
      created_by_id uuid NOT NULL REFERENCES users(id),
      status varchar(30) NOT NULL,
      planned_lift_date date,
      current_revision int NOT NULL DEFAULT 1,
      assigned_engineer_id uuid REFERENCES users(id),
      critical boolean NOT NULL DEFAULT false,
      worst_status varchar(20),
      open_discrepancies int NOT NULL DEFAULT 0,
      decision varchar(30),
      version int NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE revisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      number int NOT NULL,
      state varchar(20) NOT NULL DEFAULT 'draft' CHECK (state IN ('draft','submitted')),
      inputs jsonb NOT NULL DEFAULT '{}'::jsonb,
      submitted_at timestamptz,
      submitted_by_id uuid REFERENCES users(id),
      check_status varchar(20) NOT NULL DEFAULT 'none',
      check_progress int NOT NULL DEFAULT 0,
      check_error varchar(500),
      result_version int,
      results jsonb,
      policy_used jsonb,
      checked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (package_id, number))`);
    // A submitted revision is frozen: its inputs can no longer change.
    await q.query(`CREATE FUNCTION revisions_freeze() RETURNS trigger AS $$
      BEGIN
        IF OLD.state = 'submitted' AND (NEW.inputs IS DISTINCT FROM OLD.inputs OR NEW.state <> 'submitted') THEN
          RAISE EXCEPTION 'revision % is submitted and cannot change', OLD.id;
        END IF;
        RETURN NEW;
      END $$ LANGUAGE plpgsql`);
    await q.query(
      `CREATE TRIGGER revisions_freeze BEFORE UPDATE ON revisions FOR EACH ROW EXECUTE FUNCTION revisions_freeze()`,
    );
    await q.query(`CREATE TABLE uploaded_files (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      kind varchar(20) NOT NULL CHECK (kind IN ('lift_plan','supporting')),
      original_name varchar(255) NOT NULL,
      sha256 char(64) NOT NULL,
      size_bytes bigint NOT NULL,
      pages int NOT NULL,
      storage_key varchar(300) NOT NULL,
      uploaded_by_id uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE assignments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      engineer_id uuid NOT NULL REFERENCES users(id),
      assigned_by_id uuid NOT NULL REFERENCES users(id),
      assigned_at timestamptz NOT NULL DEFAULT now(),
      ended_at timestamptz)`);
    await q.query(`CREATE TABLE markups (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      file_id uuid NOT NULL REFERENCES uploaded_files(id) ON DELETE CASCADE,
      page_number int NOT NULL CHECK (page_number >= 1),
      kind varchar(20) NOT NULL,
      geometry jsonb NOT NULL,
      colour varchar(20) NOT NULL,
      text text,
      number int,
      created_by_id uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE findings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      check_id varchar(40),
      markup_id uuid REFERENCES markups(id) ON DELETE SET NULL,
      file_id uuid REFERENCES uploaded_files(id) ON DELETE SET NULL,
      page_number int,
      text text NOT NULL,
      severity varchar(20) NOT NULL,
      state varchar(20) NOT NULL DEFAULT 'open',
      response text,
      created_by_id uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE decisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      decision varchar(30) NOT NULL CHECK (decision IN ('accepted','accepted_as_noted','revise_and_resubmit','rejected')),
      conditions text NOT NULL DEFAULT '',
      engineer_id uuid NOT NULL REFERENCES users(id),
      version int NOT NULL DEFAULT 1,
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE stamped_returns (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      decision_id uuid NOT NULL UNIQUE REFERENCES decisions(id) ON DELETE CASCADE,
      package_id uuid NOT NULL REFERENCES lift_packages(id) ON DELETE CASCADE,
      revision_id uuid NOT NULL REFERENCES revisions(id) ON DELETE CASCADE,
      verification_code varchar(64) NOT NULL UNIQUE,
      state varchar(20) NOT NULL DEFAULT 'pending',
      sha256 char(64),
      storage_key varchar(300),
      issued_by_id uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE TABLE audit_events (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      package_id uuid REFERENCES lift_packages(id) ON DELETE CASCADE,
      organisation_id uuid REFERENCES organisations(id) ON DELETE SET NULL,
      actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
      action varchar(60) NOT NULL,
      detail jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_at timestamptz NOT NULL DEFAULT now())`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of [
      'audit_events',
      'stamped_returns',
      'decisions',
      'findings',
      'markups',
      'assignments',
      'uploaded_files',
      'revisions',
      'lift_packages',
      'site_members',
      'sites',
      'users',
      'organisations',
    ]) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
    await q.query(`DROP FUNCTION IF EXISTS revisions_freeze()`);
  }
}
