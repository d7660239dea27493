// Describes each API route for the OpenAPI document, beside the schemas it validates with.
import { z } from 'zod';
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
import { describeRoute } from './lib/openapi';
import { OrganisationList } from './modules/admin/routes';
import { LiftResultShape } from './modules/calculations/routes';
import { FileParams, PackageIdParams, RevisionParams } from './modules/packages/routes';

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
describeRoute({
  method: 'get',
  path: '/admin/sites',
  summary: 'Sites your organisation owns (admin)',
  tags: ['admin'],
});
