// The one TypeORM DataSource: used by the API, the worker, the seed, the tests and the
// TypeORM CLI (`npm run migration:run`). Schema changes go through migrations only.
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { databaseSettings } from '../config';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

export function createDataSource(url = databaseSettings().url): DataSource {
  if (!url) throw new Error('DATABASE_URL is not set');
  return new DataSource({
    type: 'postgres',
    url,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    logging: false,
    extra: { max: databaseSettings().poolSize, connectionTimeoutMillis: 5000 },
  });
}
