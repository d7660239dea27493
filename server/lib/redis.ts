// Redis connections. BullMQ workers need maxRetriesPerRequest: null; short-lived
// commands (health, rate limits) fail fast instead.
import { Redis } from 'ioredis';

export function createRedis(url: string, opts: { forWorker?: boolean } = {}): Redis {
  return new Redis(url, {
    maxRetriesPerRequest: opts.forWorker ? null : 2,
    enableOfflineQueue: opts.forWorker ? true : false,
    lazyConnect: true,
    connectTimeout: 5000,
  });
}
