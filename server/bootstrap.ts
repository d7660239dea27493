// Connects what the API and the worker share (database, Redis, queues, passport) and
// names the step that failed, so a bad start prints one clear line instead of a stack.
import 'reflect-metadata';
import type { Redis } from 'ioredis';
import type { AppContext } from './context';
import { loadConfig, type Config } from './config';
import { createDataSource } from './db/data-source';
import { logger } from './lib/logger';
import { createQueues, type QueueOptions } from './lib/queues';
import { createRedis } from './lib/redis';
import { createS3Storage } from './lib/s3-storage';
import { createPassport } from './modules/auth/passport';

export class StartupError extends Error {
  constructor(
    readonly step: string,
    message: string,
  ) {
    super(`${step} failed: ${message}`);
  }
}

function redact(url: string) {
  return url.replace(/\/\/([^:@/]+):([^@/]+)@/, '//$1:***@');
}

async function pingRedis(redis: Redis, url: string) {
  try {
    await Promise.race([
      redis.connect().then(() => redis.ping()),
      new Promise((_, reject) => setTimeout(() => reject(new Error('no answer within 5 s')), 5000)),
    ]);
  } catch (error) {
    redis.disconnect();
    throw new StartupError('connect to Redis', `${redact(url)}: ${(error as Error).message}`);
  }
}

export async function connect(
  config: Config = loadConfig(),
  queueOptions: QueueOptions = {},
): Promise<AppContext> {
  const dataSource = createDataSource(config.DATABASE_URL);
  try {
    await dataSource.initialize();
  } catch (error) {
    throw new StartupError(
      'connect to PostgreSQL',
      `${redact(config.DATABASE_URL)}: ${(error as Error).message}`,
    );
  }
  const redis = createRedis(config.REDIS_URL);
  redis.on('error', () => undefined);
  await pingRedis(redis, config.REDIS_URL);
  const queueConnection = createRedis(config.REDIS_URL, { forWorker: true });
  void queueConnection.connect().catch(() => undefined);
  queueConnection.on('error', () => undefined);
  const queues = createQueues(queueConnection, config.REDIS_PREFIX, queueOptions);
  const passport = createPassport(dataSource, config.JWT_SECRET);
  const storage = createS3Storage(config);
  try {
    await storage.ensureBucket();
  } catch (error) {
    queueConnection.disconnect();
    redis.disconnect();
    await dataSource.destroy();
    throw new StartupError(
      'reach the S3 bucket',
      `${config.S3_BUCKET} at ${config.S3_ENDPOINT ?? `AWS ${config.S3_REGION}`}: ${(error as Error).message || (error as Error).name}`,
    );
  }
  return {
    config,
    dataSource,
    redis,
    queues,
    passport: passport as unknown as AppContext['passport'],
    storage,
    async close() {
      await queues.close().catch(() => undefined);
      queueConnection.disconnect();
      redis.disconnect();
      if (dataSource.isInitialized) await dataSource.destroy();
    },
  } as AppContext & { close(): Promise<void> };
}

/**
 * The last line of defence in the API and the worker: a rejected promise nobody awaited is
 * logged and the process carries on; an exception nobody caught leaves the process in an
 * unknown state, so it is logged and the process closes (the launcher starts it again).
 */
export function handleProcessEvents(name: string, close: (code: number) => Promise<void> | void) {
  process.on('unhandledRejection', (reason) => {
    logger.error({ err: reason, service: name }, 'unhandled rejection (logged, the process carries on)');
  });
  process.on('uncaughtException', (error) => {
    logger.fatal({ err: error, service: name }, 'uncaught exception: closing');
    // Closing itself may hang on the fault that caused this.
    setTimeout(() => process.exit(1), 10_000).unref();
    void close(1);
  });
}
