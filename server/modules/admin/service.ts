// Desk administration: the admin's own organisation, the contractors that work on its
// sites, its sites with their reviewers and review policies (people and invitations: people.ts).
// Every change is audited; a policy change applies to check runs from then on, and each
// stored result keeps the policy it was computed with.
import type { Actor } from '@shared/rules/actor';
import type { DataSource } from 'typeorm';
import { In } from 'typeorm';
import { POLICY_DEFAULTS, SitePolicy } from '@shared/schemas/site-policy';
import type { z } from 'zod';
import type { SiteBody } from '@shared/schemas/admin';
import { AppError, zodFields } from '../../lib/app-error';
import { recordAudit } from '../audit/service';
import { Organisation } from '../organisations/organisation.entity';
import { Site, SiteMember } from '../sites/site.entity';
import { User } from '../users/user.entity';

/**
 * The organisations an admin manages: their own, the contractors added to their desk, and
 * any contractor with a package on one of their sites.
 */
export async function visibleOrganisations(ds: DataSource, admin: Actor) {
  return ds
    .getRepository(Organisation)
    .createQueryBuilder('o')
    .where('o.id = :org OR o.desk_owner_id = :org', { org: admin.organisationId })
    .orWhere(
      `o.id IN (SELECT lp.contractor_organisation_id FROM lift_packages lp JOIN sites s ON s.id = lp.site_id
               WHERE s.owner_organisation_id = :org)`,
      { org: admin.organisationId },
    )
    .orderBy('o.name')
    .getMany();
}

export async function listOrganisations(ds: DataSource, admin: Actor) {
  const orgs = await visibleOrganisations(ds, admin);
  const counts: Array<{ id: string; n: number }> = await ds.query(
    `SELECT organisation_id AS id, count(*)::int AS n FROM users WHERE organisation_id = ANY($1) GROUP BY organisation_id`,
    [orgs.map((o) => o.id)],
  );
  const byId = new Map(counts.map((c) => [c.id, c.n]));
  return { items: orgs.map((o) => ({ id: o.id, name: o.name, kind: o.kind, people: byId.get(o.id) ?? 0 })) };
}

export async function createOrganisation(
  ds: DataSource,
  admin: Actor,
  body: { name: string; kind: 'contractor' | 'owner' },
) {
  if (body.kind === 'owner') {
    throw AppError.badRequest('kind: a desk has one owner organisation; add contractors here', [
      { path: 'kind', message: "kind must be 'contractor' (the owner organisation is your own)" },
    ]);
  }
  return ds.transaction(async (m) => {
    const org = await m
      .getRepository(Organisation)
      .save({ name: body.name, kind: body.kind, deskOwnerId: admin.organisationId });
    await recordAudit(m, {
      action: 'organisation.created',
      actor: admin,
      packageId: null,
      detail: { name: org.name, kind: org.kind },
    });
    return { id: org.id, name: org.name, kind: org.kind, people: 0 };
  });
}

export async function renameOrganisation(ds: DataSource, admin: Actor, id: string, name: string) {
  const org = (await visibleOrganisations(ds, admin)).find((o) => o.id === id);
  if (!org) throw AppError.notFound('organisation');
  await ds.transaction(async (m) => {
    await m.getRepository(Organisation).update(id, { name });
    await recordAudit(m, {
      action: 'organisation.renamed',
      actor: admin,
      packageId: null,
      detail: { from: org.name, to: name },
    });
  });
  return (await listOrganisations(ds, admin)).items.find((o) => o.id === id)!;
}

// ---- sites ------------------------------------------------------------------------------

async function ownSite(ds: DataSource, admin: Actor, id: string) {
  const site = await ds.getRepository(Site).findOneBy({ id, ownerOrganisationId: admin.organisationId });
  if (!site) throw AppError.notFound('site');
  return site;
}

export async function adminSite(ds: DataSource, site: Site) {
  const rows: Array<{ id: string; name: string; email: string }> = await ds.query(
    `SELECT u.id, u.name, u.email FROM site_members sm JOIN users u ON u.id = sm.user_id WHERE sm.site_id = $1 ORDER BY u.name`,
    [site.id],
  );
  return {
    id: site.id,
    name: site.name,
    code: site.code,
    address: site.address,
    timeZone: site.timeZone,
    unitSystem: site.unitSystem,
    reviewTurnaroundDays: site.reviewTurnaroundDays,
    reviewMarginDays: site.reviewMarginDays,
    policyVersion: site.policyVersion,
    reviewers: rows,
  };
}

export async function listSites(ds: DataSource, admin: Actor) {
  const sites = await ds
    .getRepository(Site)
    .find({ where: { ownerOrganisationId: admin.organisationId }, order: { name: 'ASC' } });
  return { items: await Promise.all(sites.map((s) => adminSite(ds, s))) };
}

function codeTaken(error: unknown) {
  return (error as { code?: string }).code === '23505';
}

/** A site's settings, as SiteBody gives them (SitePatch: some of them). */
type SiteSettings = z.output<typeof SiteBody>;

export async function createSite(ds: DataSource, admin: Actor, body: SiteSettings) {
  try {
    const site = await ds.transaction(async (m) => {
      const s = await m
        .getRepository(Site)
        .save({ ...body, ownerOrganisationId: admin.organisationId, reviewPolicy: {} });
      await recordAudit(m, {
        action: 'site.created',
        actor: admin,
        packageId: null,
        detail: { name: s.name, code: s.code },
      });
      return s;
    });
    return adminSite(ds, site);
  } catch (error) {
    if (codeTaken(error))
      throw new AppError(409, 'code_taken', `The site code ${body.code} is already used.`, [
        { path: 'code', message: 'code is already used by another site' },
      ]);
    throw error;
  }
}

export async function updateSite(ds: DataSource, admin: Actor, id: string, body: Partial<SiteSettings>) {
  const site = await ownSite(ds, admin, id);
  try {
    await ds.transaction(async (m) => {
      await m.getRepository(Site).update(site.id, body);
      await recordAudit(m, {
        action: 'site.updated',
        actor: admin,
        packageId: null,
        detail: { site: site.code, changes: body },
      });
    });
  } catch (error) {
    if (codeTaken(error))
      throw new AppError(409, 'code_taken', `The site code ${body.code} is already used.`, [
        { path: 'code', message: 'code is already used by another site' },
      ]);
    throw error;
  }
  return adminSite(ds, await ownSite(ds, admin, id));
}

export async function setSiteReviewers(ds: DataSource, admin: Actor, id: string, userIds: string[]) {
  const site = await ownSite(ds, admin, id);
  const people = userIds.length
    ? await ds
        .getRepository(User)
        .findBy({ id: In(userIds), role: 'reviewer', active: true, organisationId: admin.organisationId })
    : [];
  if (people.length !== new Set(userIds).size) {
    throw AppError.badRequest('userIds: every id must be an active reviewer of your organisation', [
      { path: 'userIds', message: 'userIds must all be active reviewers of your organisation' },
    ]);
  }
  await ds.transaction(async (m) => {
    await m.getRepository(SiteMember).delete({ siteId: site.id });
    for (const p of people) await m.getRepository(SiteMember).save({ siteId: site.id, userId: p.id });
    await recordAudit(m, {
      action: 'site.reviewers',
      actor: admin,
      packageId: null,
      detail: { site: site.code, reviewers: people.map((p) => p.name) },
    });
  });
  return adminSite(ds, site);
}

// ---- review policy ----------------------------------------------------------------------

export async function getPolicy(ds: DataSource, admin: Actor, id: string) {
  const site = await ownSite(ds, admin, id);
  const history: Array<{ at: Date; actor: string | null; detail: { before: unknown; after: unknown } }> =
    await ds.query(
      `SELECT e.created_at AS at, u.name AS actor, e.detail FROM audit_events e LEFT JOIN users u ON u.id = e.actor_id
     WHERE e.action = 'policy.changed' AND e.detail->>'siteId' = $1 ORDER BY e.created_at DESC LIMIT 50`,
      [site.id],
    );
  return {
    policyVersion: site.policyVersion,
    overrides: site.reviewPolicy ?? {},
    effective: SitePolicy.parse(site.reviewPolicy ?? {}),
    defaults: POLICY_DEFAULTS,
    history: history.map((h) => ({
      at: new Date(h.at).toISOString(),
      actor: h.actor,
      before: h.detail.before,
      after: h.detail.after,
    })),
  };
}

export async function setPolicy(
  ds: DataSource,
  admin: Actor,
  id: string,
  overrides: Record<string, unknown>,
) {
  const site = await ownSite(ds, admin, id);
  // Own keys only: `in` would let inherited names (constructor, toString) through.
  const unknownKeys = Object.keys(overrides).filter((k) => !Object.hasOwn(POLICY_DEFAULTS, k));
  if (unknownKeys.length) {
    throw AppError.badRequest(
      `overrides.${unknownKeys[0]}: not a policy limit`,
      unknownKeys.map((k) => ({ path: `overrides.${k}`, message: `${k} is not a policy limit` })),
    );
  }
  const parsed = SitePolicy.safeParse(overrides);
  if (!parsed.success) {
    const fields = zodFields(parsed.error, 'overrides');
    throw new AppError(400, 'invalid_input', `${fields[0].path}: ${fields[0].message}`, fields);
  }
  await ds.transaction(async (m) => {
    await m
      .getRepository(Site)
      .save({ id: site.id, reviewPolicy: overrides, policyVersion: site.policyVersion + 1 });
    await recordAudit(m, {
      action: 'policy.changed',
      actor: admin,
      packageId: null,
      detail: {
        siteId: site.id,
        site: site.code,
        before: site.reviewPolicy,
        after: overrides,
        policyVersion: site.policyVersion + 1,
      },
    });
  });
  return getPolicy(ds, admin, id);
}

// ---- people -----------------------------------------------------------------------------
