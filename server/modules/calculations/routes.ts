// The engine over HTTP: evaluate a lift without storing it, and the input's JSON Schema.
// Validation errors name each field of the lift (paths start with "input.").
import { Router } from 'express';
import { z } from 'zod';
import { evaluateLift } from '@shared/engineering/evaluate';
import { liftInputJsonSchema } from '@shared/engineering/json-schema';
import { CalculationBody } from '@shared/schemas/calculations';
import type { AppContext } from '../../context';
import { currentUser, requireAuth } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';

let schemaCache: Record<string, unknown> | null = null;

export const LiftResultShape = z
  .object({ resultVersion: z.number(), overallStatus: z.string(), checks: z.array(z.unknown()) })
  .passthrough();

export function calculationRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use('/calculations', requireAuth(ctx.passport));

  router.post('/calculations', validate({ body: CalculationBody }), (req, res) => {
    const body = valid(req, 'body', CalculationBody);
    const units = body.units ?? currentUser(req).unitSystem;
    res.json(evaluateLift(body.input, body.policy, { units }));
  });

  router.get('/calculations/schema', (_req, res) => {
    schemaCache ??= liftInputJsonSchema();
    res.json(schemaCache);
  });
  return router;
}
