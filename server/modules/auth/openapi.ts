// The OpenAPI description of the auth routes (routes.ts beside it), from the zod schemas they validate with.
import { MeResponse, SignInBody } from '@shared/schemas/auth';
import { describeRoute } from '../../lib/openapi';

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
