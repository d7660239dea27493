// Review due dates: a submission gets the site's due date (the turnaround in working days, or
// the lift less the margin when sooner); the queue sorts by it both ways and flags what is
// overdue; a site's times are set by its administrator within their limits.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addWorkingDays, reviewDueOn } from '@shared/rules/review-due';
import { MailMessage } from '@server/modules/mail/mail.entity';
import { stageReminders } from '@server/modules/mail/reminders';
import { signedIn, startTestApp, type TestApp } from '../support/app';
import { desk, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const today = () => new Date().toISOString().slice(0, 10);
const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

describe('review due dates', () => {
  it("when packages are submitted, then each gets the site's due date, the queue sorts by it and flags the overdue", async () => {
    const { w, contractor, reviewer } = await desk(t);
    const admin = await signedIn(t.app, w.admin.email);
    const refused = await admin.patch(`/api/admin/sites/${w.site.id}`).send({ reviewTurnaroundDays: 0 });
    expect(refused.status).toBe(400);
    expect(JSON.stringify(refused.body)).toMatch(/between 1 and 60 working days/);
    const set = await admin
      .patch(`/api/admin/sites/${w.site.id}`)
      .send({ reviewTurnaroundDays: 3, reviewMarginDays: 1 });
    expect(set.status).toBe(200);

    const far = await submitted(t, w, contractor, undefined, 'Lift far off', inDays(60));
    const near = await submitted(t, w, contractor, undefined, 'Lift tomorrow', inDays(1));
    const times = { turnaroundDays: 3, marginDays: 1 };
    const farDetail = (await reviewer.get(`/api/packages/${far.id}`)).body.package;
    const nearDetail = (await reviewer.get(`/api/packages/${near.id}`)).body.package;
    expect(farDetail.reviewDueOn).toBe(addWorkingDays(today(), 3));
    expect(nearDetail.reviewDueOn).toBe(reviewDueOn(today(), inDays(1), times));
    expect(nearDetail.reviewDueOn).toBe(today());
    expect(nearDetail.reviewOverdue).toBe(false);

    // One made overdue by the clock: its due date moved into the past.
    await t.ctx.dataSource.query(`UPDATE lift_packages SET review_due_on = $2 WHERE id = $1`, [
      far.id,
      inDays(-2),
    ]);
    const asc = await reviewer.get('/api/packages').query({ sort: 'reviewDue', siteId: w.site.id });
    expect(asc.status).toBe(200);
    const ids = asc.body.items.map((p: { id: string }) => p.id);
    expect(ids.indexOf(far.id)).toBeLessThan(ids.indexOf(near.id));
    const overdue = asc.body.items.find((p: { id: string }) => p.id === far.id);
    expect(overdue).toMatchObject({ reviewDueOn: inDays(-2), reviewOverdue: true });
    const desc = await reviewer.get('/api/packages').query({ sort: '-reviewDue', siteId: w.site.id });
    const back = desc.body.items.map((p: { id: string }) => p.id);
    expect(back.indexOf(near.id)).toBeLessThan(back.indexOf(far.id));
  });

  it('when a review is due tomorrow or overdue, then the engineer and the coordinators are reminded once that day', async () => {
    const { w, contractor, reviewer } = await desk(t);
    const p = await submitted(t, w, contractor, undefined, 'Reminded review', inDays(20));
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    await t.ctx.dataSource.query(`UPDATE lift_packages SET review_due_on = $2 WHERE id = $1`, [
      p.id,
      inDays(1),
    ]);
    const ids = await stageReminders(t.ctx.dataSource, today(), 3, 'http://desk.test');
    const rows = (await t.ctx.dataSource.getRepository(MailMessage).findBy(ids.map((id) => ({ id })))).filter(
      (r) => r.packageId === p.id && r.event === 'review_due',
    );
    expect(rows.map((r) => r.toAddress).sort()).toEqual([w.engineer.email, w.reviewer.email].sort());
    expect(rows[0].subject).toContain('review due tomorrow');
    const again = await stageReminders(t.ctx.dataSource, today(), 3, 'http://desk.test');
    const repeated = again.length
      ? (await t.ctx.dataSource.getRepository(MailMessage).findBy(again.map((id) => ({ id })))).filter(
          (r) => r.packageId === p.id,
        )
      : [];
    expect(repeated).toEqual([]);
  });
});
