// The OpenAPI description of the fleet library's routes (routes.ts beside it), from the zod schemas
// they validate with.
import { z } from 'zod';
import {
  ChartPreviewResponse,
  ChartTextBody,
  ConfigurationBody,
  ConfigurationDetail,
  CraneBody,
  CraneDetail,
  CraneList,
  CraneListQuery,
  CranePatch,
  CraneRemovedBody,
  ExportQuery,
  LibraryUseBody,
  LibraryUseList,
  VersionBody,
  VersionDetail,
} from '@shared/schemas/library';
import { describeRoute } from '../../lib/openapi';
import { LibraryIdParams, LibraryUseParams, VerifyBody } from './routes';

const FileUpload = z.object({ file: z.string().meta({ format: 'binary' }) });

const tags = ['library'];
describeRoute({
  method: 'get',
  path: '/library/cranes',
  summary: "The contractor's fleet: search by fleet number, make or model; filter by capacity at a radius",
  tags,
  query: CraneListQuery,
  response: CraneList,
});
describeRoute({
  method: 'post',
  path: '/library/cranes',
  summary: 'Add a crane to the fleet (contractor)',
  tags,
  body: CraneBody,
  response: CraneDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/library/cranes/:id',
  summary: 'A crane of the fleet with its configurations (contractor)',
  tags,
  params: LibraryIdParams,
  response: CraneDetail,
});
describeRoute({
  method: 'patch',
  path: '/library/cranes/:id',
  summary: "Change a crane's fixed data; versions already written keep theirs (contractor)",
  tags,
  params: LibraryIdParams,
  body: CranePatch,
  response: CraneDetail,
});
describeRoute({
  method: 'post',
  path: '/library/cranes/:id/retire',
  summary: 'Retire a crane from the fleet (contractor)',
  tags,
  params: LibraryIdParams,
  response: CraneDetail,
});
describeRoute({
  method: 'post',
  path: '/library/cranes/:id/configurations',
  summary: 'Add a configuration with its first version and chart (contractor)',
  tags,
  params: LibraryIdParams,
  body: ConfigurationBody,
  response: ConfigurationDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/library/configurations/:id',
  summary: "A configuration's versions: who changed what, when (contractor)",
  tags,
  params: LibraryIdParams,
  response: ConfigurationDetail,
});
describeRoute({
  method: 'post',
  path: '/library/configurations/:id/versions',
  summary: 'Edit a configuration: writes a new version (contractor)',
  tags,
  params: LibraryIdParams,
  body: VersionBody,
  response: VersionDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/library/versions/:id',
  summary:
    'One configuration version with its chart grid (contractor, or the owner side of a package using it)',
  tags,
  params: LibraryIdParams,
  response: VersionDetail,
});
describeRoute({
  method: 'post',
  path: '/library/versions/:id/retire',
  summary: 'Retire a version: packages keep it, new ones cannot pick it (contractor)',
  tags,
  params: LibraryIdParams,
  response: VersionDetail,
});
describeRoute({
  method: 'delete',
  path: '/library/versions/:id',
  summary: 'Delete a version no package uses (contractor; 409 when in use: retire it)',
  tags,
  params: LibraryIdParams,
  status: 204,
});
describeRoute({
  method: 'post',
  path: '/library/versions/:id/document',
  summary: "Attach the manufacturer's document (PDF) to a version not yet in use (contractor)",
  tags,
  params: LibraryIdParams,
  body: FileUpload,
  bodyContentType: 'multipart/form-data',
  response: VersionDetail,
  status: 201,
});
describeRoute({
  method: 'get',
  path: '/library/versions/:id/document',
  summary: "The manufacturer's document of a version (PDF)",
  tags,
  params: LibraryIdParams,
  response: z.string().meta({ format: 'binary' }),
  responseContentType: 'application/pdf',
});
describeRoute({
  method: 'get',
  path: '/library/versions/:id/chart',
  summary: "A version's chart as CSV or .xlsx (values only)",
  tags,
  params: LibraryIdParams,
  query: ExportQuery,
  response: z.string().meta({ format: 'binary' }),
  responseContentType: 'application/octet-stream',
});
describeRoute({
  method: 'post',
  path: '/library/versions/:id/verifications',
  summary:
    "Mark a version's chart verified against the manufacturer's document, for the engineer's own desk (engineer)",
  tags,
  params: LibraryIdParams,
  body: VerifyBody,
  response: VersionDetail,
  status: 201,
});
describeRoute({
  method: 'post',
  path: '/library/chart-import/file',
  summary:
    'Preview a chart file (CSV or .xlsx): how each cell was read, the header units, errors by cell; stores nothing (contractor)',
  tags,
  body: FileUpload,
  bodyContentType: 'multipart/form-data',
  response: ChartPreviewResponse,
});
describeRoute({
  method: 'post',
  path: '/library/chart-import/text',
  summary: 'Preview a chart pasted as text; stores nothing (contractor)',
  tags,
  body: ChartTextBody,
  response: ChartPreviewResponse,
});
describeRoute({
  method: 'get',
  path: '/packages/:id/library-uses',
  summary:
    "The library versions a package's current revision uses, changed cells of a detached copy, and the desk's verifications",
  tags,
  params: LibraryIdParams,
  response: LibraryUseList,
});
describeRoute({
  method: 'put',
  path: '/packages/:id/library-uses',
  summary: 'Record that a draft uses a library version for one crane (contractor)',
  tags,
  params: LibraryIdParams,
  body: LibraryUseBody,
  response: LibraryUseList,
});
describeRoute({
  method: 'delete',
  path: '/packages/:id/library-uses/:slot',
  summary: 'Stop using the library for one crane of a draft (contractor)',
  tags,
  params: LibraryUseParams,
  status: 204,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/library-uses/crane-removed',
  summary:
    'A crane of several was removed from a draft (contractor): its library use goes and the later cranes’ uses move up one slot, in one transaction',
  tags,
  params: LibraryIdParams,
  body: CraneRemovedBody,
  response: LibraryUseList,
});
