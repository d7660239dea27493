// The review: reviewers assign engineers; the assigned engineer marks up pages, raises
// findings, accepts contractor figures with a reason and records the decision; the
// contractor answers findings and starts the next revision. Every change is audited.
// Markups: markups.ts; findings and accepted figures: findings.ts; shared checks: review-scope.ts.
import type { Actor } from '@shared/rules/actor';
import { actionAllowed, stateRefusal } from '@shared/rules/package-status';
import type { DataSource, EntityManager } from 'typeorm';
import { IsNull } from 'typeorm';
import type { DecisionBody } from '@shared/schemas/reviews';
import { AppError } from '../../lib/app-error';
import type { Queues } from '../../lib/queues';
import { recordAudit } from '../audit/service';
import { dispatchMail, stageMail, type MailDraft } from '../mail/service';
import { stageDecisionMail } from './hand-off-mail';
import { templates } from '../mail/templates';
import { Site } from '../sites/site.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage, scopedPackages } from '../packages/package-scope';
import { requireState } from '../packages/state-guard';
import { User } from '../users/user.entity';
import { Assignment, DecisionRecord } from './review.entity';
import { carryLibraryUses } from '../library/uses';
import { carryFiles } from '../files/service';
import { lockPackage, requireAssignedEngineer, underReview } from './review-scope';
import { confirmPassword, madeOn, passGate } from './decision-gate';

// ---- assignment -------------------------------------------------------------------------

export async function listEngineers(ds: DataSource, user: Actor) {
  const engineers = await ds.getRepository(User).find({
    where: { organisationId: user.organisationId, role: 'engineer', active: true },
    order: { name: 'ASC' },
  });
  const load = await ds.query(
    `SELECT assigned_engineer_id AS id, count(*)::int AS n FROM lift_packages
     WHERE status IN ('with_engineer', 'checking') AND assigned_engineer_id = ANY($1) GROUP BY assigned_engineer_id`,
    [engineers.map((e) => e.id)],
  );
  const byId = new Map<string, number>(load.map((r: { id: string; n: number }) => [r.id, r.n]));
  return {
    items: engineers.map((e) => ({
      id: e.id,
      name: e.name,
      email: e.email,
      openPackages: byId.get(e.id) ?? 0,
    })),
  };
}

export async function assignEngineer(
  ds: DataSource,
  queues: Queues,
  user: Actor,
  packageIds: string[],
  engineerId: string,
  appUrl: string,
  note?: string,
) {
  if (user.role !== 'reviewer') throw AppError.forbidden('Only a reviewer assigns engineers.');
  const engineer = await ds
    .getRepository(User)
    .findOneBy({ id: engineerId, role: 'engineer', active: true, organisationId: user.organisationId });
  if (!engineer)
    throw AppError.badRequest('engineerId: no such engineer in your organisation', [
      { path: 'engineerId', message: 'engineerId must be an active engineer of your organisation' },
    ]);
  const outcome = await ds.transaction(async (m) => {
    const mail: MailDraft[] = [];
    // Locked in id order (two reviewers' overlapping batches cannot deadlock), so a decision
    // recorded meanwhile is seen here and the package's status is the one it has now.
    const packages = await scopedPackages(m, user)
      .andWhere('p.id IN (:...ids)', { ids: packageIds })
      .orderBy('p.id')
      .setLock('pessimistic_write')
      .getMany();
    const found = new Set(packages.map((p) => p.id));
    const missing = packageIds.filter((id) => !found.has(id));
    if (missing.length) throw AppError.notFound(`lift package ${missing[0]}`);
    const refused = packages.filter((p) => !actionAllowed('assign_engineer', p.status));
    if (refused.length) {
      throw new AppError(
        409,
        'not_assignable',
        refused
          .map(
            (p) =>
              `${p.reference}: ${stateRefusal('assign_engineer', p.status, 'An engineer can be assigned')}`,
          )
          .join(' '),
      );
    }
    for (const pkg of packages) {
      if (pkg.assignedEngineerId === engineer.id) continue;
      await m
        .getRepository(Assignment)
        .update({ packageId: pkg.id, endedAt: IsNull() }, { endedAt: new Date() });
      const assignment = await m
        .getRepository(Assignment)
        .save({ packageId: pkg.id, engineerId: engineer.id, assignedById: user.id, note: note || null });
      const site = await m.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
      mail.push({
        event: 'assigned',
        dedupeKey: `assigned:${assignment.id}`,
        packageId: pkg.id,
        recipient: engineer,
        content: templates.assigned(
          engineer.name,
          {
            reference: pkg.reference,
            title: pkg.title,
            site: site.name,
            plannedLiftDate: pkg.plannedLiftDate,
            url: `${appUrl}/packages/${pkg.id}`,
          },
          user.name,
          note,
        ),
      });
      await m.getRepository(LiftPackage).update(pkg.id, {
        assignedEngineerId: engineer.id,
        status: pkg.status === 'ready_for_review' ? 'with_engineer' : pkg.status,
      });
      await recordAudit(m, {
        action: pkg.assignedEngineerId ? 'engineer.reassigned' : 'engineer.assigned',
        actor: user,
        packageId: pkg.id,
        detail: {
          engineer: engineer.name,
          engineerId: engineer.id,
          ...(note ? { note } : {}),
        },
      });
    }
    return {
      mailIds: await stageMail(m, mail),
      result: {
        assigned: packages.length,
        engineer: { id: engineer.id, name: engineer.name, email: engineer.email },
      },
    };
  });
  await dispatchMail(queues, outcome.mailIds);
  return outcome.result;
}

// ---- decision ---------------------------------------------------------------------------

/**
 * The assigned engineer's decision, under the package lock: a reassignment that got there
 * first answers 409 `reassigned`, a requested return 409 `return_issued`; a decision that got
 * there first makes the reassignment answer 409 (the status machine allows none after it).
 * Deliberate: the engineer's password first (401, rate-limited by the route), then Accepted /
 * Accepted as noted only with an override reason while something stands against them (422), and
 * the record keeps what it overrode and the version of the inputs and results it was made on.
 */
export async function recordDecision(
  ds: DataSource,
  queues: Queues,
  user: Actor,
  packageId: string,
  body: DecisionBody,
  appUrl: string,
) {
  const what = 'A decision can be recorded';
  // Outside the lock: bcrypt takes a while, and a refused password changes nothing.
  requireAssignedEngineer(user, await findScopedPackage(ds.manager, user, packageId));
  await confirmPassword(ds, user, body.password);
  const confirmedAt = new Date();
  const mailIds = await underReview(
    ds,
    user,
    packageId,
    'record_decision',
    what,
    async (m, pkg, revision) => {
      const gate = await passGate(m, pkg.id, revision, body.decision, body.overrideReason);
      // Optimistic lock: the version the engineer read must still be the current one.
      const result = await m
        .createQueryBuilder()
        .update(LiftPackage)
        .set({ status: 'decided', decision: body.decision })
        .where('id = :id AND version = :v', { id: pkg.id, v: body.baseVersion })
        .execute();
      if (!result.affected) {
        throw new AppError(
          409,
          'stale_review',
          'Someone changed this package after you opened it. Reload to see the newer version, then decide again.',
        );
      }
      const record = await m.getRepository(DecisionRecord).save({
        packageId: pkg.id,
        revisionId: revision.id,
        decision: body.decision,
        conditions: body.conditions,
        engineerId: user.id,
        overrideReason: gate.overrideReason,
        overridden: gate.overridden,
        ...madeOn(revision),
        confirmedAt,
      });
      await recordAudit(m, {
        action: 'decision.recorded',
        actor: user,
        packageId: pkg.id,
        detail: {
          decision: body.decision,
          revision: revision.number,
          ...(gate.overrideReason
            ? { overrideReason: gate.overrideReason, overridden: gate.overridden.length }
            : {}),
        },
      });
      // The coordinators issue the return next: they hear of the decision.
      return stageDecisionMail(
        m,
        pkg,
        { id: record.id, decision: body.decision, conditions: body.conditions, revision: revision.number },
        user.name,
        appUrl,
      );
    },
  );
  await dispatchMail(queues, mailIds);
}

export async function latestDecision(m: EntityManager, packageId: string) {
  return m.getRepository(DecisionRecord).findOne({ where: { packageId }, order: { createdAt: 'DESC' } });
}

// ---- resubmission -----------------------------------------------------------------------

export async function startNextRevision(ds: DataSource, user: Actor, packageId: string) {
  if (user.role !== 'contractor') throw AppError.forbidden('Only the contractor starts a new revision.');
  requireReturnedForRevision(await findScopedPackage(ds.manager, user, packageId));
  await ds.transaction(async (m) => {
    // Again under the package lock: the same click twice starts one revision.
    const pkg = await lockPackage(m, user, packageId);
    if (!pkg) throw AppError.notFound('lift package');
    requireReturnedForRevision(pkg);
    const previous = await m
      .getRepository(Revision)
      .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
    const number = pkg.currentRevision + 1;
    const next = await m
      .getRepository(Revision)
      .save({ packageId: pkg.id, number, state: 'draft', inputs: previous.inputs });
    await carryLibraryUses(m, previous.id, next.id);
    const documents = await carryFiles(m, previous, next.id);
    await m.getRepository(LiftPackage).update(pkg.id, {
      currentRevision: number,
      status: 'draft',
      decision: null,
      worstStatus: null,
      openDiscrepancies: 0,
    });
    await recordAudit(m, {
      action: 'revision.started',
      actor: user,
      packageId: pkg.id,
      detail: { revision: number, from: previous.number, documents },
    });
  });
}

/** A next revision only after a return as Revise and resubmit or Rejected, never after an acceptance. */
function requireReturnedForRevision(pkg: LiftPackage) {
  requireState('start_next_revision', pkg.status, 'A new revision can start', 'not_returned_for_revision');
  if (!['revise_and_resubmit', 'rejected'].includes(pkg.decision ?? '')) {
    throw new AppError(
      409,
      'not_returned_for_revision',
      'A new revision can start only after the package is returned as Revise and resubmit or Rejected.',
    );
  }
}
