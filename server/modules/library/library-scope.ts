// What a user may reach in the fleet library: a contractor its own cranes, configurations and
// versions; the owner side sees a version only through a package on its sites that uses it.
import type { Actor } from '@shared/rules/actor';
import type { EntityManager } from 'typeorm';
import { AppError } from '../../lib/app-error';
import { scopedPackages } from '../packages/package-scope';
import { LibraryConfiguration, LibraryCrane, LibraryUseRow, LibraryVersion } from './library.entity';

type U = Actor;

export async function ownCrane(m: EntityManager, user: U, id: string): Promise<LibraryCrane> {
  const crane = await m.getRepository(LibraryCrane).findOneBy({ id, organisationId: user.organisationId });
  if (!crane || user.role !== 'contractor') throw AppError.notFound('crane');
  return crane;
}

export async function ownConfiguration(m: EntityManager, user: U, id: string) {
  const config = await m.getRepository(LibraryConfiguration).findOneBy({ id });
  if (!config) throw AppError.notFound('configuration');
  const crane = await ownCrane(m, user, config.craneId).catch(() => {
    throw AppError.notFound('configuration');
  });
  return { config, crane };
}

/** A version the user may read: the contractor's own, or one a package in the user's scope uses. */
export async function readableVersion(m: EntityManager, user: U, id: string) {
  const version = await m.getRepository(LibraryVersion).findOneBy({ id });
  if (!version) throw AppError.notFound('configuration version');
  const config = await m.getRepository(LibraryConfiguration).findOneByOrFail({ id: version.configurationId });
  const crane = await m.getRepository(LibraryCrane).findOneByOrFail({ id: config.craneId });
  if (user.role === 'contractor') {
    if (crane.organisationId !== user.organisationId) throw AppError.notFound('configuration version');
  } else {
    const used = await scopedPackages(m, user)
      .innerJoin(LibraryUseRow, 'u', 'u.package_id = p.id')
      .andWhere('u.version_id = :vid', { vid: id })
      .getCount();
    if (!used) throw AppError.notFound('configuration version');
  }
  return { version, config, crane };
}

export async function ownVersion(m: EntityManager, user: U, id: string) {
  const found = await readableVersion(m, user, id);
  if (user.role !== 'contractor')
    throw AppError.forbidden('Only the contractor that keeps the crane can change it.');
  return found;
}
