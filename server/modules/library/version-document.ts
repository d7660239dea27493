// The manufacturer's document (PDF) of a version: attached once, before any package uses the
// version, and read by everyone who may read the version.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { sha256, type Storage } from '../../lib/storage';
import { checkFileName, inspectPdf } from '../files/pdf-check';
import { LibraryVersion } from './library.entity';
import { audit } from './library-audit';
import { ownVersion, readableVersion } from './library-scope';
import { useCounts } from './version-summaries';
import { getVersion } from './versions';

type U = Actor;

export async function attachDocument(
  ds: DataSource,
  storage: Storage,
  user: U,
  id: string,
  upload: { originalName: string; bytes: Uint8Array },
  limits: { maxPages: number },
) {
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
  const name = checkFileName(upload.originalName);
  const { pages } = await inspectPdf(upload.bytes, limits, name);
  const storageKey = `library/${version.id}/document.pdf`;
  await storage.put(storageKey, upload.bytes);
  try {
    await ds.transaction(async (m) => {
      await m.getRepository(LibraryVersion).update(version.id, {
        documentFile: {
          storageKey,
          name,
          sha256: sha256(upload.bytes),
          sizeBytes: upload.bytes.byteLength,
          pages,
        },
      });
      await audit(m, user, 'library.document_attached', {
        configuration: config.id,
        version: version.number,
        name,
        pages,
      });
    });
  } catch (error) {
    await storage.delete(storageKey).catch(() => undefined);
    throw error;
  }
  return getVersion(ds, user, id);
}

export async function readDocument(ds: DataSource, user: U, id: string) {
  const { version } = await readableVersion(ds.manager, user, id);
  if (!version.documentFile) throw AppError.notFound("manufacturer's document");
  return version.documentFile;
}
