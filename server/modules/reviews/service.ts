// The review: reviewers assign engineers; the assigned engineer marks up pages, raises
// findings, accepts contractor figures with a reason and records the decision; the
// contractor answers findings and starts the next revision. Every change is audited.
import type { Actor } from '@shared/rules/actor';
import { stateRefusal } from '@shared/rules/package-status';
import type { DataSource, EntityManager } from 'typeorm';
import { In, IsNull } from 'typeorm';
import type {
  Finding as FindingDto,
  FindingBody,
  Markup as MarkupDto,
  MarkupBody,
  DecisionBody,
} from '@shared/schemas/reviews';
import { readStoredResult } from '@shared/engineering/stored-result';
import { AppError } from '../../lib/app-error';
import type { Queues } from '../../lib/queues';
import { recordAudit } from '../audit/service';
import { dispatchMail, stageMail, type MailDraft } from '../mail/service';
import { templates } from '../mail/templates';
import { Site } from '../sites/site.entity';
import { UploadedFile } from '../files/file.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage, scopedPackages } from '../packages/package-scope';
import { User } from '../users/user.entity';
import { Assignment, DecisionRecord, Finding, Markup } from './review.entity';

function requireAssignedEngineer(user: Actor, pkg: LiftPackage) {
  if (user.role !== 'engineer' || pkg.assignedEngineerId !== user.id) {
    throw AppError.forbidden('Only the engineer of record assigned to this package can do this.');
  }
}

async function currentSubmittedRevision(m: EntityManager, pkg: LiftPackage) {
  const revision = await m
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  if (revision.state !== 'submitted')
    throw new AppError(409, 'not_submitted', `Revision ${revision.number} is still a draft.`);
  return revision;
}

/** The package as its assigned engineer works on it: in scope, theirs, and still with them. */
async function packageUnderReview(ds: DataSource, user: Actor, packageId: string, what: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  requireAssignedEngineer(user, pkg);
  if (pkg.status !== 'with_engineer') {
    throw new AppError(409, 'review_closed', `${what} only while the package is with the engineer.`);
  }
  return pkg;
}

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

const ASSIGNABLE = ['ready_for_review', 'with_engineer', 'checking', 'check_failed'];

export async function assignEngineer(
  ds: DataSource,
  queues: Queues,
  user: Actor,
  packageIds: string[],
  engineerId: string,
  appUrl: string,
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
    const packages = await scopedPackages(m, user)
      .andWhere('p.id IN (:...ids)', { ids: packageIds })
      .getMany();
    const found = new Set(packages.map((p) => p.id));
    const missing = packageIds.filter((id) => !found.has(id));
    if (missing.length) throw AppError.notFound(`lift package ${missing[0]}`);
    const refused = packages.filter((p) => !ASSIGNABLE.includes(p.status));
    if (refused.length) {
      throw new AppError(
        409,
        'not_assignable',
        `${refused.map((p) => p.reference).join(', ')}: a decision is already recorded or the package is a draft; it cannot be reassigned.`,
      );
    }
    for (const pkg of packages) {
      if (pkg.assignedEngineerId === engineer.id) continue;
      await m
        .getRepository(Assignment)
        .update({ packageId: pkg.id, endedAt: IsNull() }, { endedAt: new Date() });
      const assignment = await m
        .getRepository(Assignment)
        .save({ packageId: pkg.id, engineerId: engineer.id, assignedById: user.id });
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

// ---- markups ----------------------------------------------------------------------------

async function names(m: EntityManager, ids: string[]) {
  const users = ids.length ? await m.getRepository(User).findBy({ id: In([...new Set(ids)]) }) : [];
  return new Map(users.map((u) => [u.id, u.name]));
}

function toMarkup(mk: Markup, who: Map<string, string>): MarkupDto {
  return {
    id: mk.id,
    revisionId: mk.revisionId,
    fileId: mk.fileId,
    pageNumber: mk.pageNumber,
    kind: mk.kind,
    geometry: mk.geometry as Record<string, number>,
    colour: mk.colour as MarkupDto['colour'],
    text: mk.text,
    number: mk.number,
    createdBy: who.get(mk.createdById) ?? '',
    createdAt: mk.createdAt.toISOString(),
  };
}

export async function listMarkups(ds: DataSource, user: Actor, packageId: string, revisionNumber?: number) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await ds
    .getRepository(Revision)
    .findOneBy({ packageId: pkg.id, number: revisionNumber ?? pkg.currentRevision });
  if (!revision) throw AppError.notFound('revision');
  const markups = await ds
    .getRepository(Markup)
    .find({ where: { revisionId: revision.id }, order: { createdAt: 'ASC' } });
  const who = await names(
    ds.manager,
    markups.map((x) => x.createdById),
  );
  return { items: markups.map((x) => toMarkup(x, who)) };
}

export async function addMarkup(ds: DataSource, user: Actor, packageId: string, body: MarkupBody) {
  const pkg = await packageUnderReview(ds, user, packageId, 'Markups can be added');
  return ds.transaction(async (m) => {
    const revision = await currentSubmittedRevision(m, pkg);
    const file = await m.getRepository(UploadedFile).findOneBy({ id: body.fileId, revisionId: revision.id });
    if (!file)
      throw AppError.badRequest('fileId: not a file of this revision', [
        { path: 'fileId', message: 'fileId must be one of the revision’s files' },
      ]);
    if (body.pageNumber > file.pages) {
      throw AppError.badRequest(`pageNumber: the file has ${file.pages} pages`, [
        { path: 'pageNumber', message: `pageNumber must be between 1 and ${file.pages}` },
      ]);
    }
    let number: number | null = null;
    if (body.kind === 'pin') {
      await m.query('SELECT pg_advisory_xact_lock(hashtext($1))', [revision.id]);
      const [row] = await m.query(
        `SELECT coalesce(max(number), 0) + 1 AS n FROM markups WHERE revision_id = $1 AND kind = 'pin'`,
        [revision.id],
      );
      number = Number(row.n);
    }
    const saved = await m.getRepository(Markup).save({
      revisionId: revision.id,
      fileId: file.id,
      pageNumber: body.pageNumber,
      kind: body.kind,
      geometry: body.geometry,
      colour: body.colour,
      text: body.text ?? null,
      number,
      createdById: user.id,
    });
    return toMarkup(saved, new Map([[user.id, user.name]]));
  });
}

export async function deleteMarkup(ds: DataSource, user: Actor, packageId: string, markupId: string) {
  const pkg = await packageUnderReview(ds, user, packageId, 'Markups can be removed');
  const revision = await currentSubmittedRevision(ds.manager, pkg);
  const result = await ds.getRepository(Markup).delete({ id: markupId, revisionId: revision.id });
  if (!result.affected) throw AppError.notFound('markup');
}

// ---- findings ---------------------------------------------------------------------------

export async function listFindings(
  ds: DataSource,
  user: Actor,
  packageId: string,
): Promise<{ items: FindingDto[] }> {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const rows = await ds
    .getRepository(Finding)
    .createQueryBuilder('f')
    .innerJoin(Revision, 'r', 'r.id = f.revision_id')
    .addSelect('r.number', 'revision_number')
    .where('f.package_id = :id', { id: pkg.id })
    .orderBy('r.number', 'ASC')
    .addOrderBy('f.created_at', 'ASC')
    .getRawAndEntities();
  const who = await names(
    ds.manager,
    rows.entities.map((f) => f.createdById),
  );
  return {
    items: rows.entities.map((f, i) => ({
      id: f.id,
      revisionNumber: Number(rows.raw[i].revision_number),
      text: f.text,
      severity: f.severity,
      state: f.state,
      response: f.response,
      checkId: f.checkId,
      markupId: f.markupId,
      fileId: f.fileId,
      pageNumber: f.pageNumber,
      createdBy: who.get(f.createdById) ?? '',
      createdAt: f.createdAt.toISOString(),
      updatedAt: f.updatedAt.toISOString(),
    })),
  };
}

export async function addFinding(ds: DataSource, user: Actor, packageId: string, body: FindingBody) {
  const pkg = await packageUnderReview(ds, user, packageId, 'Findings can be raised');
  await ds.transaction(async (m) => {
    const revision = await currentSubmittedRevision(m, pkg);
    if (
      body.markupId &&
      !(await m.getRepository(Markup).findOneBy({ id: body.markupId, revisionId: revision.id }))
    ) {
      throw AppError.badRequest('markupId: not a markup of this revision', [
        { path: 'markupId', message: 'markupId must be a markup of the current revision' },
      ]);
    }
    if (
      body.fileId &&
      !(await m.getRepository(UploadedFile).findOneBy({ id: body.fileId, revisionId: revision.id }))
    ) {
      throw AppError.badRequest('fileId: not a file of this revision', [
        { path: 'fileId', message: 'fileId must be one of the revision’s files' },
      ]);
    }
    await m.getRepository(Finding).save({
      packageId: pkg.id,
      revisionId: revision.id,
      checkId: body.checkId ?? null,
      markupId: body.markupId ?? null,
      fileId: body.fileId ?? null,
      pageNumber: body.pageNumber ?? null,
      text: body.text,
      severity: body.severity,
      createdById: user.id,
    });
    await recordAudit(m, {
      action: 'finding.raised',
      actor: user,
      packageId: pkg.id,
      detail: { revision: revision.number, severity: body.severity },
    });
  });
  return listFindings(ds, user, packageId);
}

/** Contractors answer (while revising); the assigned engineer closes or reopens. */
export async function updateFinding(
  ds: DataSource,
  user: Actor,
  packageId: string,
  findingId: string,
  body: { state?: 'open' | 'answered' | 'closed'; response?: string },
) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const finding = await ds.getRepository(Finding).findOneBy({ id: findingId, packageId: pkg.id });
  if (!finding) throw AppError.notFound('finding');
  // The status machine says when each side may touch a finding (409 otherwise).
  const refusal =
    user.role === 'contractor'
      ? stateRefusal('answer_finding', pkg.status, 'Findings can be answered')
      : stateRefusal('close_or_reopen_finding', pkg.status, 'Findings can be closed or reopened');
  if (refusal) throw new AppError(409, 'wrong_state', refusal);
  await ds.transaction(async (m) => {
    if (user.role === 'contractor') {
      if (body.response === undefined || body.response.length === 0) {
        throw AppError.badRequest('response: write the answer to the finding', [
          { path: 'response', message: 'response is required' },
        ]);
      }
      if (finding.state === 'closed') throw new AppError(409, 'finding_closed', 'This finding is closed.');
      await m
        .getRepository(Finding)
        .update(finding.id, { response: body.response, state: 'answered', answeredAt: new Date() });
      await recordAudit(m, {
        action: 'finding.answered',
        actor: user,
        packageId: pkg.id,
        detail: { findingId },
      });
    } else {
      requireAssignedEngineer(user, pkg);
      if (!body.state || body.state === 'answered') {
        throw AppError.badRequest("state: the engineer sets 'open' or 'closed'", [
          { path: 'state', message: "state must be 'open' or 'closed'" },
        ]);
      }
      await m
        .getRepository(Finding)
        .update(finding.id, { state: body.state, closedAt: body.state === 'closed' ? new Date() : null });
      await recordAudit(m, {
        action: body.state === 'closed' ? 'finding.closed' : 'finding.reopened',
        actor: user,
        packageId: pkg.id,
        detail: {
          findingId,
        },
      });
    }
  });
  return listFindings(ds, user, packageId);
}

export async function acceptFigure(
  ds: DataSource,
  user: Actor,
  packageId: string,
  figure: string,
  reason: string,
) {
  const pkg = await packageUnderReview(ds, user, packageId, 'Figures can be accepted');
  await ds.transaction(async (m) => {
    const revision = await currentSubmittedRevision(m, pkg);
    const discrepancies = (readStoredResult(revision.results)?.discrepancies ?? []).filter(
      (d) => d.status === 'discrepancy',
    );
    if (!discrepancies.some((d) => d.figure === figure)) {
      throw AppError.badRequest(`figure: ${figure} is not a discrepancy of this revision`, [
        { path: 'figure', message: 'figure must be one of the revision’s discrepancies' },
      ]);
    }
    const accepted = (revision.acceptedFigures ?? []).filter((a) => a.figure !== figure);
    accepted.push({ figure, reason, engineerId: user.id, engineer: user.name, at: new Date().toISOString() });
    await m.getRepository(Revision).update(revision.id, { acceptedFigures: accepted });
    const open = discrepancies.filter((d) => !accepted.some((a) => a.figure === d.figure)).length;
    await m.getRepository(LiftPackage).update(pkg.id, { openDiscrepancies: open });
    await recordAudit(m, {
      action: 'figure.accepted',
      actor: user,
      packageId: pkg.id,
      detail: { figure, reason, revision: revision.number },
    });
  });
}

// ---- decision ---------------------------------------------------------------------------

export async function recordDecision(ds: DataSource, user: Actor, packageId: string, body: DecisionBody) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  requireAssignedEngineer(user, pkg);
  if (!['with_engineer', 'decided'].includes(pkg.status)) {
    throw new AppError(
      409,
      'review_closed',
      'A decision can be recorded only while the package is with the engineer and before the return is issued.',
    );
  }
  await ds.transaction(async (m) => {
    const revision = await currentSubmittedRevision(m, pkg);
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
    await m.getRepository(DecisionRecord).save({
      packageId: pkg.id,
      revisionId: revision.id,
      decision: body.decision,
      conditions: body.conditions,
      engineerId: user.id,
    });
    await recordAudit(m, {
      action: 'decision.recorded',
      actor: user,
      packageId: pkg.id,
      detail: { decision: body.decision, revision: revision.number },
    });
  });
}

export async function latestDecision(m: EntityManager, packageId: string) {
  return m.getRepository(DecisionRecord).findOne({ where: { packageId }, order: { createdAt: 'DESC' } });
}

// ---- resubmission -----------------------------------------------------------------------

export async function startNextRevision(ds: DataSource, user: Actor, packageId: string) {
  if (user.role !== 'contractor') throw AppError.forbidden('Only the contractor starts a new revision.');
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  if (pkg.status !== 'returned' || !['revise_and_resubmit', 'rejected'].includes(pkg.decision ?? '')) {
    throw new AppError(
      409,
      'not_returned_for_revision',
      'A new revision can start only after the package is returned as Revise and resubmit or Rejected.',
    );
  }
  await ds.transaction(async (m) => {
    const previous = await m
      .getRepository(Revision)
      .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
    const number = pkg.currentRevision + 1;
    await m
      .getRepository(Revision)
      .save({ packageId: pkg.id, number, state: 'draft', inputs: previous.inputs });
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
      detail: { revision: number, from: previous.number },
    });
  });
}
