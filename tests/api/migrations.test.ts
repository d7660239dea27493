import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource } from '@server/db/data-source';
import { MIGRATIONS } from '@server/db/migrations';

const base = process.env.DATABASE_URL!;
const dbName = `migrations_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const admin = new pg.Client({ connectionString: base });

afterAll(async () => {
  await admin.query(`DROP DATABASE IF EXISTS ${dbName}`);
  await admin.end();
});

async function tables(ds: ReturnType<typeof createDataSource>) {
  const rows: { table_name: string }[] = await ds.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY table_name`,
  );
  return rows.map((r) => r.table_name);
}

describe('migrations', () => {
  it('when every migration runs on an empty database and the last is undone, then the schema follows', async () => {
    await admin.connect();
    await admin.query(`CREATE DATABASE ${dbName}`);
    const ds = createDataSource(base.replace(/\/[^/]+$/, `/${dbName}`));
    await ds.initialize();
    try {
      const applied = await ds.runMigrations();
      expect(applied.map((m) => m.name)).toEqual(MIGRATIONS.map((m) => m.name));
      expect(await tables(ds)).toEqual(
        expect.arrayContaining([
          'organisations',
          'users',
          'sites',
          'site_members',
          'lift_packages',
          'revisions',
          'uploaded_files',
          'assignments',
          'findings',
          'markups',
          'decisions',
          'stamped_returns',
          'audit_events',
        ]),
      );
      const count = async (sql: string) => Number((await ds.query(sql))[0].n);
      // The last migration gives the queue its sort and trigram indexes and the counts kept by a
      // trigger; the one before it gives packages, sites and returns their unit system; the one before it holds one lift plan per revision; the one before that keeps what a decision overrode, why, and what it was made on; the one
      // before it indexes the foreign keys that had none; the one before that adds the fleet library.
      const lastMigration = async () => [
        await count(
          `SELECT count(*) + (SELECT count(*) FROM pg_trigger WHERE tgname = 'lift_packages_status_counts') AS n FROM pg_indexes WHERE indexname IN ('lift_packages_lift_date_asc_idx', 'lift_packages_lift_date_desc_idx', 'lift_packages_updated_idx', 'lift_packages_discrepancies_idx', 'lift_packages_revision_idx', 'lift_packages_reference_trgm_idx', 'lift_packages_title_trgm_idx', 'package_status_counts_pkey')`,
        ),
        await count(
          `SELECT count(*) AS n FROM information_schema.columns WHERE column_name = 'unit_system' AND table_name IN ('lift_packages', 'sites', 'stamped_returns')`,
        ),
        await count(
          `SELECT count(*) AS n FROM pg_indexes WHERE indexname = 'uploaded_files_one_lift_plan_key' AND indexdef LIKE 'CREATE UNIQUE INDEX%WHERE%lift_plan%'`,
        ),
        await count(
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'decisions' AND column_name IN ('override_reason', 'overridden', 'inputs_sha256', 'results_sha256', 'engine_version', 'confirmed_at')`,
        ),
        await count(
          `SELECT count(*) AS n FROM pg_indexes WHERE schemaname = 'public' AND indexname IN ('uploaded_files_revision_idx', 'uploaded_files_uploaded_by_idx', 'markups_file_idx', 'users_organisation_idx')`,
        ),
        await count(
          `SELECT count(*) AS n FROM information_schema.tables WHERE table_name IN ('library_cranes', 'library_configurations', 'library_versions', 'library_chart_cells', 'library_verifications', 'library_uses')`,
        ),
      ];
      expect(await lastMigration()).toEqual([9, 3, 1, 6, 4, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 3, 1, 6, 4, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 0, 1, 6, 4, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 0, 0, 6, 4, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 0, 0, 0, 4, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 0, 0, 0, 0, 6]);
      await ds.undoLastMigration();
      expect(await lastMigration()).toEqual([0, 0, 0, 0, 0, 0]);
      expect(await tables(ds)).toContain('lift_packages');
      for (let i = 6; i < MIGRATIONS.length; i++) await ds.undoLastMigration();
      expect((await tables(ds)).filter((t) => t !== 'migrations')).toEqual([]);
    } finally {
      await ds.destroy();
    }
  });

  it('when a submitted revision is changed in the database, then the change is refused', async () => {
    const ds = createDataSource(base);
    await ds.initialize();
    try {
      const [org] = await ds.query(
        `INSERT INTO organisations (name, kind) VALUES ('Freeze test', 'owner') RETURNING id`,
      );
      const [user] = await ds.query(
        `INSERT INTO users (organisation_id, email, name, role) VALUES ($1, $2, 'F', 'contractor') RETURNING id`,
        [org.id, `freeze-${randomUUID()}@test.example`],
      );
      const [site] = await ds.query(
        `INSERT INTO sites (owner_organisation_id, name, code) VALUES ($1, 'S', $2) RETURNING id`,
        [org.id, randomUUID().slice(0, 8)],
      );
      const [pkg] = await ds.query(
        `INSERT INTO lift_packages (reference, title, contractor_organisation_id, site_id, created_by_id, status)
         VALUES ($1, 'T', $2, $3, $4, 'checking') RETURNING id`,
        [randomUUID().slice(0, 12), org.id, site.id, user.id],
      );
      const [rev] = await ds.query(
        `INSERT INTO revisions (package_id, number, state, inputs) VALUES ($1, 1, 'submitted', '{"a":1}') RETURNING id`,
        [pkg.id],
      );
      await expect(
        ds.query(`UPDATE revisions SET inputs = '{"a":2}' WHERE id = $1`, [rev.id]),
      ).rejects.toThrow(/cannot change/);
      await ds.query(`UPDATE revisions SET check_status = 'done' WHERE id = $1`, [rev.id]);
    } finally {
      await ds.destroy();
    }
  });
});
