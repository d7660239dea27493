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
      // The newest migrations, newest first, each with what it adds (counted); undoing them one by
      // one takes each count to 0 in turn. A new migration adds its row at the top.
      const LATEST: Array<[string, string, number]> = [
        [
          'ReviewDue',
          `SELECT (SELECT count(*) FROM information_schema.columns WHERE (table_name = 'sites' AND column_name IN ('review_turnaround_days', 'review_margin_days')) OR (table_name = 'lift_packages' AND column_name = 'review_due_on')) + (SELECT count(*) FROM pg_indexes WHERE indexname LIKE 'lift_packages_review_due_%') AS n`,
          5,
        ],
        [
          'AssignmentNote',
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'assignments' AND column_name = 'note'`,
          1,
        ],
        [
          'LiveUpdates',
          `SELECT count(*) AS n FROM pg_trigger WHERE tgname IN ('lift_packages_live', 'audit_events_live', 'mail_messages_live')`,
          3,
        ],
        [
          'CarriedDocuments',
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'uploaded_files' AND column_name IN ('carried_from_id', 'carried_from_revision')`,
          2,
        ],
        [
          'StampPlacement',
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'revisions' AND column_name = 'stamp_placement'`,
          1,
        ],
        [
          'UploadContents',
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'uploaded_files' AND column_name = 'contents' AND data_type = 'jsonb'`,
          1,
        ],
        [
          'QueueAtScale',
          `SELECT count(*) + (SELECT count(*) FROM pg_trigger WHERE tgname = 'lift_packages_status_counts') AS n FROM pg_indexes WHERE indexname IN ('lift_packages_lift_date_asc_idx', 'lift_packages_lift_date_desc_idx', 'lift_packages_updated_idx', 'lift_packages_discrepancies_idx', 'lift_packages_revision_idx', 'lift_packages_reference_trgm_idx', 'lift_packages_title_trgm_idx', 'package_status_counts_pkey')`,
          9,
        ],
        [
          'DocumentUnits',
          `SELECT count(*) AS n FROM information_schema.columns WHERE column_name = 'unit_system' AND table_name IN ('lift_packages', 'sites', 'stamped_returns')`,
          3,
        ],
        [
          'OneLiftPlan',
          `SELECT count(*) AS n FROM pg_indexes WHERE indexname = 'uploaded_files_one_lift_plan_key' AND indexdef LIKE 'CREATE UNIQUE INDEX%WHERE%lift_plan%'`,
          1,
        ],
        [
          'DeliberateDecision',
          `SELECT count(*) AS n FROM information_schema.columns WHERE table_name = 'decisions' AND column_name IN ('override_reason', 'overridden', 'inputs_sha256', 'results_sha256', 'engine_version', 'confirmed_at')`,
          6,
        ],
        [
          'ForeignKeyIndexes',
          `SELECT count(*) AS n FROM pg_indexes WHERE schemaname = 'public' AND indexname IN ('uploaded_files_revision_idx', 'uploaded_files_uploaded_by_idx', 'markups_file_idx', 'users_organisation_idx')`,
          4,
        ],
        [
          'FleetLibrary',
          `SELECT count(*) AS n FROM information_schema.tables WHERE table_name IN ('library_cranes', 'library_configurations', 'library_versions', 'library_chart_cells', 'library_verifications', 'library_uses')`,
          6,
        ],
      ];
      // The table follows the migrations' own order.
      expect(MIGRATIONS.slice(-LATEST.length).map((m) => m.name.replace(/\d+$/, ''))).toEqual(
        LATEST.map(([name]) => name).reverse(),
      );
      const counts = async () => Promise.all(LATEST.map(([, sql]) => count(sql)));
      for (let undone = 0; undone <= LATEST.length; undone++) {
        expect(await counts(), `after undoing ${undone}`).toEqual(
          LATEST.map(([, , n], i) => (i < undone ? 0 : n)),
        );
        if (undone < LATEST.length) await ds.undoLastMigration();
      }
      expect(await tables(ds)).toContain('lift_packages');
      for (let i = LATEST.length; i < MIGRATIONS.length; i++) await ds.undoLastMigration();
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
