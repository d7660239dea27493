// The OpenAPI document, generated from the same zod schemas the routes validate with.
// Each routes module describes its routes next to them with describeRoute().
import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import { z, type ZodType } from 'zod';
import { ErrorBody } from '@shared/schemas/common';
import { STANDING_CAUTION } from '@shared/vocabulary/cautions';

const registry = new OpenAPIRegistry();
const described = new Set<string>();

interface RouteDoc {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Express-style path under /api, e.g. /packages/:id */
  path: string;
  summary: string;
  tags: string[];
  public?: boolean;
  params?: z.ZodObject;
  query?: z.ZodObject;
  body?: ZodType;
  bodyContentType?: string;
  response?: ZodType;
  responseContentType?: string;
  status?: number;
  /** When the route can answer 409 (a state that refuses it), what it means. */
  conflict?: string;
  /** Other answers the route can give (401 of a step-up, 422, 429), by status: what each means. */
  answers?: Record<number, string>;
}

export function describeRoute(doc: RouteDoc) {
  const path = '/api' + doc.path.replace(/:(\w+)/g, '{$1}');
  const key = `${doc.method} ${path}`;
  if (described.has(key)) return;
  described.add(key);
  const errorContent = { 'application/json': { schema: ErrorBody } };
  registry.registerPath({
    method: doc.method,
    path,
    summary: doc.summary,
    tags: doc.tags,
    security: doc.public ? [] : [{ cookieAuth: [] }],
    request: {
      ...(doc.params ? { params: doc.params } : {}),
      ...(doc.query ? { query: doc.query } : {}),
      ...(doc.body
        ? { body: { content: { [doc.bodyContentType ?? 'application/json']: { schema: doc.body } } } }
        : {}),
    },
    responses: {
      [doc.status ?? 200]: {
        description: 'Success',
        ...(doc.response
          ? { content: { [doc.responseContentType ?? 'application/json']: { schema: doc.response } } }
          : {}),
      },
      400: { description: 'Invalid input: every field and the rule it broke', content: errorContent },
      ...(doc.public ? {} : { 401: { description: 'Not signed in', content: errorContent } }),
      ...(doc.public ? {} : { 403: { description: 'Role not allowed', content: errorContent } }),
      404: { description: 'Not found (or outside your organisation)', content: errorContent },
      ...(doc.conflict ? { 409: { description: doc.conflict, content: errorContent } } : {}),
      ...Object.fromEntries(
        Object.entries(doc.answers ?? {}).map(([status, description]) => [
          status,
          { description, content: errorContent },
        ]),
      ),
    },
  });
}

let cachedDoc: unknown = null;

export function openApiDocument() {
  if (cachedDoc) return cachedDoc;
  registry.registerComponent('securitySchemes', 'cookieAuth', {
    type: 'apiKey',
    in: 'cookie',
    name: 'cp_session',
  });
  cachedDoc = new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Counterpoise API',
      version: '1',
      description: `Review desk for critical crane lifts. ${STANDING_CAUTION}`,
    },
  });
  return cachedDoc;
}
