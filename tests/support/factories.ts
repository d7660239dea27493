// Makes the records a test needs; every test makes its own, with unique names.
import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { DataSource } from 'typeorm';
import type { PackageStatus, Role } from '@shared/schemas/common';
import { Organisation } from '@server/modules/organisations/organisation.entity';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { Site, SiteMember } from '@server/modules/sites/site.entity';
import { User } from '@server/modules/users/user.entity';
import { TEST_PASSWORD } from './app';

const hash = bcrypt.hashSync(TEST_PASSWORD, 4);
const tag = () => randomUUID().slice(0, 8);

export async function makeOrganisation(
  ds: DataSource,
  kind: 'contractor' | 'owner',
  name = `${kind} ${tag()}`,
  deskOwnerId: string | null = null,
) {
  return ds.getRepository(Organisation).save({ name, kind, deskOwnerId });
}

export async function makeUser(
  ds: DataSource,
  organisation: Organisation,
  role: Role,
  extra: Partial<User> = {},
) {
  return ds.getRepository(User).save({
    organisationId: organisation.id,
    email: `${role}-${tag()}@test.example`,
    name: `${role} ${tag()}`,
    role,
    unitSystem: 'metric',
    passwordHash: hash,
    ...extra,
  });
}

export async function makeSite(ds: DataSource, owner: Organisation, reviewers: User[] = []) {
  const site = await ds
    .getRepository(Site)
    .save({ ownerOrganisationId: owner.id, name: `Site ${tag()}`, code: tag() });
  for (const r of reviewers) await ds.getRepository(SiteMember).save({ siteId: site.id, userId: r.id });
  return site;
}

export async function makePackage(
  ds: DataSource,
  opts: {
    contractor: Organisation;
    site: Site;
    createdBy: User;
    status?: PackageStatus;
    engineer?: User;
    plannedLiftDate?: string;
    /** The lift data of revision 1; it is submitted (frozen) unless the package is a draft. */
    inputs?: Record<string, unknown>;
  },
) {
  const pkg = await ds.getRepository(LiftPackage).save({
    reference: `T-${tag()}`,
    title: `Test lift ${tag()}`,
    contractorOrganisationId: opts.contractor.id,
    siteId: opts.site.id,
    createdById: opts.createdBy.id,
    unitSystem: opts.createdBy.unitSystem ?? 'metric',
    status: opts.status ?? 'ready_for_review',
    plannedLiftDate: opts.plannedLiftDate ?? '2027-03-14',
    assignedEngineerId: opts.engineer?.id ?? null,
  });
  const submitted = pkg.status !== 'draft';
  await ds.getRepository(Revision).save({
    packageId: pkg.id,
    number: 1,
    state: submitted ? 'submitted' : 'draft',
    inputs: opts.inputs ?? {},
    submittedAt: submitted ? new Date() : null,
    checkStatus: submitted ? 'queued' : 'none',
  });
  return pkg;
}

/** Two contractors, an owner with one site, and a person in every role. */
export async function makeWorld(ds: DataSource) {
  const owner = await makeOrganisation(ds, 'owner');
  const contractorA = await makeOrganisation(ds, 'contractor', undefined, owner.id);
  const contractorB = await makeOrganisation(ds, 'contractor', undefined, owner.id);
  const reviewer = await makeUser(ds, owner, 'reviewer');
  const engineer = await makeUser(ds, owner, 'engineer');
  const admin = await makeUser(ds, owner, 'admin');
  const plannerA = await makeUser(ds, contractorA, 'contractor');
  const plannerB = await makeUser(ds, contractorB, 'contractor');
  const site = await makeSite(ds, owner, [reviewer]);
  return { owner, contractorA, contractorB, reviewer, engineer, admin, plannerA, plannerB, site };
}
