// Environment parsed once with zod. A wrong or missing value stops the process with a
// list of what to fix, before anything listens.
import path from 'node:path';
import { z } from 'zod';

/** What WORKER_QUEUES names: the check run, the stamped return, mail, the daily reminders. */
export const WORKER_QUEUE_KINDS = ['check', 'stamp', 'mail', 'reminders'] as const;
export type WorkerQueueKind = (typeof WORKER_QUEUE_KINDS)[number];

const boolish = z
  .enum(['true', 'false', '1', '0'], { message: 'must be true or false' })
  .transform((v) => v === 'true' || v === '1');

/**
 * Where files live: a bucket behind the S3 API. The start and test commands run a local fake
 * S3 server and set these unless S3_ENDPOINT is set; without S3_ENDPOINT the SDK uses AWS's
 * own endpoint for S3_REGION; without keys, its usual credential chain.
 */
const S3Env = z
  .object({
    S3_ENDPOINT: z
      .url({ protocol: /^https?$/, message: 'S3_ENDPOINT must be a URL such as http://127.0.0.1:59000' })
      .optional(),
    S3_BUCKET: z
      .string({ message: 'S3_BUCKET is required (the start command sets it for the local fake S3 server)' })
      .regex(
        /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/,
        'S3_BUCKET must be 3 to 63 of a-z, 0-9, . and -, starting and ending with a letter or digit',
      ),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    // Bucket in the path (http://host/bucket/key), as the local fake and most S3-compatible servers want.
    S3_FORCE_PATH_STYLE: boolish.default(true),
  })
  .superRefine((env, ctx) => {
    if (Boolean(env.S3_ACCESS_KEY_ID) !== Boolean(env.S3_SECRET_ACCESS_KEY))
      ctx.addIssue({
        code: 'custom',
        path: [env.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID'],
        message: 'S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY are set together, or neither',
      });
  });
export type S3Settings = z.infer<typeof S3Env>;

const Env = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    APP_URL: z.url().optional(),
    DATABASE_URL: z
      .string()
      .min(1, 'DATABASE_URL is required (the start command sets it for the embedded server)'),
    REDIS_URL: z.string().min(1, 'REDIS_URL is required (the start command sets it for the embedded server)'),
    JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters'),
    SESSION_HOURS: z.coerce
      .number()
      .min(0.01)
      .max(24 * 30)
      .default(10),
    DATA_DIR: z.string().default(path.resolve('.data')),
    UPLOAD_MAX_BYTES: z.coerce
      .number()
      .int()
      .min(1024)
      .default(100 * 1024 * 1024),
    UPLOAD_MAX_PAGES: z.coerce.number().int().min(1).default(500),
    /**
     * What an upload's compressed streams may unpack to, together, when it is checked (or 8 ×
     * the file's size, if larger): a compression bomb is refused at this point. 256 MiB.
     */
    UPLOAD_DECODE_MAX_BYTES: z.coerce
      .number()
      .int()
      .min(1024 * 1024)
      .default(256 * 1024 * 1024),
    /** How long the check of one upload may take (seconds) before it is refused. */
    UPLOAD_CHECK_SECONDS: z.coerce.number().min(1).max(3600).default(120),
    /** Largest chart file (CSV or .xlsx) the fleet library's importer reads */
    CHART_IMPORT_MAX_BYTES: z.coerce
      .number()
      .int()
      .min(1024)
      .default(5 * 1024 * 1024),
    SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
    // Sign-in attempts per window from one address (any e-mail: password spraying) and for
    // one account (from any address).
    SIGN_IN_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(30),
    SIGN_IN_ACCOUNT_LIMIT: z.coerce.number().int().min(1).default(20),
    PASSWORD_CHANGE_LIMIT: z.coerce.number().int().min(1).default(5),
    // Wrong passwords when confirming a decision, per person per sign-in window.
    STEP_UP_LIMIT: z.coerce.number().int().min(1).default(5),
    INVITE_LOOKUP_LIMIT: z.coerce.number().int().min(1).default(20),
    // Which proxies' X-Forwarded-For to believe: unset = none (the socket address counts),
    // or a list Express understands ("loopback", "10.0.0.0/8,127.0.0.1", a hop count "1").
    TRUST_PROXY: z
      .string()
      .regex(
        /^[0-9a-fA-F.:/,\s a-z]{1,500}$/,
        'TRUST_PROXY must be a hop count, "loopback", or addresses/subnets separated by commas',
      )
      .optional(),
    VERIFY_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(30),
    SIGN_IN_WINDOW_MINUTES: z.coerce.number().min(0.01).default(15),
    REDIS_PREFIX: z
      .string()
      .regex(/^[a-z0-9-]{1,40}$/, 'REDIS_PREFIX must be 1 to 40 of a-z, 0-9 and -')
      .default('cp'),
    // Each queue has its own BullMQ Worker with its own concurrency, so a long stamped return
    // never takes a slot a check run waits for.
    CHECK_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
    STAMP_CONCURRENCY: z.coerce.number().int().min(1).max(16).default(1),
    MAIL_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(4),
    // The queues this worker process takes jobs from (a deployment can run stamping in
    // processes of its own); unset = all.
    WORKER_QUEUES: z
      .string()
      .default(WORKER_QUEUE_KINDS.join(','))
      .transform((value, ctx) => {
        const names = value
          .split(',')
          .map((v) => v.trim())
          .filter(Boolean);
        const unknown = names.filter((n) => !(WORKER_QUEUE_KINDS as readonly string[]).includes(n));
        if (!names.length || unknown.length)
          ctx.addIssue({
            code: 'custom',
            message: `WORKER_QUEUES must list one or more of ${WORKER_QUEUE_KINDS.join(', ')}, separated by commas${
              unknown.length ? ` (not known: ${unknown.join(', ')})` : ''
            }`,
          });
        return [...new Set(names)] as WorkerQueueKind[];
      }),
    SMTP_URL: z.string().optional(),
    MAIL_FROM: z.string().default('Counterpoise lift desk <desk@counterpoise.invalid>'),
    REMINDER_DAYS: z.coerce.number().int().min(0).max(60).default(3),
    REMINDER_CRON: z.string().default('0 7 * * *'),
    REMINDER_TIME_ZONE: z.string().default('UTC'),
    INVITE_HOURS: z.coerce
      .number()
      .min(1)
      .max(24 * 30)
      .default(72),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    // A PKCS#12 file (certificate from a real authority and its key) that signs the stamped
    // returns; without it the desk signs with its own certificate made under DATA_DIR.
    SIGNING_P12_FILE: z.string().min(1).optional(),
    SIGNING_P12_PASSPHRASE: z.string().optional(),
  })
  .and(S3Env)
  .superRefine((env, ctx) => {
    if (env.SIGNING_P12_FILE && !env.SIGNING_P12_PASSPHRASE)
      ctx.addIssue({
        code: 'custom',
        path: ['SIGNING_P12_PASSPHRASE'],
        message:
          'SIGNING_P12_PASSPHRASE must be set to the passphrase of the PKCS#12 file that SIGNING_P12_FILE names',
      });
  });
export type Config = z.infer<typeof Env>;

let cached: Config | null = null;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  if (cached && env === process.env) return cached;
  const parsed = Env.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join('\n')}`);
  }
  if (env === process.env) cached = parsed.data;
  return parsed.data;
}

/** Express's "trust proxy" value for TRUST_PROXY: false when unset. */
export function trustProxySetting(value: string | undefined): boolean | number | string[] {
  if (!value || !value.trim()) return false;
  if (/^\d+$/.test(value.trim())) return Number(value.trim());
  return value
    .split(',')
    .map((v) => v.trim())
    .filter(Boolean);
}

export function appUrl(config: Config): string {
  return config.APP_URL ?? `http://${config.HOST}:${config.PORT}`;
}

// Settings read before, or without, the full configuration (the seed, the TypeORM CLI, the mail
// catcher's process and the logger must start with only these set). The defaults are those of `Env`.
export function databaseSettings(env: NodeJS.ProcessEnv = process.env): { url?: string; poolSize: number } {
  return { url: env.DATABASE_URL, poolSize: Number(env.DB_POOL_SIZE ?? 10) };
}

export function logSettings(env: NodeJS.ProcessEnv = process.env): { level: string; service: string } {
  return {
    level: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
    service: env.CP_SERVICE ?? 'api',
  };
}

/** The S3 settings alone (the seed runs with only these and DATABASE_URL set). */
export function s3Settings(env: NodeJS.ProcessEnv = process.env): S3Settings {
  const parsed = S3Env.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

/** Where the local fake S3 server (server/s3-fake.ts) keeps its objects and listens. */
export function fakeS3Settings(env: NodeJS.ProcessEnv = process.env): { dir: string; port: number } {
  return {
    dir: path.join(path.resolve(env.DATA_DIR ?? '.data'), 's3'),
    port: Number(env.CP_S3_PORT ?? 59000),
  };
}

export function mailCatcherPort(env: NodeJS.ProcessEnv = process.env): number {
  return Number(env.CP_SMTP_PORT ?? 2526);
}

/**
 * The environment of a worker's child process that takes only the given queues (the worker
 * runs stamping in a child of its own beside other queues); its log lines say which it is.
 */
export function childWorkerEnv(
  queues: WorkerQueueKind[],
  service: string,
  env: NodeJS.ProcessEnv = process.env,
): NodeJS.ProcessEnv {
  return { ...env, WORKER_QUEUES: queues.join(','), CP_SERVICE: service };
}
