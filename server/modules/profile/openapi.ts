// The OpenAPI description of the profile routes (routes.ts beside it), from the zod schemas they validate with.
import {
  AcceptInviteBody,
  InviteInfo,
  PasswordChangeBody,
  Profile,
  ProfilePatch,
} from '@shared/schemas/admin';
import { MeResponse } from '@shared/schemas/auth';
import { TokenParams } from './routes';
import { describeRoute } from '../../lib/openapi';

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
