// The review's shared checks: only the assigned engineer, only a submitted revision, the
// package while it is with the engineer, and nothing of a revision once its stamped return is
// requested. Used by the review, markup and finding services and by the return.
// Every change runs with the package row locked (underReview), so a decision, a reassignment,
// an edit and the issue of the return happen one after the other, each seeing the last.
import type { Actor } from '@shared/rules/actor';
import { returnRefusal, type PackageAction } from '@shared/rules/package-status';
import type { DataSource, EntityManager } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage, scopedPackages } from '../packages/package-scope';
import { requireState } from '../packages/state-guard';
import { StampedReturn } from './review.entity';

export function requireAssignedEngineer(user: Actor, pkg: LiftPackage) {
  if (user.role !== 'engineer' || pkg.assignedEngineerId !== user.id) {
    throw AppError.forbidden('Only the engineer of record assigned to this package can do this.');
  }
}

function requireSubmitted(revision: Revision) {
  if (revision.state !== 'submitted')
    throw new AppError(409, 'not_submitted', `Revision ${revision.number} is still a draft.`);
}

/**
 * The package in the user's scope, read and locked (FOR UPDATE) in the caller's transaction;
 * null when it is not (or no longer) in their scope. Only the package row is locked: TypeORM
 * cannot lock a query with joins or DISTINCT, and the scope needs neither.
 */
export async function lockPackage(m: EntityManager, user: Actor, packageId: string) {
  return scopedPackages(m, user)
    .andWhere('p.id = :id', { id: packageId })
    .setLock('pessimistic_write')
    .getOne();
}

/** Whether a stamped return has been requested for the revision (pending, ready or failed). */
async function returnRequested(m: EntityManager, revisionId: string): Promise<boolean> {
  return m.getRepository(StampedReturn).existsBy({ revisionId });
}

/** 409 `return_issued` when the action changes what the revision's requested return is built from. */
async function requireNotIssued(m: EntityManager, revision: Revision, action: PackageAction, what: string) {
  const refusal = returnRefusal(action, await returnRequested(m, revision.id), revision.number, what);
  if (refusal) throw new AppError(409, 'return_issued', refusal);
}

/**
 * Runs an engineer's change to the current revision in one transaction, with the package
 * locked and every check made again under the lock: in scope and still theirs (409
 * `reassigned` when a reviewer reassigned it meanwhile), no return requested for the revision
 * (409 `return_issued`), the status allows the action (409 `code`), the revision submitted.
 */
export async function underReview<T>(
  ds: DataSource,
  user: Actor,
  packageId: string,
  action: PackageAction,
  what: string,
  work: (m: EntityManager, pkg: LiftPackage, revision: Revision) => Promise<T>,
  code = 'review_closed',
): Promise<T> {
  // Outside the lock first, for the plain answers: 404 outside the scope, 403 not theirs.
  requireAssignedEngineer(user, await findScopedPackage(ds.manager, user, packageId));
  return ds.transaction(async (m) => {
    const pkg = await lockPackage(m, user, packageId);
    if (!pkg || pkg.assignedEngineerId !== user.id) {
      throw new AppError(
        409,
        'reassigned',
        'This package was reassigned to another engineer while you worked on it; nothing was saved.',
      );
    }
    const revision = await m
      .getRepository(Revision)
      .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
    await requireNotIssued(m, revision, action, what);
    requireState(action, pkg.status, what, code);
    requireSubmitted(revision);
    return work(m, pkg, revision);
  });
}
