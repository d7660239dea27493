// Standing security suite: the role × route × organisation matrix, generated from the
// OpenAPI document (/api/openapi.json). Every route the Express app serves must be in the
// document; every documented route must be in ALLOWED below. For each route, anonymous
// callers get 401 (public routes excepted), a role outside ALLOWED gets 403, and an allowed
// role aimed at another organisation's records never gets a 2xx (nor a 500). A new route
// without a scope check, a role check or a document entry fails here.
import type { Express } from 'express';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { Revision } from '@server/modules/packages/package.entity';
import { Finding } from '@server/modules/reviews/review.entity';
import type { Role } from '@shared/schemas/common';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';

const ALL: Role[] = ['contractor', 'reviewer', 'engineer', 'admin'];
type Allowed = Role[] | 'public';

const C: Role[] = ['contractor'];
const R: Role[] = ['reviewer'];
const E: Role[] = ['engineer'];
const A: Role[] = ['admin'];
/** Who may call each documented route (the role half of the matrix; from the brief's roles). */
const ALLOWED: Record<string, Allowed> = {
  'GET /api/health': 'public',
  'GET /api/openapi.json': 'public',
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'public',
  'GET /api/verify/:code': 'public',
  'GET /api/invites/:token': 'public',
  'POST /api/invites/:token': 'public',
  'GET /api/me': ALL,
  'GET /api/me/profile': ALL,
  'PATCH /api/me/profile': ALL,
  'POST /api/me/password': ALL,
  'GET /api/hand-offs': ALL,
  'POST /api/hand-offs/read': ALL,
  'GET /api/live': ALL,
  'GET /api/sites': ALL,
  'GET /api/packages': ALL,
  'GET /api/packages/:id': ALL,
  'GET /api/packages/:id/revisions/:number': ALL,
  'GET /api/packages/:id/files/:fileId': ALL,
  'GET /api/packages/:id/check-run': ALL,
  'GET /api/packages/:id/markups': ALL,
  'GET /api/packages/:id/findings': ALL,
  'GET /api/packages/:id/compare': ALL,
  'GET /api/packages/:id/returns': ALL,
  'GET /api/packages/:id/returns/:returnId/file': ALL,
  'GET /api/packages/:id/returns/preview': R,
  'POST /api/calculations': ALL,
  'GET /api/calculations/schema': ALL,
  'POST /api/packages': C,
  'PUT /api/packages/:id/draft': C,
  'POST /api/packages/:id/duplicate': C,
  'DELETE /api/packages/:id': C,
  'POST /api/packages/:id/submit': C,
  'POST /api/packages/:id/files': C,
  'DELETE /api/packages/:id/files/:fileId': C,
  'POST /api/packages/:id/revisions': C,
  'POST /api/packages/:id/check-run/retry': ['contractor', 'reviewer'],
  'GET /api/engineers': ['reviewer', 'admin'],
  'POST /api/assignments': R,
  'GET /api/packages/:id/assignments': ['reviewer', 'engineer', 'admin'],
  'POST /api/packages/:id/returns': R,
  'POST /api/packages/:id/markups': E,
  'DELETE /api/packages/:id/markups/:markupId': E,
  'GET /api/packages/:id/stamp-placement': ['engineer', 'reviewer'],
  'PUT /api/packages/:id/stamp-placement': E,
  'DELETE /api/packages/:id/stamp-placement': E,
  'POST /api/packages/:id/findings': E,
  'PATCH /api/packages/:id/findings/:findingId': ['engineer', 'contractor'],
  'POST /api/packages/:id/accepted-figures': E,
  'POST /api/packages/:id/decision': E,
  'GET /api/admin/organisations': A,
  'POST /api/admin/organisations': A,
  'PATCH /api/admin/organisations/:id': A,
  'GET /api/admin/sites': A,
  'POST /api/admin/sites': A,
  'PATCH /api/admin/sites/:id': A,
  'PUT /api/admin/sites/:id/reviewers': A,
  'GET /api/admin/sites/:id/policy': A,
  'PUT /api/admin/sites/:id/policy': A,
  'GET /api/admin/people': A,
  'POST /api/admin/people/invite': A,
  'POST /api/admin/people/:id/reinvite': A,
  'PATCH /api/admin/people/:id': A,
  'GET /api/admin/mail': A,
  'GET /api/admin/mail/caught': A,
  'POST /api/admin/mail/:id/retry': A,
  // The fleet library: a contractor's own fleet; the owner side reads versions through packages.
  'GET /api/library/cranes': C,
  'POST /api/library/cranes': C,
  'GET /api/library/cranes/:id': C,
  'PATCH /api/library/cranes/:id': C,
  'POST /api/library/cranes/:id/retire': C,
  'POST /api/library/cranes/:id/configurations': C,
  'GET /api/library/configurations/:id': C,
  'POST /api/library/configurations/:id/versions': C,
  'POST /api/library/versions/:id/retire': C,
  'DELETE /api/library/versions/:id': C,
  'POST /api/library/versions/:id/document': C,
  'POST /api/library/chart-import/file': C,
  'POST /api/library/chart-import/text': C,
  'PUT /api/packages/:id/library-uses': C,
  'DELETE /api/packages/:id/library-uses/:slot': C,
  'POST /api/packages/:id/library-uses/crane-removed': C,
  'POST /api/library/versions/:id/verifications': E,
  'GET /api/library/versions/:id': ALL,
  'GET /api/library/versions/:id/document': ALL,
  'GET /api/library/versions/:id/chart': ALL,
  'GET /api/packages/:id/library-uses': ALL,
};

let t: TestApp;
let agents: Record<Role, supertest.Agent>;
let ids: Record<string, string>;

function mountedRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: unknown[], prefix: string) => {
    for (const layer of stack as Array<{
      route?: { path: string; methods: Record<string, boolean> };
      handle?: { stack?: unknown[] };
      matchers?: unknown;
    }>) {
      if (layer.route) {
        for (const m of Object.keys(layer.route.methods)) out.push(`${m} ${prefix}${layer.route.path}`);
      } else if (layer.handle?.stack) walk(layer.handle.stack, prefix);
    }
  };
  const router = (app as unknown as { router?: { stack: unknown[] }; _router?: { stack: unknown[] } }).router;
  walk(router?.stack ?? [], '');
  return out;
}

beforeAll(async () => {
  t = await startTestApp();
  const ds = t.ctx.dataSource;
  const mine = await makeWorld(ds);
  const theirs = await makeWorld(ds);
  agents = {
    contractor: await signedIn(t.app, mine.plannerA.email),
    reviewer: await signedIn(t.app, mine.reviewer.email),
    engineer: await signedIn(t.app, mine.engineer.email),
    admin: await signedIn(t.app, mine.admin.email),
  };
  // Records of the other desk, which none of the agents may reach.
  const pkg = await makePackage(ds, {
    contractor: theirs.contractorA,
    site: theirs.site,
    createdBy: theirs.plannerA,
    status: 'with_engineer',
    engineer: theirs.engineer,
  });
  const revision = await ds.getRepository(Revision).findOneByOrFail({ packageId: pkg.id });
  const finding = await ds.getRepository(Finding).save({
    packageId: pkg.id,
    revisionId: revision.id,
    text: 'theirs',
    severity: 'minor',
    createdById: theirs.engineer.id,
  } as Partial<Finding>);
  const mail = await ds.getRepository(MailMessage).save({
    event: 'invite',
    dedupeKey: `matrix-${pkg.id}`,
    recipientId: theirs.reviewer.id,
    toAddress: theirs.reviewer.email,
    subject: 's',
    textBody: 't',
    htmlBody: 'h',
    status: 'failed',
  } as Partial<MailMessage>);
  ids = {
    id: pkg.id,
    packageId: pkg.id,
    findingId: finding.id,
    markupId: '00000000-0000-4000-8000-000000000002',
    fileId: '00000000-0000-4000-8000-000000000001',
    number: '1',
    site: theirs.site.id,
    person: theirs.reviewer.id,
    mail: mail.id,
    org: theirs.contractorA.id,
  };
}, 60_000);
afterAll(async () => t.close());

interface DocRoute {
  key: string;
  method: string;
  path: string;
  isPublic: boolean;
}

async function documented(): Promise<DocRoute[]> {
  const doc = (await supertest(t.app).get('/api/openapi.json')).body as {
    paths: Record<string, Record<string, { security?: unknown[] }>>;
  };
  return Object.entries(doc.paths).flatMap(([p, methods]) =>
    Object.entries(methods).map(([method, op]) => {
      const path = p.replace(/\{(\w+)\}/g, ':$1');
      return {
        key: `${method.toUpperCase()} ${path}`,
        method,
        path,
        isPublic: (op.security ?? []).length === 0,
      };
    }),
  );
}

/** The route's path with the other desk's ids in place of its parameters. */
function target(path: string): string {
  return path.replace(/:(\w+)/g, (_m, name: string) => {
    if (path.startsWith('/api/admin/sites')) return ids.site;
    if (path.startsWith('/api/admin/people')) return ids.person;
    if (path.startsWith('/api/admin/mail')) return ids.mail;
    if (path.startsWith('/api/admin/organisations')) return ids.org;
    if (path.startsWith('/api/invites')) return 'not-a-real-invite-token';
    if (path.startsWith('/api/verify')) return 'AAAAAAAAAAAAAAAAAAAAAAAA';
    return ids[name] ?? ids.id;
  });
}

function call(agent: supertest.Agent | supertest.SuperTest<supertest.Test>, method: string, url: string) {
  const req = (agent as unknown as Record<string, (u: string) => supertest.Test>)
    [method](url)
    .set('X-CSRF-Guard', '1');
  // The live stream never ends by itself: its status is read and the stream closed.
  if (url === '/api/live')
    return req.buffer(true).parse((res, done) => {
      done(null, null);
      (res as unknown as { destroy(): void }).destroy();
    });
  if (method === 'get' || method === 'delete') return req;
  // The multipart routes (package files, the library's chart file and manufacturer's document).
  if (/\/(files|document|chart-import\/file)$/.test(url)) return req.field('kind', 'lift_plan');
  return req.send({});
}

describe('role × route × organisation matrix from the OpenAPI document', () => {
  it('when the app is built, then every route it serves is in the OpenAPI document', async () => {
    const docKeys = new Set((await documented()).map((r) => `${r.method} ${r.path}`));
    const served = mountedRoutes(t.app)
      .filter((r) => r.includes(' /api') || /^(get|post|put|patch|delete) \/(?!api)/.test(r))
      .map((r) => (r.includes(' /api') ? r : r.replace(' /', ' /api/')))
      .filter((r) => !r.endsWith(' /api/openapi.json'));
    expect(served.length).toBeGreaterThan(40);
    expect(served.filter((r) => !docKeys.has(r))).toEqual([]);
  });

  it('when every documented route is called by each role, then the answers follow ALLOWED and the scope', async () => {
    const routes = await documented();
    const report: string[] = [];
    const problems: string[] = [];
    for (const r of routes) {
      const allowed = ALLOWED[r.key];
      const url = target(r.path);
      const anon = (await call(supertest(t.app), r.method, url)).status;
      const line = [r.key, `anon=${anon}`];
      // Signing out would end the agents' sessions; it is covered in sessions-and-csrf.
      for (const role of r.key === 'POST /api/auth/sign-out' ? [] : ALL) {
        const status = (await call(agents[role], r.method, url)).status;
        line.push(`${role}=${status}`);
        if (status >= 500) problems.push(`${r.key} as ${role}: ${status}`);
        if (allowed && allowed !== 'public' && !allowed.includes(role) && status !== 403)
          problems.push(`${r.key} as ${role} (not allowed): ${status}, expected 403`);
        if (r.path.includes(':') && status >= 200 && status < 300 && !r.path.startsWith('/api/verify'))
          problems.push(`${r.key} as ${role} reached another desk's record: ${status}`);
      }
      if (!allowed) problems.push(`${r.key} is not in ALLOWED`);
      if ((allowed === 'public') !== r.isPublic)
        problems.push(
          `${r.key}: the document says ${r.isPublic ? 'public' : 'signed-in'}, ALLOWED disagrees`,
        );
      if (!r.isPublic && anon !== 401) problems.push(`${r.key} anonymous: ${anon}, expected 401`);
      report.push(line.join(' '));
    }
    // On failure the whole matrix is shown beside the problems.
    expect({ problems, matrix: problems.length ? report : [] }).toEqual({ problems: [], matrix: [] });
  }, 120_000);
});
