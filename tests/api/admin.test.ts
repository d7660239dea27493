// Desk administration over the API: invitations, roles and deactivation, review policies
// with their audit, and each person's profile.
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { runCheckRun } from '@server/modules/check-runs/service';
import { Revision } from '@server/modules/packages/package.entity';
import { startTestApp, signedIn, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

/** The token of the link the answer shows the inviting admin once (the stored mail has none). */
async function inviteLink(email: string, answer: { inviteLink?: string }): Promise<string> {
  const mail = await t.ctx.dataSource
    .getRepository(MailMessage)
    .findOneByOrFail({ toAddress: email, event: 'invite' });
  const token = /\/invite\/([A-Za-z0-9_-]+)$/.exec(answer.inviteLink ?? '')?.[1];
  expect(token).toBeTruthy();
  expect(mail.textBody).not.toContain(token);
  expect(mail.htmlBody).not.toContain(token);
  return token!;
}

describe('people', () => {
  it('when an admin invites a person, then the one-time link sets a password and signs them in, once', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const email = `new-${Date.now()}@test.example`;
    const res = await admin
      .post('/api/admin/people/invite')
      .send({ email, name: 'New Planner', role: 'contractor', organisationId: w.contractorA.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, state: 'invited', role: 'contractor' });
    const token = await inviteLink(email, res.body);
    const info = await supertest(t.app).get(`/api/invites/${token}`);
    expect(info.body).toMatchObject({ email, organisation: w.contractorA.name });
    const short = await supertest(t.app).post(`/api/invites/${token}`).send({ password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual([
      { path: 'password', message: 'Password must be at least 10 characters' },
    ]);
    const agent = supertest.agent(t.app);
    const accepted = await agent.post(`/api/invites/${token}`).send({ password: 'a long enough password' });
    expect(accepted.status).toBe(200);
    expect((await agent.get('/api/me')).body.user.email).toBe(email);
    expect((await supertest(t.app).get(`/api/invites/${token}`)).status).toBe(404);
    const again = await admin.post('/api/admin/people/invite').send({
      email: email.toUpperCase(),
      name: 'Dup',
      role: 'contractor',
      organisationId: w.contractorA.id,
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual([{ path: 'email', message: 'Email already has an account' }]);
  });

  it('when an invitation is past its time, then the link answers 410', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const email = `late-${Date.now()}@test.example`;
    const res = await admin
      .post('/api/admin/people/invite')
      .send({ email, name: 'Late Reviewer', role: 'reviewer', organisationId: w.owner.id });
    const token = await inviteLink(email, res.body);
    await t.ctx.dataSource.query(
      `UPDATE users SET invite_expires_at = now() - interval '1 minute' WHERE id = $1`,
      [res.body.id],
    );
    const late = await supertest(t.app).get(`/api/invites/${token}`);
    expect(late.status).toBe(410);
    expect(late.body.error.code).toBe('invite_expired');
  });

  it('when a role does not fit the organisation or the organisation is not of the desk, then 400 names the field', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const other = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const wrongRole = await admin.post('/api/admin/people/invite').send({
      email: `r-${Date.now()}@test.example`,
      name: 'Wrong Role',
      role: 'engineer',
      organisationId: w.contractorA.id,
    });
    expect(wrongRole.body.error.fields[0].path).toBe('role');
    const foreign = await admin.post('/api/admin/people/invite').send({
      email: `f-${Date.now()}@test.example`,
      name: 'Foreign',
      role: 'contractor',
      organisationId: other.contractorA.id,
    });
    expect(foreign.body.error.fields[0].path).toBe('organisationId');
  });

  it('when an admin deactivates someone, then their session ends and their history stays', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const pkg = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
    });
    const planner = await signedIn(t.app, w.plannerA.email);
    expect((await planner.get('/api/me')).status).toBe(200);
    const admin = await signedIn(t.app, w.admin.email);
    const res = await admin.patch(`/api/admin/people/${w.plannerA.id}`).send({ active: false });
    expect(res.body.state).toBe('deactivated');
    expect((await planner.get('/api/me')).status).toBe(401);
    const signIn = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: w.plannerA.email, password: TEST_PASSWORD });
    expect(signIn.status).toBe(401);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    expect((await reviewer.get(`/api/packages/${pkg.id}`)).status).toBe(200);
    expect((await admin.patch(`/api/admin/people/${w.admin.id}`).send({ active: false })).status).toBe(409);
  });

  it('when a non-admin calls the people routes, then 403', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    expect((await reviewer.get('/api/admin/people')).status).toBe(403);
    expect((await reviewer.get('/api/admin/mail')).status).toBe(403);
  });
});

describe('review policies', () => {
  it('when a policy changes, then later check runs use it, earlier results keep theirs, and the change is audited', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const bad = await admin
      .put(`/api/admin/sites/${w.site.id}/policy`)
      .send({ overrides: { minStabilityRatio: -2, madeUp: 1 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f: { path: string }) => f.path)).toContain('overrides.madeUp');

    const example = JSON.parse(
      (await import('node:fs')).readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'),
    );
    const submitted = () =>
      makePackage(t.ctx.dataSource, {
        contractor: w.contractorA,
        site: w.site,
        createdBy: w.plannerA,
        status: 'checking',
        inputs: example,
      });
    const first = await submitted();
    const rev1 = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ packageId: first.id });
    await runCheckRun(t.ctx.dataSource, rev1.id);

    const ok = await admin
      .put(`/api/admin/sites/${w.site.id}/policy`)
      .send({ overrides: { minStabilityRatio: 1.75 } });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({
      policyVersion: 2,
      overrides: { minStabilityRatio: 1.75 },
      effective: { minStabilityRatio: 1.75 },
    });
    expect(ok.body.defaults.minStabilityRatio).toMatchObject({
      value: 1.5,
      source: { kind: 'common_practice' },
    });
    expect(ok.body.history[0]).toMatchObject({ before: {}, after: { minStabilityRatio: 1.75 } });

    const second = await submitted();
    const rev2 = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ packageId: second.id });
    await runCheckRun(t.ctx.dataSource, rev2.id);
    const [a, b] = await Promise.all([
      t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ id: rev1.id }),
      t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ id: rev2.id }),
    ]);
    expect(a.policyUsed).toMatchObject({ minStabilityRatio: 1.5, policyVersion: 1 });
    expect(b.policyUsed).toMatchObject({ minStabilityRatio: 1.75, policyVersion: 2 });
  });

  it('when an admin sets the reviewers of a site, then only active reviewers of their organisation are accepted', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const res = await admin.put(`/api/admin/sites/${w.site.id}/reviewers`).send({ userIds: [w.engineer.id] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('userIds');
    const ok = await admin.put(`/api/admin/sites/${w.site.id}/reviewers`).send({ userIds: [w.reviewer.id] });
    expect(ok.body.reviewers.map((r: { id: string }) => r.id)).toEqual([w.reviewer.id]);
  });
});

describe('profile', () => {
  it('when a person switches to imperial and changes their password, then /api/me follows and other sessions end', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const here = await signedIn(t.app, w.engineer.email);
    const elsewhere = await signedIn(t.app, w.engineer.email);
    const patched = await here
      .patch('/api/me/profile')
      .send({ unitSystem: 'imperial', notifyReminders: false });
    expect(patched.body).toMatchObject({ unitSystem: 'imperial', notifyReminders: false });
    expect((await here.get('/api/me')).body.user.unitSystem).toBe('imperial');
    const wrong = await here
      .post('/api/me/password')
      .send({ currentPassword: 'nope', newPassword: 'a brand new password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('wrong_password');
    const ok = await here
      .post('/api/me/password')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a brand new password' });
    expect(ok.status).toBe(204);
    expect((await here.get('/api/me')).status).toBe(200);
    expect((await elsewhere.get('/api/me')).status).toBe(401);
  });
});
