// Starts and stops the embedded PostgreSQL and Redis that the start and test commands use
// when DATABASE_URL / REDIS_URL are not set. Debian's packages are installed when missing
// (as root); otherwise the command stops with a message saying what to install.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { describePort, isPortFree } from './ports';

export { freePort, isPortFree } from './ports';

export class StepError extends Error {
  constructor(
    readonly step: string,
    message: string,
    readonly logFile?: string,
  ) {
    super(message);
  }
}

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

function log(message: string) {
  process.stdout.write(`[counterpoise] ${message}\n`);
}

export function findPostgresBin(): string | null {
  const base = '/usr/lib/postgresql';
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, 'bin', 'postgres')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

export function which(cmd: string): string | null {
  for (const dir of (process.env.PATH ?? '').split(':')) {
    if (!dir) continue;
    const file = path.join(dir, cmd);
    try {
      fs.accessSync(file, fs.constants.X_OK);
      if (fs.statSync(file).isFile()) return file;
    } catch {
      /* not in this folder */
    }
  }
  return null;
}

/** Who needs a Debian package: the start command (the product at run time) or the test command. */
export type Purpose = 'start' | 'test';

export interface DebianPackage {
  name: string;
  /** The programs of the package that the code or the tests spawn (tests/scripts checks this). */
  binaries: string[];
  purposes: Purpose[];
  /** What it is for, said in the error when it is missing. */
  why: string;
  present(): boolean;
}

/**
 * The install list: every program the product or its tests spawn comes from one of these
 * Debian packages, installed by `npm start` / `npm test` with apt-get when missing.
 * tests/scripts/spawned-binaries.test.ts fails when code spawns a program not listed here.
 */
export const DEBIAN_PACKAGES: DebianPackage[] = [
  {
    name: 'postgresql',
    binaries: ['initdb', 'pg_ctl', 'postgres'],
    purposes: ['start', 'test'],
    why: 'the embedded database',
    present: () => findPostgresBin() !== null,
  },
  {
    name: 'redis-server',
    binaries: ['redis-server'],
    purposes: ['start', 'test'],
    why: 'the embedded job queue',
    present: () => which('redis-server') !== null,
  },
  {
    name: 'qpdf',
    binaries: ['qpdf'],
    purposes: ['start', 'test'],
    why: 'PDF structure work for the stamped return',
    present: () => which('qpdf') !== null,
  },
  {
    name: 'poppler-utils',
    binaries: ['pdftotext', 'pdftoppm', 'pdfinfo', 'pdfsig'],
    purposes: ['start', 'test'],
    why: "finding the empty corner of page 1 for the stamp block (pdftoppm), reading stamped returns back in the tests and checking the return's signature independently",
    present: () => ['pdftotext', 'pdftoppm', 'pdfinfo', 'pdfsig'].every((b) => which(b) !== null),
  },
  {
    name: 'chromium',
    binaries: ['chromium'],
    purposes: ['test'],
    why: 'the browser tests',
    present: () => fs.existsSync('/usr/bin/chromium'),
  },
];

/** The packages a command needs; PostgreSQL and Redis only when they are embedded. */
export function packagesFor(purpose: Purpose, opts: { postgres: boolean; redis: boolean }): DebianPackage[] {
  return DEBIAN_PACKAGES.filter(
    (p) =>
      p.purposes.includes(purpose) &&
      (p.name !== 'postgresql' || opts.postgres) &&
      (p.name !== 'redis-server' || opts.redis),
  );
}

/** Makes sure the Debian packages are present; installs them with apt-get when running as root. */
export function ensurePackages(packages: DebianPackage[], say: (m: string) => void = log) {
  const missing = packages.filter((p) => !p.present()).map((p) => p.name);
  if (!missing.length) return;
  const aptGet = which('apt-get');
  if (!isRoot || !aptGet) {
    const how = aptGet
      ? `run this command as root, or install them with "sudo apt-get install -y ${missing.join(' ')}"`
      : `install them with your system's package manager (Debian names: ${missing.join(' ')})`;
    throw new StepError(
      'install packages',
      `missing Debian package${missing.length > 1 ? 's' : ''} ${missing.join(', ')}: ${how}, then start again`,
    );
  }
  say(`installing ${missing.join(', ')} with apt-get (one time)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  // Another apt-get on the machine holds the dpkg lock for a while: wait for it.
  const lockWait = ['-o', 'DPkg::Lock::Timeout=300'];
  // spawns: apt-get
  const update = spawnSync(aptGet, [...lockWait, 'update', '-qq'], { stdio: 'inherit', env });
  if (update.status !== 0)
    throw new StepError('install packages', 'apt-get update failed (see its output above)');
  // spawns: apt-get
  const install = spawnSync(aptGet, [...lockWait, 'install', '-y', '-qq', ...missing], {
    stdio: 'inherit',
    env,
  });
  if (install.status !== 0)
    throw new StepError(
      'install packages',
      `apt-get install ${missing.join(' ')} failed (see its output above)`,
    );
  const still = packages.filter((p) => !p.present()).map((p) => p.name);
  if (still.length)
    throw new StepError('install packages', `apt-get ran but ${still.join(', ')} is still missing`);
}

function asPostgres(bin: string, args: string[], opts: { logFile?: string } = {}) {
  const command = isRoot ? 'runuser' : bin;
  const fullArgs = isRoot ? ['-u', 'postgres', '--', bin, ...args] : args;
  // spawns: runuser, initdb, pg_ctl (as root: runuser -u postgres -- initdb/pg_ctl)
  const r = spawnSync(command, fullArgs, { encoding: 'utf8' });
  if (r.status !== 0) {
    throw new StepError(
      'start PostgreSQL',
      `${path.basename(bin)} failed: ${(r.stderr || r.stdout || '').trim().split('\n').slice(-3).join(' ')}`,
      opts.logFile,
    );
  }
  return r.stdout;
}

export interface PostgresHandle {
  url: string;
  port: number;
  dataDir: string;
  logFile: string;
  /** False when a PostgreSQL was already running on this data folder: stop() leaves it alone. */
  startedHere: boolean;
  stop(): void;
}

/** The pid of the PostgreSQL running on dataDir, if one is. */
export function postmasterPid(dataDir: string): number | null {
  // Its first line is the pid; the lines after it are PostgreSQL's own.
  return readPid(path.join(dataDir, 'postmaster.pid'));
}

/** Starts (initialising when new) a PostgreSQL cluster in dataDir on 127.0.0.1:port. */
export async function startPostgres(
  dataDir: string,
  port: number,
  database: string,
  opts: { adopt?: boolean } = {},
): Promise<PostgresHandle> {
  const bin = findPostgresBin();
  if (!bin)
    throw new StepError('start PostgreSQL', 'PostgreSQL binaries not found under /usr/lib/postgresql');
  fs.mkdirSync(dataDir, { recursive: true });
  const logFile = path.join(dataDir, 'server.log');
  if (isRoot) execFileSync('chown', ['-R', 'postgres:postgres', dataDir]);
  if (!fs.existsSync(path.join(dataDir, 'PG_VERSION'))) {
    log(`initialising PostgreSQL data in ${path.relative(process.cwd(), dataDir) || dataDir}`);
    asPostgres(path.join(bin, 'initdb'), ['-D', dataDir, '-U', 'app', '--auth=trust', '-E', 'UTF8'], {
      logFile,
    });
  }
  const running = postmasterPid(dataDir) !== null;
  // A server left by this data folder's own crashed desk is adopted; any other is left alone.
  const startedHere = !running || Boolean(opts.adopt);
  if (!running) {
    if (!(await isPortFree(port))) {
      throw new StepError('start PostgreSQL', `${await describePort(port)}; set CP_PG_PORT to another port`);
    }
    asPostgres(
      path.join(bin, 'pg_ctl'),
      [
        '-D',
        dataDir,
        '-l',
        logFile,
        '-o',
        `-h 127.0.0.1 -p ${port} -k ${dataDir}`,
        '-w',
        '-t',
        '60',
        'start',
      ],
      { logFile },
    );
  }
  const url = `postgres://app@127.0.0.1:${port}/${database}`;
  await createDatabaseIfMissing(`postgres://app@127.0.0.1:${port}/postgres`, database, logFile);
  return {
    url,
    port,
    dataDir,
    logFile,
    startedHere,
    stop() {
      const pid = postmasterPid(dataDir);
      if (!pid || !startedHere) return;
      try {
        asPostgres(path.join(bin, 'pg_ctl'), ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
      } catch {
        try {
          process.kill(pid, 'SIGINT');
        } catch {
          /* already gone */
        }
      }
    },
  };
}

async function createDatabaseIfMissing(adminUrl: string, database: string, logFile: string) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: adminUrl });
  try {
    await client.connect();
    const found = await client.query('SELECT 1 FROM pg_database WHERE datname = $1', [database]);
    if (found.rowCount === 0) await client.query(`CREATE DATABASE "${database.replace(/"/g, '')}"`);
  } catch (error) {
    throw new StepError(
      'create database',
      `could not create database ${database}: ${(error as Error).message}`,
      logFile,
    );
  } finally {
    await client.end().catch(() => undefined);
  }
}

export interface RedisHandle {
  url: string;
  port: number;
  /** False when a Redis was already running from this folder: stop() leaves it alone. */
  startedHere: boolean;
  stop(): void;
}

/** Starts redis-server on 127.0.0.1:port with its files in dir. */
export async function startRedis(
  dir: string,
  port: number,
  opts: { persist: boolean; adopt?: boolean },
): Promise<RedisHandle> {
  const bin = which('redis-server');
  if (!bin) throw new StepError('start Redis', 'redis-server not found');
  fs.mkdirSync(dir, { recursive: true });
  const pidFile = path.join(dir, 'redis.pid');
  const logFile = path.join(dir, 'redis.log');
  const running = readPid(pidFile) !== null;
  const startedHere = !running || Boolean(opts.adopt);
  if (!running) {
    if (!(await isPortFree(port))) {
      throw new StepError('start Redis', `${await describePort(port)}; set CP_REDIS_PORT to another port`);
    }
    const args = [
      '--port',
      String(port),
      '--bind',
      '127.0.0.1',
      '--protected-mode',
      'yes',
      '--daemonize',
      'yes',
      '--pidfile',
      pidFile,
      '--logfile',
      logFile,
      '--dir',
      dir,
      '--maxmemory-policy',
      'noeviction',
      ...(opts.persist ? ['--appendonly', 'yes', '--save', '60 1'] : ['--appendonly', 'no', '--save', '']),
    ];
    // spawns: redis-server
    const r = spawnSync(bin, args, { encoding: 'utf8' });
    if (r.status !== 0)
      throw new StepError('start Redis', `redis-server failed: ${r.stderr || r.stdout}`, logFile);
    await waitFor(() => readPid(pidFile) !== null && !isPortFreeSync(port), 10_000, 'start Redis', logFile);
  }
  return {
    url: `redis://127.0.0.1:${port}`,
    port,
    startedHere,
    stop() {
      const pid = readPid(pidFile);
      if (!pid || !startedHere) return;
      try {
        process.kill(pid, 'SIGTERM');
      } catch {
        /* gone */
      }
      const until = Date.now() + 5000;
      while (Date.now() < until && readPid(pidFile)) pause(100);
    },
  };
}

/** The live pid on the first line of a pid file, if any. */
export function readPid(pidFile: string): number | null {
  if (!fs.existsSync(pidFile)) return null;
  const pid = Number(fs.readFileSync(pidFile, 'utf8').split('\n')[0].trim());
  if (!pid) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

function isPortFreeSync(port: number): boolean {
  const r = spawnSync(process.execPath, [
    '-e',
    `const s=require('net').createServer();s.once('error',()=>process.exit(1));s.listen(${port},'127.0.0.1',()=>s.close(()=>process.exit(0)))`,
  ]);
  return r.status === 0;
}

async function waitFor(test: () => boolean, ms: number, step: string, logFile?: string) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (test()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new StepError(step, `timed out after ${ms} ms`, logFile);
}

/** Blocks for ms without spawning anything (stop() is synchronous so exit handlers can call it). */
function pause(ms: number) {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}
