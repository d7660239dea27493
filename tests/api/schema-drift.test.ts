// The TypeORM entities and the migrations describe the same schema: after every migration has run
// on an empty database, TypeORM's schema builder finds nothing to change. A difference means an
// entity that says one thing (a default, a length, an index, nullability) while the database holds
// another; fix the entity, or add a migration when the database is the one that is wrong.
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '@server/db/data-source';

const base = process.env.DATABASE_URL!;
const dbName = `drift_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const admin = new pg.Client({ connectionString: base });

afterAll(async () => {
  await admin.query(`DROP DATABASE IF EXISTS ${dbName}`);
  await admin.end();
});

/**
 * Foreign keys whose columns do not lead any full (non-partial) index, as `table(columns)`.
 * Requests walk every foreign key, from the parent (a package's revisions, a revision's
 * files) or on a parent's delete (ON DELETE CASCADE / the RESTRICT check); without an index
 * that starts with its columns, each such walk reads the whole child table.
 */
const UNINDEXED_FOREIGN_KEYS = `
  SELECT c.conrelid::regclass::text || '(' || string_agg(a.attname, ', ' ORDER BY k.ord) || ')' AS fk
  FROM pg_constraint c
  CROSS JOIN LATERAL unnest(c.conkey) WITH ORDINALITY AS k(attnum, ord)
  JOIN pg_attribute a ON a.attrelid = c.conrelid AND a.attnum = k.attnum
  WHERE c.contype = 'f'
    AND c.connamespace = 'public'::regnamespace
    AND NOT EXISTS (
      SELECT 1 FROM pg_index i
      WHERE i.indrelid = c.conrelid
        AND i.indpred IS NULL
        AND (i.indkey::int2[])[0:cardinality(c.conkey) - 1] @> c.conkey
        AND (i.indkey::int2[])[0:cardinality(c.conkey) - 1] <@ c.conkey
    )
  GROUP BY c.conrelid, c.conname
  ORDER BY 1`;

describe('entities and migrations', () => {
  let ds: ReturnType<typeof createDataSource>;
  beforeAll(async () => {
    await admin.connect();
    await admin.query(`CREATE DATABASE ${dbName}`);
    ds = createDataSource(base.replace(/\/[^/]+$/, `/${dbName}`));
    await ds.initialize();
    await ds.runMigrations();
  });
  afterAll(async () => ds?.destroy());

  it('when every migration has run on an empty database, then the entities need no schema change', async () => {
    const log = await ds.driver.createSchemaBuilder().log();
    expect(log.upQueries.map((q) => q.query)).toEqual([]);
  });

  it('when every migration has run, then every foreign key leads an index', async () => {
    const rows: { fk: string }[] = await ds.query(UNINDEXED_FOREIGN_KEYS);
    // The query itself is checked: it does find a foreign key without an index.
    await ds.query(`CREATE TABLE fk_probe (id int PRIMARY KEY, user_id uuid REFERENCES users(id))`);
    try {
      const probed: { fk: string }[] = await ds.query(UNINDEXED_FOREIGN_KEYS);
      expect(probed.map((r) => r.fk)).toContain('fk_probe(user_id)');
    } finally {
      await ds.query(`DROP TABLE fk_probe`);
    }
    expect(rows.map((r) => r.fk)).toEqual([]);
  });
});
