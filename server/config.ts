// Environment parsed once with zod. A wrong or missing value stops the process with a
// list of what to fix, before anything listens.
import path from 'node:path';
import { z } from 'zod';

const Env = z.object({
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
  /** Largest chart file (CSV or .xlsx) the fleet library's importer reads */
  CHART_IMPORT_MAX_BYTES: z.coerce
    .number()
    .int()
    .min(1024)
    .default(5 * 1024 * 1024),
  SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  VERIFY_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(30),
  SIGN_IN_WINDOW_MINUTES: z.coerce.number().min(0.01).default(15),
  REDIS_PREFIX: z
    .string()
    .regex(/^[a-z0-9-]{1,40}$/, 'REDIS_PREFIX must be 1 to 40 of a-z, 0-9 and -')
    .default('cp'),
  CHECK_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(2),
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

export function appUrl(config: Config): string {
  return config.APP_URL ?? `http://${config.HOST}:${config.PORT}`;
}
