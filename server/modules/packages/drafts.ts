// The contractor's side of a package: create, autosave the draft, duplicate, submit.
// Submitting freezes the revision (a database trigger refuses later changes to its
// inputs) and writes its check run's job intent in the same transaction; the job (id
// derived from the revision) is queued after the commit, or by the worker's relay.
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import { LiftInput } from '@shared/schemas/lift-input';
import type { CreatePackageBody, SaveDraftBody } from '@shared/schemas/packages';
import { AppError, zodFields } from '../../lib/app-error';
import { checkRunJobId, type Queues } from '../../lib/queues';
import { recordAudit } from '../audit/service';
import { UploadedFile } from '../files/file.entity';
import { Site } from '../sites/site.entity';
import { reviewDueOn } from '@shared/rules/review-due';
import { LiftPackage, Revision } from './package.entity';
import { checkRunIntent, handOff, mailIntent, recordIntent } from '../jobs/intents';
import { siteReviewers, stageMail, type MailDraft } from '../mail/service';
import { templates } from '../mail/templates';
import { User } from '../users/user.entity';
import { findScopedPackage } from './package-scope';

function requireContractor(user: Actor) {
  if (user.role !== 'contractor')
    throw AppError.forbidden('Only a contractor prepares and submits lift packages.');
}

/** A site the contractor may submit to: one of its desk owner's sites (any site when it has none). */
async function siteOr400(m: EntityManager, siteId: string, user: Actor) {
  const [site] = await m
    .getRepository(Site)
    .createQueryBuilder('s')
    .where('s.id = :siteId', { siteId })
    .andWhere(
      `s.owner_organisation_id = coalesce((SELECT o.desk_owner_id FROM organisations o WHERE o.id = :org), s.owner_organisation_id)`,
      { org: user.organisationId },
    )
    .getMany();
  if (!site)
    throw AppError.badRequest('siteId: no such site', [
      { path: 'siteId', message: 'siteId must be the id of a site' },
    ]);
  return site;
}

/** The next reference of a site, e.g. TRR-0013; serialised per site with an advisory lock. */
async function nextReference(m: EntityManager, site: Site): Promise<string> {
  await m.query('SELECT pg_advisory_xact_lock(hashtext($1))', [site.id]);
  const [row] = await m.query(
    `SELECT coalesce(max(substring(reference from '([0-9]+)$')::int), 0) + 1 AS n FROM lift_packages WHERE site_id = $1`,
    [site.id],
  );
  return `${site.code}-${String(row.n).padStart(4, '0')}`;
}

export async function createPackage(
  ds: DataSource,
  user: Actor,
  body: CreatePackageBody,
  inputs: Record<string, unknown> = {},
) {
  requireContractor(user);
  return ds.transaction(async (m) => {
    const site = await siteOr400(m, body.siteId, user);
    // The package keeps its creator's unit system as it is now; a later change of their
    // setting does not move the package's documents.
    const creator = await m.getRepository(User).findOneByOrFail({ id: user.id });
    const pkg = await m.getRepository(LiftPackage).save({
      reference: await nextReference(m, site),
      title: body.title,
      contractorOrganisationId: user.organisationId,
      siteId: site.id,
      createdById: user.id,
      unitSystem: creator.unitSystem,
      status: 'draft',
      plannedLiftDate: body.plannedLiftDate ?? null,
      currentRevision: 1,
    });
    await m.getRepository(Revision).save({ packageId: pkg.id, number: 1, state: 'draft', inputs });
    await recordAudit(m, {
      action: 'package.created',
      actor: user,
      packageId: pkg.id,
      detail: { reference: pkg.reference, revision: 1 },
    });
    return pkg.id;
  });
}

/** The package's current revision, locked for the rest of the transaction. */
function lockCurrentRevision(m: EntityManager, pkg: LiftPackage): Promise<Revision> {
  return m
    .getRepository(Revision)
    .createQueryBuilder('r')
    .setLock('pessimistic_write')
    .where('r.package_id = :id AND r.number = :n', { id: pkg.id, n: pkg.currentRevision })
    .getOneOrFail();
}

export async function saveDraft(ds: DataSource, user: Actor, packageId: string, body: SaveDraftBody) {
  requireContractor(user);
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  await ds.transaction(async (m) => {
    const revision = await lockCurrentRevision(m, pkg);
    if (revision.state !== 'draft') {
      throw new AppError(
        409,
        'already_submitted',
        `Revision ${revision.number} is submitted and can no longer change.`,
      );
    }
    if (body.baseUpdatedAt && new Date(body.baseUpdatedAt).getTime() < revision.updatedAt.getTime()) {
      throw new AppError(
        409,
        'stale_draft',
        `This draft was saved elsewhere at ${revision.updatedAt.toISOString()} after the copy you edited. Reload it, or save again to keep yours.`,
      );
    }
    if (body.siteId) await siteOr400(m, body.siteId, user);
    const packageChanges: { title?: string; siteId?: string; plannedLiftDate?: string | null } = {};
    if (body.title !== undefined) packageChanges.title = body.title;
    if (body.siteId !== undefined && revision.number === 1) packageChanges.siteId = body.siteId;
    if (body.plannedLiftDate !== undefined) packageChanges.plannedLiftDate = body.plannedLiftDate;
    if (Object.keys(packageChanges).length) await m.getRepository(LiftPackage).update(pkg.id, packageChanges);
    // Always touch the revision so updated_at moves on and a stale tab is detected.
    await m
      .getRepository(Revision)
      .save({ id: revision.id, inputs: body.inputs ?? revision.inputs, updatedAt: new Date() });
  });
}

export async function duplicatePackage(ds: DataSource, user: Actor, packageId: string) {
  requireContractor(user);
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await ds
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  const title = `${pkg.title} (copy)`.slice(0, 200);
  return createPackage(
    ds,
    user,
    { title, siteId: pkg.siteId, plannedLiftDate: pkg.plannedLiftDate },
    revision.inputs,
  );
}

export async function submitPackage(
  ds: DataSource,
  queues: Queues,
  user: Actor,
  packageId: string,
  appUrl: string,
) {
  requireContractor(user);
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const { revisionId, mailIds } = await ds.transaction(async (m) => {
    const revision = await lockCurrentRevision(m, pkg);
    if (revision.state !== 'draft') {
      throw new AppError(409, 'already_submitted', `Revision ${revision.number} was already submitted.`);
    }
    const parsed = LiftInput.safeParse(revision.inputs);
    if (!parsed.success) {
      const fields = zodFields(parsed.error, 'inputs');
      throw new AppError(
        400,
        'invalid_input',
        `The lift data is not complete: ${fields[0].path}: ${fields[0].message}`,
        fields,
      );
    }
    const plan = await m
      .getRepository(UploadedFile)
      .findOneBy({ revisionId: revision.id, kind: 'lift_plan' });
    if (!plan) {
      throw new AppError(400, 'lift_plan_missing', 'Upload the lift plan PDF before submitting.', [
        { path: 'files.lift_plan', message: 'a lift plan PDF is required' },
      ]);
    }
    await m.getRepository(Revision).update(revision.id, {
      state: 'submitted',
      submittedAt: new Date(),
      submittedById: user.id,
      checkStatus: 'queued',
      checkProgress: 0,
    });
    const site = await m.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
    await m.getRepository(LiftPackage).update(pkg.id, {
      status: 'checking',
      reviewDueOn: reviewDueOn(new Date().toISOString().slice(0, 10), pkg.plannedLiftDate, {
        turnaroundDays: site.reviewTurnaroundDays,
        marginDays: site.reviewMarginDays,
      }),
    });
    await recordAudit(m, {
      action: 'revision.submitted',
      actor: user,
      packageId: pkg.id,
      detail: { revision: revision.number },
    });
    await recordIntent(m, checkRunIntent(revision.id));
    return {
      revisionId: revision.id,
      mailIds: await stageSubmittedMail(m, pkg, revision.number, revision.id, appUrl),
    };
  });
  // Bounded: with Redis away the submission still answers at once, and the relay queues it.
  await handOff(queues, [checkRunIntent(revisionId), ...mailIds.map(mailIntent)]);
}

/** Submitted: the site's reviewers; resubmitted: also the engineer who reviewed it. */
async function stageSubmittedMail(
  m: EntityManager,
  pkg: LiftPackage,
  revision: number,
  revisionId: string,
  appUrl: string,
) {
  const site = await m.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
  const ref = {
    reference: pkg.reference,
    title: pkg.title,
    site: site.name,
    plannedLiftDate: pkg.plannedLiftDate,
    url: `${appUrl}/packages/${pkg.id}`,
  };
  const drafts: MailDraft[] = (await siteReviewers(m, pkg.siteId)).map((r) => ({
    event: 'submitted',
    dedupeKey: `submitted:${revisionId}:${r.id}`,
    packageId: pkg.id,
    recipient: r,
    content: templates.submitted(r.name, ref, revision),
  }));
  if (revision > 1 && pkg.assignedEngineerId) {
    const engineer = await m.getRepository(User).findOneBy({ id: pkg.assignedEngineerId, active: true });
    if (engineer) {
      drafts.push({
        event: 'resubmitted',
        dedupeKey: `resubmitted:${revisionId}:${engineer.id}`,
        packageId: pkg.id,
        recipient: engineer,
        content: templates.resubmitted(engineer.name, ref, revision),
      });
    }
  }
  return stageMail(m, drafts);
}

/** Queues a revision's check run; the job id makes a repeat of this call harmless. */
export async function enqueueCheck(queues: Queues, revisionId: string) {
  await queues.checkRun.add('check-run', { revisionId }, { jobId: checkRunJobId(revisionId) });
}
