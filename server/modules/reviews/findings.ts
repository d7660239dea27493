// Findings on a revision (raise, answer, close, reopen) and contractor figures the engineer
// accepts with a reason. The engineer's changes stop once the revision's return is requested.
import type { Actor } from '@shared/rules/actor';
import { stateRefusal } from '@shared/rules/package-status';
import type { DataSource } from 'typeorm';
import type { Finding as FindingDto, FindingBody } from '@shared/schemas/reviews';
import { readStoredResult } from '@shared/engineering/stored-result';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/service';
import { UploadedFile } from '../files/file.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { Finding, Markup } from './review.entity';
import { requireAssignedEngineer, underReview } from './review-scope';
import { names } from './markups';
import { stageAnswerMail } from './hand-off-mail';
import { dispatchMail } from '../mail/service';
import type { Queues } from '../../lib/queues';

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
  await underReview(
    ds,
    user,
    packageId,
    'raise_finding',
    'Findings can be raised',
    async (m, pkg, revision) => {
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
    },
  );
  return listFindings(ds, user, packageId);
}

/** Contractors answer (while revising); the assigned engineer closes or reopens. */
export async function updateFinding(
  ds: DataSource,
  user: Actor,
  packageId: string,
  findingId: string,
  body: { state?: 'open' | 'answered' | 'closed'; response?: string },
  mail: { queues: Queues; appUrl: string },
) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const finding = await ds.getRepository(Finding).findOneBy({ id: findingId, packageId: pkg.id });
  if (!finding) throw AppError.notFound('finding');
  // The status machine says when each side may touch a finding (409 otherwise).
  if (user.role !== 'contractor') {
    requireAssignedEngineer(user, pkg);
    const state = body.state;
    if (!state || state === 'answered') {
      throw AppError.badRequest("state: the engineer sets 'open' or 'closed'", [
        { path: 'state', message: "state must be 'open' or 'closed'" },
      ]);
    }
    // Closing or reopening changes what the revision's return is built from: under the package
    // lock, and not once that return is requested.
    await underReview(
      ds,
      user,
      packageId,
      'close_or_reopen_finding',
      'Findings can be closed or reopened',
      async (m) => {
        await m
          .getRepository(Finding)
          .update(finding.id, { state, closedAt: state === 'closed' ? new Date() : null });
        await recordAudit(m, {
          action: state === 'closed' ? 'finding.closed' : 'finding.reopened',
          actor: user,
          packageId: pkg.id,
          detail: { findingId },
        });
      },
      'wrong_state',
    );
    return listFindings(ds, user, packageId);
  }
  const refusal = stateRefusal('answer_finding', pkg.status, 'Findings can be answered');
  if (refusal) throw new AppError(409, 'wrong_state', refusal);
  if (body.response === undefined || body.response.length === 0) {
    throw AppError.badRequest('response: write the answer to the finding', [
      { path: 'response', message: 'response is required' },
    ]);
  }
  const response = body.response;
  if (finding.state === 'closed') throw new AppError(409, 'finding_closed', 'This finding is closed.');
  const mailIds = await ds.transaction(async (m) => {
    await m
      .getRepository(Finding)
      .update(finding.id, { response, state: 'answered', answeredAt: new Date() });
    await recordAudit(m, {
      action: 'finding.answered',
      actor: user,
      packageId: pkg.id,
      detail: { findingId },
    });
    // The engineer of record reads the answer before the next revision comes in.
    return stageAnswerMail(m, pkg, finding, response, user.name, mail.appUrl);
  });
  await dispatchMail(mail.queues, mailIds);
  return listFindings(ds, user, packageId);
}

export async function acceptFigure(
  ds: DataSource,
  user: Actor,
  packageId: string,
  figure: string,
  reason: string,
) {
  await underReview(
    ds,
    user,
    packageId,
    'accept_figure',
    'Figures can be accepted',
    async (m, pkg, revision) => {
      const discrepancies = (readStoredResult(revision.results)?.discrepancies ?? []).filter(
        (d) => d.status === 'discrepancy',
      );
      if (!discrepancies.some((d) => d.figure === figure)) {
        throw AppError.badRequest(`figure: ${figure} is not a discrepancy of this revision`, [
          { path: 'figure', message: 'figure must be one of the revision’s discrepancies' },
        ]);
      }
      const accepted = (revision.acceptedFigures ?? []).filter((a) => a.figure !== figure);
      accepted.push({
        figure,
        reason,
        engineerId: user.id,
        engineer: user.name,
        at: new Date().toISOString(),
      });
      await m.getRepository(Revision).update(revision.id, { acceptedFigures: accepted });
      const open = discrepancies.filter((d) => !accepted.some((a) => a.figure === d.figure)).length;
      await m.getRepository(LiftPackage).update(pkg.id, { openDiscrepancies: open });
      await recordAudit(m, {
        action: 'figure.accepted',
        actor: user,
        packageId: pkg.id,
        detail: { figure, reason, revision: revision.number },
      });
    },
  );
}
