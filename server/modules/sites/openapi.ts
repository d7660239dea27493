// The OpenAPI description of the sites routes (routes.ts beside it), from the zod schemas they validate with.
import { SiteList } from '@shared/schemas/packages';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/sites',
  summary: 'Sites you work with',
  tags: ['sites'],
  response: SiteList,
});
