// The lift input as JSON Schema (for GET /api/calculations/schema and the OpenAPI document).
import { z } from 'zod';
import { LiftInput } from '../schemas/lift-input';
import { SitePolicy } from '../schemas/site-policy';

export function liftInputJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(LiftInput, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
}

export function sitePolicyJsonSchema(): Record<string, unknown> {
  return z.toJSONSchema(SitePolicy, { io: 'input', unrepresentable: 'any' }) as Record<string, unknown>;
}
