// Mail at every hand-off, sent through the queue to a real SMTP conversation with the
// local fake SMTP server, against the real Redis and PostgreSQL.
import fs from 'node:fs';
import type { Worker } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { startMailCatcher } from '@server/lib/mail-catcher';
import { createQueues } from '@server/lib/queues';
import { createRedis } from '@server/lib/redis';
import { runCheckRun } from '@server/modules/check-runs/service';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { stageReminders } from '@server/modules/mail/reminders';
import { stageMail } from '@server/modules/mail/service';
import { templates } from '@server/modules/mail/templates';
import { buildReturn } from '@server/modules/returns/service';
import { User } from '@server/modules/users/user.entity';
import { startMailWorker } from '../../worker/tasks/mail-task';
import { startTestApp, signedIn, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePackage, makeUser, makeWorld } from '../support/factories';
import { makePdf } from '../support/pdfs';
import { internalWords } from '../support/internal-words';
import { until } from '../support/until';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));

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

async function caughtFor(
  email: string,
): Promise<Array<{ subject: string; text_body: string; html_body: string }>> {
  return t.ctx.dataSource.query(
    `SELECT * FROM caught_mail WHERE $1 = ANY(envelope_to) ORDER BY received_at`,
    [email],
  );
}

describe('hand-off mail', () => {
  it('when a package goes from submission to return, then each hand-off reaches the right people and no one else', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const other = await makeWorld(t.ctx.dataSource);
    const contractor = await signedIn(t.app, w.plannerA.email);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const engineer = await signedIn(t.app, w.engineer.email);
    const created = await contractor
      .post('/api/packages')
      .send({ title: 'Set the clarifier drive', siteId: w.site.id });
    const id = created.body.package.id;
    const reference = created.body.package.reference;
    await contractor.put(`/api/packages/${id}/draft`).send({ inputs: example });
    await contractor
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf()), 'plan.pdf');
    const sub = await contractor.post(`/api/packages/${id}/submit`);
    await runCheckRun(t.ctx.dataSource, sub.body.current.id);

    const submitted = await until(async () => (await caughtFor(w.reviewer.email))[0]);
    expect(submitted.subject).toContain(`${reference} rev 1 submitted`);
    expect(submitted.text_body).toContain(`${appUrl(t.ctx.config)}/packages/${id}`);
    expect(submitted.html_body).toContain('<a href=');
    expect(submitted.text_body).not.toMatch(/password|secret|token/i);

    await reviewer.post('/api/assignments').send({ packageIds: [id], engineerId: w.engineer.id });
    const assigned = await until(async () => (await caughtFor(w.engineer.email))[0]);
    expect(assigned.subject).toContain(`${reference} assigned to you`);

    const version = (await engineer.get(`/api/packages/${id}`)).body.package.version;
    await engineer.post(`/api/packages/${id}/decision`).send({
      password: TEST_PASSWORD,
      decision: 'accepted_as_noted',
      conditions: 'Level the mats first.',
      baseVersion: version,
    });
    const issued = await reviewer.post(`/api/packages/${id}/returns`);
    const built = await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    expect(built.skipped).toBe(false);
    if (!built.skipped) {
      const { dispatchMail } = await import('@server/modules/mail/service');
      await dispatchMail(t.ctx.queues, built.mailIds);
    }
    const returned = await until(async () => (await caughtFor(w.plannerA.email))[0]);
    expect(returned.subject).toContain(`${reference} rev 1: Accepted as noted`);
    expect(returned.text_body).toContain('Conditions: Level the mats first.');
    expect(returned.text_body).toContain(`/api/packages/${id}/returns/${issued.body.id}/file`);

    for (const outsider of [w.plannerB, other.reviewer, other.engineer, other.plannerA]) {
      expect(await caughtFor(outsider.email)).toEqual([]);
    }
  }, 60_000);
});

describe('mail inside the review', () => {
  it('when the engineer records a decision, then every coordinator of the site is told they issue next; when the contractor answers a finding, then the assigned engineer is told, once per answer', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const other = await makeWorld(t.ctx.dataSource);
    const second = await makeUser(t.ctx.dataSource, w.owner, 'reviewer');
    await t.ctx.dataSource.query(`INSERT INTO site_members (site_id, user_id) VALUES ($1, $2)`, [
      w.site.id,
      second.id,
    ]);
    const contractor = await signedIn(t.app, w.plannerA.email);
    const reviewer = await signedIn(t.app, w.reviewer.email);
    const engineer = await signedIn(t.app, w.engineer.email);
    const created = await contractor
      .post('/api/packages')
      .send({ title: 'Lift the filter press', siteId: w.site.id });
    const id = created.body.package.id;
    const reference = created.body.package.reference;
    await contractor.put(`/api/packages/${id}/draft`).send({ inputs: example });
    await contractor
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf()), 'plan.pdf');
    const sub = await contractor.post(`/api/packages/${id}/submit`);
    await runCheckRun(t.ctx.dataSource, sub.body.current.id);
    await reviewer.post('/api/assignments').send({ packageIds: [id], engineerId: w.engineer.id });
    await engineer
      .post(`/api/packages/${id}/findings`)
      .send({ text: 'The rigging drawing is missing.', severity: 'minor' });
    const added = await engineer
      .post(`/api/packages/${id}/findings`)
      .send({ text: 'Show the mats under each outrigger on the plan.', severity: 'major' });
    expect(added.status).toBe(201);
    const finding = added.body.items.find((f: { text: string }) => f.text.startsWith('Show the mats')) as {
      id: string;
    };

    const version = (await engineer.get(`/api/packages/${id}`)).body.package.version;
    const decided = await engineer.post(`/api/packages/${id}/decision`).send({
      password: TEST_PASSWORD,
      decision: 'revise_and_resubmit',
      conditions: 'Add the mat layout.',
      baseVersion: version,
    });
    expect(decided.status).toBe(200);
    for (const coordinator of [w.reviewer, second]) {
      const mail = await until(async () =>
        (await caughtFor(coordinator.email)).find((m) => m.subject.includes('ready to issue')),
      );
      expect(mail.subject).toBe(
        `${reference} rev 1: Revise and resubmit, ready to issue — Lift the filter press`,
      );
      expect(mail.text_body).toContain(`${w.engineer.name} recorded the decision on ${reference}`);
      expect(mail.text_body).toContain('Conditions: Add the mat layout.');
      expect(mail.text_body).toContain('The stamped return is yours to issue next');
      expect(mail.text_body).toContain(`${appUrl(t.ctx.config)}/packages/${id}`);
      expect(internalWords(mail.text_body.replace(/https?:\/\/\S+/g, ''))).toEqual([]);
    }
    // Only the coordinators: not the engineer, the contractor, or another desk.
    for (const outsider of [w.engineer, w.plannerA, other.reviewer]) {
      expect((await caughtFor(outsider.email)).filter((m) => m.subject.includes('ready to issue'))).toEqual(
        [],
      );
    }

    const issued = await reviewer.post(`/api/packages/${id}/returns`);
    await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    const answer = 'Mat layout added on sheet 3: 1.5 m mats, two per outrigger.';
    const answered = await contractor
      .patch(`/api/packages/${id}/findings/${finding.id}`)
      .send({ response: answer });
    expect(answered.status).toBe(200);
    const mail = await until(async () =>
      (await caughtFor(w.engineer.email)).find((m) => m.subject.includes('answered')),
    );
    expect(mail.subject).toBe(`${reference}: finding 2 answered — Lift the filter press`);
    expect(mail.text_body).toContain(`${w.plannerA.name} answered finding 2 on ${reference}`);
    expect(mail.text_body).toContain('Finding: Show the mats under each outrigger on the plan.');
    expect(mail.text_body).toContain(`Answer: ${answer}`);
    expect(internalWords(mail.text_body.replace(/https?:\/\/\S+/g, ''))).toEqual([]);
    expect(mail.text_body).not.toContain(finding.id);
    // The same answer sent again is not a second message; a changed answer is.
    await contractor.patch(`/api/packages/${id}/findings/${finding.id}`).send({ response: answer });
    await contractor
      .patch(`/api/packages/${id}/findings/${finding.id}`)
      .send({ response: `${answer} Bearing checked.` });
    await until(
      async () =>
        (await caughtFor(w.engineer.email)).filter((m) => m.subject.includes('answered')).length === 2 ||
        null,
    );
    await new Promise((r) => setTimeout(r, 300));
    expect((await caughtFor(w.engineer.email)).filter((m) => m.subject.includes('answered'))).toHaveLength(2);
    for (const outsider of [w.reviewer, second, other.engineer]) {
      expect((await caughtFor(outsider.email)).filter((m) => m.subject.includes('answered'))).toEqual([]);
    }
  }, 60_000);
});

/**
 * One staged message sent by a mail worker of its own (own Redis prefix) to smtpUrl, with
 * short fixed backoff; resolves when the message reaches `until` status.
 */
async function deliverOne(smtpUrl: string, attempts: number, status: 'sent' | 'failed') {
  const prefix = `${t.ctx.config.REDIS_PREFIX}-${status}`;
  const ownWorker = startMailWorker(
    { ...t.ctx, config: { ...t.ctx.config, REDIS_PREFIX: prefix } },
    connection,
    smtpUrl,
  );
  const queues = createQueues(connection, prefix);
  try {
    const w = await makeWorld(t.ctx.dataSource);
    const [id] = await t.ctx.dataSource.transaction((m) =>
      stageMail(m, [
        {
          event: 'assigned',
          dedupeKey: `delivery-${status}:${w.engineer.id}`,
          packageId: null,
          recipient: w.engineer,
          content: templates.invite('X', 'Y', 'Z', 'http://x', 'soon'),
        },
      ]),
    );
    await queues.mail.add(
      'send',
      { messageId: id },
      { jobId: `mail-${id}`, attempts, backoff: { type: 'fixed', delay: 150 } },
    );
    const message = await until(async () => {
      const m = await t.ctx.dataSource.getRepository(MailMessage).findOneBy({ id });
      return m?.status === status ? m : null;
    });
    return { message, engineer: w.engineer };
  } finally {
    await ownWorker.close();
    await queues.close();
  }
}

describe('delivery', () => {
  it('when the SMTP server fails twice, then the message is retried and arrives exactly once', async () => {
    const flaky = await startMailCatcher(t.ctx.dataSource, { port: 0, failFirst: 2 });
    try {
      const { message, engineer } = await deliverOne(flaky.url, 4, 'sent');
      expect(message.attempts).toBe(3);
      await new Promise((r) => setTimeout(r, 500));
      expect(await caughtFor(engineer.email)).toHaveLength(1);
    } finally {
      await flaky.close();
    }
  }, 30_000);

  it('when every attempt fails, then the message is marked failed with the error for admins', async () => {
    const { message } = await deliverOne('smtp://127.0.0.1:1', 2, 'failed');
    expect(message.attempts).toBe(2);
    expect(message.lastError).toMatch(/ECONNREFUSED|connect/i);
  }, 30_000);
});

describe('daily reminders', () => {
  it('when lift dates sit around the window edge, then only packages within N days and not accepted are reminded, once', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const quiet = await makeUser(t.ctx.dataSource, w.contractorA, 'contractor', { notifyReminders: false });
    const day = (offset: number) =>
      new Date(Date.parse('2031-06-10T00:00:00Z') + offset * 86_400_000).toISOString().slice(0, 10);
    const at = (offset: number, extra: Partial<Parameters<typeof makePackage>[1]> = {}) =>
      makePackage(t.ctx.dataSource, {
        contractor: w.contractorA,
        site: w.site,
        createdBy: w.plannerA,
        plannedLiftDate: day(offset),
        ...extra,
      });
    const today = await at(0);
    const edge = await at(3);
    await at(4);
    await at(-1);
    const accepted = await at(1, { status: 'returned' });
    await t.ctx.dataSource.query(`UPDATE lift_packages SET decision = 'accepted' WHERE id = $1`, [
      accepted.id,
    ]);
    const quietOnes = await makePackage(t.ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: quiet,
      plannedLiftDate: day(2),
    });

    const ids = await stageReminders(t.ctx.dataSource, day(0), 3, 'http://desk.test');
    // The lift-date reminders (other test files' packages may have review-due reminders too).
    const rows = (await t.ctx.dataSource.getRepository(MailMessage).findBy(ids.map((id) => ({ id })))).filter(
      (r) => r.event === 'reminder',
    );
    const byPackage = (pid: string) =>
      rows
        .filter((r) => r.packageId === pid)
        .map((r) => r.toAddress)
        .sort();
    expect(byPackage(today.id)).toEqual([w.plannerA.email, w.reviewer.email].sort());
    expect(byPackage(edge.id)).toEqual([w.plannerA.email, w.reviewer.email].sort());
    expect(byPackage(accepted.id)).toEqual([]);
    expect(byPackage(quietOnes.id)).toEqual([w.reviewer.email]);
    expect(new Set(rows.map((r) => r.packageId))).toEqual(new Set([today.id, edge.id, quietOnes.id]));
    expect(rows.find((r) => r.packageId === today.id)!.subject).toContain('lifts today');
    expect(await stageReminders(t.ctx.dataSource, day(0), 3, 'http://desk.test')).toEqual([]);
    expect((await stageReminders(t.ctx.dataSource, day(1), 3, 'http://desk.test')).length).toBeGreaterThan(0);
    const user = await t.ctx.dataSource.getRepository(User).findOneByOrFail({ id: quiet.id });
    expect(user.notifyReminders).toBe(false);
  });
});
