// The OpenAPI description of the calculations routes (routes.ts beside it), from the zod schemas they validate with.
import { CalculationBody } from '@shared/schemas/calculations';
import { LiftResultShape } from './routes';
import { describeRoute } from '../../lib/openapi';

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
