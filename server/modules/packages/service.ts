// Lift packages: one package with its current revision, files and audit trail (the scoped list
// is list-packages.ts).
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import type { PackageDetail, PackageSummary, RevisionDetail } from '@shared/schemas/packages';
import { AppError } from '../../lib/app-error';
import { AuditEvent } from '../audit/audit-event.entity';
import { UploadedFile } from '../files/file.entity';
import { toFileSummary } from '../files/service';
import { User } from '../users/user.entity';
import { sitePolicy } from '../sites/site-policy';
import { documentUnits } from '@shared/rules/document-units';
import { isReviewOverdue } from '@shared/rules/review-due';
import { LiftPackage, Revision } from './package.entity';
import { findScopedPackage } from './package-scope';

export function toSummary(p: LiftPackage): PackageSummary {
  return {
    id: p.id,
    reference: p.reference,
    title: p.title,
    status: p.status,
    site: { id: p.site!.id, name: p.site!.name },
    contractor: { id: p.contractor!.id, name: p.contractor!.name },
    plannedLiftDate: p.plannedLiftDate,
    reviewDueOn: p.reviewDueOn,
    reviewOverdue: isReviewOverdue(p.reviewDueOn, p.status, new Date().toISOString().slice(0, 10)),
    revisionNumber: p.currentRevision,
    engineer: p.assignedEngineer ? { id: p.assignedEngineer.id, name: p.assignedEngineer.name } : null,
    critical: p.critical,
    worstStatus: p.worstStatus,
    openDiscrepancies: p.openDiscrepancies,
    decision: p.decision,
    updatedAt: p.updatedAt.toISOString(),
  };
}

export async function revisionDetail(dataSource: DataSource, revision: Revision): Promise<RevisionDetail> {
  const files = await dataSource.getRepository(UploadedFile).find({
    where: { revisionId: revision.id },
    order: { kind: 'ASC', createdAt: 'ASC' },
  });
  const [requested] = await dataSource.query(
    `SELECT min(created_at) AS at FROM stamped_returns WHERE revision_id = $1`,
    [revision.id],
  );
  return {
    id: revision.id,
    number: revision.number,
    state: revision.state,
    inputs: revision.inputs ?? {},
    submittedAt: revision.submittedAt?.toISOString() ?? null,
    updatedAt: revision.updatedAt.toISOString(),
    check: {
      status: revision.checkStatus as RevisionDetail['check']['status'],
      progress: revision.checkProgress,
      error: revision.checkError,
      resultVersion: revision.resultVersion,
      checkedAt: revision.checkedAt?.toISOString() ?? null,
    },
    results: revision.results ? { ...revision.results } : null,
    files: files.map(toFileSummary),
    acceptedFigures: (revision.acceptedFigures ?? []).map((a) => ({
      figure: a.figure,
      reason: a.reason,
      engineer: a.engineer,
      at: a.at,
    })),
    returnRequestedAt: requested?.at ? new Date(requested.at).toISOString() : null,
  };
}

/**
 * The detail of a package already known to be in the user's scope. Contractors see their
 * current revision (a draft while they work on it); everyone else the latest submitted one.
 */
export async function packageDetail(
  dataSource: DataSource,
  packageId: string,
  user?: Actor,
): Promise<PackageDetail> {
  const full = await dataSource.getRepository(LiftPackage).findOneOrFail({
    where: { id: packageId },
    relations: { site: true, contractor: true, assignedEngineer: true },
  });
  const revisions = await dataSource
    .getRepository(Revision)
    .find({ where: { packageId }, order: { number: 'DESC' } });
  const visible =
    user && user.role !== 'contractor' ? revisions.filter((r) => r.state === 'submitted') : revisions;
  const current =
    user && user.role !== 'contractor'
      ? visible[0]
      : revisions.find((r) => r.number === full.currentRevision);
  if (!current)
    throw new AppError(500, 'internal', `package ${full.reference} has no revision ${full.currentRevision}`);
  // Owner-side people do not see the contractor's work on a draft revision (file names and
  // all) until it is submitted.
  const draftNumbers = new Set(revisions.filter((r) => r.state !== 'submitted').map((r) => r.number));
  const hiddenRevision = (detail: Record<string, unknown> | null) =>
    !!user &&
    user.role !== 'contractor' &&
    typeof detail?.revision === 'number' &&
    draftNumbers.has(detail.revision);
  const events = await dataSource
    .getRepository(AuditEvent)
    .createQueryBuilder('e')
    .leftJoin(User, 'u', 'u.id = e.actor_id')
    .select([
      'e.id AS id',
      'e.action AS action',
      'e.detail AS detail',
      'e.created_at AS at',
      'u.name AS actor',
    ])
    .where('e.package_id = :packageId', { packageId })
    .orderBy('e.created_at', 'DESC')
    .limit(200)
    .getRawMany<{
      id: string;
      action: string;
      detail: Record<string, unknown>;
      at: Date;
      actor: string | null;
    }>();
  return {
    package: { ...toSummary(full), version: full.version },
    revisions: visible.map((r) => ({
      id: r.id,
      number: r.number,
      state: r.state,
      submittedAt: r.submittedAt?.toISOString() ?? null,
      checkStatus: r.checkStatus as RevisionDetail['check']['status'],
    })),
    current: await revisionDetail(dataSource, current),
    documentUnits: documentUnits(full, full.site!),
    sitePolicy: sitePolicy(full.site!),
    decision: await decisionSummary(dataSource, full.id),
    events: events
      .filter((e) => !hiddenRevision(e.detail))
      .map((e) => ({ ...e, at: new Date(e.at).toISOString() })),
  };
}

export async function getPackage(dataSource: DataSource, user: Actor, id: string): Promise<PackageDetail> {
  const found = await findScopedPackage(dataSource.manager, user, id);
  return packageDetail(dataSource, found.id, user);
}

export async function getRevision(dataSource: DataSource, user: Actor, id: string, number: number) {
  const found = await findScopedPackage(dataSource.manager, user, id);
  const revision = await dataSource.getRepository(Revision).findOneBy({ packageId: found.id, number });
  if (!revision) throw AppError.notFound('revision');
  if (revision.state === 'draft' && user.role !== 'contractor') throw AppError.notFound('revision');
  return revisionDetail(dataSource, revision);
}

async function decisionSummary(dataSource: DataSource, packageId: string) {
  const [row] = await dataSource.query(
    `SELECT d.decision, d.conditions, u.name AS engineer, r.number AS revision, d.created_at AS at,
            d.override_reason, d.overridden, d.inputs_sha256, d.results_sha256, d.engine_version
     FROM decisions d JOIN users u ON u.id = d.engineer_id JOIN revisions r ON r.id = d.revision_id
     WHERE d.package_id = $1 ORDER BY d.created_at DESC LIMIT 1`,
    [packageId],
  );
  if (!row) return null;
  return {
    decision: row.decision,
    conditions: row.conditions,
    engineer: row.engineer,
    revisionNumber: Number(row.revision),
    at: new Date(row.at).toISOString(),
    overrideReason: row.override_reason as string | null,
    overridden: (row.overridden ?? []) as string[],
    madeOn: {
      inputsSha256: row.inputs_sha256 as string | null,
      resultsSha256: row.results_sha256 as string | null,
      engineVersion: row.engine_version as string | null,
    },
  };
}
