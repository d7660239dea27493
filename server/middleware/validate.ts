// validate({ body, query, params }) parses each part with its zod schema and puts the
// parsed value on req.valid; failures become one 400 naming every field and its rule.
import type { NextFunction, Request, Response } from 'express';
import type { ZodType, z } from 'zod';
import { fromZod } from '../lib/app-error';

interface Schemas {
  body?: ZodType;
  query?: ZodType;
  params?: ZodType;
}

export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction) => {
    const valid: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const parsed = schema.safeParse(req[part] ?? {});
      if (!parsed.success) return next(fromZod(parsed.error, part === 'body' ? undefined : part));
      valid[part] = parsed.data;
    }
    req.valid = valid;
    next();
  };
}

/** The parsed value of one part, typed by its schema. */
export function valid<S extends ZodType>(
  req: Request,
  part: 'body' | 'query' | 'params',
  _schema: S,
): z.infer<S> {
  return (req.valid as Record<string, unknown>)[part] as z.infer<S>;
}
