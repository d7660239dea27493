// The desk's rate limits in one place. Counts live in Redis (shared by every API process);
// when Redis does not answer within 250 ms, an in-process count takes over for that
// request, so a limit never fails open while Redis is down.
import type { RequestHandler } from 'express';
import { ipKeyGenerator, MemoryStore, rateLimit, type Options, type Store } from 'express-rate-limit';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/app-error';
import { RedisRateLimitStore } from './rate-limit-store';

const REDIS_ANSWER_MS = 250;

function within<T>(promise: Promise<T>, ms: number): Promise<T> {
  return Promise.race([
    promise,
    new Promise<T>((_, reject) => setTimeout(() => reject(new Error('no answer from Redis')), ms).unref()),
  ]);
}

/** Redis first, the process's own memory when Redis is away. */
export class FallbackRateLimitStore implements Store {
  private readonly memory = new MemoryStore();
  constructor(private readonly redis: RedisRateLimitStore) {}

  init(options: Options) {
    this.redis.init(options);
    this.memory.init(options);
  }

  async increment(key: string) {
    try {
      return await within(this.redis.increment(key), REDIS_ANSWER_MS);
    } catch {
      return this.memory.increment(key);
    }
  }

  async decrement(key: string) {
    await within(this.redis.decrement(key), REDIS_ANSWER_MS).catch(() => this.memory.decrement(key));
  }

  async resetKey(key: string) {
    await within(this.redis.resetKey(key), REDIS_ANSWER_MS).catch(() => this.memory.resetKey(key));
  }

  shutdown() {
    this.memory.shutdown();
  }
}

export interface LimitSpec {
  name: string;
  limit: number;
  windowMs: number;
  key: Options['keyGenerator'];
  message: string;
  code?: string;
  /** Count only refused attempts (a correct password does not use up the allowance). */
  failuresOnly?: boolean;
  /** With failuresOnly: which answers count as refused (default: any 4xx or 5xx). */
  refusedWhen?: (status: number) => boolean;
}

export function limiter(ctx: AppContext, spec: LimitSpec): RequestHandler {
  return rateLimit({
    windowMs: spec.windowMs,
    limit: spec.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: spec.name,
    store: new FallbackRateLimitStore(
      new RedisRateLimitStore(ctx.redis, `${ctx.config.REDIS_PREFIX}:rl:${spec.name}:`),
    ),
    keyGenerator: spec.key,
    skipSuccessfulRequests: spec.failuresOnly ?? false,
    ...(spec.refusedWhen ? { requestWasSuccessful: (_req, res) => !spec.refusedWhen!(res.statusCode) } : {}),
    passOnStoreError: false,
    handler: (_req, _res, next) => next(new AppError(429, spec.code ?? 'too_many_attempts', spec.message)),
  });
}

export const byAddress: NonNullable<Options['keyGenerator']> = (req) => ipKeyGenerator(req.ip ?? '');

const minutes = (ms: number) => Math.ceil(ms / 60_000);

/** Sign-in: per address and e-mail, per address (spraying), per account (from any address). */
export function signInLimits(ctx: AppContext): RequestHandler[] {
  const { config } = ctx;
  const windowMs = config.SIGN_IN_WINDOW_MINUTES * 60_000;
  const message = `Too many sign-in attempts. Wait ${minutes(windowMs)} minutes and try again.`;
  const email = (req: { body?: { email?: unknown } }) => String(req.body?.email ?? '').toLowerCase();
  return [
    limiter(ctx, {
      name: 'sign-in',
      limit: config.SIGN_IN_LIMIT,
      windowMs,
      message,
      key: (req) => `${ipKeyGenerator(req.ip ?? '')}:${email(req)}`,
    }),
    limiter(ctx, {
      name: 'sign-in-address',
      limit: config.SIGN_IN_ADDRESS_LIMIT,
      windowMs,
      message,
      failuresOnly: true,
      key: byAddress,
    }),
    limiter(ctx, {
      name: 'sign-in-account',
      limit: config.SIGN_IN_ACCOUNT_LIMIT,
      windowMs,
      message,
      failuresOnly: true,
      key: (req) => email(req),
    }),
  ];
}

/**
 * The decision's password step-up: wrong passwords per person (from any address), counted only
 * when the password is refused (401), so a 409 or 422 does not use up the allowance.
 */
export function stepUpLimit(ctx: AppContext): RequestHandler {
  const windowMs = ctx.config.SIGN_IN_WINDOW_MINUTES * 60_000;
  return limiter(ctx, {
    name: 'step-up',
    limit: ctx.config.STEP_UP_LIMIT,
    windowMs,
    failuresOnly: true,
    refusedWhen: (status) => status === 401,
    key: (req, res) => req.user?.id ?? byAddress(req, res),
    code: 'too_many_attempts',
    message: `Too many wrong passwords. Wait ${minutes(windowMs)} minutes, then confirm the decision again.`,
  });
}
