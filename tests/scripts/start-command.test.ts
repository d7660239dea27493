// The start command, run for real as a child process with its own data folder and ports:
// it brings up PostgreSQL, Redis, the API and the worker; SIGTERM stops them all; a second
// start reuses the data instead of seeding again.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort, isPortFree } from '../../scripts/lib/services';
import { deskEnv, launch, type Ports } from './desk';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '@server/db/seed/demo-accounts';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-start-'));
fs.chmodSync(dataDir, 0o755);
let running: ChildProcess | null = null;

afterAll(() => {
  running?.kill('SIGKILL');
  // A server that has let go of its port may still be closing its last files: retry the removal.
  fs.rmSync(dataDir, { recursive: true, force: true, maxRetries: 10, retryDelay: 300 });
});

interface Started {
  child: ChildProcess;
  output: () => string;
}

async function start(ports: Ports): Promise<Started> {
  const desk = await launch(deskEnv(dataDir, ports));
  running = desk.child;
  return desk;
}

async function stop(s: Started): Promise<number | null> {
  const exited = new Promise<number | null>((resolve) => s.child.once('exit', (code) => resolve(code)));
  s.child.kill('SIGTERM');
  const code = await exited;
  running = null;
  return code;
}

async function signInAndCount(port: number): Promise<number> {
  const reviewer = DEMO_ACCOUNTS.find((a) => a.role === 'reviewer')!;
  const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: reviewer.email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  const cookie = res.headers.get('set-cookie')!.split(';')[0];
  const list = await fetch(`http://127.0.0.1:${port}/api/packages`, { headers: { cookie } });
  expect(list.status).toBe(200);
  return ((await list.json()) as { total: number }).total;
}

describe('the start command', () => {
  it('when started twice on one data folder, then the second run reuses the data and SIGTERM stops everything', async () => {
    const ports = {
      http: await freePort(),
      pg: await freePort(),
      redis: await freePort(),
      smtp: await freePort(),
      s3: await freePort(),
    };
    const first = await start(ports);
    expect(first.output()).toContain('demo scenario seeded');
    expect(first.output()).toContain(`local fake S3 server on 127.0.0.1:${ports.s3}`);
    // The seed's plans went through the S3 API into the fake's bucket under the data folder.
    const seededPlans = path.join(dataDir, 's3', 'counterpoise', 'revisions');
    expect(fs.readdirSync(seededPlans).length).toBeGreaterThan(0);
    expect(fs.existsSync(path.join(dataDir, 'files'))).toBe(false);
    const health = await fetch(`http://127.0.0.1:${ports.http}/api/health`);
    expect(await health.json()).toMatchObject({ status: 'ok' });
    const total = await signInAndCount(ports.http);
    expect(total).toBeGreaterThan(0);

    const db = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${ports.pg}/counterpoise` });
    await db.connect();
    await db.query(`INSERT INTO audit_events (action, detail) VALUES ('test.marker', '{"kept": true}')`);
    await db.end();

    expect(await stop(first)).toBe(0);
    expect(await isPortFree(ports.http)).toBe(true);
    expect(await isPortFree(ports.pg)).toBe(true);
    expect(await isPortFree(ports.redis)).toBe(true);
    expect(await isPortFree(ports.s3)).toBe(true);
    expect(fs.existsSync(path.join(dataDir, 'pg', 'postmaster.pid'))).toBe(false);

    const second = await start(ports);
    expect(second.output()).toContain('demo data already present, reused');
    expect(second.output()).not.toContain('demo scenario seeded');
    expect(await signInAndCount(ports.http)).toBe(total);
    const again = new pg.Client({ connectionString: `postgres://app@127.0.0.1:${ports.pg}/counterpoise` });
    await again.connect();
    const marker = await again.query(
      `SELECT count(*)::int AS n FROM audit_events WHERE action = 'test.marker'`,
    );
    await again.end();
    expect(marker.rows[0].n).toBe(1);
    expect(await stop(second)).toBe(0);
    expect(await isPortFree(ports.pg)).toBe(true);
  }, 300_000);

  it('when the database port is taken, then the command stops before starting anything, naming the port and its owner', async () => {
    const net = await import('node:net');
    const blocker = net.createServer().listen(0, '127.0.0.1');
    await new Promise((r) => blocker.once('listening', r));
    const taken = (blocker.address() as { port: number }).port;
    const env: NodeJS.ProcessEnv = { ...process.env };
    for (const key of ['DATABASE_URL', 'REDIS_URL']) delete env[key];
    const otherDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-start-bad-'));
    fs.chmodSync(otherDir, 0o755);
    try {
      const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/start.ts'], {
        env: {
          ...env,
          DATA_DIR: otherDir,
          CP_PG_PORT: String(taken),
          SKIP_CLIENT_BUILD: '1',
          PORT: String(await freePort()),
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      let out = '';
      child.stdout!.on('data', (d) => (out += d));
      child.stderr!.on('data', (d) => (out += d));
      const code = await new Promise<number | null>((resolve) => child.once('exit', resolve));
      expect(code).toBe(1);
      expect(out).toContain(`step "check ports" failed: port ${taken} on 127.0.0.1 is taken by node `);
      expect(out).toContain(`(pid ${process.pid}); stop it or set CP_PG_PORT to another port`);
      expect(out).not.toMatch(/\n\s+at /);
      // Nothing was started: no database was initialised, and the lock is gone again.
      expect(fs.existsSync(path.join(otherDir, 'pg'))).toBe(false);
      expect(fs.existsSync(path.join(otherDir, 'desk.lock'))).toBe(false);
    } finally {
      blocker.close();
      fs.rmSync(otherDir, { recursive: true, force: true });
    }
  }, 120_000);
});
