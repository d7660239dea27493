// The signed-in person's hand-offs and the live stream of changes their pages show.
import { Router, type Request, type Response } from 'express';
import { MarkHandOffsRead } from '@shared/schemas/hand-offs';
import type { AppContext } from '../../context';
import { currentActor, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { listHandOffs, markHandOffsRead } from './hand-offs';
import { LiveHub, type LiveSubscriber } from './hub';

/** A comment line every so often keeps proxies from closing a quiet stream. */
const KEEP_ALIVE_MS = 25_000;

export function liveRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const hub = new LiveHub(ctx.config.DATABASE_URL);

  router.get('/hand-offs', requireAuth(ctx.passport), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(await listHandOffs(ds, currentActor(req)));
  });

  router.post(
    '/hand-offs/read',
    requireAuth(ctx.passport),
    validate({ body: MarkHandOffsRead }),
    async (req, res) => {
      res.json(await markHandOffsRead(ds, currentActor(req), valid(req, 'body', MarkHandOffsRead)));
    },
  );

  router.get('/live', requireAuth(ctx.passport), async (req: Request, res: Response) => {
    const actor = currentActor(req);
    const sites =
      actor.role === 'reviewer'
        ? new Set(
            (
              (await ds.query(`SELECT site_id FROM site_members WHERE user_id = $1`, [actor.id])) as Array<{
                site_id: string;
              }>
            ).map((r) => r.site_id),
          )
        : new Set<string>();
    res.status(200);
    res.setHeader('Content-Type', 'text/event-stream; charset=utf-8');
    res.setHeader('Cache-Control', 'no-store, no-transform');
    res.setHeader('X-Accel-Buffering', 'no');
    res.flushHeaders();
    // A browser that loses the stream tries again after this long.
    res.write('retry: 3000\n\n');
    const subscriber: LiveSubscriber = {
      actor,
      sites,
      send: (event, data) => res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`),
      end: () => res.end(),
    };
    const keepAlive = setInterval(() => res.write(': still here\n\n'), KEEP_ALIVE_MS);
    keepAlive.unref();
    let unsubscribe: (() => void) | null = null;
    req.on('close', () => {
      clearInterval(keepAlive);
      unsubscribe?.();
      unsubscribe = null;
    });
    try {
      unsubscribe = await hub.subscribe(subscriber);
      if (req.destroyed) {
        unsubscribe();
        unsubscribe = null;
        return;
      }
      res.write('event: ready\ndata: {}\n\n');
    } catch {
      clearInterval(keepAlive);
      res.end();
    }
  });

  return router;
}
