// Standing security suite, point 7: actions only in their state, through the status machine
// (shared/rules/package-status.ts). A wrong-state action answers 409 and changes nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { Finding } from '@server/modules/reviews/review.entity';
import { canMove, stateRefusal } from '@shared/rules/package-status';
import type { PackageStatus } from '@shared/schemas/common';
import { signedIn, startTestApp, type TestApp } from '../support/app';
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

  it('when the machine is asked about moves and actions, then it follows the documented order', () => {
    expect(canMove('draft', 'checking', 'contractor')).toBe(true);
    expect(canMove('draft', 'checking', 'engineer')).toBe(false);
    expect(canMove('with_engineer', 'decided', 'engineer')).toBe(true);
    expect(canMove('returned', 'with_engineer', 'engineer')).toBe(false);
    expect(stateRefusal('close_or_reopen_finding', 'decided', 'x')).toBeNull();
    expect(stateRefusal('answer_finding', 'checking', 'Findings can be answered')).toMatch(/checking/);
  });
});
