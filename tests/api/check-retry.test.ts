// A check run whose every attempt fails (here the database refuses to store this
// revision's results, through a trigger the test adds) ends as "check could not run" with
// the reason, and the contractor or a reviewer can run it again; real worker, PostgreSQL
// and Redis.
import fs from 'node:fs';
import type { Worker } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connect } from '@server/bootstrap';
import { loadConfig } from '@server/config';
import { createRedis } from '@server/lib/redis';
import { AuditEvent } from '@server/modules/audit/audit-event.entity';
import { relayOnce } from '@server/modules/jobs/relay';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { createApp } from '@server/app';
import { checkRunTask, startCheckRunWorker } from '../../worker/tasks/check-run-task';
import { signedIn } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';
import type { AppContext } from '@server/context';
import type { Express } from 'express';
import { randomUUID } from 'node:crypto';
import { until } from '../support/until';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));

let ctx: AppContext;
let app: Express;
let worker: Worker;
const connection = createRedis(process.env.REDIS_URL!, { forWorker: true });

beforeAll(async () => {
  // Short pauses between attempts, so five failing attempts take a second, not a minute.
  ctx = await connect({ ...loadConfig(), REDIS_PREFIX: `t-${randomUUID().slice(0, 8)}` }, { backoffMs: 50 });
  app = createApp(ctx, { clientDir: '/nonexistent' });
  worker = startCheckRunWorker(ctx, connection, 1);
});
afterAll(async () => {
  await worker.close();
  connection.disconnect();
  await ctx.close?.();
});

const finalise = (_queue: string, payload: Record<string, string>, reason: string) =>
  checkRunTask(ctx, 1).onFinalFailure({ revisionId: payload.revisionId }, reason);

async function revisionOf(packageId: string) {
  return ctx.dataSource.getRepository(Revision).findOneByOrFail({ packageId, number: 1 });
}

describe('a check run that cannot run', () => {
  it('when every attempt fails, then the package shows "check could not run" with the reason, and the contractor and a reviewer can run it again', async () => {
    const w = await makeWorld(ctx.dataSource);
    const pkg = await makePackage(ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'checking',
      inputs: example,
    });
    const revisionId = (await revisionOf(pkg.id)).id;
    const fault = `refuse_results_${revisionId.replace(/-/g, '')}`;
    await ctx.dataSource.query(`CREATE FUNCTION ${fault}() RETURNS trigger AS $$
      BEGIN RAISE EXCEPTION 'no space left for the results of %', NEW.id; END $$ LANGUAGE plpgsql`);
    await ctx.dataSource.query(
      `CREATE TRIGGER ${fault} BEFORE UPDATE ON revisions FOR EACH ROW
       WHEN (NEW.id = '${revisionId}' AND NEW.check_status = 'done') EXECUTE FUNCTION ${fault}()`,
    );
    // The revision has no intent yet (made directly in the database): the relay adopts and queues it.
    expect(
      (await relayOnce(ctx.dataSource, ctx.queues, finalise, { queues: ['check-run'] })).queued,
    ).toBeGreaterThanOrEqual(1);

    const failed = await until(async () => {
      const r = await revisionOf(pkg.id);
      return r.checkStatus === 'failed' ? r : null;
    });
    expect(failed.checkError).toBe(
      `It did not finish after 5 attempts. Last error: no space left for the results of ${revisionId}`,
    );
    const after = await ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    expect(after.status).toBe('check_failed');
    expect(
      await ctx.dataSource.getRepository(AuditEvent).countBy({ packageId: pkg.id, action: 'check.failed' }),
    ).toBe(1);

    const contractor = await signedIn(app, w.plannerA.email);
    const seen = await contractor.get(`/api/packages/${pkg.id}/check-run`);
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ status: 'failed', canRetry: true, handOff: 'finished' });
    expect(seen.body.error).toMatch(/no space left/);
    const detail = await contractor.get(`/api/packages/${pkg.id}`);
    expect(detail.body.package.status).toBe('check_failed');

    // Wrong role, other organisation: refused, and nothing changes.
    const engineer = await signedIn(app, w.engineer.email);
    expect((await engineer.get(`/api/packages/${pkg.id}/check-run`)).body.canRetry ?? false).toBe(false);
    const byEngineer = await engineer.post(`/api/packages/${pkg.id}/check-run/retry`);
    expect(byEngineer.status).toBe(403);
    const other = await signedIn(app, w.plannerB.email);
    expect((await other.post(`/api/packages/${pkg.id}/check-run/retry`)).status).toBe(404);
    expect((await other.get(`/api/packages/${pkg.id}/check-run`)).status).toBe(404);
    expect((await revisionOf(pkg.id)).checkStatus).toBe('failed');

    // The contractor runs it again while the fault is still there: a second round, failing again.
    const again = await contractor.post(`/api/packages/${pkg.id}/check-run/retry`);
    expect(again.status).toBe(202);
    expect(again.body.current.check.status).toBe('queued');
    expect(again.body.package.status).toBe('checking');
    await until(async () => (await revisionOf(pkg.id)).checkStatus === 'failed');
    expect(
      await ctx.dataSource.getRepository(AuditEvent).countBy({ packageId: pkg.id, action: 'check.failed' }),
    ).toBe(2);

    // Fixed; the reviewer runs it again and it completes, once.
    await ctx.dataSource.query(`DROP TRIGGER ${fault} ON revisions`);
    await ctx.dataSource.query(`DROP FUNCTION ${fault}()`);
    const reviewer = await signedIn(app, w.reviewer.email);
    expect((await reviewer.get(`/api/packages/${pkg.id}/check-run`)).body.canRetry).toBe(true);
    const byReviewer = await reviewer.post(`/api/packages/${pkg.id}/check-run/retry`);
    expect(byReviewer.status).toBe(202);
    const done = await until(async () => {
      const r = await revisionOf(pkg.id);
      return r.checkStatus === 'done' ? r : null;
    });
    expect(done.checkError).toBeNull();
    expect((await ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id })).status).toBe(
      'ready_for_review',
    );
    expect(
      await ctx.dataSource
        .getRepository(AuditEvent)
        .countBy({ packageId: pkg.id, action: 'check.completed' }),
    ).toBe(1);
    const intents: Array<{ job_id: string; state: string }> = await ctx.dataSource.query(
      `SELECT job_id, state FROM job_intents WHERE subject_id = $1 ORDER BY created_at`,
      [done.id],
    );
    expect(intents.map((i) => i.state)).toEqual(['failed', 'failed', 'done']);
    expect(intents.map((i) => i.job_id)).toEqual([
      `check-${done.id}`,
      `check-${done.id}-r2`,
      `check-${done.id}-r3`,
    ]);

    // Nothing left to run again.
    const late = await reviewer.post(`/api/packages/${pkg.id}/check-run/retry`);
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('check_not_failed');
  }, 90_000);

  it('when the lift data itself is invalid, then running the check again is refused with the reason', async () => {
    const w = await makeWorld(ctx.dataSource);
    const { chart: _chart, ...noChart } = example;
    const pkg = await makePackage(ctx.dataSource, {
      contractor: w.contractorA,
      site: w.site,
      createdBy: w.plannerA,
      status: 'checking',
      inputs: noChart,
    });
    await relayOnce(ctx.dataSource, ctx.queues, finalise, { queues: ['check-run'] });
    await until(async () => (await revisionOf(pkg.id)).checkStatus === 'invalid');
    const contractor = await signedIn(app, w.plannerA.email);
    expect((await contractor.get(`/api/packages/${pkg.id}/check-run`)).body.canRetry).toBe(false);
    const res = await contractor.post(`/api/packages/${pkg.id}/check-run/retry`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('lift_data_invalid');
    expect(res.body.error.message).toMatch(/chart/);
  });
});
