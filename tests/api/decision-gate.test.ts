// A deliberate decision: Accepted and Accepted as noted are refused without an override reason
// while a check fails, a Major finding is not closed or a disagreeing stated figure is not
// accepted; the engineer confirms with their password (401 with one message, 429 after five
// wrong ones); the record keeps who, when, what it overrode and the version of the inputs and
// results it was made on; the reason prints on the return and shows in the history.
import fs from 'node:fs';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appUrl } from '@server/config';
import { jsonSha256 } from '@server/modules/reviews/decision-gate';
import { buildReturn } from '@server/modules/returns/service';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeUser } from '../support/factories';
import { internalWords } from '../support/internal-words';
import { desk, pdftotext, submitted, type Agent } from '../support/review-desk';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

const example = (name: string) =>
  JSON.parse(fs.readFileSync(`shared/engineering/examples/${name}.json`, 'utf8'));
const sql = (text: string, params: unknown[] = []) => t.ctx.dataSource.query(text, params);

/** A submitted package of `inputs`, with the engineer assigned. */
async function withEngineer(inputs: unknown = example('pass-outriggers')) {
  const d = await desk(t);
  const p = await submitted(t, d.w, d.contractor, inputs);
  await d.reviewer.post('/api/assignments').send({ packageIds: [p.id], engineerId: d.w.engineer.id });
  return { ...d, p };
}

async function decide(engineer: Agent, id: string, body: Record<string, unknown>) {
  const version = (await engineer.get(`/api/packages/${id}`)).body.package.version;
  return engineer
    .post(`/api/packages/${id}/decision`)
    .send({ password: TEST_PASSWORD, baseVersion: version, ...body });
}

const decisionRows = (packageId: string) =>
  sql(`SELECT * FROM decisions WHERE package_id = $1 ORDER BY created_at`, [packageId]);

const REASON =
  'The chart used is the long-boom chart by mistake; the short-boom chart rates 18.5 t at this radius (checked by hand, attached).';

describe('the gate on Accepted and Accepted as noted', () => {
  it('when a check fails, then both acceptances without an override reason answer 422 naming the field and listing the check in words, and nothing is recorded', async () => {
    const d = await withEngineer(example('fail-capacity'));
    for (const decision of ['accepted', 'accepted_as_noted'] as const) {
      const res = await decide(d.engineer, d.p.id, { decision, conditions: 'Level the mats.' });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('override_required');
      expect(res.body.error.fields).toEqual([
        {
          path: 'overrideReason',
          message: expect.stringMatching(/^Override reason is required: write why the lift may go ahead/),
        },
      ]);
      expect(res.body.error.message).toMatch(/needs an override reason: one item stands against it/);
      expect(res.body.error.message).toContain(
        'Failing check: Rated-capacity use: Gross load is 94.0% of the chart capacity',
      );
      expect(internalWords(res.body.error.message)).toEqual([]);
    }
    expect(await decisionRows(d.p.id)).toEqual([]);
    // A reason too short to say anything is refused by the schema, naming the field.
    const short = await decide(d.engineer, d.p.id, { decision: 'accepted', overrideReason: 'ok' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields).toEqual([
      { path: 'overrideReason', message: 'Override reason must be at least 10 characters' },
    ]);
    // Revise and resubmit and Rejected are never gated.
    const revise = await decide(d.engineer, d.p.id, { decision: 'revise_and_resubmit' });
    expect(revise.status).toBe(200);
    const [row] = await decisionRows(d.p.id);
    expect(row).toMatchObject({ decision: 'revise_and_resubmit', override_reason: null, overridden: [] });
  });

  it('when the engineer writes the override reason, then the acceptance is recorded with the reason and what it overrode, in the package and its history', async () => {
    const d = await withEngineer(example('fail-capacity'));
    const res = await decide(d.engineer, d.p.id, { decision: 'accepted', overrideReason: REASON });
    expect(res.status).toBe(200);
    expect(res.body.package).toMatchObject({ status: 'decided', decision: 'accepted' });
    expect(res.body.decision).toMatchObject({
      decision: 'accepted',
      overrideReason: REASON,
      overridden: [expect.stringMatching(/^Failing check: Rated-capacity use: /)],
    });
    const event = res.body.events.find((e: { action: string }) => e.action === 'decision.recorded');
    expect(event.detail).toEqual({
      decision: 'accepted',
      revision: 1,
      overrideReason: REASON,
      overridden: 1,
    });
    // The contractor reads the same package: the reason is part of the record.
    const seen = await d.contractor.get(`/api/packages/${d.p.id}`);
    expect(seen.body.decision.overrideReason).toBe(REASON);
  });

  it('when a Major finding is not closed, then an acceptance needs the reason; once the finding is closed it does not', async () => {
    const d = await withEngineer();
    const raised = await d.engineer
      .post(`/api/packages/${d.p.id}/findings`)
      .send({ text: 'The exclusion zone is not drawn on the site plan.', severity: 'major' });
    expect(raised.status).toBe(201);
    await d.engineer
      .post(`/api/packages/${d.p.id}/findings`)
      .send({ text: 'Spelling on the title block.', severity: 'minor' });
    const refused = await decide(d.engineer, d.p.id, { decision: 'accepted' });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toContain(
      'Major finding not closed: The exclusion zone is not drawn on the site plan.',
    );
    expect(refused.body.error.message).not.toContain('Spelling');
    const majorId = raised.body.items.find((f: { severity: string }) => f.severity === 'major').id;
    const closed = await d.engineer
      .patch(`/api/packages/${d.p.id}/findings/${majorId}`)
      .send({ state: 'closed' });
    expect(closed.status).toBe(200);
    const accepted = await decide(d.engineer, d.p.id, { decision: 'accepted' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.decision).toMatchObject({ overrideReason: null, overridden: [] });
  });

  it('when stated figures disagree and are not accepted, then an acceptance needs the reason; once each is accepted with a reason it does not', async () => {
    const d = await withEngineer(example('caution-discrepancies'));
    const refused = await decide(d.engineer, d.p.id, { decision: 'accepted_as_noted', conditions: 'Mats.' });
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toContain(
      'Disagreeing stated figure not accepted: Gross load: stated 9.50 t, recomputed 10.4 t',
    );
    const detail = (await d.engineer.get(`/api/packages/${d.p.id}`)).body;
    const figures = (detail.current.results.discrepancies as { figure: string; status: string }[])
      .filter((x) => x.status === 'discrepancy')
      .map((x) => x.figure);
    expect(figures.length).toBeGreaterThan(1);
    for (const figure of figures) {
      const ok = await d.engineer
        .post(`/api/packages/${d.p.id}/accepted-figures`)
        .send({ figure, reason: 'Checked against the site survey.' });
      expect(ok.status).toBe(200);
    }
    const accepted = await decide(d.engineer, d.p.id, { decision: 'accepted_as_noted', conditions: 'Mats.' });
    expect(accepted.status).toBe(200);
  });
});

describe('the password step-up', () => {
  it('when the password is missing, then 400 names it; when it is wrong, then 401 with one message and nothing recorded', async () => {
    const d = await withEngineer();
    const version = (await d.engineer.get(`/api/packages/${d.p.id}`)).body.package.version;
    const missing = await d.engineer
      .post(`/api/packages/${d.p.id}/decision`)
      .send({ decision: 'rejected', baseVersion: version });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toEqual([
      { path: 'password', message: 'Password is required: enter your password to confirm the decision' },
    ]);
    const messages = new Set<string>();
    for (const password of ['wrong horse battery', TEST_PASSWORD.toUpperCase(), ' ']) {
      const res = await decide(d.engineer, d.p.id, { decision: 'rejected', password });
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('step_up_failed');
      messages.add(res.body.error.message);
    }
    expect([...messages]).toEqual(['The password did not confirm the decision. Nothing was recorded.']);
    expect(await decisionRows(d.p.id)).toEqual([]);
    // The session is not ended by a wrong step-up password.
    expect((await d.engineer.get('/api/me')).status).toBe(200);
  });

  it('when five wrong passwords are sent, then the sixth attempt answers 429 even with the right one; a 422 does not count', async () => {
    const d = await withEngineer(example('fail-capacity'));
    const refusedByGate = await decide(d.engineer, d.p.id, { decision: 'accepted' });
    expect(refusedByGate.status).toBe(422);
    const answers: number[] = [];
    for (let i = 0; i < 5; i++)
      answers.push(
        (await decide(d.engineer, d.p.id, { decision: 'rejected', password: `nope-${i}` })).status,
      );
    expect(answers).toEqual([401, 401, 401, 401, 401]);
    const blocked = await decide(d.engineer, d.p.id, { decision: 'rejected' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/^Too many wrong passwords\. Wait 15 minutes/);
    expect(await decisionRows(d.p.id)).toEqual([]);
    // The count is the person's: another engineer is not held up by it.
    const other = await makeUser(t.ctx.dataSource, d.w.owner, 'engineer');
    const second = await signedIn(t.app, other.email);
    await d.reviewer.post('/api/assignments').send({ packageIds: [d.p.id], engineerId: other.id });
    expect((await decide(second, d.p.id, { decision: 'rejected' })).status).toBe(200);
  });
});

describe('what the decision records', () => {
  it('when a decision is recorded, then it keeps who, when, the password confirmation and the sha-256 of the inputs and results it was made on', async () => {
    const before = Date.now();
    const d = await withEngineer();
    const res = await decide(d.engineer, d.p.id, { decision: 'accepted' });
    expect(res.status).toBe(200);
    const [row] = await decisionRows(d.p.id);
    const [revision] = await sql(`SELECT inputs, results FROM revisions WHERE id = $1`, [d.p.revisionId]);
    expect(row.engineer_id).toBe(d.w.engineer.id);
    expect(row.created_at.getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect(row.confirmed_at.getTime()).toBeLessThanOrEqual(row.created_at.getTime() + 1000);
    expect(row.inputs_sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(row.inputs_sha256).toBe(jsonSha256(revision.inputs));
    expect(row.results_sha256).toBe(jsonSha256(revision.results));
    expect(row.engine_version).toBe(revision.results.engineVersion);
    expect(res.body.decision.madeOn).toEqual({
      inputsSha256: row.inputs_sha256,
      resultsSha256: row.results_sha256,
      engineVersion: row.engine_version,
    });
    // Different inputs give a different version: the hash follows the data, not the row.
    const other = await withEngineer(example('pass-crawler'));
    await decide(other.engineer, other.p.id, { decision: 'accepted' });
    const [otherRow] = await decisionRows(other.p.id);
    expect(otherRow.inputs_sha256).not.toBe(row.inputs_sha256);
    // Key order does not change the version.
    expect(jsonSha256({ b: 1, a: [1, { d: 2, c: 3 }] })).toBe(jsonSha256({ a: [1, { c: 3, d: 2 }], b: 1 }));
  });
});

describe('the override on the stamped return', () => {
  it('when an acceptance over a failing check is issued, then the stamp and the calculation sheet print the override reason and the sheet lists what it overrode', async () => {
    const d = await withEngineer(example('fail-capacity'));
    expect((await decide(d.engineer, d.p.id, { decision: 'accepted', overrideReason: REASON })).status).toBe(
      200,
    );
    const issued = await d.reviewer.post(`/api/packages/${d.p.id}/returns`);
    expect(issued.status).toBe(202);
    await buildReturn(t.ctx.dataSource, t.ctx.storage, issued.body.id, appUrl(t.ctx.config));
    const file = await d.contractor
      .get(`/api/packages/${d.p.id}/returns/${issued.body.id}/file`)
      .buffer(true);
    expect(file.status).toBe(200);
    const flat = (text: string) => text.replace(/\s+/g, ' ');
    // Page 1: the stamp's override line (cut short, pointing to the sheet).
    const stamp = flat(await pdftotext(file.body, 1));
    expect(stamp).toContain('Override');
    expect(stamp).toContain('The chart used is the long-boom');
    // The calculation sheet's first page (page 3: the plan has 2): the reason in full and the items.
    const sheet = flat(await pdftotext(file.body, 3));
    expect(sheet).toContain('Override');
    expect(sheet).toContain(flat(REASON));
    expect(sheet).toContain('Overridden');
    expect(sheet).toContain('Failing check: Rated-capacity use: Gross load is 94.0% of the chart capacity');
    // And /verify says the same: the decision, its conditions and the override reason.
    const verified = await supertest(t.app).get(`/api/verify/${issued.body.verificationCode}`);
    expect(verified.body).toMatchObject({ decision: 'accepted', conditions: '', overrideReason: REASON });
  }, 60_000);
});
