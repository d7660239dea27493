// Desk administration routes (admins only) and the mail outbox.
import { Router } from 'express';
import { z } from 'zod';
import {
  InviteBody,
  OrganisationBody,
  OrganisationPatch,
  PersonPatch,
  PolicyOverridesBody,
  SiteBody,
  SitePatch,
  SiteReviewersBody,
} from '@shared/schemas/admin';
import { Role } from '@shared/schemas/common';
import { appUrl } from '../../config';
import type { AppContext } from '../../context';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { listCaught, listOutbox, retryMail } from '../mail/outbox';
import {
  createOrganisation,
  createSite,
  getPolicy,
  listOrganisations,
  listSites,
  renameOrganisation,
  setPolicy,
  setSiteReviewers,
  updateSite,
} from './service';
import { invitePerson, listPeople, reinvite, updatePerson } from './people';

export const IdParams = z.object({ id: z.uuid({ message: 'id must be a UUID' }) });
export const PeopleQuery = z.object({
  organisationId: z.uuid().optional(),
  role: Role.optional(),
  state: z.enum(['active', 'invited', 'invite_expired', 'deactivated']).optional(),
});
export const MailQuery = z.object({
  status: z.enum(['queued', 'sent', 'failed']).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'pageSize must be at most 200').default(50),
});

export function adminRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const inviteOpts = () => ({
    appUrl: appUrl(ctx.config),
    hours: ctx.config.INVITE_HOURS,
    secret: ctx.config.JWT_SECRET,
  });
  router.use('/admin', requireAuth(ctx.passport), requireRole('admin'));

  router.get('/admin/organisations', async (req, res) => {
    res.json(await listOrganisations(ds, currentActor(req)));
  });
  router.post('/admin/organisations', validate({ body: OrganisationBody }), async (req, res) => {
    res
      .status(201)
      .json(await createOrganisation(ds, currentActor(req), valid(req, 'body', OrganisationBody)));
  });
  router.patch(
    '/admin/organisations/:id',
    validate({ params: IdParams, body: OrganisationPatch }),
    async (req, res) => {
      const { id } = valid(req, 'params', IdParams);
      res.json(
        await renameOrganisation(ds, currentActor(req), id, valid(req, 'body', OrganisationPatch).name),
      );
    },
  );

  router.get('/admin/sites', async (req, res) => {
    res.json(await listSites(ds, currentActor(req)));
  });
  router.post('/admin/sites', validate({ body: SiteBody }), async (req, res) => {
    res.status(201).json(await createSite(ds, currentActor(req), valid(req, 'body', SiteBody)));
  });
  router.patch('/admin/sites/:id', validate({ params: IdParams, body: SitePatch }), async (req, res) => {
    const { id } = valid(req, 'params', IdParams);
    res.json(await updateSite(ds, currentActor(req), id, valid(req, 'body', SitePatch)));
  });
  router.put(
    '/admin/sites/:id/reviewers',
    validate({ params: IdParams, body: SiteReviewersBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', IdParams);
      res.json(
        await setSiteReviewers(ds, currentActor(req), id, valid(req, 'body', SiteReviewersBody).userIds),
      );
    },
  );
  router.get('/admin/sites/:id/policy', validate({ params: IdParams }), async (req, res) => {
    res.json(await getPolicy(ds, currentActor(req), valid(req, 'params', IdParams).id));
  });
  router.put(
    '/admin/sites/:id/policy',
    validate({ params: IdParams, body: PolicyOverridesBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', IdParams);
      res.json(await setPolicy(ds, currentActor(req), id, valid(req, 'body', PolicyOverridesBody).overrides));
    },
  );

  router.get('/admin/people', validate({ query: PeopleQuery }), async (req, res) => {
    res.json(await listPeople(ds, currentActor(req), valid(req, 'query', PeopleQuery)));
  });
  router.post('/admin/people/invite', validate({ body: InviteBody }), async (req, res) => {
    res
      .status(201)
      .json(
        await invitePerson(ds, ctx.queues, currentActor(req), valid(req, 'body', InviteBody), inviteOpts()),
      );
  });
  router.post('/admin/people/:id/reinvite', validate({ params: IdParams }), async (req, res) => {
    res.json(
      await reinvite(ds, ctx.queues, currentActor(req), valid(req, 'params', IdParams).id, inviteOpts()),
    );
  });
  router.patch('/admin/people/:id', validate({ params: IdParams, body: PersonPatch }), async (req, res) => {
    const { id } = valid(req, 'params', IdParams);
    res.json(await updatePerson(ds, currentActor(req), id, valid(req, 'body', PersonPatch)));
  });

  // The outbox: what the desk sent, queued or failed (with the error), and for the embedded
  // set-up what the local fake SMTP server received. Mail of the admin's desk only.
  router.get('/admin/mail', validate({ query: MailQuery }), async (req, res) => {
    res.json(await listOutbox(ds, currentActor(req), valid(req, 'query', MailQuery)));
  });
  router.get('/admin/mail/caught', async (req, res) => {
    res.json(await listCaught(ds, currentActor(req)));
  });
  router.post('/admin/mail/:id/retry', validate({ params: IdParams }), async (req, res) => {
    const { id } = valid(req, 'params', IdParams);
    res.status(202).json(await retryMail(ds, ctx.queues, currentActor(req), id));
  });

  return router;
}
