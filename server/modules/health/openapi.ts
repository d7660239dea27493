// The OpenAPI description of the health routes (routes.ts beside it), from the zod schemas they validate with.

import { HealthResponse } from '@shared/schemas/health';
import { describeRoute } from '../../lib/openapi';

describeRoute({
  method: 'get',
  path: '/health',
  summary: 'Database and queue status (503 when either is down)',
  tags: ['system'],
  public: true,
  response: HealthResponse,
});
describeRoute({
  method: 'get',
  path: '/openapi.json',
  summary: 'This document',
  tags: ['system'],
  public: true,
});
