// The invented demo week: Tamsin Ridge Energy (owner) runs lift reviews for its refinery
// and its wharf terminal; Brackwater Lifting and Selsdon & Hale Crane Hire submit plans.
import type { DataSource } from 'typeorm';
import type { Storage } from '../../lib/storage';
import { Organisation } from '../../modules/organisations/organisation.entity';
import { Site, SiteMember } from '../../modules/sites/site.entity';
import { User } from '../../modules/users/user.entity';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './demo-accounts';
import { seedLibrary } from './library';
import { finishSeededPackages, seedPackages } from './packages';

export async function seedScenario(
  dataSource: DataSource,
  storage: Storage,
  opts: { hash: (p: string) => string; appUrl: string },
) {
  const { seeded, people, reviewer } = await dataSource.transaction(async (m) => {
    const orgs = new Map<string, Organisation>();
    for (const [name, kind] of [
      ['Tamsin Ridge Energy', 'owner'],
      ['Brackwater Lifting Ltd', 'contractor'],
      ['Selsdon & Hale Crane Hire', 'contractor'],
    ] as const) {
      const deskOwnerId = kind === 'contractor' ? orgs.get('Tamsin Ridge Energy')!.id : null;
      orgs.set(name, await m.getRepository(Organisation).save({ name, kind, deskOwnerId }));
    }
    const passwordHash = opts.hash(DEMO_PASSWORD);
    const people = new Map<string, User>();
    for (const a of DEMO_ACCOUNTS) {
      const user = await m.getRepository(User).save({
        organisationId: orgs.get(a.organisation)!.id,
        email: a.email,
        name: a.name,
        role: a.role,
        unitSystem:
          a.organisation === 'Selsdon & Hale Crane Hire' || a.email.startsWith('dev.')
            ? 'imperial'
            : 'metric',
        passwordHash,
      });
      people.set(a.email, user);
    }
    const owner = orgs.get('Tamsin Ridge Energy')!;
    const refinery = await m.getRepository(Site).save({
      ownerOrganisationId: owner.id,
      name: 'Tamsin Ridge Refinery',
      code: 'TRR',
      address: 'North Gate, Tamsin Ridge Road',
      timeZone: 'Europe/London',
      reviewPolicy: {},
    });
    const wharf = await m.getRepository(Site).save({
      ownerOrganisationId: owner.id,
      name: 'Old Ferry Wharf Terminal',
      code: 'OFW',
      address: 'Berth 3, Old Ferry Lane',
      timeZone: 'Europe/London',
      reviewPolicy: { maxChartUsePct: 80, minStabilityRatio: 1.6 },
    });
    const reviewer = people.get('rhea.okafor@tamsin-ridge.example')!;
    for (const site of [refinery, wharf])
      await m.getRepository(SiteMember).save({ siteId: site.id, userId: reviewer.id });
    const library = await seedLibrary(m, { orgs, people });
    const seeded = await seedPackages(m, storage, { orgs, people, sites: { refinery, wharf }, library });
    return { seeded, people, reviewer };
  });
  await finishSeededPackages(dataSource, seeded, people, reviewer, { storage, appUrl: opts.appUrl });
}
