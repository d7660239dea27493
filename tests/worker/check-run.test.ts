// The check run in the worker, against the real Redis and PostgreSQL of the test command.
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import type { Worker } from 'bullmq';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { checkRunJobId } from '@server/lib/queues';
import { createRedis } from '@server/lib/redis';
import { AuditEvent } from '@server/modules/audit/audit-event.entity';
import { runCheckRun } from '@server/modules/check-runs/service';
import { enqueueCheck } from '@server/modules/packages/drafts';
import { LiftPackage, Revision } from '@server/modules/packages/package.entity';
import { startCheckRunWorker } from '../../worker/tasks/check-run-task';
import { startTestApp, type TestApp } from '../support/app';
import { makePackage, makeWorld } from '../support/factories';
import { until } from '../support/until';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/caution-discrepancies.json', 'utf8'));

let t: TestApp;
let worker: Worker | null = null;
const connection = createRedis(process.env.REDIS_URL!, { forWorker: true });

beforeAll(async () => {
  t = await startTestApp();
});
afterEach(async () => {
  await worker?.close();
  worker = null;
});
afterAll(async () => {
  connection.disconnect();
  await t.close();
});

async function submittedRevision(inputs: Record<string, unknown>) {
  const w = await makeWorld(t.ctx.dataSource);
  const pkg = await makePackage(t.ctx.dataSource, {
    contractor: w.contractorA,
    site: w.site,
    createdBy: w.plannerA,
    status: 'checking',
    inputs,
  });
  const revision = await t.ctx.dataSource
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: 1 });
  return { pkg, revisionId: revision.id };
}

async function completions(packageId: string) {
  return t.ctx.dataSource.getRepository(AuditEvent).countBy({ packageId, action: 'check.completed' });
}

describe('the check-run worker', () => {
  it('when a submitted revision is queued, then the worker stores the results and the package is ready for review', async () => {
    const { pkg, revisionId } = await submittedRevision(example);
    worker = startCheckRunWorker(t.ctx, connection, 1);
    await enqueueCheck(t.ctx.queues, revisionId);
    const done = await until(async () => {
      const r = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ id: revisionId });
      return r.checkStatus === 'done' ? r : null;
    });
    expect(done.resultVersion).toBe(2);
    expect(done.policyUsed).toMatchObject({ minStabilityRatio: 1.5 });
    const after = await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    expect(after.status).toBe('ready_for_review');
    expect(after.openDiscrepancies).toBeGreaterThan(0);
    expect(after.worstStatus).toBe((done.results as { overallStatus: string }).overallStatus);
    const job = await t.ctx.queues.checkRun.getJob(checkRunJobId(revisionId));
    expect(job?.progress).toMatchObject({ percent: 100 });
  });

  it('when the lift data is invalid, then the job fails at once without retries and the contractor sees why', async () => {
    const { chart: _chart, ...noChart } = example;
    const { pkg, revisionId } = await submittedRevision(noChart);
    worker = startCheckRunWorker(t.ctx, connection, 1);
    await enqueueCheck(t.ctx.queues, revisionId);
    const job = await until(async () => {
      const j = await t.ctx.queues.checkRun.getJob(checkRunJobId(revisionId));
      return j && (await j.isFailed()) ? j : null;
    });
    expect(job.attemptsMade).toBe(1);
    expect(job.failedReason).toMatch(/chart/);
    const after = await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    expect(after.status).toBe('check_failed');
    const revision = await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ id: revisionId });
    expect(revision.checkStatus).toBe('invalid');
    expect(revision.checkError).toMatch(/chart is required/);
  });

  it('when the same revision is queued twice, then one job runs and a repeat run changes nothing', async () => {
    const { pkg, revisionId } = await submittedRevision(example);
    const total = async () =>
      Object.values(
        await t.ctx.queues.checkRun.getJobCounts('waiting', 'active', 'completed', 'failed', 'delayed'),
      ).reduce((a, b) => a + b, 0);
    const before = await total();
    await enqueueCheck(t.ctx.queues, revisionId);
    await enqueueCheck(t.ctx.queues, revisionId);
    expect(await total()).toBe(before + 1);
    worker = startCheckRunWorker(t.ctx, connection, 2);
    await until(async () => (await completions(pkg.id)) === 1);
    expect((await runCheckRun(t.ctx.dataSource, revisionId)).skipped).toBe(true);
    expect(await completions(pkg.id)).toBe(1);
  });

  it('when a worker is killed mid-job, then the stalled job is recovered and completes once', async () => {
    const { pkg, revisionId } = await submittedRevision(example);
    const child = spawn(process.execPath, ['--import', 'tsx', 'tests/support/stalling-worker.ts'], {
      env: { ...process.env, REDIS_PREFIX: t.ctx.config.REDIS_PREFIX },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    let out = '';
    child.stdout!.on('data', (d) => (out += d));
    await until(async () => out.includes('ready'), 30_000);
    await enqueueCheck(t.ctx.queues, revisionId);
    await until(async () => out.includes(`took ${checkRunJobId(revisionId)}`)).catch((e) => {
      throw new Error(`${e.message}; the stalling worker printed: ${out}`);
    });
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    expect(await completions(pkg.id)).toBe(0);

    worker = startCheckRunWorker(t.ctx, connection, 1, { stalledInterval: 500, lockDuration: 2000 });
    await until(async () => (await completions(pkg.id)) === 1, 30_000);
    const job = await until(async () => {
      const j = await t.ctx.queues.checkRun.getJob(checkRunJobId(revisionId));
      return j && (await j.isCompleted()) ? j : null;
    });
    expect(job.stalledCounter).toBeGreaterThanOrEqual(1);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await completions(pkg.id)).toBe(1);
    const after = await t.ctx.dataSource.getRepository(LiftPackage).findOneByOrFail({ id: pkg.id });
    expect(after.status).toBe('ready_for_review');
  }, 60_000);
});
