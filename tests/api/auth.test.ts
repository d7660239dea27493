import jwt from 'jsonwebtoken';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '@server/modules/users/user.entity';
import { startTestApp, signedIn, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeOrganisation, makeUser } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

describe('sign-in', () => {
  it('when the password is right, then an httpOnly SameSite cookie is set and /api/me names the person', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'contractor');
    const user = await makeUser(t.ctx.dataSource, org, 'contractor');
    const agent = supertest.agent(t.app);
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email: user.email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/cp_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({
      id: user.id,
      role: 'contractor',
      organisation: { id: org.id, kind: 'contractor' },
    });
    expect(me.body.user.passwordHash).toBeUndefined();
  });

  it('when the password is wrong or the e-mail unknown, then both get the same generic 401', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'contractor');
    const user = await makeUser(t.ctx.dataSource, org, 'contractor');
    const wrong = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: 'nope' });
    const unknown = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@test.example', password: 'nope' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error.message).toBe('Email or password is incorrect.');
  });

  it('when the body is invalid, then 400 names each field and its rule', async () => {
    const res = await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: 'not-an-email', password: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']));
    expect(res.body.error.fields.find((f: { path: string }) => f.path === 'email').message).toMatch(/e-mail/);
  });

  it('when the JSON is malformed, then 400 carries the parse error', async () => {
    const res = await supertest(t.app)
      .post('/api/auth/sign-in')
      .set('content-type', 'application/json')
      .send('{"email": "a@b.c",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('when too many attempts come for one address, then 429 says to wait', async () => {
    const limited = await startTestApp({ SIGN_IN_LIMIT: 3 });
    try {
      const email = `limit-${Date.now()}@test.example`;
      const codes: number[] = [];
      for (let i = 0; i < 5; i++) {
        codes.push(
          (await supertest(limited.app).post('/api/auth/sign-in').send({ email, password: 'x' })).status,
        );
      }
      expect(codes).toEqual([401, 401, 401, 429, 429]);
      const last = await supertest(limited.app).post('/api/auth/sign-in').send({ email, password: 'x' });
      expect(last.body.error.code).toBe('too_many_attempts');
    } finally {
      await limited.close();
    }
  });
});

describe('sessions', () => {
  it('when no cookie is sent, then /api/me is 401', async () => {
    const res = await supertest(t.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('when the token has expired, then /api/me is 401 session_expired', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'owner');
    const user = await makeUser(t.ctx.dataSource, org, 'reviewer');
    const token = jwt.sign(
      { sub: user.id, tv: 0, exp: Math.floor(Date.now() / 1000) - 60 },
      t.ctx.config.JWT_SECRET,
    );
    const res = await supertest(t.app).get('/api/me').set('Cookie', `cp_session=${token}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('session_expired');
  });

  it('when a token is signed with another secret, then it is refused', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'owner');
    const user = await makeUser(t.ctx.dataSource, org, 'reviewer');
    const token = jwt.sign({ sub: user.id, tv: 0 }, 'x'.repeat(40));
    expect((await supertest(t.app).get('/api/me').set('Cookie', `cp_session=${token}`)).status).toBe(401);
  });

  it('when a person is deactivated, then their existing session stops working', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'owner');
    const user = await makeUser(t.ctx.dataSource, org, 'engineer');
    const agent = await signedIn(t.app, user.email);
    expect((await agent.get('/api/me')).status).toBe(200);
    await t.ctx.dataSource.getRepository(User).update(user.id, { active: false, tokenVersion: 1 });
    expect((await agent.get('/api/me')).status).toBe(401);
  });

  it('when a person signs out, then the cookie is cleared', async () => {
    const org = await makeOrganisation(t.ctx.dataSource, 'owner');
    const user = await makeUser(t.ctx.dataSource, org, 'engineer');
    const agent = await signedIn(t.app, user.email);
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(String(out.headers['set-cookie'])).toMatch(/cp_session=;/);
    expect((await agent.get('/api/me')).status).toBe(401);
  });
});
