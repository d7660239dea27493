// Review routes: engineers to assign, assignment, markups, findings, accepted figures,
// the decision, the next revision and the difference between revisions.
import { Router } from 'express';
import { z } from 'zod';
import {
  AcceptFigureBody,
  AssignBody,
  DecisionBody,
  FindingBody,
  FindingUpdateBody,
  MarkupBody,
} from '@shared/schemas/reviews';
import { appUrl } from '../../config';
import type { AppContext } from '../../context';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { stepUpLimit } from '../auth/rate-limits';
import { PackageIdParams } from '../packages/routes';
import { assignmentHistory } from './assignments';
import { packageDetail } from '../packages/service';
import { compareRevisions } from './compare';
import { acceptFigure, addFinding, listFindings, updateFinding } from './findings';
import { addMarkup, deleteMarkup, listMarkups } from './markups';
import { assignEngineer, listEngineers, recordDecision, startNextRevision } from './service';
import { getStampPlacement, placeStamp, resetStampPlacement } from './stamp-placement';
import { StampPlacementBody } from '@shared/schemas/stamp-placement';

export const MarkupParams = PackageIdParams.extend({
  markupId: z.uuid({ message: 'markupId must be a UUID' }),
});
export const FindingParams = PackageIdParams.extend({
  findingId: z.uuid({ message: 'findingId must be a UUID' }),
});
export const MarkupQuery = z.object({ revision: z.coerce.number().int().min(1).max(1000).optional() });
export const CompareQuery = z.object({
  from: z.coerce.number().int().min(1, 'from must be a revision number'),
  to: z.coerce.number().int().min(1, 'to must be a revision number'),
});

export function reviewRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const auth = requireAuth(ctx.passport);
  const stepUp = stepUpLimit(ctx);

  router.get('/engineers', auth, requireRole('reviewer', 'admin'), async (req, res) => {
    res.json(await listEngineers(ds, currentActor(req)));
  });

  router.post(
    '/assignments',
    auth,
    requireRole('reviewer'),
    validate({ body: AssignBody }),
    async (req, res) => {
      const body = valid(req, 'body', AssignBody);
      res.json(
        await assignEngineer(
          ds,
          ctx.queues,
          currentActor(req),
          body.packageIds,
          body.engineerId,
          appUrl(ctx.config),
          body.note,
        ),
      );
    },
  );

  router.get(
    '/packages/:id/assignments',
    auth,
    requireRole('reviewer', 'engineer', 'admin'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.json(await assignmentHistory(ds, currentActor(req), id));
    },
  );

  router.get(
    '/packages/:id/markups',
    auth,
    validate({ params: PackageIdParams, query: MarkupQuery }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.json(await listMarkups(ds, currentActor(req), id, valid(req, 'query', MarkupQuery).revision));
    },
  );

  router.post(
    '/packages/:id/markups',
    auth,
    requireRole('engineer'),
    validate({ params: PackageIdParams, body: MarkupBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.status(201).json(await addMarkup(ds, currentActor(req), id, valid(req, 'body', MarkupBody)));
    },
  );

  router.delete(
    '/packages/:id/markups/:markupId',
    auth,
    requireRole('engineer'),
    validate({ params: MarkupParams }),
    async (req, res) => {
      const { id, markupId } = valid(req, 'params', MarkupParams);
      await deleteMarkup(ds, currentActor(req), id, markupId);
      res.status(204).end();
    },
  );

  router.get(
    '/packages/:id/stamp-placement',
    auth,
    requireRole('engineer', 'reviewer'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.json(await getStampPlacement(ds, ctx.storage, currentActor(req), id));
    },
  );

  router.put(
    '/packages/:id/stamp-placement',
    auth,
    requireRole('engineer'),
    validate({ params: PackageIdParams, body: StampPlacementBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.json(
        await placeStamp(ds, ctx.storage, currentActor(req), id, valid(req, 'body', StampPlacementBody)),
      );
    },
  );

  router.delete(
    '/packages/:id/stamp-placement',
    auth,
    requireRole('engineer'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.json(await resetStampPlacement(ds, ctx.storage, currentActor(req), id));
    },
  );

  router.get('/packages/:id/findings', auth, validate({ params: PackageIdParams }), async (req, res) => {
    res.json(await listFindings(ds, currentActor(req), valid(req, 'params', PackageIdParams).id));
  });

  router.post(
    '/packages/:id/findings',
    auth,
    requireRole('engineer'),
    validate({ params: PackageIdParams, body: FindingBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      res.status(201).json(await addFinding(ds, currentActor(req), id, valid(req, 'body', FindingBody)));
    },
  );

  router.patch(
    '/packages/:id/findings/:findingId',
    auth,
    requireRole('engineer', 'contractor'),
    validate({ params: FindingParams, body: FindingUpdateBody }),
    async (req, res) => {
      const { id, findingId } = valid(req, 'params', FindingParams);
      res.json(
        await updateFinding(ds, currentActor(req), id, findingId, valid(req, 'body', FindingUpdateBody), {
          queues: ctx.queues,
          appUrl: appUrl(ctx.config),
        }),
      );
    },
  );

  router.post(
    '/packages/:id/accepted-figures',
    auth,
    requireRole('engineer'),
    validate({ params: PackageIdParams, body: AcceptFigureBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      const body = valid(req, 'body', AcceptFigureBody);
      await acceptFigure(ds, currentActor(req), id, body.figure, body.reason);
      res.json(await packageDetail(ds, id, currentActor(req)));
    },
  );

  router.post(
    '/packages/:id/decision',
    auth,
    requireRole('engineer'),
    stepUp,
    validate({ params: PackageIdParams, body: DecisionBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      await recordDecision(
        ds,
        ctx.queues,
        currentActor(req),
        id,
        valid(req, 'body', DecisionBody),
        appUrl(ctx.config),
      );
      res.json(await packageDetail(ds, id, currentActor(req)));
    },
  );

  router.post(
    '/packages/:id/revisions',
    auth,
    requireRole('contractor'),
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      await startNextRevision(ds, currentActor(req), id);
      res.status(201).json(await packageDetail(ds, id, currentActor(req)));
    },
  );

  router.get(
    '/packages/:id/compare',
    auth,
    validate({ params: PackageIdParams, query: CompareQuery }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      const { from, to } = valid(req, 'query', CompareQuery);
      res.json(await compareRevisions(ds, currentActor(req), id, from, to));
    },
  );

  return router;
}
