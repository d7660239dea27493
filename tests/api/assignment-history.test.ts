// Assignment with a note, and the package's assignment history: the note goes with the
// assignment e-mail and into the history; a reassignment ends the previous one; the history
// is the desk's (coordinator, engineer, administrator), not the contractor's; a note over the
// limit is refused naming the field and the limit, and nothing changes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { makeUser } from '../support/factories';
import { desk, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

describe('assignment history', () => {
  it('when a coordinator assigns with a note and then reassigns, then the history and the mail hold both', async () => {
    const { w, contractor, reviewer, engineer } = await desk(t);
    const second = await makeUser(t.ctx.dataSource, w.owner, 'engineer');
    const p = await submitted(t, w, contractor, undefined, 'Assign with a note');

    const tooLong = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [p.id], engineerId: w.engineer.id, note: 'x'.repeat(501) });
    expect(tooLong.status).toBe(400);
    expect(JSON.stringify(tooLong.body)).toMatch(/at most 500 characters/);
    expect((await reviewer.get(`/api/packages/${p.id}/assignments`)).body.items).toEqual([]);

    const first = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [p.id], engineerId: w.engineer.id, note: 'Crane mats are the open point.' });
    expect(first.status).toBe(200);
    const mail = await t.ctx.dataSource
      .getRepository(MailMessage)
      .findOneByOrFail({ packageId: p.id, event: 'assigned', recipientId: w.engineer.id });
    expect(mail.textBody).toContain('note: Crane mats are the open point.');

    const again = await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: second.id });
    expect(again.status).toBe(200);
    const history = await reviewer.get(`/api/packages/${p.id}/assignments`);
    expect(history.status).toBe(200);
    expect(history.body.items).toEqual([
      expect.objectContaining({
        engineer: second.name,
        assignedBy: w.reviewer.name,
        endedAt: null,
        note: null,
      }),
      expect.objectContaining({
        engineer: w.engineer.name,
        endedAt: expect.any(String),
        note: 'Crane mats are the open point.',
      }),
    ]);
    // The engineer who holds it now reads the history; the contractor does not.
    const holder = await signedIn(t.app, second.email);
    expect((await holder.get(`/api/packages/${p.id}/assignments`)).status).toBe(200);
    expect((await contractor.get(`/api/packages/${p.id}/assignments`)).status).toBe(403);
    // The previous engineer no longer sees the package at all.
    expect((await engineer.get(`/api/packages/${p.id}/assignments`)).status).toBe(404);
  });
});
