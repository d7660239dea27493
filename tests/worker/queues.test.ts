// Check runs are not held up by stamping: a worker process takes only the queues WORKER_QUEUES
// names, a check completes while a stamp job is in progress in another worker, and a worker
// that takes every queue runs stamping in a child process of its own. The real worker
// (worker/index.ts) runs as a process against a database of this file's own (its relay would
// otherwise queue other test files' intents), on the test command's PostgreSQL and Redis.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Worker } from 'bullmq';
import pg from 'pg';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { signerFor } from '@server/lib/pdf-tools/signer';
import { createRedis } from '@server/lib/redis';
import type { Storage } from '@server/lib/storage';
import { Revision } from '@server/modules/packages/package.entity';
import { StampedReturn } from '@server/modules/reviews/review.entity';
import { runMigrations } from '../../scripts/lib/migrate';
import { stampedReturnTask } from '../../worker/tasks/stamped-return-task';
import { startTask } from '../../worker/tasks/task';
import { signedIn, startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { makePdf } from '../support/pdfs';
import { until } from '../support/until';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
const base = process.env.DATABASE_URL!;
const dbName = `queues_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const dbUrl = base.replace(/\/[^/]+$/, `/${dbName}`);
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-queues-test-'));
const admin = new pg.Client({ connectionString: base });
const connection = createRedis(process.env.REDIS_URL!, { forWorker: true });

let t: TestApp;
const children: ChildProcess[] = [];
const inProcess: Worker[] = [];

beforeAll(async () => {
  await admin.connect();
  await admin.query(`CREATE DATABASE ${dbName}`);
  await runMigrations(dbUrl);
  t = await startTestApp({ DATABASE_URL: dbUrl, DATA_DIR: dataDir });
});
afterEach(async () => {
  await Promise.all(inProcess.splice(0).map((w) => w.close()));
  await Promise.all(children.splice(0).map(stop));
  // A stamp job a test left waiting must not be the next test's.
  await t.ctx.queues.stampedReturn.drain(true);
});
afterAll(async () => {
  connection.disconnect();
  await t.close();
  await admin.query(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
  await admin.end();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

function stop(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  return exited;
}

/** The real worker process; resolves with its "worker ready" log line (the parent's, not a child's). */
async function startWorker(queues: string | null) {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    DATABASE_URL: dbUrl,
    DATA_DIR: dataDir,
    REDIS_PREFIX: t.ctx.config.REDIS_PREFIX,
    LOG_LEVEL: 'info',
    CP_SERVICE: 'worker',
  };
  if (queues) env.WORKER_QUEUES = queues;
  else delete env.WORKER_QUEUES;
  const child = spawn(process.execPath, ['--import', 'tsx', 'worker/index.ts'], {
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  children.push(child);
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const ready = await until(
    async () => out.split('\n').find((l) => l.includes('worker ready') && l.includes('"service":"worker"')),
    60_000,
    'worker ready',
  ).catch((e) => {
    throw new Error(`${e.message}; the worker printed: ${out.slice(-3000)}`);
  });
  return { child, ready: JSON.parse(ready) as { queues: Record<string, number>; stampProcess?: number } };
}

async function people() {
  const w = await makeWorld(t.ctx.dataSource);
  const [contractor, reviewer, engineer] = await Promise.all(
    [w.plannerA, w.reviewer, w.engineer].map((u) => signedIn(t.app, u.email)),
  );
  return { w, contractor, reviewer, engineer };
}

/** A package submitted through the API: its check-run job is queued by the hand-off. */
async function submit(p: Awaited<ReturnType<typeof people>>, title: string) {
  const created = await p.contractor
    .post('/api/packages')
    .send({ title, siteId: p.w.site.id, plannedLiftDate: '2030-03-14' });
  const id = created.body.package.id as string;
  await p.contractor.put(`/api/packages/${id}/draft`).send({ inputs: example });
  const up = await p.contractor
    .post(`/api/packages/${id}/files`)
    .field('kind', 'lift_plan')
    .attach('file', Buffer.from(await makePdf(2)), 'plan.pdf');
  expect(up.status).toBe(201);
  const sub = await p.contractor.post(`/api/packages/${id}/submit`);
  expect(sub.status).toBe(202);
  return { id, revisionId: sub.body.current.id as string };
}

async function checked(revisionId: string, ms = 30_000) {
  return until(
    async () =>
      (await t.ctx.dataSource.getRepository(Revision).findOneByOrFail({ id: revisionId })).checkStatus ===
      'done',
    ms,
    `check of ${revisionId}`,
  );
}

/** Assigns, accepts and issues the return: its stamp job is queued by the hand-off. */
async function issue(p: Awaited<ReturnType<typeof people>>, id: string) {
  await p.reviewer.post('/api/assignments').send({ packageIds: [id], engineerId: p.w.engineer.id });
  const version = (await p.engineer.get(`/api/packages/${id}`)).body.package.version;
  const decided = await p.engineer
    .post(`/api/packages/${id}/decision`)
    .send({ password: TEST_PASSWORD, decision: 'accepted', conditions: '', baseVersion: version });
  expect(decided.status).toBe(200);
  const issued = await p.reviewer.post(`/api/packages/${id}/returns`);
  expect(issued.status).toBe(202);
  const [decision] = await t.ctx.dataSource.query(
    `SELECT id FROM decisions WHERE package_id = $1 ORDER BY created_at DESC LIMIT 1`,
    [id],
  );
  return { returnId: issued.body.id as string, jobId: `stamp-${decision.id}` };
}

const returnState = async (id: string) =>
  (await t.ctx.dataSource.getRepository(StampedReturn).findOneByOrFail({ id })).state;

describe('queues apart', () => {
  it('when a worker takes only the check queue, then it runs check runs and leaves stamp jobs waiting', async () => {
    const { ready } = await startWorker('check');
    expect(ready.queues).toEqual({ 'check-run': t.ctx.config.CHECK_CONCURRENCY });
    const p = await people();
    const first = await submit(p, 'Set the pump skid');
    await checked(first.revisionId);
    const { returnId, jobId } = await issue(p, first.id);
    // A check queued after the stamp job still runs, while the stamp job is left alone.
    const second = await submit(p, 'Set the second pump skid');
    await checked(second.revisionId);
    await new Promise((r) => setTimeout(r, 1000));
    const stampJob = await t.ctx.queues.stampedReturn.getJob(jobId);
    expect(await stampJob!.getState()).toBe('waiting');
    expect(stampJob!.processedOn).toBeFalsy();
    expect(await returnState(returnId)).toBe('pending');
  }, 120_000);

  it('when a stamp job is in progress in another worker, then a check run still completes', async () => {
    await startWorker('check');
    // The stamp worker holds its job where it reads the originals, until the test lets it go.
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    let entered = false;
    const storage: Storage = Object.create(t.ctx.storage, {
      getFile: {
        value: async (key: string, file: string) => {
          entered = true;
          await gate;
          return t.ctx.storage.getFile(key, file);
        },
      },
    });
    const stampCtx = { ...t.ctx, storage };
    inProcess.push(
      startTask(stampCtx, connection, stampedReturnTask(stampCtx, 1, await signerFor(t.ctx.config))),
    );
    const p = await people();
    const first = await submit(p, 'Lift the cooling tower fan');
    await checked(first.revisionId);
    const { returnId, jobId } = await issue(p, first.id);
    await until(async () => entered, 30_000, 'the stamp job reading the originals');

    const second = await submit(p, 'Lift the second cooling tower fan');
    await checked(second.revisionId);
    expect(await (await t.ctx.queues.stampedReturn.getJob(jobId))!.getState()).toBe('active');
    expect(await returnState(returnId)).toBe('pending');

    release();
    await until(async () => (await returnState(returnId)) === 'ready', 60_000, 'the return ready');
  }, 120_000);

  it('when a worker takes every queue, then stamping runs in a child process that builds the return and goes with the worker', async () => {
    const { child, ready } = await startWorker(null);
    expect(ready.queues).toMatchObject({ 'check-run': t.ctx.config.CHECK_CONCURRENCY, reminders: 1 });
    expect(ready.queues).not.toHaveProperty('stamp-return');
    const stamper = ready.stampProcess!;
    expect(stamper).toBeGreaterThan(0);
    // A process that exited but was not reaped yet (a zombie) counts as gone.
    const alive = (pid: number) => {
      try {
        return !/^State:\s+Z/m.test(fs.readFileSync(`/proc/${pid}/status`, 'utf8'));
      } catch {
        return false;
      }
    };
    expect(alive(stamper)).toBe(true);

    const p = await people();
    const pkg = await submit(p, 'Set the transformer');
    await checked(pkg.revisionId);
    const { returnId, jobId } = await issue(p, pkg.id);
    await until(async () => (await returnState(returnId)) === 'ready', 90_000, 'the return ready');
    const job = await t.ctx.queues.stampedReturn.getJob(jobId);
    expect(await job!.getState()).toBe('completed');

    child.kill('SIGKILL');
    await until(async () => !alive(stamper), 30_000, 'the stamping process gone');
  }, 180_000);
});

describe('WORKER_QUEUES', () => {
  const env = { ...process.env };
  it('when it is not set, then a worker takes every queue; when set, only those named, once each', async () => {
    const { loadConfig } = await import('@server/config');
    expect(loadConfig({ ...env, WORKER_QUEUES: undefined }).WORKER_QUEUES).toEqual([
      'check',
      'stamp',
      'mail',
      'reminders',
    ]);
    expect(loadConfig({ ...env, WORKER_QUEUES: ' stamp , stamp,mail' }).WORKER_QUEUES).toEqual([
      'stamp',
      'mail',
    ]);
  });

  it('when it names a queue that does not exist, then the configuration error names the setting and the word', async () => {
    const { loadConfig } = await import('@server/config');
    expect(() => loadConfig({ ...env, WORKER_QUEUES: 'check,stamps' })).toThrow(
      /WORKER_QUEUES: WORKER_QUEUES must list one or more of check, stamp, mail, reminders, separated by commas \(not known: stamps\)/,
    );
    expect(() => loadConfig({ ...env, WORKER_QUEUES: ' , ' })).toThrow(/WORKER_QUEUES must list one or more/);
    expect(() => loadConfig({ ...env, STAMP_CONCURRENCY: '0' })).toThrow(/STAMP_CONCURRENCY/);
  });
});
