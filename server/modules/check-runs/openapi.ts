// The OpenAPI description of the check-runs routes (routes.ts beside it), from the zod schemas they validate with.
import { CheckRunStatus } from '@shared/schemas/check-runs';
import { PackageDetail } from '@shared/schemas/packages';
import { PackageIdParams } from '../packages/routes';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/packages/:id/check-run',
  summary: "The current revision's check run and where its job is (waiting for the queue, queued, running)",
  tags: ['packages'],
  params: PackageIdParams,
  response: CheckRunStatus,
});
describeRoute({
  method: 'post',
  path: '/packages/:id/check-run/retry',
  summary: 'Run a check that could not run again (contractor or reviewer; 409 unless it failed)',
  tags: ['packages'],
  params: PackageIdParams,
  response: PackageDetail,
  status: 202,
});
