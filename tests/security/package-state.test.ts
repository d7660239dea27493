// Standing security suite, point 7: actions only in their state, through the status machine
// (shared/rules/package-status.ts). A wrong-state action answers 409 and changes nothing.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { Finding } from '@server/modules/reviews/review.entity';
import { canMove, stateRefusal } from '@shared/rules/package-status';
import type { PackageStatus } from '@shared/schemas/common';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => t.close());

async function packageWithFinding(status: PackageStatus) {
  const w = await makeWorld(t.ctx.dataSource);
  const pkg = await makePackage(t.ctx.dataSource, {
    contractor: w.contractorA,
    site: w.site,
    createdBy: w.plannerA,
    status,
    engineer: w.engineer,
  });
  const revision = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ packageId: pkg.id });
  const finding = await t.ctx.dataSource.getRepository(Finding).save({
    packageId: pkg.id,
    revisionId: revision.id,
    text: 'Show the exclusion zone.',
    severity: 'major',
    state: 'open',
    createdById: w.engineer.id,
  } as Partial<Finding>);
  return { w, pkg, finding };
}

describe('actions only in their state', () => {
  it('when a contractor answers a finding while the package is with the engineer, then 409 and no answer', async () => {
    const { w, pkg, finding } = await packageWithFinding('with_engineer');
    const contractor = await signedIn(t.app, w.plannerA.email);
    const res = await contractor
      .patch(`/api/packages/${pkg.id}/findings/${finding.id}`)
      .send({ response: 'Answered too early.' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/returned to the contractor/);
    const stored = await t.ctx.dataSource.getRepository(Finding).findOneByOrFail({ id: finding.id });
    expect(stored).toMatchObject({ state: 'open', response: null });
  });

  it('when the engineer closes or reopens a finding after the return, then 409 and the finding stays', async () => {
    const { w, pkg, finding } = await packageWithFinding('returned');
    const engineer = await signedIn(t.app, w.engineer.email);
    for (const state of ['closed', 'open'] as const) {
      const res = await engineer.patch(`/api/packages/${pkg.id}/findings/${finding.id}`).send({ state });
      expect({ state, status: res.status }).toEqual({ state, status: 409 });
      expect(res.body.error.message).toMatch(/before the return/);
    }
    expect((await t.ctx.dataSource.getRepository(Finding).findOneByOrFail({ id: finding.id })).state).toBe(
      'open',
    );
    // Once returned, the contractor may answer.
    const contractor = await signedIn(t.app, w.plannerA.email);
    const answered = await contractor
      .patch(`/api/packages/${pkg.id}/findings/${finding.id}`)
      .send({ response: 'Zone drawn on sheet 3.' });
    expect(answered.status).toBe(200);
    expect((await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id })).status).toBe(
      'returned',
    );
  });

  // Each action of the review and return, in a status where it is not allowed: 409, a message
  // that names the action and the status, and the package with its markups, findings,
  // decisions, returns and revisions as they were.
  const WRONG_STATE: Array<{
    action: string;
    status: PackageStatus;
    as: 'engineer' | 'reviewer' | 'contractor';
    send: (
      pkg: string,
      w: Awaited<ReturnType<typeof makeWorld>>,
    ) => [method: 'post' | 'delete', path: string, body?: object];
    message: RegExp;
  }> = [
    {
      action: 'add a markup',
      status: 'decided',
      as: 'engineer',
      send: (id) => [
        'post',
        `/api/packages/${id}/markups`,
        {
          kind: 'rectangle',
          fileId: randomUUID(),
          pageNumber: 1,
          geometry: { x: 10, y: 10, width: 40, height: 20 },
        },
      ],
      message:
        /^Markups can be added only while the package is with the engineer; this package is decided\.$/,
    },
    {
      action: 'remove a markup',
      status: 'returned',
      as: 'engineer',
      send: (id) => ['delete', `/api/packages/${id}/markups/${randomUUID()}`],
      message:
        /^Markups can be removed only while the package is with the engineer; this package is returned\.$/,
    },
    {
      action: 'raise a finding',
      status: 'ready_for_review',
      as: 'engineer',
      send: (id) => ['post', `/api/packages/${id}/findings`, { text: 'Too early.', severity: 'minor' }],
      message:
        /^Findings can be raised only while the package is with the engineer; this package is ready for review\.$/,
    },
    {
      action: 'accept a stated figure',
      status: 'decided',
      as: 'engineer',
      send: (id) => [
        'post',
        `/api/packages/${id}/accepted-figures`,
        { figure: 'radius', reason: 'Checked on site.' },
      ],
      message:
        /^Figures can be accepted only while the package is with the engineer; this package is decided\.$/,
    },
    {
      action: 'record a decision',
      status: 'returned',
      as: 'engineer',
      send: (id) => [
        'post',
        `/api/packages/${id}/decision`,
        { password: TEST_PASSWORD, decision: 'accepted', baseVersion: 1 },
      ],
      message:
        /^A decision can be recorded only while the package is with the engineer, before the return; this package is returned\.$/,
    },
    {
      action: 'issue the return',
      status: 'with_engineer',
      as: 'reviewer',
      send: (id) => ['post', `/api/packages/${id}/returns`],
      message:
        /^The stamped return can be issued only once the engineer has recorded a decision; this package is with engineer\.$/,
    },
    {
      action: 'assign an engineer',
      status: 'decided',
      as: 'reviewer',
      send: (id, w) => ['post', '/api/assignments', { packageIds: [id], engineerId: w.engineer.id }],
      message:
        /: An engineer can be assigned only between submission and the decision; this package is decided\.$/,
    },
    {
      action: 'start the next revision',
      status: 'with_engineer',
      as: 'contractor',
      send: (id) => ['post', `/api/packages/${id}/revisions`],
      message:
        /^A new revision can start only after the package is returned; this package is with engineer\.$/,
    },
  ];

  async function snapshot(id: string) {
    const ds = t.ctx.dataSource;
    const pkg = await ds.getRepository(LiftPackage).findOneByOrFail({ id });
    const [counts] = await ds.query(
      `SELECT (SELECT count(*) FROM markups mk JOIN revisions r ON r.id = mk.revision_id WHERE r.package_id = $1) AS markups,
              (SELECT count(*) FROM findings WHERE package_id = $1) AS findings,
              (SELECT count(*) FROM decisions WHERE package_id = $1) AS decisions,
              (SELECT count(*) FROM stamped_returns WHERE package_id = $1) AS returns,
              (SELECT count(*) FROM revisions WHERE package_id = $1) AS revisions,
              (SELECT count(*) FROM audit_events WHERE package_id = $1) AS events`,
      [id],
    );
    return { ...counts, status: pkg.status, version: pkg.version, engineer: pkg.assignedEngineerId };
  }

  for (const c of WRONG_STATE) {
    it(`when someone tries to ${c.action} while the package is ${c.status}, then 409 names the state and nothing changes`, async () => {
      const { w, pkg } = await packageWithFinding(c.status);
      const who = { engineer: w.engineer, reviewer: w.reviewer, contractor: w.plannerA }[c.as];
      const agent = await signedIn(t.app, who.email);
      const before = await snapshot(pkg.id);
      const [method, path, body] = c.send(pkg.id, w);
      const res = await (body ? agent[method](path).send(body) : agent[method](path));
      expect({ status: res.status, message: res.body.error?.message }).toEqual({
        status: 409,
        message: expect.stringMatching(c.message),
      });
      expect(await snapshot(pkg.id)).toEqual(before);
    });
  }

  it('when the machine is asked about moves and actions, then it follows the documented order', () => {
    expect(canMove('draft', 'checking', 'contractor')).toBe(true);
    expect(canMove('draft', 'checking', 'engineer')).toBe(false);
    expect(canMove('with_engineer', 'decided', 'engineer')).toBe(true);
    expect(canMove('returned', 'with_engineer', 'engineer')).toBe(false);
    expect(stateRefusal('close_or_reopen_finding', 'decided', 'x')).toBeNull();
    expect(stateRefusal('answer_finding', 'checking', 'Findings can be answered')).toMatch(/checking/);
  });
});
