// The preview the coordinator sees before issuing: page 1 of the stamped return as it will print
// (the stamp block, the markups, the footer), built by the same builder from the same input as the
// stamp job, for the decision on record now. Nothing is stored or signed, and no return row is
// written: the verification code is a placeholder of the real one's length that reads "preview,
// not yet issued".
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import { documentUnits } from '@shared/rules/document-units';
import { AppError } from '../../lib/app-error';
import { concatenate } from '../../lib/pdf-tools/qpdf';
import type { Storage } from '../../lib/storage';
import { Site } from '../sites/site.entity';
import { fetchOriginals, readReturnInput } from './return-input';
import { decidedForReturn } from './service';
import { buildStampedReturnFile, StampInputError } from './stamp-pdf';

/** 24 characters, as a real code: the stamp block lays out the same. */
export const PREVIEW_CODE = 'PREVIEWXNOTXYETXISSUEDXX';

export async function previewReturn(
  ds: DataSource,
  storage: Storage,
  user: Actor,
  packageId: string,
  appUrl: string,
): Promise<Buffer> {
  const { pkg, decision } = await decidedForReturn(ds, user, packageId, 'previewed');
  const site = await ds.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
  const { input, files } = await readReturnInput(
    ds,
    {
      packageId: pkg.id,
      revisionId: decision.revisionId,
      decisionId: decision.id,
      issuedById: user.id,
      unitSystem: documentUnits(pkg, site).system,
      issuedAt: new Date(),
      verificationCode: PREVIEW_CODE,
    },
    appUrl,
  );
  const work = await mkdtemp(path.join(tmpdir(), 'return-preview-'));
  try {
    const documents = await fetchOriginals(storage, files, work);
    const whole = path.join(work, 'preview-whole.pdf');
    await buildStampedReturnFile({ ...input, documents }, whole, { signer: null, workDir: work });
    const first = path.join(work, 'preview-page-1.pdf');
    await concatenate([{ file: whole, range: '1' }], first);
    return await readFile(first);
  } catch (err) {
    if (err instanceof StampInputError) throw new AppError(422, 'unreadable_document', err.message);
    throw err;
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
