// The review desk over the API: queue filters, assignment, markups, findings, the
// decision with its stale-save guard, the stamped return, verification and resubmission.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { runCheckRun } from '@server/modules/check-runs/service';
import { buildReturn } from '@server/modules/returns/service';
import { startTestApp, signedIn, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeUser, makeWorld } from '../support/factories';
import { makePdf } from '../support/pdfs';
import {
  desk as deskOf,
  passing,
  pdftotext,
  submitted as submittedIn,
  type Agent,
  type World,
} from '../support/review-desk';

const disagreeing = JSON.parse(
  fs.readFileSync('shared/engineering/examples/caution-discrepancies.json', 'utf8'),
);

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ VERIFY_LIMIT_PER_MINUTE: 1000 });
});
afterAll(async () => t.close());

const submitted = (w: World, contractor: Agent, inputs = passing, title?: string, date?: string) =>
  submittedIn(t, w, contractor, inputs, title, date);
const desk = () => deskOf(t);

describe('the queue', () => {
  it('when the reviewer filters by engineer, criticality, discrepancies and date window, then the server filters', async () => {
    const { w, contractor, reviewer } = await desk();
    const a = await submitted(w, contractor, passing, 'Plain lift', '2030-01-10');
    const b = await submitted(
      w,
      contractor,
      disagreeing,
      'Disagreeing lift',
      new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10),
    );
    await reviewer.post('/api/assignments').send({ packageIds: [a.id], engineerId: w.engineer.id });
    const ids = async (q: string) => {
      const res = await reviewer.get(`/api/packages?${q}`);
      expect(res.status, `${q}: ${JSON.stringify(res.body)}`).toBe(200);
      return res.body.items.map((p: { id: string }) => p.id);
    };
    expect(await ids('engineerId=none')).toEqual([b.id]);
    expect(await ids(`engineerId=${w.engineer.id}`)).toEqual([a.id]);
    expect(await ids('discrepancies=true')).toEqual([b.id]);
    expect(await ids('liftWithinDays=7')).toEqual([b.id]);
    expect(await ids(`contractorId=${w.contractorB.id}`)).toEqual([]);
    expect(await ids('sort=-openDiscrepancies')).toEqual([b.id, a.id]);
    const bad = await reviewer.get('/api/packages?critical=maybe');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual([
      { path: 'query.critical', message: 'Critical must be true or false' },
    ]);
  });
});

describe('assignment', () => {
  it('when a reviewer assigns two packages at once, then both go to the engineer; others may not assign', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const a = await submitted(w, contractor);
    const b = await submitted(w, contractor);
    expect(
      (await engineer.post('/api/assignments').send({ packageIds: [a.id], engineerId: w.engineer.id }))
        .status,
    ).toBe(403);
    expect(
      (await contractor.post('/api/assignments').send({ packageIds: [a.id], engineerId: w.engineer.id }))
        .status,
    ).toBe(403);
    const res = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [a.id, b.id], engineerId: w.engineer.id });
    expect(res.status).toBe(200);
    expect(res.body.assigned).toBe(2);
    const mine = (await engineer.get('/api/packages')).body.items;
    expect(mine.map((p: { id: string }) => p.id).sort()).toEqual([a.id, b.id].sort());
    expect(mine.every((p: { status: string }) => p.status === 'with_engineer')).toBe(true);
    const notEngineer = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [a.id], engineerId: w.plannerA.id });
    expect(notEngineer.status).toBe(400);
    expect(notEngineer.body.error.fields[0].path).toBe('engineerId');
    const other = await makeWorld(t.ctx.dataSource);
    const outside = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [a.id], engineerId: other.engineer.id });
    expect(outside.status).toBe(400);
  });

  it('when the package belongs to another site, then assignment answers 404', async () => {
    const { reviewer, w } = await desk();
    const other = await desk();
    const theirs = await submitted(other.w, other.contractor);
    const res = await reviewer
      .post('/api/assignments')
      .send({ packageIds: [theirs.id], engineerId: w.engineer.id });
    expect(res.status).toBe(404);
  });
});

describe('the engineer’s review', () => {
  it('when markups are added, then they are stored in PDF page coordinates and pins are numbered', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const p = await submitted(w, contractor);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const rect = await engineer.post(`/api/packages/${p.id}/markups`).send({
      fileId: p.fileId,
      pageNumber: 1,
      kind: 'rectangle',
      geometry: { x: 72, y: 600, width: 144, height: 36 },
      colour: 'rust',
    });
    expect(rect.status).toBe(201);
    expect(rect.body.geometry).toEqual({ x: 72, y: 600, width: 144, height: 36 });
    const pin1 = await engineer
      .post(`/api/packages/${p.id}/markups`)
      .send({ fileId: p.fileId, pageNumber: 2, kind: 'pin', geometry: { x: 300, y: 400 } });
    const pin2 = await engineer
      .post(`/api/packages/${p.id}/markups`)
      .send({ fileId: p.fileId, pageNumber: 2, kind: 'pin', geometry: { x: 310, y: 410 } });
    expect([pin1.body.number, pin2.body.number]).toEqual([1, 2]);
    const beyond = await engineer
      .post(`/api/packages/${p.id}/markups`)
      .send({ fileId: p.fileId, pageNumber: 3, kind: 'pin', geometry: { x: 1, y: 1 } });
    expect(beyond.status).toBe(400);
    expect(beyond.body.error.fields[0]).toEqual({
      path: 'pageNumber',
      message: 'Page number must be between 1 and 2',
    });
    const emptyText = await engineer
      .post(`/api/packages/${p.id}/markups`)
      .send({ fileId: p.fileId, pageNumber: 1, kind: 'text', geometry: { x: 1, y: 1 }, text: ' ' });
    expect(emptyText.status).toBe(400);
    const list = await reviewer.get(`/api/packages/${p.id}/markups`);
    expect(list.body.items).toHaveLength(3);
    expect(
      (
        await contractor
          .post(`/api/packages/${p.id}/markups`)
          .send({ fileId: p.fileId, pageNumber: 1, kind: 'pin', geometry: { x: 1, y: 1 } })
      ).status,
    ).toBe(403);
  });

  it('when another engineer or the reviewer tries to decide, then they are refused', async () => {
    const { w, contractor, reviewer } = await desk();
    const p = await submitted(w, contractor);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const second = await makeUser(t.ctx.dataSource, w.owner, 'engineer');
    const otherEngineer = await signedIn(t.app, second.email);
    expect(
      (
        await otherEngineer
          .post(`/api/packages/${p.id}/decision`)
          .send({ password: TEST_PASSWORD, decision: 'accepted', baseVersion: 1 })
      ).status,
    ).toBe(404);
    expect(
      (
        await reviewer
          .post(`/api/packages/${p.id}/decision`)
          .send({ password: TEST_PASSWORD, decision: 'accepted', baseVersion: 1 })
      ).status,
    ).toBe(403);
  });

  it('when two tabs decide from the same version, then the second gets 409 and the first decision stands', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const p = await submitted(w, contractor);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const seen = (await engineer.get(`/api/packages/${p.id}`)).body.package.version;
    const first = await engineer
      .post(`/api/packages/${p.id}/decision`)
      .send({ password: TEST_PASSWORD, decision: 'accepted', baseVersion: seen });
    expect(first.status).toBe(200);
    expect(first.body.package).toMatchObject({ status: 'decided', decision: 'accepted' });
    const second = await engineer
      .post(`/api/packages/${p.id}/decision`)
      .send({ password: TEST_PASSWORD, decision: 'rejected', baseVersion: seen });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('stale_review');
    expect((await engineer.get(`/api/packages/${p.id}`)).body.package.decision).toBe('accepted');
  });

  it('when Accepted as noted has no conditions, then 400 names conditions', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const p = await submitted(w, contractor);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const res = await engineer
      .post(`/api/packages/${p.id}/decision`)
      .send({ password: TEST_PASSWORD, decision: 'accepted_as_noted', conditions: '', baseVersion: 1 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual([
      { path: 'conditions', message: 'Conditions are required with Accepted as noted' },
    ]);
  });

  it('when the engineer accepts a figure that differs, then the open discrepancies drop and the reason is kept', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const p = await submitted(w, contractor, disagreeing);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    const before = (await engineer.get(`/api/packages/${p.id}`)).body;
    const open = before.current.results.discrepancies.filter(
      (d: { status: string }) => d.status === 'discrepancy',
    );
    expect(open.length).toBeGreaterThan(1);
    const res = await engineer
      .post(`/api/packages/${p.id}/accepted-figures`)
      .send({ figure: open[0].figure, reason: 'Weigh ticket supplied on site.' });
    expect(res.status).toBe(200);
    expect(res.body.package.openDiscrepancies).toBe(open.length - 1);
    const unknown = await engineer
      .post(`/api/packages/${p.id}/accepted-figures`)
      .send({ figure: 'nothing', reason: 'not a discrepancy' });
    expect(unknown.status).toBe(400);
  });
});

async function issueAndBuild(reviewer: Agent, id: string) {
  const issued = await reviewer.post(`/api/packages/${id}/returns`);
  expect(issued.status).toBe(202);
  expect(await t.ctx.queues.stampedReturn.getJob(`stamp-${await latestDecisionId(id)}`)).toBeTruthy();
  await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
  return issued.body as { id: string; verificationCode: string };
}

async function latestDecisionId(packageId: string) {
  const [row] = await t.ctx.dataSource.query(
    `SELECT id FROM decisions WHERE package_id = $1 ORDER BY created_at DESC LIMIT 1`,
    [packageId],
  );
  return row.id as string;
}

describe('the stamped return, verification and resubmission', () => {
  it('when a package goes round a revision, then the return, verification and carried findings all hold', async () => {
    const { w, contractor, reviewer, engineer } = await desk();
    const p = await submitted(w, contractor);
    await reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: w.engineer.id });
    await engineer.post(`/api/packages/${p.id}/markups`).send({
      fileId: p.fileId,
      pageNumber: 1,
      kind: 'cloud',
      geometry: { x: 100, y: 500, width: 200, height: 80 },
    });
    const raised = await engineer.post(`/api/packages/${p.id}/findings`).send({
      text: 'Show the spotter position on the site plan.',
      severity: 'major',
      fileId: p.fileId,
      pageNumber: 1,
    });
    expect(raised.status).toBe(201);
    const version = (await engineer.get(`/api/packages/${p.id}`)).body.package.version;
    await engineer.post(`/api/packages/${p.id}/decision`).send({
      password: TEST_PASSWORD,
      decision: 'revise_and_resubmit',
      conditions: 'Add the spotter.',
      baseVersion: version,
    });

    // Only reviewers issue; issuing twice gives the same single return.
    expect((await engineer.post(`/api/packages/${p.id}/returns`)).status).toBe(403);
    const ret = await issueAndBuild(reviewer, p.id);
    const again = await reviewer.post(`/api/packages/${p.id}/returns`);
    expect(again.body.id).toBe(ret.id);
    expect((await buildReturn(t.ctx.dataSource, t.ctx.storage, ret.id, appUrl(t.ctx.config))).skipped).toBe(
      true,
    );
    expect(ret.verificationCode).toMatch(/^[A-Z2-7]{24}$/);

    const list = await contractor.get(`/api/packages/${p.id}/returns`);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0]).toMatchObject({ state: 'ready', progress: 100 });
    const file = await contractor.get(`/api/packages/${p.id}/returns/${ret.id}/file`).buffer(true);
    expect(file.status).toBe(200);
    // Each revision's return downloads under its own name: reference, revision, decision.
    expect(file.headers['content-disposition']).toMatch(
      /^inline; filename="[A-Za-z0-9-]+-rev1-revise-and-resubmit-stamped-return\.pdf"$/,
    );
    expect(createHash('sha256').update(file.body).digest('hex')).toBe(list.body.items[0].sha256);
    const firstPage = await pdftotext(file.body, 1);
    expect(firstPage).toMatch(/Revise and resubmit/i);
    expect(firstPage).toContain(ret.verificationCode);
    const { PDFDocument } = await import('pdf-lib');
    const pages = (await PDFDocument.load(new Uint8Array(file.body))).getPageCount();
    expect(pages).toBe(list.body.items[0].pages);
    expect(pages).toBeGreaterThan(2);
    expect((await contractor.get(`/api/packages/${p.id}`)).body.package.status).toBe('returned');

    // Verification: public, says this revision is current, leaks nothing else.
    const v1 = await supertest(t.app).get(`/api/verify/${ret.verificationCode}`);
    expect(v1.status).toBe(200);
    expect(Object.keys(v1.body).sort()).toEqual([
      'conditions',
      'current',
      'decidedOn',
      'decision',
      'decisionLabel',
      'found',
      'issuedOn',
      'overrideReason',
      'reference',
      'revision',
      'sha256',
      'signingCertificateSha256',
      'supersededBy',
      'title',
    ]);
    expect(v1.body).toMatchObject({
      revision: 1,
      decision: 'revise_and_resubmit',
      current: true,
      supersededBy: null,
    });
    const missing = await supertest(t.app).get('/api/verify/AAAAAAAAAAAAAAAAAAAAAAAA');
    const malformed = await supertest(t.app).get('/api/verify/abc');
    expect(missing.status).toBe(404);
    expect(malformed.status).toBe(404);
    expect(malformed.body).toEqual(missing.body);

    // The contractor answers the finding and resubmits as revision 2 with a new PDF.
    const findingId = raised.body.items[0].id;
    const answer = await contractor
      .patch(`/api/packages/${p.id}/findings/${findingId}`)
      .send({ response: 'Spotter added on drawing 2.' });
    expect(answer.body.items[0]).toMatchObject({
      state: 'answered',
      response: 'Spotter added on drawing 2.',
      revisionNumber: 1,
    });
    const next = await contractor.post(`/api/packages/${p.id}/revisions`);
    expect(next.status).toBe(201);
    // The new revision starts with revision 1's lift plan, kept until the contractor replaces it.
    expect(next.body.current).toMatchObject({
      number: 2,
      state: 'draft',
      files: [
        expect.objectContaining({ kind: 'lift_plan', originalName: 'plan.pdf', carriedFromRevision: 1 }),
      ],
    });
    expect(next.body.current.inputs).toEqual(passing);
    const changed = { ...passing, load: { ...passing.load, weight: { value: 9.8, unit: 't' } } };
    await contractor.put(`/api/packages/${p.id}/draft`).send({ inputs: changed });
    await contractor
      .post(`/api/packages/${p.id}/files`)
      .field('kind', 'lift_plan')
      .attach('file', Buffer.from(await makePdf(1)), 'plan-rev2.pdf');
    const sub2 = await contractor.post(`/api/packages/${p.id}/submit`);
    expect(sub2.status).toBe(202);
    await runCheckRun(t.ctx.dataSource, sub2.body.current.id);
    const seen = (await engineer.get(`/api/packages/${p.id}`)).body;
    expect(seen.package).toMatchObject({ status: 'with_engineer', revisionNumber: 2 });
    const diff = await engineer.get(`/api/packages/${p.id}/compare?from=1&to=2`);
    expect(diff.body.inputs).toEqual([
      { path: 'load.weight', from: { value: 9.5, unit: 't' }, to: { value: 9.8, unit: 't' } },
    ]);
    expect(diff.body.checks.find((c: { id: string }) => c.id === 'gross-load').changed).toBe(true);
    expect(diff.body.documents).toEqual([
      expect.objectContaining({
        kind: 'lift_plan',
        change: 'replaced',
        from: expect.objectContaining({ name: 'plan.pdf' }),
        to: expect.objectContaining({ name: 'plan-rev2.pdf' }),
      }),
    ]);
    const findings = (await engineer.get(`/api/packages/${p.id}/findings`)).body.items;
    expect(findings).toEqual([
      expect.objectContaining({ id: findingId, state: 'answered', revisionNumber: 1 }),
    ]);
    const closed = await engineer
      .patch(`/api/packages/${p.id}/findings/${findingId}`)
      .send({ state: 'closed' });
    expect(closed.body.items[0].state).toBe('closed');

    // The old return is now superseded.
    const v2 = await supertest(t.app).get(`/api/verify/${ret.verificationCode}`);
    expect(v2.body).toMatchObject({ current: false, supersededBy: 2 });
  }, 60_000);

  it('when the verification page is hammered, then it is rate-limited', async () => {
    const limited = await startTestApp({ VERIFY_LIMIT_PER_MINUTE: 3 });
    try {
      const codes: number[] = [];
      for (let i = 0; i < 5; i++)
        codes.push((await supertest(limited.app).get('/api/verify/AAAAAAAAAAAAAAAAAAAAAAAB')).status);
      expect(codes.slice(0, 3)).toEqual([404, 404, 404]);
      expect(codes.slice(3)).toEqual([429, 429]);
    } finally {
      await limited.close();
    }
  });
});
