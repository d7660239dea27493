// Standing security suite, point 4: limits per address and per account, X-Forwarded-For
// believed only behind a configured proxy, and limits that hold while Redis is away.
import supertest from 'supertest';
import { describe, expect, it } from 'vitest';
import { signedIn, startTestApp } from '../support/app';
import { makeOrganisation, makeUser } from '../support/factories';

const attempt = (app: Parameters<typeof supertest>[0], email: string, forwardedFor?: string) => {
  const req = supertest(app).post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password: 'wrong password' }).then((r) => r.status);
};

describe('rate limits', () => {
  it('when one address sprays passwords across many e-mails, then it is limited per address', async () => {
    const t = await startTestApp({ SIGN_IN_ADDRESS_LIMIT: 3 });
    try {
      const codes: number[] = [];
      for (let i = 0; i < 5; i++) codes.push(await attempt(t.app, `spray-${i}-${Date.now()}@test.example`));
      expect(codes).toEqual([401, 401, 401, 429, 429]);
    } finally {
      await t.close();
    }
  });

  it('when no proxy is configured, then a rotated X-Forwarded-For does not reset the address limit', async () => {
    const t = await startTestApp({ SIGN_IN_ADDRESS_LIMIT: 3, TRUST_PROXY: undefined });
    try {
      const codes: number[] = [];
      for (let i = 0; i < 5; i++)
        codes.push(await attempt(t.app, `rot-${i}-${Date.now()}@test.example`, `203.0.113.${i + 1}`));
      expect(codes).toEqual([401, 401, 401, 429, 429]);
    } finally {
      await t.close();
    }
  });

  it('when one account is tried from many addresses (behind a trusted proxy), then it is limited per account', async () => {
    const t = await startTestApp({ SIGN_IN_ACCOUNT_LIMIT: 3, TRUST_PROXY: 'loopback' });
    try {
      const email = `account-${Date.now()}@test.example`;
      const codes: number[] = [];
      for (let i = 0; i < 5; i++) codes.push(await attempt(t.app, email, `198.51.100.${i + 1}`));
      expect(codes).toEqual([401, 401, 401, 429, 429]);
      // Another account from a fresh address is not held up by that one.
      expect(await attempt(t.app, `other-${Date.now()}@test.example`, '198.51.100.99')).toBe(401);
    } finally {
      await t.close();
    }
  });

  it('when Redis does not answer, then the sign-in limit still holds (in-process count)', async () => {
    const t = await startTestApp({ SIGN_IN_LIMIT: 2 });
    try {
      t.ctx.redis.disconnect();
      const email = `redis-down-${Date.now()}@test.example`;
      const codes: number[] = [];
      for (let i = 0; i < 4; i++) codes.push(await attempt(t.app, email));
      expect(codes).toEqual([401, 401, 429, 429]);
    } finally {
      await t.close();
    }
  });

  it('when the password change or invitation look-ups are repeated, then they are limited', async () => {
    const t = await startTestApp({ PASSWORD_CHANGE_LIMIT: 2, INVITE_LOOKUP_LIMIT: 2 });
    try {
      const org = await makeOrganisation(t.ctx.dataSource, 'contractor');
      const user = await makeUser(t.ctx.dataSource, org, 'contractor');
      const agent = await signedIn(t.app, user.email);
      const changes: number[] = [];
      for (let i = 0; i < 3; i++)
        changes.push(
          (
            await agent
              .post('/api/me/password')
              .send({ currentPassword: 'not it', newPassword: 'a new long password 1' })
          ).status,
        );
      expect(changes).toEqual([400, 400, 429]);
      const lookups: number[] = [];
      for (let i = 0; i < 3; i++)
        lookups.push((await supertest(t.app).get(`/api/invites/guessed-token-${i}-abcdef`)).status);
      expect(lookups).toEqual([404, 404, 429]);
    } finally {
      await t.close();
    }
  });
});
