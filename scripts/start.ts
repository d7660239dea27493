// The start command: takes the data folder's lock, checks its ports, builds the client,
// brings up PostgreSQL and Redis (embedded under .data/ unless DATABASE_URL / REDIS_URL are
// set) and the local fake S3 server (unless S3_ENDPOINT is set), migrates, seeds the demo
// once, then supervises the API, the worker, the mail catcher and the fake S3 server
// (restarting one that crashes) until Ctrl-C or SIGTERM, which stops what it started, in order.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { AlreadyRunning, acquireLock, type DeskLock, type LockInfo } from './lib/lock';
import { commandOf, firstTakenPort } from './lib/ports';
import { waitForHealth } from './lib/processes';
import { postmasterPid, readPid, StepError } from './lib/services';
import { fakeS3Port, mailCatcherSpec, prepareStack } from './lib/stack';
import { Supervisor, type ProcessSpec } from './lib/supervisor';

const root = process.cwd();
const dataDir = path.resolve(process.env.DATA_DIR ?? '.data');
const logDir = path.join(dataDir, 'logs');
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const address = `http://${host}:${port}`;
/** The order of a clean stop: no new requests, then the jobs in flight, then the outbox and the files. */
const STOP_ORDER = ['api', 'worker', 'mail-catcher', 's3-fake'];

function say(message: string) {
  process.stdout.write(`[counterpoise] ${message}\n`);
}

function rel(file: string) {
  return path.relative(root, file) || file;
}

let stopServices: () => void = () => undefined;
let lock: DeskLock | null = null;
let supervisor: Supervisor | null = null;
let stopping = false;
/** Whether anything was started that needs stopping (a refusal up front says one sentence). */
let started = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  if (started) say('stopping…');
  await supervisor?.stopAll(STOP_ORDER);
  stopServices();
  lock?.release();
  if (started) say('stopped');
  process.exit(code);
}

/** Processes a crashed desk of this data folder left behind: stopped, they hold its ports. */
async function stopLeftovers(previous: LockInfo) {
  const scripts: Record<string, string> = {
    api: 'server/index.ts',
    worker: 'worker/index.ts',
    'mail-catcher': 'server/mail-catcher.ts',
    's3-fake': 'server/s3-fake.ts',
  };
  for (const [name, pid] of Object.entries(previous.processes ?? {})) {
    const script = scripts[name];
    // A recycled pid running something else is not ours to stop.
    if (!script || !commandOf(pid).includes(script)) continue;
    say(`stopping the ${name} (pid ${pid}) that the previous desk left running`);
    const signal = (s: NodeJS.Signals) => {
      try {
        process.kill(pid, s);
      } catch {
        /* already gone */
      }
    };
    signal('SIGTERM');
    const until = Date.now() + 10_000;
    while (Date.now() < until && commandOf(pid).includes(script))
      await new Promise((r) => setTimeout(r, 100));
    if (commandOf(pid).includes(script)) signal('SIGKILL');
  }
}

async function checkPorts() {
  const embeddedPg = !process.env.DATABASE_URL && !postmasterPid(path.join(dataDir, 'pg'));
  const embeddedRedis = !process.env.REDIS_URL && !readPid(path.join(dataDir, 'redis', 'redis.pid'));
  const ports = [
    { port, variable: 'PORT' },
    ...(embeddedPg ? [{ port: Number(process.env.CP_PG_PORT ?? 54329), variable: 'CP_PG_PORT' }] : []),
    ...(embeddedRedis
      ? [{ port: Number(process.env.CP_REDIS_PORT ?? 56379), variable: 'CP_REDIS_PORT' }]
      : []),
    ...(process.env.SMTP_URL
      ? []
      : [{ port: Number(process.env.CP_SMTP_PORT ?? 55025), variable: 'CP_SMTP_PORT' }]),
    ...(process.env.S3_ENDPOINT ? [] : [{ port: fakeS3Port(), variable: 'CP_S3_PORT' }]),
  ];
  const taken = await firstTakenPort(ports);
  if (taken) throw new StepError('check ports', taken);
}

async function main() {
  try {
    lock = acquireLock(dataDir, address);
  } catch (error) {
    if (error instanceof AlreadyRunning) {
      process.stderr.write(
        `[counterpoise] ${error.message} (data folder ${rel(dataDir)}); stop that desk first or give this one its own DATA_DIR.\n`,
      );
      process.exit(1);
    }
    throw error;
  }
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  process.on('SIGHUP', () => void shutdown(0));
  if (lock.previous) {
    say(`took over the lock of a desk that is no longer running (pid ${lock.previous.pid})`);
    await stopLeftovers(lock.previous);
  }
  await checkPorts();
  fs.mkdirSync(logDir, { recursive: true });

  if (process.env.SKIP_CLIENT_BUILD !== '1') {
    say('building the client…');
    const r = spawnSync(
      process.execPath,
      [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'],
      { stdio: ['ignore', 'inherit', 'inherit'] },
    );
    if (r.status !== 0) throw new StepError('build the client', 'vite build failed (see the output above)');
  }

  supervisor = new Supervisor({
    say: (m) => (m.includes('unexpectedly') ? process.stderr.write(`[counterpoise] ${m}\n`) : say(m)),
    onGiveUp: () => void shutdown(1),
    onPids: (pids) => lock?.update({ processes: pids }),
  });
  const sup = supervisor;
  const stack = await prepareStack({
    dataDir,
    root,
    say,
    onStarted: (stop) => {
      started = true;
      stopServices = stop;
    },
    lock,
    run: (spec) => sup.start({ ...spec, logFile: spec.logFile && rel(spec.logFile) }),
    logDir,
  });
  const env: NodeJS.ProcessEnv = {
    ...stack.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    PORT: String(port),
    HOST: host,
  };
  const tsx = ['--import', 'tsx'];
  const specs: ProcessSpec[] = [];
  const catcher = mailCatcherSpec(env, say, path.join(logDir, 'mail.log'));
  if (catcher) specs.push(catcher);
  specs.push(
    {
      name: 'api',
      command: process.execPath,
      args: [...tsx, 'server/index.ts'],
      env: { ...env, CP_SERVICE: 'api' },
      logFile: path.join(logDir, 'api.log'),
    },
    {
      name: 'worker',
      command: process.execPath,
      args: [...tsx, 'worker/index.ts'],
      env: { ...env, CP_SERVICE: 'worker' },
      logFile: path.join(logDir, 'worker.log'),
    },
  );
  for (const spec of specs) supervisor.start({ ...spec, logFile: spec.logFile && rel(spec.logFile) });
  try {
    await waitForHealth(`${address}/api/health`, 90_000, () => !supervisor?.gaveUp);
  } catch (error) {
    throw new StepError('start the API', (error as Error).message, path.join(logDir, 'api.log'));
  }
  say(`ready: ${address}`);
  say(`logs: ${rel(logDir)}/api.log, worker.log, mail.log and s3.log`);
  say(`demo accounts (password "${DEMO_PASSWORD}"):`);
  for (const a of DEMO_ACCOUNTS)
    say(`  ${a.role.padEnd(10)} ${a.email.padEnd(40)} ${a.name}, ${a.organisation}`);
  const servers = stack.services.map((s) => (s === 'postgres' ? 'PostgreSQL' : 'Redis'));
  say(`Ctrl-C stops the API, the worker${servers.length ? ` and ${servers.join(' and ')}` : ''}.`);
}

process.on('uncaughtException', (error) => {
  process.stderr.write(`[counterpoise] the launcher failed: ${error.message}\n`);
  void shutdown(1);
});

main().catch(async (error) => {
  const e = error as Error & { step?: string; logFile?: string };
  const log = e.logFile ? ` See ${rel(e.logFile)}.` : '';
  process.stderr.write(`[counterpoise] step "${e.step ?? 'start'}" failed: ${e.message}.${log}\n`);
  await shutdown(1);
});
