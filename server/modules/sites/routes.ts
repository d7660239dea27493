// GET /api/sites: the sites a person works with. Contractors may submit to any site of
// the desk; reviewers see the sites they serve; engineers and admins their owner's sites.
import { Router } from 'express';
import type { AppContext } from '../../context';
import { currentActor, requireAuth } from '../../middleware/auth';
import { Site } from './site.entity';

export function siteRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/sites', requireAuth(ctx.passport), async (req, res) => {
    const user = currentActor(req);
    const qb = ctx.dataSource
      .getRepository(Site)
      .createQueryBuilder('s')
      .leftJoinAndSelect('s.owner', 'o')
      .orderBy('s.name');
    if (user.role === 'contractor') {
      // A contractor submits to the sites of the desk it was added to (any site when it was not).
      qb.where(
        `s.owner_organisation_id = coalesce((SELECT o.desk_owner_id FROM organisations o WHERE o.id = :org), s.owner_organisation_id)`,
        { org: user.organisationId },
      );
    } else if (user.role === 'reviewer') {
      qb.where('s.id IN (SELECT sm.site_id FROM site_members sm WHERE sm.user_id = :u)', { u: user.id });
    } else {
      qb.where('s.owner_organisation_id = :org', { org: user.organisationId });
    }
    const sites = await qb.getMany();
    res.json({
      items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, owner: s.owner?.name ?? '' })),
    });
  });
  return router;
}
