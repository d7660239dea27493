// The stamped return: a reviewer issues it for the recorded decision; the stamp job
// builds the PDF (original pages with markups burned in, the stamp block, the calculation
// sheet), stores it with its sha-256 and marks the package returned. One return per
// decision: issuing twice or retrying the job gives the same single return. Once requested,
// the revision's decision, findings and markups are fixed, and the return is built from the
// decision it was issued for.
import type { Actor } from '@shared/rules/actor';
import { randomBytes } from 'node:crypto';
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { UnrecoverableError } from 'bullmq';
import type { DataSource } from 'typeorm';
import { DECISION_LABELS, type Decision } from '@shared/schemas/common';
import { documentUnits } from '@shared/rules/document-units';
import { AppError } from '../../lib/app-error';
import type { Queues } from '../../lib/queues';
import type { Signer } from '../../lib/pdf-tools/signer';
import type { Storage } from '../../lib/storage';
import { recordAudit } from '../audit/service';
import { handOff, latestIntent, nextRound, recordIntent, type Intent } from '../jobs/intents';
import { stageMail } from '../mail/service';
import { templates } from '../mail/templates';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { requireState } from '../packages/state-guard';
import { DecisionRecord, StampedReturn } from '../reviews/review.entity';
import { lockPackage } from '../reviews/review-scope';
import { latestDecision } from '../reviews/service';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';
import { fetchOriginals, readReturnInput } from './return-input';
import { buildStampedReturnFile, StampInputError } from './stamp-pdf';

const BASE32 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567';

/** 24 base-32 characters: 120 random bits, too many to guess. */
export function newVerificationCode(): string {
  const bytes = randomBytes(24);
  return Array.from(bytes, (b) => BASE32[b & 31]).join('');
}

export function stampJobId(decisionId: string, round = 1) {
  return round > 1 ? `stamp-${decisionId}-r${round}` : `stamp-${decisionId}`;
}

function stampIntent(returnId: string, decisionId: string, round = 1): Intent {
  return {
    queue: 'stamp-return',
    jobId: stampJobId(decisionId, round),
    subjectId: returnId,
    payload: { returnId },
  };
}

function toReturn(r: StampedReturn) {
  return {
    id: r.id,
    revisionId: r.revisionId,
    state: r.state,
    progress: r.progress,
    error: r.error,
    sha256: r.sha256,
    pages: r.pages,
    verificationCode: r.verificationCode,
    unitSystem: r.unitSystem,
    createdAt: r.createdAt.toISOString(),
    readyAt: r.readyAt?.toISOString() ?? null,
  };
}

/**
 * The package a reviewer may issue (or preview) the stamped return of, and the decision on
 * record: 403 for anyone else, 409 while there is no decision.
 */
export async function decidedForReturn(
  ds: DataSource,
  user: Actor,
  packageId: string,
  verb: 'issued' | 'previewed',
) {
  if (user.role !== 'reviewer')
    throw AppError.forbidden(
      `Only a reviewer ${verb === 'issued' ? 'issues' : 'previews'} the stamped return.`,
    );
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  requireState('issue_return', pkg.status, `The stamped return can be ${verb}`, 'no_decision');
  const decision = await latestDecision(ds.manager, pkg.id);
  if (!decision) {
    throw new AppError(
      409,
      'no_decision',
      'The engineer of record has not recorded a decision on this revision yet.',
    );
  }
  return { pkg, decision };
}

export async function issueReturn(ds: DataSource, queues: Queues, user: Actor, packageId: string) {
  // The decision the reviewer's request found; the return is issued for exactly this one.
  const { pkg, decision } = await decidedForReturn(ds, user, packageId, 'issued');
  let ret = await ds.getRepository(StampedReturn).findOneBy({ decisionId: decision.id });
  if (!ret) {
    ret = await ds.transaction(async (m) => {
      // Under the package lock a decision cannot land between this check and the insert; from
      // the insert on, the revision's decision, findings and markups are fixed (review-scope).
      const locked = await lockPackage(m, user, pkg.id);
      if (!locked) throw AppError.notFound('lift package');
      requireState('issue_return', locked.status, 'The stamped return can be issued', 'no_decision');
      const now = await latestDecision(m, pkg.id);
      if (now?.id !== decision.id) {
        throw new AppError(
          409,
          'decision_changed',
          `The engineer changed the decision to ${now ? DECISION_LABELS[now.decision] : 'none'} while the return was being issued. Read the new decision, then issue the return again.`,
        );
      }
      const existing = await m.getRepository(StampedReturn).findOneBy({ decisionId: decision.id });
      if (existing) return existing;
      // The document's unit system is fixed here: the site's or the package's, never the
      // engineer's or the reviewer's own setting.
      const site = await m.getRepository(Site).findOneByOrFail({ id: locked.siteId });
      const units = documentUnits(locked, site).system;
      await m.query(
        `INSERT INTO stamped_returns (decision_id, package_id, revision_id, verification_code, issued_by_id, unit_system)
         VALUES ($1, $2, $3, $4, $5, $6)`,
        [decision.id, pkg.id, decision.revisionId, newVerificationCode(), user.id, units],
      );
      await recordAudit(m, {
        action: 'return.requested',
        actor: user,
        packageId: pkg.id,
        detail: { decision: decision.decision },
      });
      const row = await m.getRepository(StampedReturn).findOneByOrFail({ decisionId: decision.id });
      await recordIntent(m, stampIntent(row.id, decision.id));
      return row;
    });
  } else if (ret.state === 'failed') {
    // Issuing again after a failed build: a new round of the job, with its own id.
    const failed = ret;
    ret = await ds.transaction(async (m) => {
      const [, changed]: [unknown[], number] = await m.query(
        `UPDATE stamped_returns SET state = 'pending', error = NULL, progress = 0 WHERE id = $1 AND state = 'failed'`,
        [failed.id],
      );
      if (changed)
        await recordIntent(
          m,
          stampIntent(failed.id, decision.id, await nextRound(m, 'stamp-return', failed.id)),
        );
      return m.getRepository(StampedReturn).findOneByOrFail({ id: failed.id });
    });
  }
  if (ret.state === 'pending') {
    // Bounded: with Redis away the reviewer still gets an answer, and the relay queues it.
    const intent = await latestIntent(ds, 'stamp-return', ret.id);
    if (intent?.state === 'pending')
      await handOff(queues, [
        { queue: 'stamp-return', jobId: intent.jobId, subjectId: ret.id, payload: { returnId: ret.id } },
      ]);
  }
  return toReturn(ret);
}

export async function listReturns(ds: DataSource, user: Actor, packageId: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const rows = await ds
    .getRepository(StampedReturn)
    .find({ where: { packageId: pkg.id }, order: { createdAt: 'DESC' } });
  return { items: rows.map(toReturn) };
}

export async function readReturn(ds: DataSource, user: Actor, packageId: string, returnId: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const ret = await ds.getRepository(StampedReturn).findOneBy({ id: returnId, packageId: pkg.id });
  if (!ret || ret.state !== 'ready' || !ret.storageKey) throw AppError.notFound('stamped return');
  const revision = await ds.getRepository(Revision).findOneByOrFail({ id: ret.revisionId });
  const decision = await ds.getRepository(DecisionRecord).findOneByOrFail({ id: ret.decisionId });
  return {
    ret,
    storageKey: ret.storageKey,
    fileName: returnFileName(pkg.reference, revision.number, decision.decision),
  };
}

/** Each revision's return downloads under its own name: reference, revision and decision, in file-safe words. */
export function returnFileName(reference: string, revisionNumber: number, decision: string): string {
  const safe = (text: string) =>
    text
      .normalize('NFKD')
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '');
  const words = DECISION_LABELS[decision as Decision] ?? decision;
  return `${safe(reference) || 'package'}-rev${revisionNumber}-${safe(words).toLowerCase()}-stamped-return.pdf`;
}

export type ProgressFn = (percent: number, step: string) => Promise<void> | void;

export interface BuildReturnOptions {
  /** Signs the return; without one (some tests) it is left unsigned. */
  signer?: Signer | null;
  /** Folder for the build's files, best on the storage's file system. */
  workDir?: string;
}

/** The stamp job's work. Safe to run again: a ready return is left as it is. */
export async function buildReturn(
  ds: DataSource,
  storage: Storage,
  returnId: string,
  appUrl: string,
  progress: ProgressFn = () => undefined,
  options: BuildReturnOptions = {},
) {
  const ret = await ds.getRepository(StampedReturn).findOneBy({ id: returnId });
  if (!ret) throw new Error(`stamped return ${returnId} does not exist`);
  if (ret.state === 'ready') return { skipped: true as const };
  const step = async (percent: number, name: string) => {
    await ds.getRepository(StampedReturn).update(ret.id, { progress: percent });
    await progress(percent, name);
  };
  await step(5, 'reading the review');
  const { input, files, pkg, revision, decision, site } = await readReturnInput(
    ds,
    {
      packageId: ret.packageId,
      revisionId: ret.revisionId,
      decisionId: ret.decisionId,
      issuedById: ret.issuedById,
      unitSystem: ret.unitSystem,
      issuedAt: ret.createdAt,
      verificationCode: ret.verificationCode,
    },
    appUrl,
  );
  await step(20, 'reading the original pages');
  const workRoot = options.workDir ?? tmpdir();
  await mkdir(workRoot, { recursive: true });
  const work = await mkdtemp(path.join(workRoot, 'return-'));
  let pages: number;
  let digest: string;
  let signingCertificateSha256: string | null;
  const storageKey = `returns/${pkg.id}/${ret.id}.pdf`;
  try {
    const documents = await fetchOriginals(storage, files, work);
    await step(40, 'burning in markups and the stamp');
    const out = path.join(work, 'return.pdf');
    const built = await buildStampedReturnFile({ ...input, documents }, out, {
      signer: options.signer,
      workDir: work,
    });
    pages = built.pages;
    signingCertificateSha256 = built.signingCertificateSha256;
    await step(85, 'storing the return');
    // The stored sha-256 is of the signed file, exactly as it is stored (computed in the same
    // read of the file as the signature's digest).
    digest = built.sha256;
    await storage.putFile(storageKey, out);
  } catch (err) {
    // A document qpdf refuses is bad data: retrying cannot help, and the reviewer sees why.
    if (err instanceof StampInputError) throw new UnrecoverableError(err.message);
    throw err;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
  const mailIds = await ds.transaction(async (m) => {
    const updated = await m
      .createQueryBuilder()
      .update(StampedReturn)
      .set({
        state: 'ready',
        sha256: digest,
        signingCertificateSha256,
        storageKey,
        pages,
        progress: 100,
        readyAt: new Date(),
        error: null,
      })
      .where('id = :id AND state <> :ready', { id: ret.id, ready: 'ready' })
      .execute();
    if (!updated.affected) return [];
    await m.getRepository(LiftPackage).update(pkg.id, { status: 'returned' });
    await recordAudit(m, {
      action: 'return.issued',
      actor: { id: ret.issuedById },
      packageId: pkg.id,
      detail: { decision: DECISION_LABELS[decision.decision], revision: revision.number, pages },
    });
    // The decision goes to the person who submitted the revision.
    const submitter = revision.submittedById
      ? await m.getRepository(User).findOneBy({ id: revision.submittedById })
      : null;
    if (!submitter?.active) return [];
    const url = `${appUrl}/packages/${pkg.id}`;
    return stageMail(m, [
      {
        event: 'returned',
        dedupeKey: `returned:${ret.id}`,
        packageId: pkg.id,
        recipient: submitter,
        content: templates.returned(
          submitter.name,
          {
            reference: pkg.reference,
            title: pkg.title,
            site: site.name,
            plannedLiftDate: pkg.plannedLiftDate,
            url,
          },
          revision.number,
          decision.decision,
          decision.conditions,
          `${appUrl}/api/packages/${pkg.id}/returns/${ret.id}/file`,
        ),
      },
    ]);
  });
  await progress(100, 'done');
  return { skipped: false as const, pages, mailIds };
}

/** The stamp job's last attempt failed: the reviewer sees why and can issue again. */
export async function markReturnFailed(ds: DataSource, returnId: string, error: string) {
  await ds
    .getRepository(StampedReturn)
    .update({ id: returnId, state: 'pending' }, { state: 'failed', error: error.slice(0, 500) });
}
