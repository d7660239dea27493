// The authoritative check run of a submitted revision: parse the frozen inputs with the
// engine's schema, evaluate them against the site's policy, store the results with the
// policy used, and move the package on. Running it again for a revision already checked
// changes nothing, so a retried or duplicated job is harmless.
import type { DataSource, EntityManager } from 'typeorm';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { SitePolicy } from '@shared/schemas/site-policy';
import { AuditEvent } from '../audit/audit-event.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { Site } from '../sites/site.entity';

export class InvalidLiftData extends Error {}

export type ProgressFn = (percent: number, step: string) => Promise<void> | void;

/** The site's policy: its overrides over the engine's defaults. */
export function sitePolicy(site: Site) {
  return SitePolicy.parse(site.reviewPolicy ?? {});
}

export async function runCheck(
  dataSource: DataSource,
  revisionId: string,
  progress: ProgressFn = () => undefined,
) {
  const revision = await dataSource.getRepository(Revision).findOneBy({ id: revisionId });
  if (!revision) throw new InvalidLiftData(`revision ${revisionId} does not exist`);
  if (revision.checkStatus === 'done' && revision.results) return { skipped: true as const };
  if (revision.state !== 'submitted') throw new InvalidLiftData(`revision ${revisionId} is not submitted`);
  const pkg = await dataSource.getRepository(LiftPackage).findOneByOrFail({ id: revision.packageId });
  const site = await dataSource.getRepository(Site).findOneByOrFail({ id: pkg.siteId });

  await setProgress(dataSource.manager, revision.id, 10, 'running');
  await progress(10, 'reading the lift data');
  const parsed = LiftInput.safeParse(revision.inputs);
  if (!parsed.success) {
    const reason = parsed.error.issues
      .slice(0, 5)
      .map((i) => `${i.path.join('.')}: ${i.message}`)
      .join('; ');
    await dataSource.transaction(async (m) => {
      await m.getRepository(Revision).update(revision.id, {
        checkStatus: 'invalid',
        checkError: reason.slice(0, 500),
        checkProgress: 100,
      });
      await m.getRepository(LiftPackage).update(pkg.id, { status: 'check_failed' });
      await audit(m, pkg.id, 'check.invalid', { revision: revision.number, reason });
    });
    throw new InvalidLiftData(reason);
  }
  const policy = sitePolicy(site);
  await progress(40, 'recomputing the checks');
  const result = evaluateLift(parsed.data, policy);
  await progress(80, 'storing the results');
  const worstStatus = result.overallStatus;
  const openDiscrepancies = result.discrepancies.filter((d) => d.status === 'discrepancy').length;
  await dataSource.transaction(async (m) => {
    // jsonb columns: TypeORM's deep-partial type cannot describe an open record, hence the casts.
    await m.getRepository(Revision).update(revision.id, {
      checkStatus: 'done',
      checkProgress: 100,
      checkError: null,
      results: result as never,
      resultVersion: result.resultVersion,
      policyUsed: { ...policy, siteId: site.id, policyVersion: site.policyVersion } as never,
      checkedAt: new Date(),
    });
    const current = await m.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    const isCurrentRevision = current.currentRevision === revision.number;
    if (isCurrentRevision) {
      await m.getRepository(LiftPackage).update(pkg.id, {
        status:
          current.status === 'checking' || current.status === 'check_failed'
            ? current.assignedEngineerId
              ? 'with_engineer'
              : 'ready_for_review'
            : current.status,
        critical: result.critical.isCritical,
        worstStatus,
        openDiscrepancies,
      });
    }
    await audit(m, pkg.id, 'check.completed', {
      revision: revision.number,
      overallStatus: worstStatus,
      openDiscrepancies,
    });
  });
  await progress(100, 'done');
  return { skipped: false as const, result };
}

async function setProgress(m: EntityManager, revisionId: string, percent: number, status: string) {
  await m.getRepository(Revision).update(revisionId, { checkProgress: percent, checkStatus: status });
}

async function audit(m: EntityManager, packageId: string, action: string, detail: Record<string, unknown>) {
  await m.getRepository(AuditEvent).save({ packageId, action, detail, actorId: null, organisationId: null });
}
