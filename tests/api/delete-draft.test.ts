// A contractor deletes a package never submitted: the package, its draft and its stored files
// go, and the audit log keeps the reference; a submitted package stays (409), another
// organisation's is 404, and the owner side may not delete (403).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../support/app';
import { makePdf } from '../support/pdfs';
import { desk, submitted } from '../support/review-desk';
import { signedIn } from '../support/app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

describe('deleting a draft', () => {
  it('when the contractor deletes a first draft, then it and its files are gone; a submitted one stays', async () => {
    const { w, contractor, reviewer } = await desk(t);
    const created = await contractor
      .post('/api/packages')
      .send({ title: 'Never to be lifted', siteId: w.site.id, plannedLiftDate: null });
    const id = created.body.package.id as string;
    const up = await contractor
      .post(`/api/packages/${id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(1)), 'plan.pdf');
    expect(up.status).toBe(201);
    const [row] = await t.ctx.dataSource.query(`SELECT storage_key FROM uploaded_files WHERE id = $1`, [
      up.body.id,
    ]);
    expect(await t.ctx.storage.open(row.storage_key)).not.toBeNull();

    const other = await signedIn(t.app, w.plannerB.email);
    expect((await other.delete(`/api/packages/${id}`)).status).toBe(404);
    expect((await reviewer.delete(`/api/packages/${id}`)).status).toBe(403);

    const gone = await contractor.delete(`/api/packages/${id}`);
    expect(gone.status).toBe(204);
    expect((await contractor.get(`/api/packages/${id}`)).status).toBe(404);
    expect(await t.ctx.storage.open(row.storage_key)).toBeNull();
    const [audit] = await t.ctx.dataSource.query(
      `SELECT detail FROM audit_events WHERE action = 'package.deleted' AND detail->>'reference' = $1`,
      [created.body.package.reference],
    );
    expect(audit.detail).toMatchObject({ title: 'Never to be lifted', files: 1 });

    const p = await submitted(t, w, contractor);
    const kept = await contractor.delete(`/api/packages/${p.id}`);
    expect(kept.status).toBe(409);
    expect(kept.body.error.message).toMatch(/stays on record/);
    expect((await contractor.get(`/api/packages/${p.id}`)).status).toBe(200);
  });
});
