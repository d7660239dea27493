// The review's shared checks: only the assigned engineer, only a submitted revision, and
// the package while it is with the engineer. Used by the review, markup and finding services.
import type { Actor } from '@shared/rules/actor';
import type { PackageAction } from '@shared/rules/package-status';
import type { DataSource, EntityManager } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { requireState } from '../packages/state-guard';

export function requireAssignedEngineer(user: Actor, pkg: LiftPackage) {
  if (user.role !== 'engineer' || pkg.assignedEngineerId !== user.id) {
    throw AppError.forbidden('Only the engineer of record assigned to this package can do this.');
  }
}

export async function currentSubmittedRevision(m: EntityManager, pkg: LiftPackage) {
  const revision = await m
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  if (revision.state !== 'submitted')
    throw new AppError(409, 'not_submitted', `Revision ${revision.number} is still a draft.`);
  return revision;
}

/** The package as its assigned engineer works on it: in scope, theirs, and still with them. */
export async function packageUnderReview(
  ds: DataSource,
  user: Actor,
  packageId: string,
  action: PackageAction,
  what: string,
) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  requireAssignedEngineer(user, pkg);
  requireState(action, pkg.status, what, 'review_closed');
  return pkg;
}
