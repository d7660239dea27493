// Describes each API route for the OpenAPI document, beside the schemas it validates with.
import { z } from 'zod';
import { MeResponse, SignInBody } from '@shared/schemas/auth';
import { PackageListQuery, PackageListResponse } from '@shared/schemas/packages';
import { describeRoute } from './lib/openapi';
import { OrganisationList } from './modules/admin/routes';
import { PackageIdParams } from './modules/packages/routes';

describeRoute({ method: 'get', path: '/health', summary: 'Database and queue status (503 when either is down)', tags: ['system'], public: true });
describeRoute({ method: 'get', path: '/openapi.json', summary: 'This document', tags: ['system'], public: true });
describeRoute({ method: 'post', path: '/auth/sign-in', summary: 'Sign in; sets the httpOnly session cookie', tags: ['auth'], public: true, body: SignInBody, response: MeResponse });
describeRoute({ method: 'post', path: '/auth/sign-out', summary: 'Sign out; clears the session cookie', tags: ['auth'], public: true, status: 204 });
describeRoute({ method: 'get', path: '/me', summary: 'The signed-in person', tags: ['auth'], response: MeResponse });
describeRoute({ method: 'get', path: '/packages', summary: 'Lift packages in your scope, filtered, sorted and paged', tags: ['packages'], query: PackageListQuery, response: PackageListResponse });
describeRoute({ method: 'get', path: '/packages/:id', summary: 'One lift package with its revisions', tags: ['packages'], params: PackageIdParams, response: z.object({}).passthrough() });
describeRoute({ method: 'get', path: '/admin/organisations', summary: 'Organisations of the desk (admin)', tags: ['admin'], response: OrganisationList });
describeRoute({ method: 'get', path: '/admin/sites', summary: 'Sites your organisation owns (admin)', tags: ['admin'] });
