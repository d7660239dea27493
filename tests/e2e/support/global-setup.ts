// Starts the product for the browser tests the way the start command does — client build,
// embedded PostgreSQL, Redis, fake SMTP and fake S3, migrations, the demo seed, API and worker —
// but isolated: a temporary DATA_DIR, free ports, and none of the caller's DATABASE_URL,
// REDIS_URL, SMTP_URL, S3_* or JWT_SECRET (so it embeds its own, like a fresh machine).
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { freePort } from '../../../scripts/lib/services';

declare module 'vitest' {
  export interface ProvidedContext {
    e2e: { baseUrl: string; databaseUrl: string; dataDir: string };
  }
}

const READY_TIMEOUT_MS = 240_000;
const STOP_TIMEOUT_MS = 60_000;

let child: ChildProcess | null = null;
let dataDir: string | null = null;

export default async function setup(project: TestProject) {
  // While writing tests: point at an app that is already running (its own data folder).
  if (process.env.E2E_BASE_URL && process.env.E2E_DATABASE_URL) {
    project.provide('e2e', {
      baseUrl: process.env.E2E_BASE_URL,
      databaseUrl: process.env.E2E_DATABASE_URL,
      dataDir: '',
    });
    return;
  }
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-e2e-'));
  fs.chmodSync(dataDir, 0o755);
  const ports = {
    http: await freePort(),
    pg: await freePort(),
    redis: await freePort(),
    smtp: await freePort(),
    s3: await freePort(),
  };
  const env: NodeJS.ProcessEnv = { ...process.env };
  for (const key of ['DATABASE_URL', 'REDIS_URL', 'SMTP_URL', 'JWT_SECRET', 'NODE_ENV', 'APP_URL'])
    delete env[key];
  for (const key of Object.keys(env)) if (key.startsWith('S3_')) delete env[key];
  Object.assign(env, {
    DATA_DIR: dataDir,
    PORT: String(ports.http),
    HOST: '127.0.0.1',
    CP_PG_PORT: String(ports.pg),
    CP_REDIS_PORT: String(ports.redis),
    CP_SMTP_PORT: String(ports.smtp),
    CP_S3_PORT: String(ports.s3),
    LOG_LEVEL: 'warn',
    // Every test file signs in several people; the default limit is for people, not robots.
    SIGN_IN_LIMIT: '1000',
  });
  delete env.SKIP_CLIENT_BUILD;

  const started = Date.now();
  child = spawn(process.execPath, ['--import', 'tsx', 'scripts/start.ts'], {
    env,
    cwd: process.cwd(),
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const proc = child;
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => {
      clearInterval(poll);
      reject(new Error(`the app did not become ready in ${READY_TIMEOUT_MS / 1000} s:\n${out}`));
    }, READY_TIMEOUT_MS);
    const poll = setInterval(() => {
      if (out.includes('ready: http://')) {
        clearInterval(poll);
        clearTimeout(timer);
        resolve();
      } else if (proc.exitCode !== null) {
        clearInterval(poll);
        clearTimeout(timer);
        reject(new Error(`the start command exited with ${proc.exitCode}:\n${out}`));
      }
    }, 200);
  }).catch(async (error) => {
    await teardown();
    throw error;
  });
  process.stdout.write(
    `[e2e] app ready on port ${ports.http} in ${((Date.now() - started) / 1000).toFixed(1)} s\n`,
  );

  project.provide('e2e', {
    baseUrl: `http://127.0.0.1:${ports.http}`,
    databaseUrl: `postgres://app@127.0.0.1:${ports.pg}/counterpoise`,
    dataDir,
  });
  return teardown;
}

async function teardown() {
  const proc = child;
  child = null;
  if (proc && proc.exitCode === null && proc.signalCode === null) {
    const exited = new Promise<void>((resolve) => proc.once('exit', () => resolve()));
    proc.kill('SIGTERM');
    const timeout = new Promise<'timeout'>((resolve) =>
      setTimeout(() => resolve('timeout'), STOP_TIMEOUT_MS),
    );
    if ((await Promise.race([exited, timeout])) === 'timeout') proc.kill('SIGKILL');
  }
  if (dataDir) fs.rmSync(dataDir, { recursive: true, force: true });
  dataDir = null;
}
