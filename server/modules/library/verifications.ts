// Owner desk verification: an owner desk's engineer verifies a version's chart against the
// manufacturer's document for that desk alone; other desks do not see it.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { AppError } from '../../lib/app-error';
import type { LiftPackage } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { LibraryVerification } from './library.entity';
import { audit } from './library-audit';
import { readableVersion } from './library-scope';
import { names } from './version-summaries';
import { getVersion } from './versions';

type U = Actor;

export async function verifyVersion(ds: DataSource, user: U, id: string, note: string, packageId?: string) {
  if (user.organisationKind !== 'owner')
    throw AppError.forbidden("Only an owner desk's engineer verifies a chart.");
  await ds.transaction(async (m) => {
    const { version, config } = await readableVersion(m, user, id);
    const existing = await m
      .getRepository(LibraryVerification)
      .findOneBy({ versionId: version.id, ownerOrganisationId: user.organisationId });
    if (existing) {
      const who = (await names(m, [existing.engineerId])).get(existing.engineerId);
      throw AppError.conflict(
        `Version ${version.number} of ${config.name} was verified for your desk by ${who} already.`,
      );
    }
    let pkg: LiftPackage | null = null;
    if (packageId) pkg = await findScopedPackage(m, user, packageId);
    await m.getRepository(LibraryVerification).save({
      versionId: version.id,
      ownerOrganisationId: user.organisationId,
      engineerId: user.id,
      packageId: pkg?.id ?? null,
      note,
    });
    await audit(
      m,
      user,
      'library.chart_verified',
      { version: version.id, configuration: config.name, number: version.number, note },
      pkg?.id,
    );
  });
  return getVersion(ds, user, id);
}
