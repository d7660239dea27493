// Desk administration (admins only): the organisations, sites and people of the desk.
// Admins manage their own organisation's sites and the organisations that work on them.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context';
import { currentUser, requireAuth, requireRole } from '../../middleware/auth';
import { Organisation } from '../organisations/organisation.entity';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';

export const OrganisationList = z.object({
  items: z.array(
    z.object({
      id: z.uuid(),
      name: z.string(),
      kind: z.enum(['contractor', 'owner']),
      people: z.number().int(),
    }),
  ),
});

export function adminRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use('/admin', requireAuth(ctx.passport), requireRole('admin'));

  router.get('/admin/organisations', async (req, res) => {
    const me = currentUser(req);
    // The admin's own organisation and every contractor that has a package on its sites.
    const rows = await ctx.dataSource
      .getRepository(Organisation)
      .createQueryBuilder('o')
      .leftJoin(User, 'u', 'u.organisation_id = o.id')
      .select(['o.id AS id', 'o.name AS name', 'o.kind AS kind', 'count(u.id)::int AS people'])
      .where('o.id = :org', { org: me.organisationId })
      .orWhere(
        `o.id IN (SELECT lp.contractor_organisation_id FROM lift_packages lp JOIN sites s ON s.id = lp.site_id
                 WHERE s.owner_organisation_id = :org)`,
        { org: me.organisationId },
      )
      .groupBy('o.id')
      .orderBy('o.name')
      .getRawMany();
    res.json({ items: rows });
  });

  router.get('/admin/sites', async (req, res) => {
    const sites = await ctx.dataSource
      .getRepository(Site)
      .find({ where: { ownerOrganisationId: currentUser(req).organisationId }, order: { name: 'ASC' } });
    res.json({ items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, timeZone: s.timeZone })) });
  });

  return router;
}
