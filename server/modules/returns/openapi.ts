// The OpenAPI description of the returns routes (routes.ts beside it), from the zod schemas they validate with.
import { ReturnList, StampedReturn } from '@shared/schemas/returns';
import { z } from 'zod';
import { PackageIdParams } from '../packages/routes';
import { ReturnParams } from './routes';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'post',
  path: '/packages/:id/returns',
  summary: 'Issue the stamped return for the recorded decision (reviewer)',
  tags: ['returns'],
  params: PackageIdParams,
  response: StampedReturn,
  status: 202,
  conflict:
    'No decision recorded yet (no_decision), or the engineer changed the decision while the return was being issued (decision_changed)',
});
describeRoute({
  method: 'get',
  path: '/packages/:id/returns',
  summary: 'Stamped returns of the package with their progress',
  tags: ['returns'],
  params: PackageIdParams,
  response: ReturnList,
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
  path: '/packages/:id/returns/preview',
  summary:
    'Page 1 of the stamped return as it will print for the decision on record (reviewer): not stored, not signed',
  tags: ['returns'],
  params: PackageIdParams,
  responseContentType: 'application/pdf',
  response: z.string(),
  conflict: 'No decision recorded yet (no_decision)',
});
