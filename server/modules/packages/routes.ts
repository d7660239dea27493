// Lift package routes. Thin: validate, call the service, answer.
import { Router } from 'express';
import { z } from 'zod';
import { PackageListQuery } from '@shared/schemas/packages';
import type { AppContext } from '../../context';
import { currentUser, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { getPackage, listPackages } from './service';

export const PackageIdParams = z.object({ id: z.uuid({ message: 'id must be a UUID' }) });

export function packageRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use('/packages', requireAuth(ctx.passport));

  router.get('/packages', validate({ query: PackageListQuery }), async (req, res) => {
    res.json(await listPackages(ctx.dataSource, currentUser(req), valid(req, 'query', PackageListQuery)));
  });

  router.get('/packages/:id', validate({ params: PackageIdParams }), async (req, res) => {
    const { id } = valid(req, 'params', PackageIdParams);
    res.json(await getPackage(ctx.dataSource, currentUser(req), id));
  });

  return router;
}
