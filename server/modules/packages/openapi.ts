// The OpenAPI description of the packages routes (routes.ts beside it), from the zod schemas they validate with.
import {
  CreatePackageBody,
  FileSummary,
  PackageDetail,
  PackageListQuery,
  PackageListResponse,
  RevisionDetail,
  SaveDraftBody,
} from '@shared/schemas/packages';
import { z } from 'zod';
import { FileParams, PackageIdParams, RevisionParams } from './routes';
import { describeRoute } from '../../lib/openapi';

const Upload = z.object({
  kind: z.enum(['lift_plan', 'supporting']),
  file: z.string().meta({ format: 'binary' }),
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
  method: 'delete',
  path: '/packages/:id',
  summary: 'Delete a package that was never submitted (its draft and files)',
  tags: ['packages'],
  params: PackageIdParams,
  status: 204,
  conflict: 'The package has been submitted and stays on record (not_a_first_draft)',
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
