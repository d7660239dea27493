// The OpenAPI description of the admin routes (routes.ts beside it), from the zod schemas they validate with.
import {
  AdminOrganisation,
  AdminSite,
  CaughtMail,
  InviteBody,
  MailMessage,
  OrganisationBody,
  OrganisationList,
  OrganisationPatch,
  InvitedPerson,
  Person,
  PolicyResponse,
  PersonPatch,
  PolicyOverridesBody,
  SiteBody,
  SitePatch,
  SiteReviewersBody,
} from '@shared/schemas/admin';
import { z } from 'zod';
import { IdParams, MailQuery, PeopleQuery } from './routes';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/admin/organisations',
  summary: 'Organisations of the desk (admin)',
  tags: ['admin'],
  response: OrganisationList,
});
describeRoute({
  method: 'post',
  path: '/admin/organisations',
  summary: 'Add a contractor organisation to the desk (admin)',
  tags: ['admin'],
  body: OrganisationBody,
  response: AdminOrganisation,
  status: 201,
});
describeRoute({
  method: 'patch',
  path: '/admin/organisations/:id',
  summary: 'Rename an organisation (admin)',
  tags: ['admin'],
  params: IdParams,
  body: OrganisationPatch,
  response: AdminOrganisation,
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
  response: PolicyResponse,
});
describeRoute({
  method: 'put',
  path: '/admin/sites/:id/policy',
  summary: 'Set the site policy overrides (audited; applies to check runs from now on)',
  tags: ['admin'],
  params: IdParams,
  body: PolicyOverridesBody,
  response: PolicyResponse,
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
  response: InvitedPerson,
  status: 201,
});
describeRoute({
  method: 'post',
  path: '/admin/people/:id/reinvite',
  summary: 'Send a new invitation link (admin)',
  tags: ['admin'],
  params: IdParams,
  response: InvitedPerson,
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
