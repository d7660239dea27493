// Documents carry over into a new revision: the lift plan and the supporting PDFs of revision 1
// start revision 2, each marked with the revision it came from, over the same stored object.
// The contractor keeps, replaces or removes each; removing a carried copy leaves revision 1's
// file readable; the revision difference names each document's change.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { runCheckRun } from '@server/modules/check-runs/service';
import { buildReturn } from '@server/modules/returns/service';
import { startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePdf } from '../support/pdfs';
import { desk, submitted } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

type File = {
  id: string;
  kind: string;
  originalName: string;
  sha256: string;
  carriedFromRevision: number | null;
};

describe('documents across revisions', () => {
  it('when a returned package starts revision 2, then its documents carry over and each can be kept, replaced or removed', async () => {
    const { w, contractor, reviewer, engineer } = await desk(t);
    const p = await submitted(t, w, contractor, undefined, 'Carry the documents', '2027-03-14', [
      'ground-report.pdf',
      'sling-certificates.pdf',
      'crane-mats.pdf',
    ]);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const version = (await engineer.get(`/api/packages/${p.id}`)).body.package.version;
    const decided = await engineer.post(`/api/packages/${p.id}/decision`).send({
      password: TEST_PASSWORD,
      decision: 'revise_and_resubmit',
      conditions: 'Show the mats.',
      baseVersion: version,
    });
    expect(decided.status).toBe(200);
    const issued = await reviewer.post(`/api/packages/${p.id}/returns`);
    expect(issued.status).toBe(202);
    await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    const rev1 = (await contractor.get(`/api/packages/${p.id}/revisions/1`)).body.files as File[];
    expect(rev1).toHaveLength(4);

    const next = await contractor.post(`/api/packages/${p.id}/revisions`);
    expect(next.status).toBe(201);
    const carried = next.body.current.files as File[];
    expect(carried.map((f) => [f.kind, f.originalName, f.carriedFromRevision]).sort()).toEqual(
      [
        ['lift_plan', 'plan.pdf', 1],
        ['supporting', 'crane-mats.pdf', 1],
        ['supporting', 'ground-report.pdf', 1],
        ['supporting', 'sling-certificates.pdf', 1],
      ].sort(),
    );
    // New rows over the same bytes.
    for (const f of carried) {
      const was = rev1.find((g) => g.originalName === f.originalName)!;
      expect(f.id).not.toBe(was.id);
      expect(f.sha256).toBe(was.sha256);
    }
    const byName = (name: string) => carried.find((f) => f.originalName === name)!;

    // Remove one: revision 1's copy of it stays readable.
    const removed = await contractor.delete(`/api/packages/${p.id}/files/${byName('crane-mats.pdf').id}`);
    expect(removed.status).toBe(204);
    const oldMats = rev1.find((f) => f.originalName === 'crane-mats.pdf')!;
    const oldBytes = await engineer.get(`/api/packages/${p.id}/files/${oldMats.id}`).buffer(true);
    expect(oldBytes.status).toBe(200);
    expect(createHash('sha256').update(oldBytes.body).digest('hex')).toBe(oldMats.sha256);

    // Replace one: a new file of the same name, the carried copy removed.
    const replacement = await contractor
      .post(`/api/packages/${p.id}/files`)
      .field('kind', 'supporting')
      .attach('file', Buffer.from(await makePdf(3, 'Ground report, revised')), 'ground-report.pdf');
    expect(replacement.status).toBe(201);
    await contractor.delete(`/api/packages/${p.id}/files/${byName('ground-report.pdf').id}`);
    // Add one.
    await contractor
      .post(`/api/packages/${p.id}/files`)
      .field('kind', 'supporting')
      .attach('file', Buffer.from(await makePdf(1, 'Lift sequence')), 'lift-sequence.pdf');

    const draft = (await contractor.get(`/api/packages/${p.id}`)).body.current.files as File[];
    expect(draft.find((f) => f.originalName === 'ground-report.pdf')!.carriedFromRevision).toBeNull();
    expect(draft.find((f) => f.originalName === 'sling-certificates.pdf')!.carriedFromRevision).toBe(1);

    const sub = await contractor.post(`/api/packages/${p.id}/submit`);
    expect(sub.status).toBe(202);
    await runCheckRun(t.ctx.dataSource, sub.body.current.id);
    const diff = await engineer.get(`/api/packages/${p.id}/compare?from=1&to=2`);
    expect(diff.status).toBe(200);
    const changes = (
      diff.body.documents as Array<{
        change: string;
        from: { name: string } | null;
        to: { name: string } | null;
      }>
    ).map((d) => [d.change, d.from?.name ?? null, d.to?.name ?? null]);
    expect(changes.sort()).toEqual(
      [
        ['unchanged', 'plan.pdf', 'plan.pdf'],
        ['unchanged', 'sling-certificates.pdf', 'sling-certificates.pdf'],
        ['replaced', 'ground-report.pdf', 'ground-report.pdf'],
        ['added', null, 'lift-sequence.pdf'],
        ['removed', 'crane-mats.pdf', null],
      ].sort(),
    );
  }, 60_000);
});
