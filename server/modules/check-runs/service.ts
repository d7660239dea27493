// The authoritative check run of a submitted revision: parse the frozen inputs with the
// engine's schema, evaluate them against the site's policy, store the results with the
// policy used, and move the package on. Running it again for a revision already checked
// changes nothing, so a retried or duplicated job is harmless. Also: the run's last
// failure ("check could not run"), where its job is, and running it again.
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import { evaluateLift } from '@shared/engineering/evaluate';
import type { CheckRunStatus } from '@shared/schemas/check-runs';
import { LiftInput } from '@shared/schemas/lift-input';
import { AppError } from '../../lib/app-error';
import { withTimeout, type Queues } from '../../lib/queues';
import { recordAudit } from '../audit/service';
import { checkRunIntent, handOff, latestIntent, nextRound, recordIntent } from '../jobs/intents';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { packageDetail } from '../packages/service';
import { Site } from '../sites/site.entity';
import { sitePolicy } from '../sites/site-policy';

export class InvalidLiftData extends Error {}

export type ProgressFn = (percent: number, step: string) => Promise<void> | void;

export async function runCheckRun(
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
      await recordAudit(m, {
        action: 'check.invalid',
        actor: null,
        packageId: pkg.id,
        detail: { revision: revision.number, reason },
      });
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
    await m.getRepository(Revision).update(revision.id, {
      checkStatus: 'done',
      checkProgress: 100,
      checkError: null,
      results: result,
      resultVersion: result.resultVersion,
      policyUsed: { ...policy, siteId: site.id, policyVersion: site.policyVersion },
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
    await recordAudit(m, {
      action: 'check.completed',
      actor: null,
      packageId: pkg.id,
      detail: {
        revision: revision.number,
        overallStatus: worstStatus,
        openDiscrepancies,
      },
    });
  });
  await progress(100, 'done');
  return { skipped: false as const, result };
}

async function setProgress(m: EntityManager, revisionId: string, percent: number, status: string) {
  await m.getRepository(Revision).update(revisionId, { checkProgress: percent, checkStatus: status });
}

/**
 * The check run's last attempt failed (not the lift data: the worker, the database, the
 * policy): the revision shows "check could not run" with the reason, and the contractor or
 * the reviewer can ask for it again. Only a run still queued or running is marked, so
 * calling this twice, or after the run finished, changes nothing.
 */
export async function markCheckFailed(ds: DataSource, revisionId: string, reason: string) {
  await ds.transaction(async (m) => {
    const [rows]: [Array<{ package_id: string; number: number }>, number] = await m.query(
      `UPDATE revisions SET check_status = 'failed', check_error = $2, check_progress = 0
       WHERE id = $1 AND state = 'submitted' AND check_status IN ('queued', 'running')
       RETURNING package_id, number`,
      [revisionId, reason.slice(0, 500)],
    );
    if (!rows.length) return;
    const { package_id: packageId, number } = rows[0];
    await m.query(
      `UPDATE lift_packages SET status = 'check_failed'
       WHERE id = $1 AND current_revision = $2 AND status = 'checking'`,
      [packageId, number],
    );
    await recordAudit(m, {
      action: 'check.failed',
      actor: null,
      packageId: packageId,
      detail: { revision: number, reason },
    });
  });
}

const MAY_RETRY: ReadonlyArray<Actor['role']> = ['contractor', 'reviewer'];
/** Asking the queue where a job is must not hold the page when Redis is away. */
const QUEUE_LOOK_MS = 300;

async function currentRevision(m: EntityManager, pkg: LiftPackage, lock = false) {
  const q = m
    .getRepository(Revision)
    .createQueryBuilder('r')
    .where('r.package_id = :id AND r.number = :n', { id: pkg.id, n: pkg.currentRevision });
  return (lock ? q.setLock('pessimistic_write') : q).getOneOrFail();
}

/** The current revision's check run, with where its job is. */
export async function checkRunStatus(
  ds: DataSource,
  queues: Queues,
  user: Actor,
  packageId: string,
): Promise<CheckRunStatus> {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await currentRevision(ds.manager, pkg);
  const status = revision.checkStatus as CheckRunStatus['status'];
  let handOff: CheckRunStatus['handOff'] = status === 'none' ? 'none' : 'finished';
  let failedAttempts = 0;
  if (status === 'queued' || status === 'running') {
    const intent = await latestIntent(ds, 'check-run', revision.id);
    const job = intent
      ? await withTimeout(queues.checkRun.getJob(intent.jobId), QUEUE_LOOK_MS, 'check status').catch(
          () => null,
        )
      : null;
    const state = job
      ? await withTimeout(job.getState(), QUEUE_LOOK_MS, 'check status').catch(() => null)
      : null;
    failedAttempts = job?.attemptsMade ?? 0;
    handOff = !state ? 'waiting_for_queue' : state === 'active' ? 'running' : 'queued';
  }
  return {
    revisionId: revision.id,
    revisionNumber: revision.number,
    status,
    progress: revision.checkProgress,
    error: revision.checkError,
    handOff,
    failedAttempts,
    canRetry: status === 'failed' && MAY_RETRY.includes(user.role),
  };
}

/** "Run the check again" after a final failure: a new round of the job, with its own id. */
export async function retryCheck(ds: DataSource, queues: Queues, user: Actor, packageId: string) {
  if (!MAY_RETRY.includes(user.role))
    throw AppError.forbidden('Only the contractor or a reviewer runs a check again.');
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const intent = await ds.transaction(async (m) => {
    const revision = await currentRevision(m, pkg, true);
    if (revision.checkStatus === 'invalid') {
      throw new AppError(
        409,
        'lift_data_invalid',
        `The lift data of revision ${revision.number} is invalid (${revision.checkError ?? 'see the check'}); running the check again would give the same answer. Correct it in a new revision.`,
      );
    }
    if (revision.state !== 'submitted' || revision.checkStatus !== 'failed') {
      throw new AppError(
        409,
        'check_not_failed',
        `The check of revision ${revision.number} has not failed (it is ${revision.checkStatus}); there is nothing to run again.`,
      );
    }
    await m
      .getRepository(Revision)
      .update(revision.id, { checkStatus: 'queued', checkError: null, checkProgress: 0 });
    await m.query(`UPDATE lift_packages SET status = 'checking' WHERE id = $1 AND status = 'check_failed'`, [
      pkg.id,
    ]);
    await recordAudit(m, {
      action: 'check.retried',
      actor: user,
      packageId: pkg.id,
      detail: { revision: revision.number, previousError: revision.checkError },
    });
    const next = checkRunIntent(revision.id, await nextRound(m, 'check-run', revision.id));
    await recordIntent(m, next);
    return next;
  });
  await handOff(queues, [intent]);
  return packageDetail(ds, pkg.id, user);
}
