// Standing security suite, point 3: runs the real API process (server/index.ts) with request
// logging on (LOG_LEVEL=debug), its stdout written to a log file, signs in, reads, invites,
// accepts the invitation and signs out, then reads that file back and checks that none of
// the session tokens, the invitation token, the passwords or an Authorization value is in it
// (and that the requests were logged at all, so the check cannot pass on an empty file).
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, TEST_PASSWORD, type TestApp } from '../support/app';
import { makeWorld } from '../support/factories';

let t: TestApp;
let api: ChildProcess;
let dir: string;
let logFile: string;
let base: string;

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

beforeAll(async () => {
  t = await startTestApp();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-log-'));
  logFile = path.join(dir, 'api.log');
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  const out = fs.openSync(logFile, 'a');
  // spawns: node
  api = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'debug',
      HOST: '127.0.0.1',
      PORT: String(port),
      APP_URL: base,
      DATA_DIR: dir,
      REDIS_PREFIX: t.ctx.config.REDIS_PREFIX,
      CP_SERVICE: 'api',
    },
    stdio: ['ignore', out, out],
  });
  const started = Date.now();
  while (!fs.readFileSync(logFile, 'utf8').includes('API listening')) {
    if (Date.now() - started > 60_000)
      throw new Error(`API did not start:\n${fs.readFileSync(logFile, 'utf8')}`);
    if (api.exitCode !== null) throw new Error(`API exited:\n${fs.readFileSync(logFile, 'utf8')}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}, 90_000);

afterAll(async () => {
  if (api && api.exitCode === null) {
    const exited = new Promise((r) => api.once('exit', r));
    api.kill('SIGTERM');
    await exited;
  }
  await t?.close();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

const tokenOf = (res: Response) => /cp_session=([^;]+)/.exec(res.headers.get('set-cookie') ?? '')?.[1] ?? '';

describe('no secrets in the API log', () => {
  it('when people sign in, invite, accept and sign out, then the log holds none of the tokens', async () => {
    const w = await makeWorld(t.ctx.dataSource);
    const json = { 'Content-Type': 'application/json', Origin: base };
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: json,
      body: JSON.stringify({ email: w.admin.email, password: TEST_PASSWORD }),
    });
    expect(signIn.status).toBe(200);
    const adminToken = tokenOf(signIn);
    expect(adminToken.length).toBeGreaterThan(40);
    const cookie = { Cookie: `cp_session=${adminToken}` };
    const bearer = 'Bearer a-secret-bearer-value-0123456789';
    expect((await fetch(`${base}/api/me`, { headers: { ...cookie, Authorization: bearer } })).status).toBe(
      200,
    );

    const email = `logged-${Date.now()}@test.example`;
    const invite = await fetch(`${base}/api/admin/people/invite`, {
      method: 'POST',
      headers: { ...json, ...cookie, 'X-CSRF-Guard': '1' },
      body: JSON.stringify({
        email,
        name: 'Logged Person',
        role: 'contractor',
        organisationId: w.contractorA.id,
      }),
    });
    expect(invite.status).toBe(201);
    // The link is shown once in the answer; the stored mail holds only a placeholder.
    const answer = (await invite.json()) as { inviteLink: string };
    const inviteToken = /\/invite\/([A-Za-z0-9_-]+)$/.exec(answer.inviteLink)?.[1] ?? '';
    expect(inviteToken.length).toBeGreaterThan(10);
    expect((await fetch(`${base}/api/invites/${inviteToken}`)).status).toBe(200);
    const newPassword = 'a long logged password 42';
    const accepted = await fetch(`${base}/api/invites/${inviteToken}`, {
      method: 'POST',
      headers: json,
      body: JSON.stringify({ password: newPassword }),
    });
    expect(accepted.status).toBe(200);
    const newToken = tokenOf(accepted);
    expect(newToken.length).toBeGreaterThan(40);
    const out = await fetch(`${base}/api/auth/sign-out`, {
      method: 'POST',
      headers: { ...cookie, 'X-CSRF-Guard': '1', Origin: base },
    });
    expect(out.status).toBe(204);
    // pino writes synchronously to the file; give the last line a moment all the same.
    await new Promise((r) => setTimeout(r, 300));

    const log = fs.readFileSync(logFile, 'utf8');
    // The requests were logged, with their headers, so the checks below look at real lines.
    expect(log).toMatch(/"url":"\/api\/me"/);
    expect(log).toMatch(/"url":"\/api\/auth\/sign-in"/);
    expect(log).toMatch(/"set-cookie":"\[redacted\]"/);
    expect(log).toMatch(/"url":"\/api\/invites\/\[redacted\]"/);
    const secrets = {
      adminToken,
      newToken,
      inviteToken,
      bearer: 'a-secret-bearer-value-0123456789',
      password: TEST_PASSWORD,
      newPassword,
    };
    for (const [name, value] of Object.entries(secrets)) {
      expect({ name, found: log.includes(value) }).toEqual({ name, found: false });
    }
    // A JWT looks like eyJ….eyJ….sig: none may appear anywhere in the file.
    expect(log.match(/eyJ[A-Za-z0-9_-]+\.eyJ[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+/g) ?? []).toEqual([]);
  });
});
