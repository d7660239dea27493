// GET /api/sites: the sites a person works with (sitesFor in service.ts says which).
import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentActor, requireAuth } from '../../middleware/auth';
import { sitesFor } from './service';

export function siteRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/sites', requireAuth(ctx.passport), async (req, res) => {
    res.json(await sitesFor(ctx.dataSource, currentActor(req)));
  });
  return router;
}
