// Runs the TypeORM migrations against a database URL (used by start, test and dev).
import { createDataSource } from '../../server/db/data-source';

export async function runMigrations(url: string): Promise<string[]> {
  const dataSource = createDataSource(url);
  await dataSource.initialize();
  try {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    return applied.map((m) => m.name);
  } finally {
    await dataSource.destroy();
  }
}
