// Desk administration, people: the list of people an admin manages, invitations (issue, send
// again, look up, accept) and changes to a person. Every change is audited.
import type { Actor } from '@shared/rules/actor';
import { createHash, randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import type { Role } from '@shared/schemas/common';
import { AppError } from '../../lib/app-error';
import type { Queues } from '../../lib/queues';
import { recordAudit } from '../audit/service';
import { dispatchMail, stageMail } from '../mail/service';
import { templates } from '../mail/templates';
import { LINK_PLACEHOLDER, sealLink } from '../mail/sealed-link';
import { Organisation } from '../organisations/organisation.entity';
import { SiteMember } from '../sites/site.entity';
import { User } from '../users/user.entity';
import { visibleOrganisations } from './service';

function personState(u: User): 'active' | 'invited' | 'invite_expired' | 'deactivated' {
  if (!u.active) return 'deactivated';
  if (!u.passwordHash)
    return u.inviteExpiresAt && u.inviteExpiresAt.getTime() < Date.now() ? 'invite_expired' : 'invited';
  return 'active';
}

export function toPerson(u: User) {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    organisation: { id: u.organisation!.id, name: u.organisation!.name, kind: u.organisation!.kind },
    active: u.active,
    state: personState(u),
    createdAt: u.createdAt.toISOString(),
  };
}

export async function listPeople(
  ds: DataSource,
  admin: Actor,
  filter: { organisationId?: string; role?: Role; state?: string },
) {
  const orgIds = (await visibleOrganisations(ds, admin)).map((o) => o.id);
  const users = await ds.getRepository(User).find({
    where: {
      organisationId: In(filter.organisationId ? orgIds.filter((o) => o === filter.organisationId) : orgIds),
      ...(filter.role ? { role: filter.role } : {}),
    },
    relations: { organisation: true },
    order: { name: 'ASC' },
  });
  const people = users.map(toPerson);
  return { items: filter.state ? people.filter((p) => p.state === filter.state) : people };
}

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

export interface InviteOptions {
  appUrl: string;
  hours: number;
  /** The key the link is sealed with in the stored message (JWT_SECRET). */
  secret: string;
}

/**
 * A new one-time link: only its hash is kept on the person, the stored message holds a
 * placeholder and the link sealed until it is sent. Returns the link, which the inviting
 * admin sees once in the answer.
 */
async function issueInvite(
  m: EntityManager,
  admin: Actor,
  user: User,
  org: Organisation,
  opts: InviteOptions,
): Promise<{ mailIds: string[]; link: string }> {
  const token = randomBytes(24).toString('base64url');
  const expires = new Date(Date.now() + opts.hours * 3600_000);
  const link = `${opts.appUrl}/invite/${token}`;
  await m
    .getRepository(User)
    .update(user.id, { inviteTokenHash: hashToken(token), inviteExpiresAt: expires });
  const mailIds = await stageMail(m, [
    {
      event: 'invite',
      dedupeKey: `invite:${user.id}:${hashToken(token).slice(0, 16)}`,
      packageId: null,
      recipient: user,
      content: templates.invite(user.name, org.name, admin.name, LINK_PLACEHOLDER, expires.toUTCString()),
      sealedLink: sealLink(opts.secret, link, expires),
    },
  ]);
  return { mailIds, link };
}

export async function invitePerson(
  ds: DataSource,
  queues: Queues,
  admin: Actor,
  body: { email: string; name: string; role: Role; organisationId: string },
  opts: InviteOptions,
) {
  const org = (await visibleOrganisations(ds, admin)).find((o) => o.id === body.organisationId);
  if (!org)
    throw AppError.badRequest('organisationId: not an organisation of this desk', [
      { path: 'organisationId', message: 'organisationId must be an organisation of this desk' },
    ]);
  const contractorRole = body.role === 'contractor';
  if (contractorRole !== (org.kind === 'contractor')) {
    throw AppError.badRequest(`role: ${body.role} does not fit a ${org.kind} organisation`, [
      {
        path: 'role',
        message:
          org.kind === 'contractor'
            ? "people of a contractor have the role 'contractor'"
            : "the owner's people are reviewers, engineers or admins",
      },
    ]);
  }
  const taken = await ds
    .getRepository(User)
    .createQueryBuilder('u')
    .where('lower(u.email) = lower(:e)', { e: body.email })
    .getCount();
  if (taken)
    throw new AppError(409, 'email_taken', `${body.email} already has an account.`, [
      { path: 'email', message: 'email already has an account' },
    ]);
  const { user, mailIds, link } = await ds.transaction(async (m) => {
    const u = await m.getRepository(User).save({
      organisationId: org.id,
      email: body.email,
      name: body.name,
      role: body.role,
      passwordHash: null,
      unitSystem: 'metric',
    });
    const issued = await issueInvite(m, admin, u, org, opts);
    await recordAudit(m, {
      action: 'person.invited',
      actor: admin,
      packageId: null,
      detail: { email: u.email, role: u.role, organisation: org.name },
    });
    return { user: u, ...issued };
  });
  await dispatchMail(queues, mailIds);
  return {
    ...toPerson(
      (await ds.getRepository(User).findOne({ where: { id: user.id }, relations: { organisation: true } }))!,
    ),
    inviteLink: link,
  };
}

async function visiblePerson(ds: DataSource, admin: Actor, id: string) {
  const orgIds = (await visibleOrganisations(ds, admin)).map((o) => o.id);
  const user = await ds
    .getRepository(User)
    .findOne({ where: { id, organisationId: In(orgIds) }, relations: { organisation: true } });
  if (!user) throw AppError.notFound('person');
  return user;
}

export async function reinvite(
  ds: DataSource,
  queues: Queues,
  admin: Actor,
  id: string,
  opts: InviteOptions,
) {
  const user = await visiblePerson(ds, admin, id);
  if (user.passwordHash)
    throw new AppError(409, 'already_active', `${user.name} has already set a password.`);
  const { mailIds, link } = await ds.transaction(async (m) => {
    const issued = await issueInvite(m, admin, user, user.organisation!, opts);
    await recordAudit(m, {
      action: 'person.reinvited',
      actor: admin,
      packageId: null,
      detail: { email: user.email },
    });
    return issued;
  });
  await dispatchMail(queues, mailIds);
  return { ...toPerson(await visiblePerson(ds, admin, id)), inviteLink: link };
}

export async function updatePerson(
  ds: DataSource,
  admin: Actor,
  id: string,
  body: { role?: Role; active?: boolean },
) {
  const user = await visiblePerson(ds, admin, id);
  if (user.id === admin.id && (body.active === false || (body.role && body.role !== 'admin'))) {
    throw new AppError(409, 'own_account', 'You cannot deactivate yourself or drop your own admin role.');
  }
  if (body.role && (body.role === 'contractor') !== (user.organisation!.kind === 'contractor')) {
    throw AppError.badRequest(`role: ${body.role} does not fit a ${user.organisation!.kind} organisation`, [
      { path: 'role', message: `role must fit a ${user.organisation!.kind} organisation` },
    ]);
  }
  await ds.transaction(async (m) => {
    const changes: Partial<Pick<User, 'role' | 'active' | 'tokenVersion'>> = {};
    if (body.role && body.role !== user.role) changes.role = body.role;
    if (body.active !== undefined && body.active !== user.active) changes.active = body.active;
    // A role change or a deactivation ends every session the person has.
    if (changes.role || changes.active === false) changes.tokenVersion = user.tokenVersion + 1;
    if (Object.keys(changes).length) {
      await m.getRepository(User).update(user.id, changes);
      if (changes.role && user.role === 'reviewer')
        await m.getRepository(SiteMember).delete({ userId: user.id });
      await recordAudit(m, {
        action: 'person.updated',
        actor: admin,
        packageId: null,
        detail: { email: user.email, ...body },
      });
    }
  });
  return toPerson(await visiblePerson(ds, admin, id));
}

// ---- invitation acceptance (public) -----------------------------------------------------

export async function findInvite(ds: DataSource, token: string) {
  const user = await ds
    .getRepository(User)
    .findOne({ where: { inviteTokenHash: hashToken(token) }, relations: { organisation: true } });
  if (!user || !user.active) throw AppError.notFound('invitation');
  if (!user.inviteExpiresAt || user.inviteExpiresAt.getTime() < Date.now()) {
    throw new AppError(
      410,
      'invite_expired',
      'This invitation link has expired. Ask the desk administrator to send a new one.',
    );
  }
  return user;
}

export async function acceptInvite(ds: DataSource, token: string, passwordHash: string) {
  const user = await findInvite(ds, token);
  await ds.transaction(async (m) => {
    await m
      .getRepository(User)
      .update(user.id, { passwordHash, inviteTokenHash: null, inviteExpiresAt: null });
    await recordAudit(m, {
      action: 'person.joined',
      actor: user,
      packageId: null,
      detail: { email: user.email },
    });
  });
  return user;
}
