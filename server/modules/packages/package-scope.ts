// Organisation isolation in one place. Every read or write of a lift package starts from
// scopedPackages(): contractors see their organisation's packages, reviewers the packages
// of the sites they serve, engineers the packages assigned to them, admins the packages
// of sites their organisation owns. Anything outside the scope is "not found" (404), so
// a guessed id tells nothing.
import type { Actor } from '@shared/rules/actor';
import type { EntityManager, SelectQueryBuilder } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { LiftPackage } from './package.entity';
import { PackageStatusCount } from './package-status-count.entity';

/** A package that was never submitted is the contractor's alone; a later revision in draft is not. */
const NOT_FIRST_DRAFT = (alias: string) =>
  `NOT (${alias}.status = 'draft' AND ${alias}.current_revision = 1)`;

export function scopedPackages(
  manager: EntityManager,
  user: Actor,
  alias = 'p',
): SelectQueryBuilder<LiftPackage> {
  const qb = manager.getRepository(LiftPackage).createQueryBuilder(alias);
  switch (user.role) {
    case 'contractor':
      return qb.where(`${alias}.contractor_organisation_id = :scopeOrg`, { scopeOrg: user.organisationId });
    case 'reviewer':
      return qb
        .where(`${alias}.site_id IN (SELECT sm.site_id FROM site_members sm WHERE sm.user_id = :scopeUser)`, {
          scopeUser: user.id,
        })
        .andWhere(NOT_FIRST_DRAFT(alias));
    case 'engineer':
      return qb
        .where(`${alias}.assigned_engineer_id = :scopeUser`, { scopeUser: user.id })
        .andWhere(NOT_FIRST_DRAFT(alias));
    case 'admin':
      return qb
        .where(`${alias}.site_id IN (SELECT s.id FROM sites s WHERE s.owner_organisation_id = :scopeOrg)`, {
          scopeOrg: user.organisationId,
        })
        .andWhere(NOT_FIRST_DRAFT(alias));
  }
}

/**
 * The kept counts (package_status_counts, one row per site, contractor, status and first draft)
 * of the packages in the same scope as scopedPackages(): the counts above a list, summed by status,
 * without reading the packages. Engineers have no kept counts (theirs are per assignment).
 */
export function scopedStatusCounts(
  manager: EntityManager,
  user: Actor,
): SelectQueryBuilder<PackageStatusCount> | null {
  const qb = manager.getRepository(PackageStatusCount).createQueryBuilder('c');
  switch (user.role) {
    case 'contractor':
      return qb.where('c.contractor_organisation_id = :scopeOrg', { scopeOrg: user.organisationId });
    case 'reviewer':
      return qb
        .where('c.site_id IN (SELECT sm.site_id FROM site_members sm WHERE sm.user_id = :scopeUser)', {
          scopeUser: user.id,
        })
        .andWhere('NOT c.first_draft');
    case 'engineer':
      return null;
    case 'admin':
      return qb
        .where('c.site_id IN (SELECT s.id FROM sites s WHERE s.owner_organisation_id = :scopeOrg)', {
          scopeOrg: user.organisationId,
        })
        .andWhere('NOT c.first_draft');
  }
}

/** One package the user may see, or a 404. */
export async function findScopedPackage(
  manager: EntityManager,
  user: Actor,
  id: string,
): Promise<LiftPackage> {
  const found = await scopedPackages(manager, user).andWhere('p.id = :id', { id }).getOne();
  if (!found) throw AppError.notFound('lift package');
  return found;
}
