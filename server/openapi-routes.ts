// Describes each API route for the OpenAPI document, beside the schemas it validates with.
import { z } from 'zod';
import {
  AcceptInviteBody,
  AdminSite,
  CaughtMail,
  InviteBody,
  InviteInfo,
  MailMessage,
  OrganisationBody,
  OrganisationPatch,
  PasswordChangeBody,
  Person,
  PersonPatch,
  PolicyOverridesBody,
  ProfilePatch,
  SiteBody,
  SitePatch,
  SiteReviewersBody,
} from '@shared/schemas/admin';
import { MeResponse, SignInBody } from '@shared/schemas/auth';
import { CalculationBody } from '@shared/schemas/calculations';
import {
  CreatePackageBody,
  FileSummary,
  PackageDetail,
  PackageListQuery,
  PackageListResponse,
  RevisionDetail,
  SaveDraftBody,
  SiteList,
} from '@shared/schemas/packages';
import {
  AcceptFigureBody,
  AssignBody,
  DecisionBody,
  Finding,
  FindingBody,
  FindingUpdateBody,
  Markup,
  MarkupBody,
  Verification,
} from '@shared/schemas/reviews';
import { describeRoute } from './lib/openapi';
import { IdParams, MailQuery, OrganisationList, PeopleQuery } from './modules/admin/routes';
import { TokenParams } from './modules/profile/routes';
import { LiftResultShape } from './modules/calculations/routes';
import { FileParams, PackageIdParams, RevisionParams } from './modules/packages/routes';
import { ReturnParams } from './modules/returns/routes';
import { CompareQuery, FindingParams, MarkupParams, MarkupQuery } from './modules/reviews/routes';

const Upload = z.object({
  kind: z.enum(['lift_plan', 'supporting']),
  file: z.string().meta({ format: 'binary' }),
});

describeRoute({
  method: 'get',
  path: '/health',
  summary: 'Database and queue status (503 when either is down)',
  tags: ['system'],
  public: true,
});
describeRoute({
  method: 'get',
  path: '/openapi.json',
  summary: 'This document',
  tags: ['system'],
  public: true,
});
describeRoute({
  method: 'post',
  path: '/auth/sign-in',
  summary: 'Sign in; sets the httpOnly session cookie',
  tags: ['auth'],
  public: true,
  body: SignInBody,
  response: MeResponse,
});
describeRoute({
  method: 'post',
  path: '/auth/sign-out',
  summary: 'Sign out; clears the session cookie',
  tags: ['auth'],
  public: true,
  status: 204,
});
describeRoute({
  method: 'get',
  path: '/me',
  summary: 'The signed-in person',
  tags: ['auth'],
  response: MeResponse,
});
describeRoute({
  method: 'get',
  path: '/sites',
  summary: 'Sites you work with',
  tags: ['sites'],
  response: SiteList,
});
describeRoute({
  method: 'get',
  path: '/packages',
  summary: 'Lift packages in your scope, filtered, sorted and paged',
  tags: ['packages'],
  query: PackageListQuery,
  response: PackageListResponse,
});
describeRoute({
  method: 'post',
  path: '/packages',
  summary: 'Start a lift package (contractor): a draft with revision 1',
  tags: ['packages'],
  body: CreatePackageBody,
  response: PackageDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/packages/:id',
  summary: 'One lift package: current revision, check results, files, audit trail',
  tags: ['packages'],
  params: PackageIdParams,
  response: PackageDetail,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/revisions/:number',
  summary: 'One revision with its inputs, results and files',
  tags: ['packages'],
  params: RevisionParams,
  response: RevisionDetail,
});
describeRoute({
  method: 'put',
  path: '/packages/:id/draft',
  summary: 'Autosave the draft revision (409 when stale or submitted)',
  tags: ['packages'],
  params: PackageIdParams,
  body: SaveDraftBody,
  response: PackageDetail,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/duplicate',
  summary: 'Start a new draft from this package’s inputs',
  tags: ['packages'],
  params: PackageIdParams,
  response: PackageDetail,
  status: 201,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/submit',
  summary: 'Freeze the revision and queue its check run',
  tags: ['packages'],
  params: PackageIdParams,
  response: PackageDetail,
  status: 202,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/files',
  summary: 'Upload a PDF to the draft revision (checked: header, trailer, encryption, size, pages)',
  tags: ['files'],
  params: PackageIdParams,
  body: Upload,
  bodyContentType: 'multipart/form-data',
  response: FileSummary,
  status: 201,
});
describeRoute({
  method: 'delete',
  path: '/packages/:id/files/:fileId',
  summary: 'Remove a PDF from the draft revision',
  tags: ['files'],
  params: FileParams,
  status: 204,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/files/:fileId',
  summary: 'The PDF itself',
  tags: ['files'],
  params: FileParams,
  responseContentType: 'application/pdf',
  response: z.string(),
});
describeRoute({
  method: 'post',
  path: '/calculations',
  summary: 'Evaluate a lift with the engine without storing it',
  tags: ['calculations'],
  body: CalculationBody,
  response: LiftResultShape,
});
describeRoute({
  method: 'get',
  path: '/calculations/schema',
  summary: 'JSON Schema of the lift input',
  tags: ['calculations'],
});
describeRoute({
  method: 'get',
  path: '/admin/organisations',
  summary: 'Organisations of the desk (admin)',
  tags: ['admin'],
  response: OrganisationList,
});

const Findings = z.object({ items: z.array(Finding) });
const StampedReturn = z.object({
  id: z.uuid(),
  revisionId: z.uuid(),
  state: z.enum(['pending', 'ready', 'failed']),
  progress: z.number().int(),
  error: z.string().nullable(),
  sha256: z.string().nullable(),
  pages: z.number().int().nullable(),
  verificationCode: z.string(),
  createdAt: z.string(),
  readyAt: z.string().nullable(),
});
describeRoute({
  method: 'get',
  path: '/engineers',
  summary: 'Engineers of your organisation with their open packages (reviewer, admin)',
  tags: ['review'],
});
describeRoute({
  method: 'post',
  path: '/assignments',
  summary: 'Assign or reassign an engineer to one or many packages (reviewer)',
  tags: ['review'],
  body: AssignBody,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/markups',
  summary: 'Markups of a revision, in PDF page coordinates',
  tags: ['review'],
  params: PackageIdParams,
  query: MarkupQuery,
  response: z.object({ items: z.array(Markup) }),
});
describeRoute({
  method: 'post',
  path: '/packages/:id/markups',
  summary: 'Add a markup (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: MarkupBody,
  response: Markup,
  status: 201,
});
describeRoute({
  method: 'delete',
  path: '/packages/:id/markups/:markupId',
  summary: 'Remove a markup (assigned engineer)',
  tags: ['review'],
  params: MarkupParams,
  status: 204,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/findings',
  summary: 'Findings of every revision with their state',
  tags: ['review'],
  params: PackageIdParams,
  response: Findings,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/findings',
  summary: 'Raise a finding on a page, a markup or a check (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: FindingBody,
  response: Findings,
  status: 201,
});
describeRoute({
  method: 'patch',
  path: '/packages/:id/findings/:findingId',
  summary: 'Answer (contractor) or close/reopen (engineer) a finding',
  tags: ['review'],
  params: FindingParams,
  body: FindingUpdateBody,
  response: Findings,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/accepted-figures',
  summary: 'Accept a stated figure that differs, with a reason (assigned engineer)',
  tags: ['review'],
  params: PackageIdParams,
  body: AcceptFigureBody,
  response: PackageDetail,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/decision',
  summary: 'Record the decision (assigned engineer); 409 when the package changed since baseVersion',
  tags: ['review'],
  params: PackageIdParams,
  body: DecisionBody,
  response: PackageDetail,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/revisions',
  summary: 'Start the next revision after Revise and resubmit or Rejected (contractor)',
  tags: ['review'],
  params: PackageIdParams,
  response: PackageDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/compare',
  summary: 'Inputs and check results that differ between two revisions',
  tags: ['review'],
  params: PackageIdParams,
  query: CompareQuery,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/returns',
  summary: 'Issue the stamped return for the recorded decision (reviewer)',
  tags: ['returns'],
  params: PackageIdParams,
  response: StampedReturn,
  status: 202,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/returns',
  summary: 'Stamped returns of the package with their progress',
  tags: ['returns'],
  params: PackageIdParams,
  response: z.object({ items: z.array(StampedReturn) }),
});
describeRoute({
  method: 'get',
  path: '/packages/:id/returns/:returnId/file',
  summary: 'The stamped PDF',
  tags: ['returns'],
  params: ReturnParams,
  responseContentType: 'application/pdf',
  response: z.string(),
});
describeRoute({
  method: 'get',
  path: '/verify/:code',
  summary: 'Public: is this stamped return the current accepted revision? (rate-limited)',
  tags: ['verify'],
  public: true,
  params: z.object({ code: z.string() }),
  response: Verification,
});

const Org = OrganisationList.shape.items.element;
const Profile = z.object({
  name: z.string(),
  email: z.string(),
  unitSystem: z.enum(['metric', 'imperial']),
  notifyReminders: z.boolean(),
});
describeRoute({
  method: 'post',
  path: '/admin/organisations',
  summary: 'Add a contractor organisation to the desk (admin)',
  tags: ['admin'],
  body: OrganisationBody,
  response: Org,
  status: 201,
});
describeRoute({
  method: 'patch',
  path: '/admin/organisations/:id',
  summary: 'Rename an organisation (admin)',
  tags: ['admin'],
  params: IdParams,
  body: OrganisationPatch,
  response: Org,
});
describeRoute({
  method: 'get',
  path: '/admin/sites',
  summary: 'Sites your organisation owns, with reviewers (admin)',
  tags: ['admin'],
  response: z.object({ items: z.array(AdminSite) }),
});
describeRoute({
  method: 'post',
  path: '/admin/sites',
  summary: 'Add a site (admin)',
  tags: ['admin'],
  body: SiteBody,
  response: AdminSite,
  status: 201,
});
describeRoute({
  method: 'patch',
  path: '/admin/sites/:id',
  summary: 'Change a site (admin)',
  tags: ['admin'],
  params: IdParams,
  body: SitePatch,
  response: AdminSite,
});
describeRoute({
  method: 'put',
  path: '/admin/sites/:id/reviewers',
  summary: 'Set the reviewers of a site (admin)',
  tags: ['admin'],
  params: IdParams,
  body: SiteReviewersBody,
  response: AdminSite,
});
describeRoute({
  method: 'get',
  path: '/admin/sites/:id/policy',
  summary: 'The site review policy: overrides, effective values, defaults with sources, history',
  tags: ['admin'],
  params: IdParams,
});
describeRoute({
  method: 'put',
  path: '/admin/sites/:id/policy',
  summary: 'Set the site policy overrides (audited; applies to check runs from now on)',
  tags: ['admin'],
  params: IdParams,
  body: PolicyOverridesBody,
});
describeRoute({
  method: 'get',
  path: '/admin/people',
  summary: 'People of the desk (admin)',
  tags: ['admin'],
  query: PeopleQuery,
  response: z.object({ items: z.array(Person) }),
});
describeRoute({
  method: 'post',
  path: '/admin/people/invite',
  summary: 'Invite a person by e-mail with a one-time link (admin)',
  tags: ['admin'],
  body: InviteBody,
  response: Person,
  status: 201,
});
describeRoute({
  method: 'post',
  path: '/admin/people/:id/reinvite',
  summary: 'Send a new invitation link (admin)',
  tags: ['admin'],
  params: IdParams,
  response: Person,
});
describeRoute({
  method: 'patch',
  path: '/admin/people/:id',
  summary: 'Change a role or deactivate (ends their sessions) (admin)',
  tags: ['admin'],
  params: IdParams,
  body: PersonPatch,
  response: Person,
});
describeRoute({
  method: 'get',
  path: '/admin/mail',
  summary: 'Mail the desk sent, queued or failed, with errors (admin)',
  tags: ['mail'],
  query: MailQuery,
  response: z.object({ items: z.array(MailMessage), total: z.number().int() }),
});
describeRoute({
  method: 'get',
  path: '/admin/mail/caught',
  summary: 'Messages the local fake SMTP server received (admin)',
  tags: ['mail'],
  response: z.object({ items: z.array(CaughtMail) }),
});
describeRoute({
  method: 'post',
  path: '/admin/mail/:id/retry',
  summary: 'Send a failed message again (admin)',
  tags: ['mail'],
  params: IdParams,
  status: 202,
});
describeRoute({
  method: 'get',
  path: '/me/profile',
  summary: 'Your profile',
  tags: ['profile'],
  response: Profile,
});
describeRoute({
  method: 'patch',
  path: '/me/profile',
  summary: 'Change your name, unit system or reminders',
  tags: ['profile'],
  body: ProfilePatch,
  response: Profile,
});
describeRoute({
  method: 'post',
  path: '/me/password',
  summary: 'Change your password (ends your other sessions)',
  tags: ['profile'],
  body: PasswordChangeBody,
  status: 204,
});
describeRoute({
  method: 'get',
  path: '/invites/:token',
  summary: 'Public: the invitation behind a one-time link (410 when expired)',
  tags: ['profile'],
  public: true,
  params: TokenParams,
  response: InviteInfo,
});
describeRoute({
  method: 'post',
  path: '/invites/:token',
  summary: 'Public: set the password of an invitation and sign in',
  tags: ['profile'],
  public: true,
  params: TokenParams,
  body: AcceptInviteBody,
  response: MeResponse,
});
