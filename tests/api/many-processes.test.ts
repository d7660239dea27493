// Many processes, many machines: two API processes (server/index.ts) and two worker processes
// (worker/index.ts, every queue each, so each forks its own stamping child) on one PostgreSQL,
// Redis and S3, each process with a data folder of its own (nothing on one process's disk is
// there for another). A session made on API A works on API B; 200 submissions spread over both
// APIs are each checked exactly once, both workers taking some; 20 stamped returns, issued on
// both APIs at once, are each built once; every uploaded plan and every return downloads from
// either API with the sha-256 on record; wrong sign-ins spread over both APIs meet one limit.
// Its own database, as in tests/worker/queues.test.ts: the workers' relay would otherwise
// queue other test files' intents.
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDeskP12 } from '@server/lib/pdf-tools/signer';
import { runMigrations } from '../../scripts/lib/migrate';
import { freePort } from '../../scripts/lib/services';
import { startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';
import { makePdf } from '../support/pdfs';
import { startApi, startWorker, stopAll, type Spawned } from '../support/processes';
import { passing } from '../support/review-desk';
import { until } from '../support/until';

const SUBMISSIONS = 200;
const RETURNS = 20;
const BATCH = 10;
const SIGN_IN_LIMIT = 6;

const base = process.env.DATABASE_URL!;
const dbName = `procs_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
const dbUrl = base.replace(/\/[^/]+$/, `/${dbName}`);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-procs-'));
const admin = new pg.Client({ connectionString: base });

let t: TestApp;
const spawned: Spawned[] = [];
let apis: Array<{ name: string; base: string }> = [];
let workers: Spawned[] = [];

beforeAll(async () => {
  await admin.connect();
  await admin.query(`CREATE DATABASE ${dbName}`);
  await runMigrations(dbUrl);
  t = await startTestApp({ DATABASE_URL: dbUrl, DATA_DIR: path.join(dir, 'test') });
  // One signing identity for every stamping process (each would otherwise make its own in
  // its data folder): a deployment gives them SIGNING_P12_FILE.
  const p12 = path.join(dir, 'signing.p12');
  createDeskP12(p12, 'procs-test-pass', 'Counterpoise many-processes test');
  const shared = {
    DATABASE_URL: dbUrl,
    REDIS_PREFIX: t.ctx.config.REDIS_PREFIX,
    SIGN_IN_LIMIT: String(SIGN_IN_LIMIT),
    SIGNING_P12_FILE: p12,
    SIGNING_P12_PASSPHRASE: 'procs-test-pass',
    LOG_LEVEL: 'info',
  };
  const own = (name: string) => {
    fs.mkdirSync(path.join(dir, name), { recursive: true });
    return { ...shared, DATA_DIR: path.join(dir, name) };
  };
  const log = (name: string) => path.join(dir, `${name}.log`);
  const [portA, portB] = [await freePort(), await freePort()];
  const started = await Promise.all([
    startApi('api-a', portA, own('api-a'), log('api-a')),
    startApi('api-b', portB, own('api-b'), log('api-b')),
    startWorker('worker-1', own('worker-1'), log('worker-1')),
    startWorker('worker-2', own('worker-2'), log('worker-2')),
  ]);
  spawned.push(...started);
  apis = [started[0], started[1]];
  workers = [started[2], started[3]];
}, 180_000);

afterAll(async () => {
  await stopAll(spawned);
  await t?.close();
  await admin.query(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
  await admin.end();
  fs.rmSync(dir, { recursive: true, force: true });
});

interface Answer {
  status: number;
  body: Record<string, unknown> & { error?: { code: string; message: string } };
  bytes?: Buffer;
}

/** A request to one API process over real HTTP, with the session cookie and the CSRF guard. */
async function call(
  api: { base: string },
  cookie: string | null,
  method: string,
  url: string,
  body?: unknown,
): Promise<Answer> {
  const headers: Record<string, string> = { 'X-CSRF-Guard': '1' };
  if (cookie) headers.Cookie = `cp_session=${cookie}`;
  let payload: string | FormData | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  const res = await fetch(`${api.base}/api${url}`, { method, headers, body: payload });
  if ((res.headers.get('content-type') ?? '').startsWith('application/json'))
    return { status: res.status, body: (await res.json()) as Answer['body'] };
  return { status: res.status, body: {}, bytes: Buffer.from(await res.arrayBuffer()) };
}

async function signIn(api: { base: string }, email: string): Promise<string> {
  const res = await fetch(`${api.base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-CSRF-Guard': '1' },
    body: JSON.stringify({ email, password: TEST_PASSWORD }),
  });
  expect(res.status, `sign-in of ${email} on ${api.base}`).toBe(200);
  const token = /cp_session=([^;]+)/.exec(res.headers.get('set-cookie') ?? '')?.[1];
  expect(token).toBeTruthy();
  return token!;
}

/** `fn` over `items`, `size` at a time. */
async function inBatches<T, R>(items: T[], size: number, fn: (item: T, i: number) => Promise<R>) {
  const out: R[] = [];
  for (let i = 0; i < items.length; i += size)
    out.push(...(await Promise.all(items.slice(i, i + size).map((item, j) => fn(item, i + j)))));
  return out;
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** The job ids each worker process (its stamping child included) logged as completed on a queue. */
function completedJobs(prefix: string) {
  return workers.map((w) =>
    w
      .lines()
      .filter((l) => l.msg === 'job completed' && String(l.jobId).startsWith(prefix))
      .map((l) => String(l.jobId)),
  );
}

describe('two API processes and two workers on one PostgreSQL, Redis and S3', () => {
  it('checks every submission and builds every return exactly once, and serves every file from either API', async () => {
    const started = Date.now();
    const [A, B] = apis;
    const w = await makeWorld(t.ctx.dataSource);

    // A session made on A works on B (sessions are rows, the secret is shared).
    const contractor = await signIn(A, w.plannerA.email);
    const [reviewer, engineer] = [await signIn(B, w.reviewer.email), await signIn(B, w.engineer.email)];
    for (const api of apis) {
      const me = await call(api, contractor, 'GET', '/me');
      expect(me.status, api.base).toBe(200);
      expect(me.body).toMatchObject({ user: { email: w.plannerA.email } });
    }
    expect((await call(A, engineer, 'GET', '/me')).status).toBe(200);

    // 200 packages: created, drafted, uploaded and submitted, alternating the APIs.
    const plan = Buffer.from(await makePdf(1, 'Many processes lift plan'));
    const submissions = await inBatches(
      Array.from({ length: SUBMISSIONS }, (_, i) => i),
      BATCH,
      async (i) => {
        const api = apis[i % 2];
        const other = apis[(i + 1) % 2];
        const created = await call(api, contractor, 'POST', '/packages', {
          title: `Many processes lift ${i + 1}`,
          siteId: w.site.id,
          plannedLiftDate: '2030-03-14',
        });
        expect(created.status, JSON.stringify(created.body)).toBe(201);
        const id = (created.body.package as { id: string }).id;
        const drafted = await call(other, contractor, 'PUT', `/packages/${id}/draft`, { inputs: passing });
        expect(drafted.status, JSON.stringify(drafted.body)).toBe(200);
        const form = new FormData();
        form.append('kind', 'lift_plan');
        form.append('file', new Blob([plan], { type: 'application/pdf' }), `plan-${i + 1}.pdf`);
        const up = await call(api, contractor, 'POST', `/packages/${id}/files`, form);
        expect(up.status, JSON.stringify(up.body)).toBe(201);
        const sub = await call(other, contractor, 'POST', `/packages/${id}/submit`);
        expect(sub.status, JSON.stringify(sub.body)).toBe(202);
        return { id, fileId: up.body.id as string, revisionId: (sub.body.current as { id: string }).id };
      },
    );
    const submittedAt = Date.now();
    const ids = submissions.map((s) => s.id);
    const revisionIds = submissions.map((s) => s.revisionId);

    await until(
      async () => {
        const [{ n }] = await t.ctx.dataSource.query(
          `SELECT count(*)::int AS n FROM lift_packages WHERE id = ANY($1) AND status = 'ready_for_review'`,
          [ids],
        );
        return n === SUBMISSIONS;
      },
      120_000,
      'every package checked',
    );
    const checkedAt = Date.now();

    // Exactly once: one completed check per revision in the audit, one completed job per
    // revision over both workers, and each worker took some.
    const audit: Array<{ package_id: string; n: number }> = await t.ctx.dataSource.query(
      `SELECT package_id, count(*)::int AS n FROM audit_events
       WHERE action = 'check.completed' AND package_id = ANY($1) GROUP BY package_id`,
      [ids],
    );
    expect(audit).toHaveLength(SUBMISSIONS);
    expect(audit.every((a) => a.n === 1)).toBe(true);
    const checks = completedJobs('check-');
    const allChecks = checks.flat();
    expect(allChecks.sort()).toEqual(revisionIds.map((r) => `check-${r}`).sort());
    expect(checks[0].length, 'checks run by worker 1').toBeGreaterThan(0);
    expect(checks[1].length, 'checks run by worker 2').toBeGreaterThan(0);
    const [{ n: revisionsDone }] = await t.ctx.dataSource.query(
      `SELECT count(*)::int AS n FROM revisions WHERE id = ANY($1) AND check_status = 'done' AND results IS NOT NULL`,
      [revisionIds],
    );
    expect(revisionsDone).toBe(SUBMISSIONS);

    // 20 decisions and their stamped returns, each issued on both APIs at once.
    const chosen = submissions.slice(0, RETURNS);
    const assigned = await call(B, reviewer, 'POST', '/assignments', {
      packageIds: chosen.map((c) => c.id),
      engineerId: w.engineer.id,
    });
    expect(assigned.status, JSON.stringify(assigned.body)).toBe(200);
    // Four at a time: the step-up limit counts a decision's password before it is checked
    // (taken back when right), so one person's decisions at once stay under STEP_UP_LIMIT (5).
    const issued = await inBatches(chosen, 4, async (c, i) => {
      const api = apis[i % 2];
      const seen = await call(api, engineer, 'GET', `/packages/${c.id}`);
      const decided = await call(api, engineer, 'POST', `/packages/${c.id}/decision`, {
        password: TEST_PASSWORD,
        decision: i % 2 ? 'accepted_as_noted' : 'revise_and_resubmit',
        conditions: i % 2 ? 'Keep the exclusion zone taped off.' : 'Show the spotter on the site plan.',
        baseVersion: (seen.body.package as { version: number }).version,
      });
      expect(decided.status, JSON.stringify(decided.body)).toBe(200);
      const both = await Promise.all(apis.map((a) => call(a, reviewer, 'POST', `/packages/${c.id}/returns`)));
      for (const b of both) expect(b.status, JSON.stringify(b.body)).toBe(202);
      expect(both[0].body.id).toBe(both[1].body.id);
      return { ...c, returnId: both[0].body.id as string };
    });
    const issuedAt = Date.now();

    const returnIds = issued.map((r) => r.returnId);
    await until(
      async () => {
        const [{ n }] = await t.ctx.dataSource.query(
          `SELECT count(*)::int AS n FROM stamped_returns WHERE id = ANY($1) AND state = 'ready'`,
          [returnIds],
        );
        return n === RETURNS;
      },
      120_000,
      'every return ready',
    );
    const readyAt = Date.now();

    const returns: Array<{
      id: string;
      decision_id: string;
      package_id: string;
      sha256: string;
      cert: string;
    }> = await t.ctx.dataSource.query(
      `SELECT r.id, r.decision_id, r.package_id, r.sha256, r.signing_certificate_sha256 AS cert
         FROM stamped_returns r WHERE r.package_id = ANY($1)`,
      [ids],
    );
    expect(returns).toHaveLength(RETURNS);
    const [{ n: decisions }] = await t.ctx.dataSource.query(
      `SELECT count(DISTINCT d.id)::int AS n FROM decisions d JOIN stamped_returns r ON r.decision_id = d.id
       WHERE d.package_id = ANY($1)`,
      [ids],
    );
    expect(decisions).toBe(RETURNS);
    expect(new Set(returns.map((r) => r.cert)).size).toBe(1);
    const built: Array<{ package_id: string; n: number }> = await t.ctx.dataSource.query(
      `SELECT package_id, count(*)::int AS n FROM audit_events
       WHERE action = 'return.issued' AND package_id = ANY($1) GROUP BY package_id`,
      [ids],
    );
    expect(built).toHaveLength(RETURNS);
    expect(built.every((b) => b.n === 1)).toBe(true);
    const stamps = completedJobs('stamp-');
    expect(stamps.flat().sort()).toEqual(returns.map((r) => `stamp-${r.decision_id}`).sort());

    // Every return and every plan downloads from both APIs with the sha-256 on record.
    for (const r of returns)
      for (const api of apis) {
        const file = await call(api, contractor, 'GET', `/packages/${r.package_id}/returns/${r.id}/file`);
        expect(file.status, `${api.base} return ${r.id}`).toBe(200);
        expect(sha256(file.bytes!)).toBe(r.sha256);
      }
    const plans: Array<{ id: string; package_id: string; sha256: string }> = await t.ctx.dataSource.query(
      `SELECT f.id, r.package_id, f.sha256 FROM uploaded_files f JOIN revisions r ON r.id = f.revision_id
       WHERE r.package_id = ANY($1)`,
      [ids],
    );
    expect(plans).toHaveLength(SUBMISSIONS);
    await inBatches(plans, BATCH, async (f) => {
      for (const api of apis) {
        const file = await call(api, reviewer, 'GET', `/packages/${f.package_id}/files/${f.id}`);
        expect(file.status, `${api.base} file ${f.id}`).toBe(200);
        expect(sha256(file.bytes!)).toBe(f.sha256);
      }
    });

    // Every job intent closed; none left failed or waiting.
    const intents: Array<{ state: string; n: number }> = await t.ctx.dataSource.query(
      `SELECT state, count(*)::int AS n FROM job_intents WHERE queue IN ('check-run', 'stamp-return') GROUP BY state`,
    );
    expect(intents).toEqual([{ state: 'done', n: SUBMISSIONS + RETURNS }]);

    console.info(
      `many processes: ${SUBMISSIONS} submitted in ${((submittedAt - started) / 1000).toFixed(1)} s, ` +
        `checked ${((checkedAt - submittedAt) / 1000).toFixed(1)} s later (worker 1 ${checks[0].length}, ` +
        `worker 2 ${checks[1].length}); ${RETURNS} returns ready ${((readyAt - issuedAt) / 1000).toFixed(1)} s ` +
        `after issuing (worker 1 ${stamps[0].length}, worker 2 ${stamps[1].length}); ` +
        `${plans.length * 2 + returns.length * 2} downloads checked`,
    );
  }, 240_000);

  it('ends on B a session signed out on A', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const [A, B] = apis;
    const session = await signIn(B, w.reviewer.email);
    expect((await call(A, session, 'GET', '/me')).status).toBe(200);
    expect((await call(A, session, 'POST', '/auth/sign-out')).status).toBeLessThan(300);
    expect((await call(B, session, 'GET', '/me')).status).toBe(401);
  });

  it('counts wrong sign-ins spread over both APIs against one limit', async () => {
    const email = `nobody-${randomUUID().slice(0, 8)}@test.example`;
    const answers: number[] = [];
    for (let i = 0; i < SIGN_IN_LIMIT + 2; i++) {
      const res = await fetch(`${apis[i % 2].base}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Guard': '1' },
        body: JSON.stringify({ email, password: 'not the password' }),
      });
      answers.push(res.status);
    }
    // Per process, each API would have let SIGN_IN_LIMIT through: together they let SIGN_IN_LIMIT.
    expect(answers).toEqual([...Array(SIGN_IN_LIMIT).fill(401), 429, 429]);
  });
});
