// Uploaded PDFs of a draft revision. The route names the storage key before the body is read
// (`uploadTarget`: the package is the person's and its revision a draft), the body streams
// into the object store and a working copy (receive.ts), the copy is checked (pdf-check.ts),
// and only then is the row written. A refused upload leaves no object, no row and no copy.
import type { Actor } from '@shared/rules/actor';
import { randomUUID } from 'node:crypto';
import { QueryFailedError, type DataSource, type EntityManager } from 'typeorm';
import type { FileKind, FileSummary } from '@shared/schemas/packages';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../lib/storage';
import { notCarriedWords } from '@shared/vocabulary/pdf-contents';
import { recordAudit } from '../audit/service';
import { Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { UploadedFile } from './file.entity';
import { checkFileName, inspectPdf, type UploadLimits } from './pdf-check';
import { discardUpload, discardWorkFile, type ReceivedUpload } from './receive';

export function toFileSummary(f: UploadedFile): FileSummary {
  return {
    id: f.id,
    kind: f.kind,
    originalName: f.originalName,
    sha256: f.sha256,
    sizeBytes: Number(f.sizeBytes),
    pages: f.pages,
    carriedFromRevision: f.carriedFromRevision ?? null,
    createdAt: f.createdAt.toISOString(),
    contents: f.contents ?? null,
    notCarried: notCarriedWords(f.contents ?? null),
  };
}

/**
 * A new revision starts with the previous one's documents (the lift plan and the supporting
 * PDFs): each gets a row of its own naming the row it came from, over the same stored object.
 * The contractor then keeps, replaces or removes each one in the draft.
 */
export async function carryFiles(
  m: EntityManager,
  from: Pick<Revision, 'id' | 'number'>,
  toRevisionId: string,
) {
  const repo = m.getRepository(UploadedFile);
  const rows = await repo.find({ where: { revisionId: from.id }, order: { createdAt: 'ASC', id: 'ASC' } });
  for (const { revision: _revision, ...row } of rows) {
    await repo.insert({
      ...row,
      id: randomUUID(),
      revisionId: toRevisionId,
      carriedFromId: row.id,
      carriedFromRevision: row.carriedFromRevision ?? from.number,
    });
  }
  return rows.length;
}

/**
 * A stored object is shared by a document's rows across revisions: it goes only when no row
 * names it any more (a carried copy removed from a draft leaves the previous revision's file).
 */
async function deleteStoredIfUnused(ds: DataSource, storage: Storage, storageKey: string) {
  const still = await ds.getRepository(UploadedFile).existsBy({ storageKey });
  if (!still) await storage.delete(storageKey).catch(() => undefined);
}

function requireDraft(revision: Pick<Revision, 'number' | 'state'>) {
  if (revision.state !== 'draft') {
    throw new AppError(
      409,
      'already_submitted',
      `Revision ${revision.number} is submitted; its files can no longer change.`,
    );
  }
}

async function currentDraft(ds: DataSource, user: Actor, packageId: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await ds
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  requireDraft(revision);
  return { pkg, revision };
}

/**
 * Locks the revision row for the rest of the transaction and checks again that it is a
 * draft: uploads, removals and the submission (which locks the same row) go one at a time,
 * so two lift plans sent at once end as one, and no file changes under a submission.
 */
async function lockDraft(m: EntityManager, revisionId: string) {
  const [row] = await m.query(`SELECT number, state FROM revisions WHERE id = $1 FOR UPDATE`, [revisionId]);
  requireDraft({ number: Number(row.number), state: row.state });
}

const ONE_LIFT_PLAN = 'uploaded_files_one_lift_plan_key';
const ATTEMPTS = 3;

function isOnePlanConflict(error: unknown): boolean {
  const driver = (error as { driverError?: { code?: string; constraint?: string } }).driverError;
  return error instanceof QueryFailedError && driver?.code === '23505' && driver.constraint === ONE_LIFT_PLAN;
}

/**
 * The database's one-lift-plan index answered a conflict: a lift plan was stored beside the
 * revision lock (a row written outside the upload path). The upload runs again and replaces it,
 * as one upload after another does; after a few tries it gives up with 409 and the sentence.
 */
async function onePlanAtATime<T>(save: () => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await save();
    } catch (error) {
      if (!isOnePlanConflict(error)) throw error;
      if (attempt >= ATTEMPTS) {
        throw new AppError(
          409,
          'lift_plan_conflict',
          'Another lift plan was stored for this revision at the same moment. Upload the plan again to replace it.',
          [{ path: 'file', message: 'file: another lift plan was stored at the same moment' }],
        );
      }
    }
  }
}

/** Where the next upload to this package's draft goes, checked before its body is read. */
export async function uploadTarget(ds: DataSource, user: Actor, packageId: string) {
  const { revision } = await currentDraft(ds, user, packageId);
  const id = randomUUID();
  return { id, storageKey: `revisions/${revision.id}/${id}.pdf` };
}

/**
 * Checks and records an upload already stored under `target` (uploadTarget). On any refusal
 * the object is deleted again; the working copy is always deleted.
 */
export async function addFile(
  ds: DataSource,
  storage: Storage,
  user: Actor,
  packageId: string,
  target: { id: string },
  upload: ReceivedUpload & { kind: FileKind },
  limits: UploadLimits,
): Promise<FileSummary> {
  try {
    const { pkg, revision } = await currentDraft(ds, user, packageId);
    const originalName = checkFileName(upload.originalName);
    const { pages, contents } = await inspectPdf(upload, limits, originalName);
    await discardWorkFile(upload);
    const saved = await onePlanAtATime(() =>
      ds.transaction(async (m) => {
        await lockDraft(m, revision.id);
        // One lift plan per revision: a new one replaces the one there is (under the lock, so
        // the one there is is the last upload's).
        let replaced: UploadedFile | null = null;
        if (upload.kind === 'lift_plan') {
          replaced = await m
            .getRepository(UploadedFile)
            .findOneBy({ revisionId: revision.id, kind: 'lift_plan' });
          if (replaced) await m.getRepository(UploadedFile).delete(replaced.id);
        }
        const file = await m.getRepository(UploadedFile).save({
          id: target.id,
          revisionId: revision.id,
          kind: upload.kind,
          originalName,
          sha256: upload.sha256,
          sizeBytes: String(upload.size),
          pages,
          storageKey: upload.storageKey,
          uploadedById: user.id,
          contents,
        });
        await recordAudit(m, {
          action: 'file.added',
          actor: user,
          packageId: pkg.id,
          detail: {
            revision: revision.number,
            name: originalName,
            kind: upload.kind,
            pages,
            replaced: replaced?.originalName ?? null,
          },
        });
        return { file, replaced };
      }),
    );
    if (saved.replaced) await deleteStoredIfUnused(ds, storage, saved.replaced.storageKey);
    return toFileSummary(saved.file);
  } catch (error) {
    await discardUpload(storage, upload);
    throw error;
  }
}

export async function removeFile(
  ds: DataSource,
  storage: Storage,
  user: Actor,
  packageId: string,
  fileId: string,
) {
  const { pkg, revision } = await currentDraft(ds, user, packageId);
  const file = await ds.transaction(async (m) => {
    await lockDraft(m, revision.id);
    const found = await m.getRepository(UploadedFile).findOneBy({ id: fileId, revisionId: revision.id });
    if (!found) throw AppError.notFound('file');
    await m.getRepository(UploadedFile).delete(found.id);
    await recordAudit(m, {
      action: 'file.removed',
      actor: user,
      packageId: pkg.id,
      detail: { revision: revision.number, name: found.originalName },
    });
    return found;
  });
  await deleteStoredIfUnused(ds, storage, file.storageKey);
}

/** The uploaded file of a package the person may see (its bytes are streamed by the route). */
export async function readFile(ds: DataSource, user: Actor, packageId: string, fileId: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const file = await ds
    .getRepository(UploadedFile)
    .createQueryBuilder('f')
    .innerJoin(Revision, 'r', 'r.id = f.revision_id')
    .where('f.id = :fileId AND r.package_id = :packageId', { fileId, packageId: pkg.id })
    .getOne();
  if (!file) throw AppError.notFound('file');
  return file;
}
