// The start command as a supervisor, run for real (PostgreSQL, Redis, API, worker and mail
// catcher as separate processes): one desk per data folder with a stale lock taken over;
// kill -9 of the worker while a check run and a stamped return are under way restarts it
// and both jobs finish exactly once; a process that keeps crashing stops the desk,
// naming it and its log, and the desk stops what it started.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '@server/db/seed/demo-accounts';
import { readLock } from '../../scripts/lib/lock';
import { isPortFree, postmasterPid } from '../../scripts/lib/services';
import { makePdf } from '../support/pdfs';
import { deskEnv, freePorts, launch, signIn, stopDesk, until, type Desk, type Ports } from './desk';

const example = JSON.parse(fs.readFileSync('shared/engineering/examples/pass-outriggers.json', 'utf8'));
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-launcher-'));
fs.chmodSync(dataDir, 0o755);
let ports: Ports;
let desk: Desk;
let db: pg.Client;
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role)!;

beforeAll(async () => {
  ports = await freePorts();
  // A lock left by a desk that crashed: its pid no longer runs.
  const gone = spawnSync(process.execPath, ['-e', '']).pid;
  fs.writeFileSync(
    path.join(dataDir, 'desk.lock'),
    JSON.stringify({ pid: gone, url: 'http://127.0.0.1:1', startedAt: '', processes: {}, services: [] }),
  );
  desk = await launch(deskEnv(dataDir, ports));
  db = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${ports.pg}/counterpoise` });
  // The desk stops its PostgreSQL in the last test: this connection ends then.
  db.on('error', () => undefined);
  await db.connect();
}, 200_000);

afterAll(async () => {
  await db?.end().catch(() => undefined);
  if (desk?.child.exitCode === null) await stopDesk(desk);
  fs.rmSync(dataDir, { recursive: true, force: true });
});

const base = () => `http://127.0.0.1:${ports.http}`;
const healthy = async () => (await fetch(`${base()}/api/health`)).status === 200;

async function api(cookie: string, method: string, url: string, body?: unknown) {
  const res = await fetch(`${base()}${url}`, {
    method,
    headers: { cookie, 'x-csrf-guard': '1', ...(body ? { 'content-type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  return { status: res.status, body: await res.json().catch(() => null) };
}

describe('the launcher', () => {
  it('when a desk already runs on the data folder, then a second start is refused at once and the first stays healthy', async () => {
    expect(desk.output()).toMatch(/took over the lock of a desk that is no longer running \(pid \d+\)/);
    const lock = readLock(dataDir)!;
    expect(lock.pid).toBe(desk.child.pid);
    expect(Object.keys(lock.processes).sort()).toEqual(['api', 'mail-catcher', 's3-fake', 'worker']);
    const pgPid = postmasterPid(path.join(dataDir, 'pg'));

    const started = Date.now();
    const second = await launch(deskEnv(dataDir, ports), { ready: false });
    const code = await second.exited;
    expect(code).not.toBe(0);
    expect(Date.now() - started).toBeLessThan(15_000);
    expect(second.output()).toContain(
      `already running at http://127.0.0.1:${ports.http}, pid ${desk.child.pid}`,
    );
    expect(second.output()).not.toMatch(/\n\s+at /);
    expect(second.output().trim().split('\n')).toHaveLength(1);

    expect(await healthy()).toBe(true);
    expect(readLock(dataDir)).toEqual(lock);
    expect(postmasterPid(path.join(dataDir, 'pg'))).toBe(pgPid);
  }, 60_000);

  it('when the worker is killed -9 while a check run and a stamped return are running, then it is restarted and both finish exactly once', async () => {
    const contractor = await signIn(ports.http, account('contractor').email, DEMO_PASSWORD);
    const reviewer = await signIn(ports.http, account('reviewer').email, DEMO_PASSWORD);
    const sites = await api(contractor, 'GET', '/api/sites');
    const created = await api(contractor, 'POST', '/api/packages', {
      title: 'Launcher test lift',
      siteId: sites.body.items[0].id,
    });
    expect(created.status).toBe(201);
    const packageId: string = created.body.package.id;
    expect(
      (await api(contractor, 'PUT', `/api/packages/${packageId}/draft`, { inputs: example })).status,
    ).toBe(200);
    const form = new FormData();
    form.append('kind', 'lift_plan');
    form.append('file', new Blob([Buffer.from(await makePdf(2))], { type: 'application/pdf' }), 'plan.pdf');
    const upload = await fetch(`${base()}/api/packages/${packageId}/files`, {
      method: 'POST',
      headers: { cookie: contractor, 'x-csrf-guard': '1' },
      body: form,
    });
    expect(upload.status).toBe(201);
    const [decided] = (await db.query(`SELECT id FROM lift_packages WHERE status = 'decided' LIMIT 1`)).rows;

    // Hold the worker while both jobs are queued, then let it take them into row locks the
    // test holds, so both are really running (blocked in the database) when it is killed.
    const workerPid = readLock(dataDir)!.processes.worker;
    process.kill(workerPid, 'SIGSTOP');
    const submitted = await api(contractor, 'POST', `/api/packages/${packageId}/submit`);
    expect(submitted.status).toBe(202);
    const revisionId: string = submitted.body.current.id;
    const issued = await api(reviewer, 'POST', `/api/packages/${decided.id}/returns`);
    expect(issued.status).toBe(202);
    const returnId: string = issued.body.id;
    const holder = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${ports.pg}/counterpoise` });
    holder.on('error', () => undefined);
    await holder.connect();
    await holder.query('BEGIN');
    await holder.query('SELECT 1 FROM revisions WHERE id = $1 FOR UPDATE', [revisionId]);
    await holder.query('SELECT 1 FROM stamped_returns WHERE id = $1 FOR UPDATE', [returnId]);
    process.kill(workerPid, 'SIGCONT');
    await until(
      async () =>
        Number(
          (
            await db.query(
              `SELECT count(*) AS n FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND pid <> $1`,
              [(await holder.query('SELECT pg_backend_pid() AS p')).rows[0].p],
            )
          ).rows[0].n,
        ) >= 2,
      30_000,
      'both jobs waiting in the database',
    );
    process.kill(workerPid, 'SIGKILL');
    await holder.query('ROLLBACK');
    await holder.end();

    await until(
      async () => desk.output().includes('worker stopped unexpectedly (killed by SIGKILL); restarting it'),
      10_000,
      'restart notice',
    );
    const restarted = await until(
      async () => {
        const pid = readLock(dataDir)?.processes.worker;
        return pid && pid !== workerPid ? pid : null;
      },
      20_000,
      'a new worker pid',
    );
    expect(restarted).not.toBe(workerPid);

    const finished = async () => {
      const [rev] = (await db.query('SELECT check_status FROM revisions WHERE id = $1', [revisionId])).rows;
      const [ret] = (await db.query('SELECT state FROM stamped_returns WHERE id = $1', [returnId])).rows;
      return rev.check_status === 'done' && ret.state === 'ready';
    };
    // BullMQ hands a stalled job on once its lock (30 s) has run out.
    await until(finished, 120_000, 'both jobs done');
    await new Promise((r) => setTimeout(r, 2000));
    const count = async (sql: string, args: unknown[]) => Number((await db.query(sql, args)).rows[0].n);
    expect(
      await count(
        `SELECT count(*) AS n FROM audit_events WHERE package_id = $1 AND action = 'check.completed'`,
        [packageId],
      ),
    ).toBe(1);
    expect(
      await count(
        `SELECT count(*) AS n FROM audit_events WHERE package_id = $1 AND action = 'return.issued'`,
        [decided.id],
      ),
    ).toBe(1);
    expect(await count(`SELECT count(*) AS n FROM stamped_returns WHERE package_id = $1`, [decided.id])).toBe(
      1,
    );
    const intents = (
      await db.query(`SELECT state FROM job_intents WHERE subject_id = ANY($1)`, [[revisionId, returnId]])
    ).rows.map((r) => r.state);
    expect(intents).toEqual(['done', 'done']);
    const pkg = await api(contractor, 'GET', `/api/packages/${packageId}`);
    expect(pkg.body.package.status).toBe('ready_for_review');
    expect(await healthy()).toBe(true);
  }, 240_000);

  it('when a process keeps crashing, then the desk stops after the fifth crash, naming it and its log, and stops what it started', async () => {
    for (let i = 0; i < 5; i++) {
      const pid = await until(
        async () => readLock(dataDir)?.processes['mail-catcher'],
        30_000,
        'mail catcher pid',
      );
      process.kill(pid, 'SIGKILL');
      if (i < 4)
        await until(
          async () => {
            const next = readLock(dataDir)?.processes['mail-catcher'];
            return next && next !== pid;
          },
          30_000,
          'mail catcher restarted',
        );
    }
    const code = await desk.exited;
    expect(code).toBe(1);
    expect(desk.output()).toMatch(
      /mail-catcher stopped unexpectedly 5 times within 2 minutes \(last: killed by SIGKILL\); stopping the desk\. See .*logs\/mail\.log\./,
    );
    expect(await isPortFree(ports.http)).toBe(true);
    expect(await isPortFree(ports.pg)).toBe(true);
    expect(await isPortFree(ports.redis)).toBe(true);
    expect(fs.existsSync(path.join(dataDir, 'desk.lock'))).toBe(false);
  }, 120_000);
});
