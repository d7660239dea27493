// A contractor deletes a package that was never submitted (revision 1 still a draft): the
// package, its draft and its uploaded files go; the deletion is kept in the audit log by
// reference. Anything submitted stays for the record (409).
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../lib/storage';
import { recordAudit } from '../audit/service';
import { UploadedFile } from '../files/file.entity';
import { LiftPackage, Revision } from './package.entity';
import { findScopedPackage } from './package-scope';

export async function deleteDraftPackage(ds: DataSource, storage: Storage, user: Actor, packageId: string) {
  if (user.role !== 'contractor') throw AppError.forbidden('Only the contractor deletes a draft.');
  await findScopedPackage(ds.manager, user, packageId);
  const keys = await ds.transaction(async (m) => {
    const pkg = await m
      .getRepository(LiftPackage)
      .createQueryBuilder('p')
      .where('p.id = :id AND p.contractor_organisation_id = :org', {
        id: packageId,
        org: user.organisationId,
      })
      .setLock('pessimistic_write')
      .getOne();
    if (!pkg) throw AppError.notFound('lift package');
    if (pkg.status !== 'draft' || pkg.currentRevision !== 1)
      throw new AppError(
        409,
        'not_a_first_draft',
        `${pkg.reference} has been submitted: it stays on record. Only a package never submitted can be deleted.`,
      );
    const revisions = await m.getRepository(Revision).findBy({ packageId: pkg.id });
    const files = revisions.length
      ? await m
          .getRepository(UploadedFile)
          .createQueryBuilder('f')
          .where('f.revision_id IN (:...ids)', { ids: revisions.map((r) => r.id) })
          .getMany()
      : [];
    await recordAudit(m, {
      action: 'package.deleted',
      actor: user,
      packageId: null,
      detail: { reference: pkg.reference, title: pkg.title, files: files.length },
    });
    await m.getRepository(LiftPackage).delete(pkg.id);
    return files.map((f) => f.storageKey);
  });
  // The draft's objects are its own (a first draft carries nothing over from another revision).
  for (const key of keys) await storage.delete(key).catch(() => undefined);
}
