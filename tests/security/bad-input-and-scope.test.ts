// Standing security suite, points 5 and 6: every bad input answers 4xx naming the field or
// the limit and leaves nothing stored; look-ups by id are scoped to the desk.
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { Site } from '@server/modules/sites/site.entity';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const packagesTitled = (title: string) => t.ctx.dataSource.getRepository(LiftPackage).countBy({ title });

describe('bad input answers 4xx naming the field or the limit', () => {
  it('when a title holds a NUL character or a lone surrogate, then 400 naming title and no package', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.plannerA.email);
    const tag = `nul-${Date.now()}`;
    const nul = await agent.post('/api/packages').send({ title: `${tag}\u0000lift`, siteId: w.site.id });
    expect(nul.status).toBe(400);
    expect(nul.body.error.fields[0].path).toBe('title');
    expect(nul.body.error.message).toMatch(/NUL/);
    // PostgreSQL cannot even compare with a NUL, so look for the title's start.
    const stored: unknown[] = await t.ctx.dataSource.query(
      `SELECT 1 FROM lift_packages WHERE title LIKE $1`,
      [`${tag}%`],
    );
    expect(stored).toHaveLength(0);
    // A lone surrogate can only arrive as a JSON escape.
    const lone = await agent
      .post('/api/packages')
      .set('Content-Type', 'application/json')
      .send(`{"title":"${tag} \\ud800 north","siteId":"${w.site.id}"}`);
    expect(lone.status).toBe(400);
    expect(lone.body.error.fields[0].path).toBe('title');
    expect(lone.body.error.message).toMatch(/surrogate/);
  });

  it('when draft inputs or a profile name hold NUL, then 400 naming the field and nothing changes', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    const agent = await signedIn(t.app, w.plannerA.email);
    const draft = await agent
      .put(`/api/packages/${pkg.id}/draft`)
      .send({ inputs: { load: { description: 'beam\u0000' } } });
    expect(draft.status).toBe(400);
    expect(draft.body.error.fields[0].path).toBe('inputs.load.description');
    const rev = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ packageId: pkg.id });
    expect(rev.inputs).toEqual({});
    const profile = await agent.patch('/api/me/profile').send({ name: 'A\u0000B' });
    expect(profile.status).toBe(400);
    expect(profile.body.error.fields[0].path).toBe('name');
  });

  it('when a body is nested deeper than 32 levels (10,000 on sign-in), then 400 naming the limit', async () => {
    const deep = '['.repeat(10_000) + ']'.repeat(10_000);
    const res = await supertest(t.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send(`{"email":"a@b.example","password":${deep}}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('too_deep');
    expect(res.body.error.message).toMatch(/32 levels/);
    const justOver = '{"a":'.repeat(33) + '1' + '}'.repeat(33);
    const over = await supertest(t.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send(justOver);
    expect(over.status).toBe(400);
    expect(over.body.error.code).toBe('too_deep');
  });

  it('when a body has a __proto__ or constructor key, then 400 naming the key', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent
      .post('/api/packages')
      .set('Content-Type', 'application/json')
      .send(`{"title":"Proto lift","siteId":"${w.site.id}","__proto__":{"admin":true}}`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('__proto__');
    expect(await packagesTitled('Proto lift')).toBe(0);
  });

  it('when baseUpdatedAt is malformed, then 400 naming it instead of skipping the stale-save guard', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    const agent = await signedIn(t.app, w.plannerA.email);
    const res = await agent
      .put(`/api/packages/${pkg.id}/draft`)
      .send({ title: 'Overwritten title', baseUpdatedAt: 'yesterday' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('baseUpdatedAt');
    expect((await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id })).title).toBe(
      pkg.title,
    );
  });

  it('when a multipart body has no closing boundary, or a PDF header has no catalog, then 4xx naming the file', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    const agent = await signedIn(t.app, w.plannerA.email);
    const open = await agent
      .post(`/api/packages/${pkg.id}/files`)
      .set('Content-Type', 'multipart/form-data; boundary=XyZ')
      .send(
        '--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4 never ends',
      );
    expect(open.status).toBe(400);
    expect(open.body.error.fields[0].path).toBe('file');
    const hollow = await agent
      .post(`/api/packages/${pkg.id}/files`)
      .field('kind', 'lift_plan')
      .attach(
        'file',
        Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Nothing >>\nendobj\ntrailer\n<< >>\n%%EOF\n'),
        {
          filename: 'hollow.pdf',
          contentType: 'application/pdf',
        },
      );
    expect([400, 422]).toContain(hollow.status);
    expect(hollow.body.error.fields[0].path).toBe('file');
    const files: unknown[] = await t.ctx.dataSource.query(
      `SELECT 1 FROM uploaded_files f JOIN revisions r ON r.id = f.revision_id WHERE r.package_id = $1`,
      [pkg.id],
    );
    expect(files).toHaveLength(0);
  });
});

describe('look-ups scoped to the desk', () => {
  it("when an admin re-queues another desk's failed message, then 404 and it stays failed", async () => {
    const mine = await makeWorld(t.ctx.dataSource);
    const theirs = await makeWorld(t.ctx.dataSource);
    const repo = t.ctx.dataSource.getRepository(MailMessage);
    const failed = (recipient: { id: string; email: string }) =>
      repo.save({
        event: 'invite',
        dedupeKey: `sec-${recipient.id}-${Date.now()}`,
        recipientId: recipient.id,
        toAddress: recipient.email,
        subject: 'A failed message',
        textBody: 'body',
        htmlBody: '<p>body</p>',
        status: 'failed',
      } as Partial<MailMessage>);
    const other = await failed(theirs.reviewer);
    const own = await failed(mine.reviewer);
    const admin = await signedIn(t.app, mine.admin.email);
    const cross = await admin.post(`/api/admin/mail/${other.id}/retry`);
    expect(cross.status).toBe(404);
    expect((await repo.findOneByOrFail({ id: other.id })).status).toBe('failed');
    const ok = await admin.post(`/api/admin/mail/${own.id}/retry`);
    expect(ok.status).toBe(202);
  });

  it('when policy overrides name inherited keys (constructor, toString), then 400 and the policy is unchanged', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    for (const key of ['constructor', 'toString', 'hasOwnProperty']) {
      const res = await admin
        .put(`/api/admin/sites/${w.site.id}/policy`)
        .set('Content-Type', 'application/json')
        .send(`{"overrides":{"${key}":1}}`);
      expect({ key, status: res.status }).toEqual({ key, status: 400 });
      expect(res.body.error.fields[0].path).toBe(`overrides.${key}`);
    }
    const site = await t.ctx.dataSource.getRepository(Site).findOneByOrFail({ id: w.site.id });
    expect(Object.keys(site.reviewPolicy ?? {})).toEqual([]);
  });

  it('when the sign-in body is wrong, then the answer stays 4xx (sanity: a real sign-in works)', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const ok = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: w.plannerA.email, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
  });
});

describe("owner-side view of a contractor's draft revision", () => {
  it('when a contractor uploads to a draft revision 2, then the reviewer sees no event (no file name) of it', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'draft',
    });
    const revisions = t.ctx.dataSource.getRepository(Revision);
    // Revision 1 was submitted and returned; revision 2 is the contractor's new draft.
    await revisions.update({ packageId: pkg.id, number: 1 }, { state: 'submitted', submittedAt: new Date() });
    await revisions.save({ packageId: pkg.id, number: 2, state: 'draft', inputs: {}, checkStatus: 'none' });
    await t.ctx.dataSource.getRepository(LiftPackage).update(pkg.id, { currentRevision: 2, status: 'draft' });
    await t.ctx.dataSource.query(
      `INSERT INTO audit_events (package_id, organisation_id, actor_id, action, detail)
       VALUES ($1, $2, $3, 'file.added', $4), ($1, $2, $3, 'revision.submitted', $5)`,
      [
        pkg.id,
        w.contractorA.id,
        w.plannerA.id,
        JSON.stringify({ revision: 2, name: 'secret-draft-plan.pdf' }),
        JSON.stringify({ revision: 1 }),
      ],
    );
    const contractor = await signedIn(t.app, w.plannerA.email);
    const own = await contractor.get(`/api/packages/${pkg.id}`);
    expect(JSON.stringify(own.body.events)).toContain('secret-draft-plan.pdf');
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const seen = await reviewer.get(`/api/packages/${pkg.id}`);
    expect(seen.status).toBe(200);
    expect(JSON.stringify(seen.body.events)).not.toContain('secret-draft-plan.pdf');
    expect(seen.body.events.map((e: { action: string }) => e.action)).toContain('revision.submitted');
  });
});

describe('invitation links', () => {
  it('when an admin reads caught mail holding an invitation, then the link itself is not shown', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const token = 'Abc123_secret-invite-token-value';
    await t.ctx.dataSource.query(
      `INSERT INTO caught_mail (envelope_from, envelope_to, subject, text_body, html_body, raw_size)
       VALUES ('desk@test.example', $1, 'You are invited', $2, $3, 100)`,
      [
        [w.reviewer.email],
        `Set your password: http://desk.example/invite/${token}`,
        `<a href="http://desk.example/invite/${token}">Set your password</a>`,
      ],
    );
    const admin = await signedIn(t.app, w.admin.email);
    const res = await admin.get('/api/admin/mail/caught');
    expect(res.status).toBe(200);
    const mine = res.body.items.filter((m: { to: string[] }) => m.to.includes(w.reviewer.email));
    expect(mine).toHaveLength(1);
    expect(mine[0].text).toContain('/invite/[link sent to the recipient]');
    expect(JSON.stringify(mine)).not.toContain(token);
  });
});
