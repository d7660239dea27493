// The sites a person works with. Contractors may submit to any site of the desk they were added
// to (any site when they were not); reviewers see the sites they serve; engineers and admins
// their owner's sites.
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import { Site } from './site.entity';

export async function sitesFor(ds: DataSource, user: Actor) {
  const qb = ds
    .getRepository(Site)
    .createQueryBuilder('s')
    .leftJoinAndSelect('s.owner', 'o')
    .orderBy('s.name');
  if (user.role === 'contractor') {
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
  return { items: sites.map((s) => ({ id: s.id, name: s.name, code: s.code, owner: s.owner?.name ?? '' })) };
}
