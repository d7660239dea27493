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
import { AppError } from '../../lib/app-error';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { handOff, mailIntent, nextRound, recordIntent } from '../jobs/intents';
import { MailMessage } from '../mail/mail.entity';
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

/**
 * An invitation link works once, for the person invited: the admin reading caught mail sees
 * that a link was sent, not the link itself.
 */
export function hideInviteLinks(text: string): string {
  return text.replace(/\/invite\/[A-Za-z0-9_-]+/g, '/invite/[link sent to the recipient]');
}

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
    const q = valid(req, 'query', MailQuery);
    const org = currentActor(req).organisationId;
    const qb = ds
      .getRepository(MailMessage)
      .createQueryBuilder('mm')
      .leftJoin('users', 'u', 'u.id = mm.recipient_id')
      .leftJoin('organisations', 'o', 'o.id = u.organisation_id')
      .where('(u.organisation_id = :org OR o.desk_owner_id = :org)', { org })
      .orderBy('mm.created_at', 'DESC')
      .skip((q.page - 1) * q.pageSize)
      .take(q.pageSize);
    if (q.status) qb.andWhere('mm.status = :status', { status: q.status });
    const [rows, total] = await qb.getManyAndCount();
    res.json({
      total,
      items: rows.map((m) => ({
        id: m.id,
        event: m.event,
        to: m.toAddress,
        subject: m.subject,
        status: m.status,
        attempts: m.attempts,
        lastError: m.lastError,
        packageId: m.packageId,
        createdAt: m.createdAt.toISOString(),
        sentAt: m.sentAt?.toISOString() ?? null,
      })),
    });
  });

  router.get('/admin/mail/caught', async (req, res) => {
    const org = currentActor(req).organisationId;
    const rows: Array<{
      id: string;
      envelope_from: string;
      envelope_to: string[];
      subject: string;
      text_body: string;
      html_body: string | null;
      received_at: Date;
    }> = await ds.query(
      `SELECT c.* FROM caught_mail c
         WHERE EXISTS (SELECT 1 FROM users u JOIN organisations o ON o.id = u.organisation_id
                       WHERE lower(u.email) = ANY (SELECT lower(x) FROM unnest(c.envelope_to) x)
                         AND (u.organisation_id = $1 OR o.desk_owner_id = $1))
         ORDER BY c.received_at DESC LIMIT 200`,
      [org],
    );
    res.json({
      items: rows.map((r) => ({
        id: r.id,
        from: r.envelope_from,
        to: r.envelope_to,
        subject: r.subject,
        text: hideInviteLinks(r.text_body),
        html: r.html_body === null ? null : hideInviteLinks(r.html_body),
        receivedAt: new Date(r.received_at).toISOString(),
      })),
    });
  });

  router.post('/admin/mail/:id/retry', validate({ params: IdParams }), async (req, res) => {
    const { id } = valid(req, 'params', IdParams);
    // The same desk filter as the outbox: another desk's message is a plain 404.
    const org = currentActor(req).organisationId;
    const msg = await ds
      .getRepository(MailMessage)
      .createQueryBuilder('mm')
      .leftJoin('users', 'u', 'u.id = mm.recipient_id')
      .leftJoin('organisations', 'o', 'o.id = u.organisation_id')
      .where('mm.id = :id AND mm.status = :status', { id, status: 'failed' })
      .andWhere('(u.organisation_id = :org OR o.desk_owner_id = :org)', { org })
      .getOne();
    if (!msg) throw AppError.notFound('failed message');
    // Through the job hand-off: the intent is written with the status, a new round gets a job id
    // of its own (the failed job keeps the old one), and a dead Redis leaves it to the relay.
    const intent = await ds.transaction(async (m) => {
      await m.getRepository(MailMessage).update(id, { status: 'queued' });
      const next = mailIntent(id, await nextRound(m, 'mail', id));
      await recordIntent(m, next);
      return next;
    });
    await handOff(ctx.queues, [intent]);
    res.status(202).json({ id, status: 'queued' });
  });

  return router;
}
