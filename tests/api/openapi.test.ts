// Every route the Express app answers is in /api/openapi.json (method and path), read from the
// app's own router rather than from the route files' text, so a route written any way is found.
import type { Express } from 'express';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../support/app';

interface Layer {
  rawPath?: unknown;
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
}

/** "get /api/packages/{id}" for every route under /api, walking routers mounted with app.use(). */
export function routesOf(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const p of paths)
          for (const [method, on] of Object.entries(layer.route.methods))
            if (on && method !== '_all') out.push(`${method} ${prefix}${p}`);
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out
    .filter((r) => r.split(' ')[1].startsWith('/api/'))
    .map((r) => r.replace(/:(\w+)/g, '{$1}'))
    .sort();
}

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the OpenAPI document', () => {
  it('when the Express router is walked, then every route it answers is documented, and nothing more', async () => {
    const doc = (await supertest(t.app).get('/api/openapi.json')).body;
    const documented = Object.entries(doc.paths as Record<string, Record<string, unknown>>)
      .flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m} ${p}`))
      .sort();
    const routes = [...new Set(routesOf(t.app))].sort();
    expect(routes.length).toBeGreaterThan(50);
    expect(documented).toEqual(routes);
  });

  it('when a route answers a body, then the document names its schema', async () => {
    const doc = (await supertest(t.app).get('/api/openapi.json')).body;
    const ok = (p: string, m: string) => doc.paths[p][m].responses['200'] ?? doc.paths[p][m].responses['201'];
    for (const [p, m] of [
      ['/api/health', 'get'],
      ['/api/engineers', 'get'],
      ['/api/assignments', 'post'],
      ['/api/packages/{id}/compare', 'get'],
      ['/api/packages/{id}/findings', 'get'],
      ['/api/me/profile', 'get'],
      ['/api/admin/organisations', 'get'],
    ])
      expect(ok(p, m).content['application/json'].schema, `${m} ${p}`).toBeDefined();
  });
});
