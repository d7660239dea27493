// The manufacturer's document (PDF) of a version: attached once, before any package uses the
// version, and read by everyone who may read the version. As with a package's files, the
// route names the storage key before the body is read (`documentTarget`), the body streams
// into the object store and a working copy, and the version is written only once the copy
// passes the check; a refused document leaves no object.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { randomUUID } from 'node:crypto';
import type { Storage } from '../../lib/storage';
import { checkFileName, inspectPdf, type UploadLimits } from '../files/pdf-check';
import { discardUpload, discardWorkFile, type ReceivedUpload } from '../files/receive';
import { LibraryVersion } from './library.entity';
import { audit } from './library-audit';
import { ownVersion, readableVersion } from './library-scope';
import { useCounts } from './version-summaries';
import { getVersion } from './versions';

type U = Actor;

async function attachable(ds: DataSource, user: U, id: string) {
  const { version, config } = await ownVersion(ds.manager, user, id);
  if (version.documentFile)
    throw AppError.conflict(
      `Version ${version.number} already has its document attached; make a new version to change it.`,
    );
  const used = (await useCounts(ds.manager, [version.id])).get(version.id) ?? 0;
  if (used)
    throw AppError.conflict(
      `Version ${version.number} is in use by packages; make a new version to attach another document.`,
    );
  return { version, config };
}

/** Where the document goes, checked before the body is read (a key of its own per upload). */
export async function documentTarget(ds: DataSource, user: U, id: string) {
  const { version } = await attachable(ds, user, id);
  return { storageKey: `library/${version.id}/${randomUUID()}.pdf` };
}

export async function attachDocument(
  ds: DataSource,
  storage: Storage,
  user: U,
  id: string,
  upload: ReceivedUpload,
  limits: UploadLimits,
) {
  try {
    const { version, config } = await attachable(ds, user, id);
    const name = checkFileName(upload.originalName);
    const { pages } = await inspectPdf(upload, limits, name);
    await discardWorkFile(upload);
    await ds.transaction(async (m) => {
      // Only while the version still has none: two documents sent at once end as one.
      const updated = await m
        .createQueryBuilder()
        .update(LibraryVersion)
        .set({
          documentFile: {
            storageKey: upload.storageKey,
            name,
            sha256: upload.sha256,
            sizeBytes: upload.size,
            pages,
          },
        })
        .where('id = :id AND document_file IS NULL', { id: version.id })
        .execute();
      if (!updated.affected)
        throw AppError.conflict(
          `Version ${version.number} already has its document attached; make a new version to change it.`,
        );
      await audit(m, user, 'library.document_attached', {
        configuration: config.id,
        version: version.number,
        name,
        pages,
      });
    });
  } catch (error) {
    await discardUpload(storage, upload);
    throw error;
  }
  return getVersion(ds, user, id);
}

export async function readDocument(ds: DataSource, user: U, id: string) {
  const { version } = await readableVersion(ds.manager, user, id);
  if (!version.documentFile) throw AppError.notFound("manufacturer's document");
  return version.documentFile;
}
