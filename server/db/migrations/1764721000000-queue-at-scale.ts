import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The reviewer's queue at 100,000 packages (issue 16 item 4).
 * - One index per sort, ending in the reference (the tie-break), so that a page is a range scan
 *   from the cursor: the planned lift date through coalesce() so that a missing date sorts last
 *   in both directions (expression indexes: TypeORM's metadata does not see them).
 * - Trigram indexes (pg_trgm, in Debian's postgresql package) for the search on reference and
 *   title.
 * - package_status_counts: the number of packages per site, contractor, status and "first draft"
 *   (a package never submitted, which only its contractor sees), kept by a trigger on every
 *   insert, update and delete of a package, so that the counts above the queue are a sum over a
 *   few rows, not a count over the scope.
 */
export class QueueAtScale1764721000000 implements MigrationInterface {
  name = 'QueueAtScale1764721000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pg_trgm`);
    await q.query(
      `CREATE INDEX lift_packages_lift_date_asc_idx ON lift_packages ((coalesce(planned_lift_date, 'infinity'::date)), reference)`,
    );
    await q.query(
      `CREATE INDEX lift_packages_lift_date_desc_idx ON lift_packages ((coalesce(planned_lift_date, '-infinity'::date)), reference)`,
    );
    await q.query(`CREATE INDEX lift_packages_updated_idx ON lift_packages (updated_at, reference)`);
    await q.query(
      `CREATE INDEX lift_packages_discrepancies_idx ON lift_packages (open_discrepancies, reference)`,
    );
    await q.query(`CREATE INDEX lift_packages_revision_idx ON lift_packages (current_revision, reference)`);
    await q.query(
      `CREATE INDEX lift_packages_reference_trgm_idx ON lift_packages USING gin (reference gin_trgm_ops)`,
    );
    await q.query(
      `CREATE INDEX lift_packages_title_trgm_idx ON lift_packages USING gin (title gin_trgm_ops)`,
    );

    await q.query(
      `CREATE TABLE package_status_counts (
         site_id uuid NOT NULL,
         contractor_organisation_id uuid NOT NULL,
         status varchar(30) NOT NULL,
         first_draft boolean NOT NULL,
         n int NOT NULL DEFAULT 0,
         CONSTRAINT package_status_counts_pkey PRIMARY KEY (site_id, contractor_organisation_id, status, first_draft)
       )`,
    );
    await q.query(
      `CREATE INDEX package_status_counts_contractor_idx ON package_status_counts (contractor_organisation_id)`,
    );
    await q.query(
      `CREATE FUNCTION package_status_counts_keep() RETURNS trigger LANGUAGE plpgsql AS $$
       BEGIN
         IF TG_OP = 'UPDATE' AND (OLD.site_id, OLD.contractor_organisation_id, OLD.status,
              OLD.status = 'draft' AND OLD.current_revision = 1)
            IS NOT DISTINCT FROM (NEW.site_id, NEW.contractor_organisation_id, NEW.status,
              NEW.status = 'draft' AND NEW.current_revision = 1) THEN
           RETURN NULL;
         END IF;
         IF TG_OP IN ('UPDATE', 'DELETE') THEN
           UPDATE package_status_counts SET n = n - 1
           WHERE site_id = OLD.site_id AND contractor_organisation_id = OLD.contractor_organisation_id
             AND status = OLD.status AND first_draft = (OLD.status = 'draft' AND OLD.current_revision = 1);
         END IF;
         IF TG_OP IN ('UPDATE', 'INSERT') THEN
           INSERT INTO package_status_counts (site_id, contractor_organisation_id, status, first_draft, n)
           VALUES (NEW.site_id, NEW.contractor_organisation_id, NEW.status,
                   NEW.status = 'draft' AND NEW.current_revision = 1, 1)
           ON CONFLICT (site_id, contractor_organisation_id, status, first_draft)
           DO UPDATE SET n = package_status_counts.n + 1;
         END IF;
         RETURN NULL;
       END $$`,
    );
    await q.query(
      `CREATE TRIGGER lift_packages_status_counts AFTER INSERT OR UPDATE OR DELETE ON lift_packages
       FOR EACH ROW EXECUTE FUNCTION package_status_counts_keep()`,
    );
    await q.query(
      `INSERT INTO package_status_counts (site_id, contractor_organisation_id, status, first_draft, n)
       SELECT site_id, contractor_organisation_id, status, status = 'draft' AND current_revision = 1, count(*)
       FROM lift_packages GROUP BY 1, 2, 3, 4`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER lift_packages_status_counts ON lift_packages`);
    await q.query(`DROP FUNCTION package_status_counts_keep()`);
    await q.query(`DROP TABLE package_status_counts`);
    for (const index of [
      'lift_packages_title_trgm_idx',
      'lift_packages_reference_trgm_idx',
      'lift_packages_revision_idx',
      'lift_packages_discrepancies_idx',
      'lift_packages_updated_idx',
      'lift_packages_lift_date_desc_idx',
      'lift_packages_lift_date_asc_idx',
    ])
      await q.query(`DROP INDEX ${index}`);
    await q.query(`DROP EXTENSION IF EXISTS pg_trgm`);
  }
}
