// The check run of a package's current revision: where it is (for the package page) and
// "run the check again" after it could not run (contractor or reviewer). Thin routes.
import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { PackageIdParams } from '../packages/routes';
import { checkRunStatus, retryCheck } from './service';

export function checkRunRoutes(ctx: AppContext): Router {
  const router = Router();
  const auth = requireAuth(ctx.passport);
  router.get('/packages/:id/check-run', auth, validate({ params: PackageIdParams }), async (req, res) => {
    const { id } = valid(req, 'params', PackageIdParams);
    res.json(await checkRunStatus(ctx.dataSource, ctx.queues, currentActor(req), id));
  });
  router.post(
    '/packages/:id/check-run/retry',
    auth,
    requireRole('contractor', 'reviewer'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.status(202).json(await retryCheck(ctx.dataSource, ctx.queues, currentActor(req), id));
    },
  );
  return router;
}
