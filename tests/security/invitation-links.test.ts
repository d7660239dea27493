// Point 8: an invitation link is readable only by the person invited and, once, by the admin
// who invites. The stored outbox row holds a placeholder and the link sealed; the sender opens
// it at send time and clears it once sent. Real PostgreSQL, Redis and SMTP conversation.
import type { Worker } from 'bullmq';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher } from '@server/lib/mail-catcher';
import { createRedis } from '@server/lib/redis';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { LINK_PLACEHOLDER, sealLink, unsealLink } from '@server/modules/mail/sealed-link';
import { sendStaged } from '@server/modules/mail/sender';
import { startMailWorker } from '../../worker/tasks/mail-task';
import { startTestApp, signedIn, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { until } from '../support/until';

let t: TestApp;
let catcher: Awaited<ReturnType<typeof startMailCatcher>>;
let worker: Worker;
const connection = createRedis(process.env.REDIS_URL!, { forWorker: true });

beforeAll(async () => {
  t = await startTestApp();
  catcher = await startMailCatcher(t.ctx.dataSource, { port: 0 });
  worker = startMailWorker(t.ctx, connection, catcher.url);
});
afterAll(async () => {
  await worker.close();
  await catcher.close();
  connection.disconnect();
  await t.close();
});

const stored = (email: string) =>
  t.ctx.dataSource.getRepository(MailMessage).findOneByOrFail({ toAddress: email, event: 'invite' });

describe('invitation links', () => {
  it('when an admin invites, then the answer shows the link once and the stored mail never holds it', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const email = `sealed-${Date.now()}@test.example`;
    const res = await admin
      .post('/api/admin/people/invite')
      .send({ email, name: 'Sealed Person', role: 'contractor', organisationId: w.contractorA.id });
    expect(res.status).toBe(201);
    const token = /\/invite\/([A-Za-z0-9_-]{20,})$/.exec(res.body.inviteLink)?.[1];
    expect(token).toBeTruthy();

    // Delivered with the real link...
    const caught = await until(
      async () =>
        (
          await t.ctx.dataSource.query(
            `SELECT text_body, html_body FROM caught_mail WHERE $1 = ANY(envelope_to)`,
            [email],
          )
        )[0],
    );
    expect(caught.text_body).toContain(`/invite/${token}`);
    expect(caught.html_body).toContain(`/invite/${token}`);
    expect(caught.text_body).not.toContain(LINK_PLACEHOLDER);

    // ...while the stored row keeps the placeholder, and the sealed value is gone once sent.
    const row = await until(async () => {
      const r = await stored(email);
      return r.status === 'sent' ? r : null;
    });
    expect(row.textBody).toContain(LINK_PLACEHOLDER);
    expect(row.htmlBody).toContain(LINK_PLACEHOLDER);
    expect(row.sealedLink).toBeNull();
    const whole = JSON.stringify(
      await t.ctx.dataSource.query(`SELECT * FROM mail_messages WHERE id = $1`, [row.id]),
    );
    expect(whole).not.toContain(token);
    // Nothing the admin can read returns it: the outbox list, or the people list.
    const outbox = await admin.get('/api/admin/mail');
    expect(JSON.stringify(outbox.body)).not.toContain(token);
    expect(JSON.stringify((await admin.get('/api/admin/people')).body)).not.toContain(token);
    // The caught mail (the embedded fake SMTP) shows that a link was sent, not the link.
    const caughtForAdmin = await admin.get('/api/admin/mail/caught');
    expect(JSON.stringify(caughtForAdmin.body)).not.toContain(token);
    // The person's link works.
    expect((await supertest(t.app).get(`/api/invites/${token}`)).status).toBe(200);
  });

  it('when a new link is sent, then the answer shows it once and the old link stops working', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const admin = await signedIn(t.app, w.admin.email);
    const email = `again-${Date.now()}@test.example`;
    const first = await admin
      .post('/api/admin/people/invite')
      .send({ email, name: 'Again Person', role: 'reviewer', organisationId: w.owner.id });
    const again = await admin.post(`/api/admin/people/${first.body.id}/reinvite`);
    expect(again.status).toBe(200);
    expect(again.body.inviteLink).not.toBe(first.body.inviteLink);
    const oldToken = first.body.inviteLink.split('/invite/')[1];
    const newToken = again.body.inviteLink.split('/invite/')[1];
    expect((await supertest(t.app).get(`/api/invites/${oldToken}`)).status).toBe(404);
    expect((await supertest(t.app).get(`/api/invites/${newToken}`)).status).toBe(200);
  });

  it('when the sealed link has expired or was altered, then nothing is sent and the message is failed', async () => {
    const secret = t.ctx.config.JWT_SECRET;
    const sealed = sealLink(secret, 'http://desk.example/invite/abc', new Date(Date.now() + 60_000));
    expect(unsealLink(secret, sealed)).toBe('http://desk.example/invite/abc');
    expect(unsealLink(secret, sealed, Date.now() + 120_000)).toBeNull();
    expect(unsealLink('another secret of at least thirty-two chars', sealed)).toBeNull();
    const [iv, tag, body] = sealed.split('.').slice(1);
    expect(unsealLink(secret, ['v1', iv, tag, body!.slice(0, -2) + 'AA'].join('.'))).toBeNull();

    const w = await makeWorld(t.ctx.dataSource);
    const [row] = await t.ctx.dataSource.query(
      `INSERT INTO mail_messages (event, dedupe_key, recipient_id, to_address, subject, text_body, html_body, sealed_link)
       VALUES ('invite', $1, $2, $3, 'Invite', $4, $4, $5) RETURNING id`,
      [
        `expired-${Date.now()}`,
        w.plannerA.id,
        w.plannerA.email,
        `Set your password: ${LINK_PLACEHOLDER}`,
        sealLink(secret, 'http://desk.example/invite/old', new Date(Date.now() - 1000)),
      ],
    );
    const outcome = await sendStaged(
      t.ctx.dataSource,
      { smtpUrl: catcher.url, from: 'desk@test.example', secret },
      row.id,
      { number: 1, last: false },
    );
    expect(outcome).toBe('link_expired');
    const after = await t.ctx.dataSource.getRepository(MailMessage).findOneByOrFail({ id: row.id });
    expect(after).toMatchObject({ status: 'failed', sealedLink: null });
    expect(after.lastError).toMatch(/expired before the message was sent/);
    const caught = await t.ctx.dataSource.query(
      `SELECT 1 FROM caught_mail WHERE $1 = ANY(envelope_to) AND text_body LIKE '%/invite/old%'`,
      [w.plannerA.email],
    );
    expect(caught).toEqual([]);
  });
});
