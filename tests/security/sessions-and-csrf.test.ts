// Standing security suite, points 1 and 2 of the security review: sessions end on sign-out,
// odd tokens answer 401, and cross-site or wrongly typed state changes are refused with
// nothing changed.
import jwt from 'jsonwebtoken';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const sessionCookie = (res: supertest.Response) =>
  String(res.headers['set-cookie']).match(/cp_session=([^;]+)/)?.[1] ?? '';

describe('sessions', () => {
  it('when a person signs out, then the old token gets 401 from then on', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const res = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: w.plannerA.email, password: TEST_PASSWORD });
    const token = sessionCookie(res);
    expect(token).not.toBe('');
    const me = () => supertest(t.app).get('/api/me').set('Cookie', `cp_session=${token}`);
    expect((await me()).status).toBe(200);
    const out = await supertest(t.app)
      .post('/api/auth/sign-out')
      .set('Cookie', `cp_session=${token}`)
      .set('X-CSRF-Guard', '1');
    expect(out.status).toBe(204);
    const after = await me();
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthenticated');
  });

  it('when a token has no exp, a sub that is not a user id, or no session id, then 401 and never 500', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const secret = t.ctx.config.JWT_SECRET;
    const signedInRes = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: w.plannerA.email, password: TEST_PASSWORD });
    const real = jwt.decode(sessionCookie(signedInRes)) as { sub: string; tv: number; sid: string };
    const tokens = {
      noExp: jwt.sign({ sub: real.sub, tv: real.tv, sid: real.sid }, secret, { algorithm: 'HS256' }),
      subNotId: jwt.sign({ sub: 'admin', tv: 0, sid: real.sid }, secret, { expiresIn: 600 }),
      subObject: jwt.sign({ sub: { $ne: null }, tv: 0, sid: real.sid }, secret, { expiresIn: 600 }),
      noSid: jwt.sign({ sub: real.sub, tv: real.tv }, secret, { expiresIn: 600 }),
      otherSid: jwt.sign(
        { sub: real.sub, tv: real.tv, sid: '00000000-0000-4000-8000-000000000000' },
        secret,
        { expiresIn: 600 },
      ),
    };
    for (const [name, token] of Object.entries(tokens)) {
      const res = await supertest(t.app).get('/api/me').set('Cookie', `cp_session=${token}`);
      expect({ name, status: res.status }).toEqual({ name, status: 401 });
    }
  });
});

describe('cross-site request guard', () => {
  async function world() {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    return { w, pkg };
  }
  const packagesTitled = (title: string) => t.ctx.dataSource.getRepository(LiftPackage).countBy({ title });

  it('when a signed-in change comes without the X-CSRF-Guard header, then 403 and nothing is created', async () => {
    const { w } = await world();
    const bare = supertest.agent(t.app);
    expect(
      (await bare.post('/api/auth/sign-in').send({ email: w.plannerA.email, password: TEST_PASSWORD }))
        .status,
    ).toBe(200);
    const title = `csrf-${Date.now()}`;
    const res = await bare.post('/api/packages').send({ title, siteId: w.site.id });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_header_missing');
    expect(res.body.error.message).toMatch(/X-CSRF-Guard/);
    expect(await packagesTitled(title)).toBe(0);
  });

  it('when a change comes from another origin or a same-site page, then 403 cross_site_request, nothing created', async () => {
    const { w } = await world();
    const agent = await signedIn(t.app, w.plannerA.email);
    const title = `xsite-${Date.now()}`;
    const fromOrigin = await agent
      .post('/api/packages')
      .set('Origin', 'http://127.0.0.1:9')
      .send({ title, siteId: w.site.id });
    expect(fromOrigin.status).toBe(403);
    expect(fromOrigin.body.error.code).toBe('cross_site_request');
    const sameSite = await agent
      .post('/api/packages')
      .set('Sec-Fetch-Site', 'same-site')
      .send({ title, siteId: w.site.id });
    expect(sameSite.status).toBe(403);
    expect(await packagesTitled(title)).toBe(0);
    // The desk's own page (same origin) is let through.
    const own = await agent
      .post('/api/packages')
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ title, siteId: w.site.id });
    expect(own.status).toBe(201);
    expect(await packagesTitled(title)).toBe(1);
  });

  it('when a JSON body is sent as text/plain (a form POST), then 415 and the draft is unchanged', async () => {
    const { w, pkg } = await world();
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent
      .put(`/api/packages/${pkg.id}/draft`)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify({ title: 'Changed by a form' }));
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/application\/json/);
    const stored = await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    expect(stored.title).toBe(pkg.title);
    const form = await agent
      .post('/api/packages')
      .type('form')
      .send({ title: 'form-post', siteId: w.site.id });
    expect(form.status).toBe(415);
  });

  it('when the upload route gets JSON, then 415 naming multipart/form-data, and no file is stored', async () => {
    const { w, pkg } = await world();
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent.post(`/api/packages/${pkg.id}/files`).send({ file: 'x' });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/multipart\/form-data/);
    const revisions = await t.ctx.dataSource.getRepository(Revision).findBy({ packageId: pkg.id });
    expect(revisions).toHaveLength(1);
    const files: unknown[] = await t.ctx.dataSource.query(
      `SELECT 1 FROM uploaded_files WHERE revision_id = $1`,
      [revisions[0].id],
    );
    expect(files).toHaveLength(0);
  });

  it('when the library takes uploads on two routes, then only those take multipart and its JSON routes still 415 a form', async () => {
    const { w } = await world();
    const agent = await signedIn(t.app, w.plannerA.email);
    const cranes = async () =>
      (
        await t.ctx.dataSource.query(
          `SELECT count(*)::int AS n FROM library_cranes WHERE organisation_id = $1`,
          [w.plannerA.organisationId],
        )
      )[0].n as number;
    const multipartToJson = await agent
      .post('/api/library/cranes')
      .field('fleetNumber', 'F-1')
      .attach('file', Buffer.from('x'), { filename: 'x.csv' });
    expect(multipartToJson.status).toBe(415);
    expect(multipartToJson.body.error.message).toMatch(/application\/json/);
    const textImport = await agent
      .post('/api/library/chart-import/text')
      .attach('file', Buffer.from('x'), { filename: 'x.csv' });
    expect(textImport.status).toBe(415);
    expect(await cranes()).toBe(0);
    for (const url of [
      '/api/library/chart-import/file',
      '/api/library/versions/00000000-0000-4000-8000-000000000000/document',
    ]) {
      const json = await agent.post(url).send({ file: 'x' });
      expect({ url, status: json.status }).toEqual({ url, status: 415 });
      expect(json.body.error.message).toMatch(/multipart\/form-data/);
    }
  });
});
