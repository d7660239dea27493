// Stamped returns: the reviewer issues one (a job builds it), anyone on the package
// follows its progress and downloads it when ready.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { sendStored } from '../../lib/send-stored';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { PackageIdParams } from '../packages/routes';
import { previewReturn } from './preview';
import { issueReturn, listReturns, readReturn } from './service';
import { appUrl } from '../../config';

export const ReturnParams = PackageIdParams.extend({
  returnId: z.uuid({ message: 'returnId must be a UUID' }),
});

export function returnRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const auth = requireAuth(ctx.passport);

  router.post(
    '/packages/:id/returns',
    auth,
    requireRole('reviewer'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      res
        .status(202)
        .json(await issueReturn(ds, ctx.queues, currentActor(req), valid(req, 'params', PackageIdParams).id));
    },
  );

  // Page 1 as it will print, for the coordinator to confirm before issuing: built, never stored.
  router.get(
    '/packages/:id/returns/preview',
    auth,
    requireRole('reviewer'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      const pdf = await previewReturn(ds, ctx.storage, currentActor(req), id, appUrl(ctx.config));
      res
        .status(200)
        .set({
          'Content-Type': 'application/pdf',
          'Content-Disposition': 'inline; filename="stamped-return-preview.pdf"',
          'Cache-Control': 'no-store',
        })
        .send(pdf);
    },
  );

  router.get('/packages/:id/returns', auth, validate({ params: PackageIdParams }), async (req, res) => {
    res.json(await listReturns(ds, currentActor(req), valid(req, 'params', PackageIdParams).id));
  });

  router.get(
    '/packages/:id/returns/:returnId/file',
    auth,
    validate({ params: ReturnParams }),
    async (req, res) => {
      const { id, returnId } = valid(req, 'params', ReturnParams);
      const { ret, storageKey, fileName } = await readReturn(ds, currentActor(req), id, returnId);
      await sendStored(req, res, ctx.storage, {
        key: storageKey,
        contentType: 'application/pdf',
        disposition: `inline; filename="${fileName}"`,
        sha256: ret.sha256,
        what: 'stamped return',
      });
    },
  );
  return router;
}
