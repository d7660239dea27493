// The test command: starts a throwaway PostgreSQL, Redis and fake S3 server (temporary
// folders, free ports) unless DATABASE_URL / REDIS_URL / S3_ENDPOINT are set, then runs formatting, lint, types and
// every test suite, stops the servers and exits non-zero on any failure.
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import {
  ensurePackages,
  freePort,
  packagesFor,
  startPostgres,
  startRedis,
  type PostgresHandle,
  type RedisHandle,
} from './lib/services';
import { startThrowawayS3, type FakeS3Handle } from './lib/s3';
import { fakeS3Env } from '../server/lib/fake-s3';

const root = process.cwd();
const outDir = path.join(root, 'test-output');
let tmp: string | null = null;
let postgres: PostgresHandle | null = null;
let redis: RedisHandle | null = null;
let s3: FakeS3Handle | null = null;

function say(message: string) {
  process.stdout.write(`[test] ${message}\n`);
}

function cleanup() {
  s3?.stop();
  s3 = null;
  redis?.stop();
  postgres?.stop();
  redis = null;
  postgres = null;
  if (tmp) fs.rmSync(tmp, { recursive: true, force: true });
  tmp = null;
}

process.on('SIGINT', () => {
  cleanup();
  process.exit(130);
});
process.on('SIGTERM', () => {
  cleanup();
  process.exit(143);
});

function run(name: string, args: string[], env: NodeJS.ProcessEnv): boolean {
  say(`${name}…`);
  const started = Date.now();
  const r = spawnSync(process.execPath, args, { stdio: 'inherit', env, cwd: root });
  const ok = r.status === 0;
  say(`${name}: ${ok ? 'ok' : 'FAILED'} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  return ok;
}

async function main(): Promise<number> {
  fs.mkdirSync(outDir, { recursive: true });
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    JWT_SECRET: process.env.JWT_SECRET ?? randomBytes(32).toString('hex'),
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'silent',
  };
  const needPostgres = !process.env.DATABASE_URL;
  const needRedis = !process.env.REDIS_URL;
  const needS3 = !process.env.S3_ENDPOINT;
  // Every program the tests spawn (pdftotext, qpdf, Chromium...) comes from the install list.
  ensurePackages(packagesFor('test', { postgres: needPostgres, redis: needRedis }), say);
  if (needPostgres || needRedis || needS3) {
    tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-test-'));
    fs.chmodSync(tmp, 0o755);
  }
  if (needPostgres) {
    postgres = await startPostgres(path.join(tmp!, 'pg'), await freePort(), 'counterpoise_test');
    env.DATABASE_URL = postgres.url;
    say(`throwaway PostgreSQL on port ${postgres.port}`);
  }
  if (needRedis) {
    redis = await startRedis(path.join(tmp!, 'redis'), await freePort(), { persist: false });
    env.REDIS_URL = redis.url;
    say(`throwaway Redis on port ${redis.port}`);
  }
  if (needS3) {
    s3 = await startThrowawayS3(tmp!, await freePort());
    Object.assign(env, fakeS3Env(s3.url, 'counterpoise-test'));
    say(`throwaway fake S3 server on port ${s3.port}`);
  }
  const bin = (p: string) => path.join(root, 'node_modules', p);
  const results: Array<[string, boolean]> = [];
  // `npm test -- <filter>` runs only the matching test files, without the static checks.
  const filters = process.argv.slice(2);
  if (!filters.length) {
    results.push([
      'format',
      run(
        'format (prettier --check)',
        [bin('prettier/bin/prettier.cjs'), '--check', '--log-level', 'warn', '.'],
        env,
      ),
    ]);
    results.push([
      'lint',
      run('lint (eslint)', [bin('eslint/bin/eslint.js'), '--max-warnings', '0', '.'], env),
    ]);
    results.push(['types', run('types (tsc)', [bin('typescript/bin/tsc'), '-p', 'tsconfig.json'], env)]);
  }
  const reportFile = path.join(outDir, 'vitest.json');
  fs.rmSync(reportFile, { force: true });
  // `npm test -- tests/e2e` runs only the browser tests; other filters only the unit/API run.
  const e2eFilters = filters.filter((f) => f.includes('e2e'));
  const unitFilters = filters.filter((f) => !f.includes('e2e'));
  if (!filters.length || unitFilters.length)
    results.push([
      'tests',
      run(
        'tests (vitest)',
        [
          bin('vitest/vitest.mjs'),
          'run',
          '--reporter=default',
          '--reporter=json',
          `--outputFile.json=${reportFile}`,
          ...unitFilters,
        ],
        env,
      ),
    ]);
  // The browser tests start their own app the way the start command does (its own
  // PostgreSQL, Redis, fake SMTP and fake S3): they do not use the throwaway servers above.
  const e2eReportFile = path.join(outDir, 'vitest-e2e.json');
  fs.rmSync(e2eReportFile, { force: true });
  if (!filters.length || e2eFilters.length) {
    const e2eEnv: NodeJS.ProcessEnv = { ...env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn' };
    for (const key of ['DATABASE_URL', 'REDIS_URL', 'JWT_SECRET', 'NODE_ENV']) delete e2eEnv[key];
    for (const key of Object.keys(e2eEnv)) if (key.startsWith('S3_')) delete e2eEnv[key];
    results.push([
      'browser tests',
      run(
        'browser tests (vitest, Chromium)',
        [
          bin('vitest/vitest.mjs'),
          'run',
          '--config',
          'vitest.e2e.config.ts',
          '--reporter=default',
          '--reporter=json',
          `--outputFile.json=${e2eReportFile}`,
          ...e2eFilters,
        ],
        e2eEnv,
      ),
    ]);
  }
  let passed = 0;
  let failed = 0;
  for (const file of [reportFile, e2eReportFile]) {
    if (!fs.existsSync(file)) continue;
    const report = JSON.parse(fs.readFileSync(file, 'utf8')) as {
      numPassedTests: number;
      numFailedTests: number;
      numFailedTestSuites: number;
    };
    passed += report.numPassedTests;
    // A suite that fails before its tests run (a broken import, a failing beforeAll) counts too.
    failed += report.numFailedTests || report.numFailedTestSuites;
  }
  const failedSteps = results.filter(([, ok]) => !ok).map(([name]) => name);
  if (failedSteps.length) say(`failed steps: ${failedSteps.join(', ')}`);
  if (passed + failed === 0) {
    say('no test ran');
    failedSteps.push('no tests');
  }
  process.stdout.write(`${passed} passed, ${failed} failed\n`);
  return failedSteps.length ? 1 : 0;
}

main()
  .then((code) => {
    cleanup();
    process.exit(code);
  })
  .catch((error) => {
    const e = error as Error & { step?: string };
    process.stderr.write(`[test] ${e.step ? `step "${e.step}" failed: ` : ''}${e.message}\n`);
    cleanup();
    process.exit(1);
  });
