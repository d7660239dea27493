// Desk administration payloads: organisations, sites and their reviewers, people and
// invitations, review policies, the mail outbox, and each person's profile.
import { z } from 'zod';
import { safeText } from './safe-text';
import { OrganisationKind, Role, UnitSystem } from './common';

const name = (field: string) =>
  safeText(field)
    .trim()
    .min(2, `${field} must be at least 2 characters`)
    .max(200, `${field} must be at most 200 characters`);

export const OrganisationBody = z.object({ name: name('name'), kind: OrganisationKind });
export const OrganisationPatch = z.object({ name: name('name') });

const siteFields = {
  name: name('name'),
  code: z
    .string()
    .trim()
    .regex(
      /^[A-Z0-9]{2,8}$/,
      'code must be 2 to 8 capital letters or digits (it starts every package reference)',
    ),
  address: safeText('address').trim().max(300, 'address must be at most 300 characters'),
  timeZone: z
    .string()
    .max(60)
    .refine((tz) => {
      try {
        new Intl.DateTimeFormat('en-GB', { timeZone: tz });
        return true;
      } catch {
        return false;
      }
    }, 'timeZone must be an IANA time zone such as Europe/London'),
  /** The unit system of every document of the site's packages; null: each package's own. */
  unitSystem: z
    .enum(['metric', 'imperial'], { message: "unitSystem must be 'metric', 'imperial' or null" })
    .nullable(),
  /** Working days a review is given from submission (shared/rules/review-due.ts). */
  reviewTurnaroundDays: z
    .number({ error: 'reviewTurnaroundDays must be a whole number of working days' })
    .int('reviewTurnaroundDays must be a whole number of working days')
    .min(1, 'reviewTurnaroundDays must be between 1 and 60 working days')
    .max(60, 'reviewTurnaroundDays must be between 1 and 60 working days'),
  /** Calendar days before the planned lift by which the review must be done. */
  reviewMarginDays: z
    .number({ error: 'reviewMarginDays must be a whole number of days' })
    .int('reviewMarginDays must be a whole number of days')
    .min(0, 'reviewMarginDays must be between 0 and 30 days')
    .max(30, 'reviewMarginDays must be between 0 and 30 days'),
};

export const SiteBody = z.object({
  ...siteFields,
  address: siteFields.address.default(''),
  timeZone: siteFields.timeZone.default('UTC'),
  unitSystem: siteFields.unitSystem.default(null),
  reviewTurnaroundDays: siteFields.reviewTurnaroundDays.default(5),
  reviewMarginDays: siteFields.reviewMarginDays.default(2),
});
/** A change of some of a site's settings: what is left out stays as it is (no defaults). */
export const SitePatch = z.object(siteFields).partial();
export const SiteReviewersBody = z.object({
  userIds: z.array(z.uuid()).max(50, 'userIds must list at most 50 people'),
});

export const AdminSite = z.object({
  id: z.uuid(),
  name: z.string(),
  code: z.string(),
  address: z.string(),
  timeZone: z.string(),
  unitSystem: UnitSystem.nullable(),
  reviewTurnaroundDays: z.number().int(),
  reviewMarginDays: z.number().int(),
  policyVersion: z.number().int(),
  reviewers: z.array(z.object({ id: z.uuid(), name: z.string(), email: z.string() })),
});

export const Person = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: Role,
  organisation: z.object({ id: z.uuid(), name: z.string(), kind: OrganisationKind }),
  active: z.boolean(),
  /** invited: the person has not set a password yet; expired: the link ran out. */
  state: z.enum(['active', 'invited', 'invite_expired', 'deactivated']),
  createdAt: z.string(),
});
export type Person = z.infer<typeof Person>;

/**
 * The answer to an invitation (or a new link): the person, and the link itself, shown once to
 * the admin who sent it. Only a hash of it is kept; the stored e-mail holds a placeholder.
 */
export const InvitedPerson = Person.extend({ inviteLink: z.string() });
export type InvitedPerson = z.infer<typeof InvitedPerson>;

export const InviteBody = z.object({
  email: z.email({ message: 'email must be a valid e-mail address' }).max(254),
  name: name('name'),
  role: Role,
  organisationId: z.uuid({ message: 'organisationId must be the id of an organisation' }),
});
export const PersonPatch = z.object({ role: Role.optional(), active: z.boolean().optional() });

export const InviteInfo = z.object({
  email: z.string(),
  name: z.string(),
  organisation: z.string(),
  expiresAt: z.string(),
});
export const AcceptInviteBody = z.object({
  password: z
    .string()
    .min(10, 'password must be at least 10 characters')
    .max(200, 'password must be at most 200 characters'),
});

/** A site's policy overrides: any subset of the engine's policy; an absent key takes the default. */
/** GET/PUT /api/admin/sites/:id/policy: the overrides, the effective values, defaults with sources, the history. */
const PolicyValues = z.record(z.string(), z.unknown());

export const PolicyDefault = z.object({
  value: z.unknown(),
  label: z.string(),
  source: z.object({ kind: z.string(), text: z.string() }),
});

const PolicyActor = z.union([z.string(), z.object({ name: z.string() }).loose(), z.null()]);

export const PolicyResponse = z.object({
  policyVersion: z.number().int(),
  overrides: PolicyValues,
  effective: PolicyValues,
  defaults: z.record(z.string(), PolicyDefault),
  history: z.array(
    z.object({
      at: z.string(),
      actor: PolicyActor.optional(),
      before: PolicyValues.nullable().optional(),
      after: PolicyValues.nullable().optional(),
    }),
  ),
});
export type PolicyResponse = z.infer<typeof PolicyResponse>;
export const PolicyOverridesBody = z.object({ overrides: z.record(z.string(), z.unknown()) });

export const ProfilePatch = z.object({
  name: name('name').optional(),
  unitSystem: UnitSystem.optional(),
  notifyReminders: z.boolean().optional(),
});
export const PasswordChangeBody = z.object({
  currentPassword: z.string().min(1, 'currentPassword is required').max(200),
  newPassword: z
    .string()
    .min(10, 'newPassword must be at least 10 characters')
    .max(200, 'newPassword must be at most 200 characters'),
});

export const MAIL_EVENTS = [
  'submitted',
  'assigned',
  'decided',
  'returned',
  'answered',
  'resubmitted',
  'reminder',
  'review_due',
  'invite',
] as const;
export const MailMessage = z.object({
  id: z.uuid(),
  event: z.enum(MAIL_EVENTS),
  to: z.string(),
  subject: z.string(),
  status: z.enum(['queued', 'sent', 'failed']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  packageId: z.uuid().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export const CaughtMail = z.object({
  id: z.uuid(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  receivedAt: z.string(),
});

/** A contractor or site owner on the desk, with how many people it has (GET /api/admin/organisations). */
export const AdminOrganisation = z.object({
  id: z.uuid(),
  name: z.string(),
  kind: OrganisationKind,
  people: z.number().int(),
});
export type AdminOrganisation = z.infer<typeof AdminOrganisation>;
export const OrganisationList = z.object({ items: z.array(AdminOrganisation) });
export type OrganisationList = z.infer<typeof OrganisationList>;

/** GET/PATCH /api/me/profile: the signed-in person's own settings. */
export const Profile = z.object({
  name: z.string(),
  email: z.string(),
  unitSystem: UnitSystem,
  notifyReminders: z.boolean(),
});
export type Profile = z.infer<typeof Profile>;
