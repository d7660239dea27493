import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, signedIn, type TestApp } from '../support/app';
import { makePackage, makeUser, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

describe('organisation isolation', () => {
  it("when a contractor asks for another organisation's package, then the answer is 404", async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const theirs = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorB,
      site: w.site,
      createdBy: w.plannerB,
    });
    const mine = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    const agent = await signedIn(t.app, w.plannerA.email);
    expect((await agent.get(`/api/packages/${theirs.id}`)).status).toBe(404);
    const own = await agent.get(`/api/packages/${mine.id}`);
    expect(own.status).toBe(200);
    expect(own.body.package.reference).toBe(mine.reference);
    const list = await agent.get('/api/packages');
    const ids = list.body.items.map((p: { id: string }) => p.id);
    expect(ids).toContain(mine.id);
    expect(ids).not.toContain(theirs.id);
  });

  it("when a reviewer lists the queue, then it holds their site's submitted packages and no drafts", async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const submitted = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    const draft = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorB,
      site: w.site,
      createdBy: w.plannerB,
      status: 'draft',
    });
    const other = await makeWorld(t.ctx.dataSource);
    const elsewhere = await makePackage(t.ctx.dataSource, {
      contractor: other.contractorA,
      site: other.site,
      createdBy: other.plannerA,
    });
    const agent = await signedIn(t.app, w.reviewer.email);
    const list = await agent.get('/api/packages');
    expect(list.status).toBe(200);
    const ids = list.body.items.map((p: { id: string }) => p.id);
    expect(ids).toEqual([submitted.id]);
    expect(list.body.countsByStatus).toEqual({ ready_for_review: 1 });
    expect((await agent.get(`/api/packages/${draft.id}`)).status).toBe(404);
    expect((await agent.get(`/api/packages/${elsewhere.id}`)).status).toBe(404);
  });

  it('when an engineer lists packages, then only the ones assigned to them appear', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const assigned = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'with_engineer',
      engineer: w.engineer,
    });
    const otherEngineer = await makeUser(t.ctx.dataSource, w.owner, 'engineer');
    const notMine = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'with_engineer',
      engineer: otherEngineer,
    });
    const agent = await signedIn(t.app, w.engineer.email);
    const ids = (await agent.get('/api/packages')).body.items.map((p: { id: string }) => p.id);
    expect(ids).toEqual([assigned.id]);
    expect((await agent.get(`/api/packages/${notMine.id}`)).status).toBe(404);
  });

  it('when the id is not a UUID, then 400 names the id field', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent.get('/api/packages/abc');
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0]).toEqual({
      path: 'params.id',
      message: 'The id in the address must be a UUID',
    });
  });
});

describe('roles', () => {
  it("when a contractor calls an admin route, then 403; an admin gets their desk's organisations only", async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const elsewhere = await makeWorld(t.ctx.dataSource);
    await makePackage(t.ctx.dataSource, { contractor: w.contractorA, site: w.site, createdBy: w.plannerA });
    const contractor = await signedIn(t.app, w.plannerA.email);
    const forbidden = await contractor.get('/api/admin/organisations');
    expect(forbidden.status).toBe(403);
    expect(forbidden.body.error.code).toBe('forbidden');
    const admin = await signedIn(t.app, w.admin.email);
    const ok = await admin.get('/api/admin/organisations');
    expect(ok.status).toBe(200);
    const names = ok.body.items.map((o: { name: string }) => o.name);
    expect(names).toEqual(expect.arrayContaining([w.owner.name, w.contractorA.name]));
    expect(names).toContain(w.contractorB.name);
    expect(names).not.toContain(elsewhere.contractorA.name);
    expect(names).not.toContain(elsewhere.owner.name);
  });

  it('when the list query breaks a limit, then 400 names the field and the limit', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.reviewer.email);
    const res = await agent.get('/api/packages?pageSize=500');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([
      { path: 'query.pageSize', message: 'Page size must be at most 100' },
    ]);
  });

  it('when the queue is paged, then the server pages and counts', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    for (let i = 0; i < 5; i++) {
      await makePackage(t.ctx.dataSource, {
        contractor: w.contractorA,
        site: w.site,
        createdBy: w.plannerA,
        plannedLiftDate: `2027-04-0${i + 1}`,
      });
    }
    const agent = await signedIn(t.app, w.reviewer.email);
    const page2 = await agent.get('/api/packages?pageSize=2&page=2&sort=plannedLiftDate');
    expect(page2.body.total).toBe(5);
    expect(page2.body.items.map((p: { plannedLiftDate: string }) => p.plannedLiftDate)).toEqual([
      '2027-04-03',
      '2027-04-04',
    ]);
  });
});

describe('system routes', () => {
  it('when an unknown API route is asked for, then JSON 404', async () => {
    const res = await supertest(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('when database and Redis answer, then health is ok and security headers are set', async () => {
    const res = await supertest(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: { ok: true }, queue: { ok: true } });
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toBeDefined();
  });

  it('when the database is down, then health answers 503 naming it', async () => {
    const broken = await startTestApp();
    await broken.ctx.dataSource.destroy();
    try {
      const res = await supertest(broken.app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body.database).toEqual({ ok: false, error: 'not answering' });
      expect(res.body.queue.ok).toBe(true);
      expect(res.body.error.code).toBe('database_unavailable');
    } finally {
      await broken.close();
    }
  });

  it('when the OpenAPI document is asked for, then it lists the routes', async () => {
    const res = await supertest(t.app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(Object.keys(res.body.paths)).toEqual(
      expect.arrayContaining(['/api/auth/sign-in', '/api/packages/{id}', '/api/health']),
    );
  });
});

describe('security headers over plain http', () => {
  it('when the desk is served without https, then browsers are not told to switch to https', async () => {
    const res = await supertest(t.app).get('/api/health');
    expect(res.headers['strict-transport-security']).toBeUndefined();
    expect(res.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
  });
});
