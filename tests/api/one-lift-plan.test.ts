// One lift plan per revision: the upload's lock on the revision row serialises uploads, and a
// partial unique index holds the rule in the database too; an upload that meets the index's
// conflict runs again and replaces the plan, as one upload after another would.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../support/app';
import { makePdf } from '../support/pdfs';
import { desk } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const sql = (text: string, params: unknown[] = []) => t.ctx.dataSource.query(text, params);

async function draftPackage() {
  const d = await desk(t);
  const created = await d.contractor
    .post('/api/packages')
    .send({ title: 'One plan only', siteId: d.w.site.id, plannedLiftDate: '2027-03-14' });
  const id = created.body.package.id as string;
  const revisionId = created.body.current.id as string;
  return { ...d, id, revisionId };
}

const filesOf = (revisionId: string) =>
  sql(`SELECT id, kind, original_name AS name FROM uploaded_files WHERE revision_id = $1 ORDER BY kind`, [
    revisionId,
  ]);

describe('one lift plan per revision', () => {
  it('when a second lift plan row is written straight into the database, then the index refuses it; supporting files are not limited', async () => {
    const d = await draftPackage();
    const insert = (kind: string, n: number) =>
      sql(
        `INSERT INTO uploaded_files (revision_id, kind, original_name, sha256, size_bytes, pages, storage_key, uploaded_by_id)
         VALUES ($1, $2, $3, repeat('0', 64), 1, 1, $3, $4)`,
        [d.revisionId, kind, `direct-${kind}-${n}.pdf`, d.w.plannerA.id],
      );
    await insert('lift_plan', 1);
    await expect(insert('lift_plan', 2)).rejects.toThrow(/uploaded_files_one_lift_plan_key/);
    await insert('supporting', 1);
    await insert('supporting', 2);
    expect((await filesOf(d.revisionId)).map((f: { kind: string }) => f.kind)).toEqual([
      'lift_plan',
      'supporting',
      'supporting',
    ]);
  });

  it('when a lift plan row lands outside the upload lock while an upload is in flight, then the upload meets the index, runs again and its plan is the one kept', async () => {
    const d = await draftPackage();
    const runner = t.ctx.dataSource.createQueryRunner();
    await runner.connect();
    try {
      await runner.startTransaction();
      // A row written beside the lock: without the foreign key's trigger (replica role) the insert
      // takes no share lock on the revision row, so the upload's lock does not wait for it. Not
      // committed yet: the upload cannot see it, and its own insert waits on the index.
      await runner.query(`SET LOCAL session_replication_role = replica`);
      await runner.query(
        `INSERT INTO uploaded_files (revision_id, kind, original_name, sha256, size_bytes, pages, storage_key, uploaded_by_id)
         VALUES ($1, 'lift_plan', 'beside-the-lock.pdf', repeat('0', 64), 1, 1, 'revisions/none.pdf', $2)`,
        [d.revisionId, d.w.plannerA.id],
      );
      const started = Date.now();
      const upload = d.contractor
        .post(`/api/packages/${d.id}/files`)
        .field('kind', 'lift_plan')
        .attach('file', Buffer.from(await makePdf(1, 'The real plan')), 'real-plan.pdf')
        .then((res) => res);
      await new Promise((resolve) => setTimeout(resolve, 400));
      await runner.commitTransaction();
      const res = await upload;
      expect(res.status).toBe(201);
      // It waited for the other row's commit, met the conflict and replaced that row.
      expect(Date.now() - started).toBeGreaterThanOrEqual(400);
      expect(await filesOf(d.revisionId)).toEqual([
        { id: res.body.id, kind: 'lift_plan', name: 'real-plan.pdf' },
      ]);
    } finally {
      if (runner.isTransactionActive) await runner.rollbackTransaction();
      await runner.release();
    }
  });

  it('when 10 lift plans and 3 supporting files are uploaded at once, then every upload answers 201 and the revision ends with one lift plan and the 3 supporting files', async () => {
    const d = await draftPackage();
    const plans = await Promise.all(Array.from({ length: 10 }, (_, i) => makePdf(1, `Plan ${i + 1}`)));
    const upload = (kind: string, bytes: Uint8Array, name: string) =>
      d.contractor
        .post(`/api/packages/${d.id}/files`)
        .field('kind', kind)
        .attach('file', Buffer.from(bytes), name);
    const answers = await Promise.all([
      ...plans.map((bytes, i) => upload('lift_plan', bytes, `plan-${i + 1}.pdf`)),
      ...[1, 2, 3].map(async (n) =>
        upload('supporting', await makePdf(1, `Drawing ${n}`), `drawing-${n}.pdf`),
      ),
    ]);
    expect(answers.map((a) => a.status)).toEqual(Array(13).fill(201));
    const files = await filesOf(d.revisionId);
    const lift = files.filter((f: { kind: string }) => f.kind === 'lift_plan');
    expect(lift).toHaveLength(1);
    expect(lift[0].name).toMatch(/^plan-\d+\.pdf$/);
    expect(files.filter((f: { kind: string }) => f.kind === 'supporting')).toHaveLength(3);
    // The package page shows the same one plan.
    const detail = (await d.contractor.get(`/api/packages/${d.id}`)).body;
    expect(detail.current.files.filter((f: { kind: string }) => f.kind === 'lift_plan')).toEqual([
      expect.objectContaining({ id: lift[0].id }),
    ]);
  }, 60_000);
});
