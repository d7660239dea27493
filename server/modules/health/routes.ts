// GET /api/health: the database and the queue's Redis, each with a short timeout; 503
// when either is down so a load balancer takes the process out of rotation, with the same
// error code every other route answers during that outage. The driver's error text (host,
// port, user) goes to the log, never into the public answer.
import { Router } from 'express';
import type { AppContext } from '../../context';
import { logger } from '../../lib/logger';

function withTimeout<T>(promise: Promise<T>, ms: number): Promise<T> {
  return Promise.race([
    promise,
    new Promise<T>((_, reject) => setTimeout(() => reject(new Error(`timed out after ${ms} ms`)), ms)),
  ]);
}

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const probe = (what: string, check: Promise<unknown>) =>
      withTimeout(check, 2000).then(
        () => ({ ok: true }),
        (e: Error) => {
          logger.warn({ err: e, probe: what }, 'health probe failed');
          return { ok: false, error: 'not answering' };
        },
      );
    const [database, queue] = await Promise.all([
      probe('database', ctx.dataSource.query('SELECT 1')),
      probe('queue', ctx.redis.ping()),
    ]);
    const ok = database.ok && queue.ok;
    const error = !database.ok
      ? { code: 'database_unavailable', message: 'The database is not answering.' }
      : !queue.ok
        ? { code: 'queue_unavailable', message: 'The job queue (Redis) is not answering.' }
        : undefined;
    res
      .status(ok ? 200 : 503)
      .json({ status: ok ? 'ok' : 'degraded', database, queue, ...(error ? { error } : {}) });
  });
  return router;
}
