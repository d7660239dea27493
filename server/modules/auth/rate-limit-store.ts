// An express-rate-limit store on Redis, so several API processes share one count.
import type { IncrementResponse, Options, Store } from 'express-rate-limit';
import type { Redis } from 'ioredis';

export class RedisRateLimitStore implements Store {
  private windowMs = 60_000;
  constructor(
    private readonly redis: Redis,
    readonly prefix: string,
  ) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const k = this.prefix + key;
    const results = await this.redis.multi().incr(k).pttl(k).exec();
    const totalHits = Number(results?.[0]?.[1] ?? 1);
    let ttl = Number(results?.[1]?.[1] ?? -1);
    if (ttl < 0) {
      await this.redis.pexpire(k, this.windowMs);
      ttl = this.windowMs;
    }
    return { totalHits, resetTime: new Date(Date.now() + ttl) };
  }

  async decrement(key: string) {
    await this.redis.decr(this.prefix + key);
  }

  async resetKey(key: string) {
    await this.redis.del(this.prefix + key);
  }
}
