// The OpenAPI description of the verify routes (routes.ts beside it), from the zod schemas they validate with.
import { Verification } from '@shared/schemas/reviews';
import { z } from 'zod';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/verify/:code',
  summary: 'Public: is this stamped return the current accepted revision? (rate-limited)',
  tags: ['verify'],
  public: true,
  params: z.object({ code: z.string() }),
  response: Verification,
});
