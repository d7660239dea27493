// Seeds the invented demo scenario once: an owner with two sites, two lifting
// contractors, a person in every role, and about a dozen lift packages across every
// status, each with a generated lift plan PDF and (once submitted) the engine's results.
import bcrypt from 'bcryptjs';
import type { DataSource } from 'typeorm';
import { s3Settings } from '../../config';
import { createS3Storage } from '../../lib/s3-storage';
import { createDataSource } from '../data-source';
import { seedScenario } from './scenario';

export async function isSeeded(dataSource: DataSource): Promise<boolean> {
  const [row] = await dataSource.query(`SELECT count(*)::int AS n FROM organisations`);
  return Number(row.n) > 0;
}

/**
 * Seeds when the database holds no organisation yet; returns whether it seeded. The plans go
 * into the bucket that the S3_* settings name (created when missing), as the API's uploads do.
 */
export async function seedDemoOnce(url: string, appUrl: string, env: NodeJS.ProcessEnv): Promise<boolean> {
  const dataSource = createDataSource(url);
  await dataSource.initialize();
  try {
    if (await isSeeded(dataSource)) return false;
    const storage = createS3Storage(s3Settings(env));
    await storage.ensureBucket();
    await seedScenario(dataSource, storage, { hash: (p) => bcrypt.hashSync(p, 10), appUrl });
    return true;
  } finally {
    await dataSource.destroy();
  }
}
