// What the start and dev commands share: PostgreSQL and Redis (embedded unless
// DATABASE_URL / REDIS_URL are set), the local fake S3 server (unless S3_ENDPOINT is set),
// migrations, the demo seed, and the environment the API and the worker run with.
import path from 'node:path';
import { fakeS3Env } from '../../server/lib/fake-s3';
import { runMigrations } from './migrate';
import { fakeS3Spec, waitForFakeS3 } from './s3';
import type { DeskLock } from './lock';
import { localSecret } from './secret';
import {
  ensurePackages,
  packagesFor,
  startPostgres,
  startRedis,
  type PostgresHandle,
  type RedisHandle,
} from './services';
import type { ProcessSpec } from './supervisor';

export interface Stack {
  env: NodeJS.ProcessEnv;
  embedded: boolean;
  /** The embedded servers this run started (or adopted), which stop() stops. */
  services: string[];
  /** The embedded servers found running and left alone. */
  foundRunning: string[];
  stop(): void;
}

export async function prepareStack(opts: {
  dataDir: string;
  root: string;
  say: (message: string) => void;
  /** Registers the handles as soon as each server is up, so a later failure still stops them. */
  onStarted: (stop: () => void) => void;
  /** The data folder's lock: servers its stale predecessor started are adopted, and the ones this run starts are recorded in it. */
  lock?: DeskLock;
  /** Starts a process (supervised, in the start command) that lives as long as the desk: the fake S3 server. */
  run: (spec: ProcessSpec) => void;
  logDir?: string;
}): Promise<Stack> {
  const { dataDir, root, say } = opts;
  let postgres: PostgresHandle | null = null;
  let redis: RedisHandle | null = null;
  const stop = () => {
    redis?.stop();
    postgres?.stop();
  };
  let databaseUrl = process.env.DATABASE_URL;
  let redisUrl = process.env.REDIS_URL;
  ensurePackages(packagesFor('start', { postgres: !databaseUrl, redis: !redisUrl }), say);
  opts.onStarted(stop);
  const adopt = opts.lock?.previous?.services ?? [];
  if (!databaseUrl) {
    postgres = await startPostgres(
      path.join(dataDir, 'pg'),
      Number(process.env.CP_PG_PORT ?? 54329),
      'counterpoise',
      { adopt: adopt.includes('postgres') },
    );
    databaseUrl = postgres.url;
    say(`PostgreSQL on 127.0.0.1:${postgres.port} (data in ${path.relative(root, postgres.dataDir)})`);
  }
  if (!redisUrl) {
    redis = await startRedis(path.join(dataDir, 'redis'), Number(process.env.CP_REDIS_PORT ?? 56379), {
      persist: true,
      adopt: adopt.includes('redis'),
    });
    redisUrl = redis.url;
    say(`Redis on 127.0.0.1:${redis.port}`);
  }

  const s3 = await withStep('start the local fake S3 server', () => fakeS3(opts));

  const applied = await withStep('run migrations', () => runMigrations(databaseUrl!));
  say(applied.length ? `applied migrations: ${applied.join(', ')}` : 'database schema is up to date');

  const { seedDemoOnce } = await import('../../server/db/seed/seed');
  const seeded = await withStep('seed the demo scenario', () =>
    seedDemoOnce(
      databaseUrl!,
      process.env.APP_URL ?? `http://${process.env.HOST ?? '127.0.0.1'}:${process.env.PORT ?? 3000}`,
      { ...process.env, ...s3 },
    ),
  );
  say(seeded ? 'demo scenario seeded' : 'demo data already present, reused');

  const handles = [
    ['postgres', postgres],
    ['redis', redis],
  ] as const;
  const services = handles.filter(([, h]) => h?.startedHere).map(([n]) => n);
  const foundRunning = handles.filter(([, h]) => h && !h.startedHere).map(([n]) => n);
  opts.lock?.update({ services });
  for (const n of foundRunning)
    say(
      `${n === 'postgres' ? 'PostgreSQL' : 'Redis'} was already running on this data folder: used, and left running at the end`,
    );
  return {
    embedded: Boolean(postgres || redis),
    services,
    foundRunning,
    stop,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      REDIS_URL: redisUrl,
      JWT_SECRET: process.env.JWT_SECRET ?? localSecret(dataDir),
      DATA_DIR: dataDir,
      ...s3,
    },
  };
}

/** The fake S3 server's port (the start command checks it is free before anything starts). */
export function fakeS3Port(): number {
  return Number(process.env.CP_S3_PORT ?? 59000);
}

/**
 * Without S3_ENDPOINT, starts the local fake S3 server (objects under the data folder's s3/)
 * and waits until it answers; returns the S3_* settings for the seed, the API and the worker.
 */
async function fakeS3(opts: {
  dataDir: string;
  root: string;
  say: (m: string) => void;
  run: (spec: ProcessSpec) => void;
  logDir?: string;
}): Promise<Record<string, string>> {
  if (process.env.S3_ENDPOINT) {
    opts.say(
      `files in the S3 bucket ${process.env.S3_BUCKET ?? '(S3_BUCKET not set)'} at ${process.env.S3_ENDPOINT}`,
    );
    return {};
  }
  const port = fakeS3Port();
  const url = `http://127.0.0.1:${port}`;
  opts.run(fakeS3Spec(opts.dataDir, port, opts.logDir ? path.join(opts.logDir, 's3.log') : undefined));
  await waitForFakeS3(url);
  opts.say(
    `local fake S3 server on 127.0.0.1:${port} (objects in ${path.relative(opts.root, path.join(opts.dataDir, 's3'))})`,
  );
  return fakeS3Env(url, process.env.S3_BUCKET ?? 'counterpoise');
}

async function withStep<T>(step: string, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    const e = error as Error & { step?: string };
    e.step = e.step ?? step;
    throw e;
  }
}

/**
 * Without SMTP_URL, the local fake SMTP server (mail goes over real SMTP and is kept for the
 * outbox page) to run beside the API; points env.SMTP_URL at it.
 */
export function mailCatcherSpec(
  env: NodeJS.ProcessEnv,
  say: (m: string) => void,
  logFile?: string,
): ProcessSpec | null {
  if (process.env.SMTP_URL) return null;
  const smtpPort = Number(process.env.CP_SMTP_PORT ?? 55025);
  env.SMTP_URL = `smtp://127.0.0.1:${smtpPort}`;
  say(`local outbox (fake SMTP) on 127.0.0.1:${smtpPort}; admins read it at /admin/mail`);
  return {
    name: 'mail-catcher',
    command: process.execPath,
    args: ['--import', 'tsx', 'server/mail-catcher.ts'],
    env: { ...env, CP_SERVICE: 'mail-catcher', CP_SMTP_PORT: String(smtpPort) },
    logFile,
  };
}
