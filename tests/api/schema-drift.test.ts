// The TypeORM entities and the migrations describe the same schema: after every migration has run
// on an empty database, TypeORM's schema builder finds nothing to change. A difference means an
// entity that says one thing (a default, a length, an index, nullability) while the database holds
// another; fix the entity, or add a migration when the database is the one that is wrong.
import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { createDataSource } from '@server/db/data-source';

const base = process.env.DATABASE_URL!;
const dbName = `drift_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const admin = new pg.Client({ connectionString: base });

afterAll(async () => {
  await admin.query(`DROP DATABASE IF EXISTS ${dbName}`);
  await admin.end();
});

describe('entities and migrations', () => {
  it('when every migration has run on an empty database, then the entities need no schema change', async () => {
    await admin.connect();
    await admin.query(`CREATE DATABASE ${dbName}`);
    const ds = createDataSource(base.replace(/\/[^/]+$/, `/${dbName}`));
    await ds.initialize();
    try {
      await ds.runMigrations();
      const log = await ds.driver.createSchemaBuilder().log();
      expect(log.upQueries.map((q) => q.query)).toEqual([]);
    } finally {
      await ds.destroy();
    }
  });
});
