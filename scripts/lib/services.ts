// Starts and stops the embedded PostgreSQL and Redis that the start and test commands use
// when DATABASE_URL / REDIS_URL are not set. Debian's packages are installed when missing
// (as root); otherwise the command stops with a message saying what to install.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

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

function which(cmd: string): string | null {
  const r = spawnSync('sh', ['-c', `command -v ${cmd}`], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

/** Makes sure the Debian packages are present; installs them with apt-get when running as root. */
export function ensurePackages(needs: { postgres?: boolean; redis?: boolean; chromium?: boolean }) {
  const missing: string[] = [];
  if (needs.postgres && !findPostgresBin()) missing.push('postgresql');
  if (needs.redis && !which('redis-server')) missing.push('redis-server');
  if (needs.chromium && !fs.existsSync('/usr/bin/chromium')) missing.push('chromium');
  if (!missing.length) return;
  if (!isRoot || !which('apt-get')) {
    throw new StepError(
      'install packages',
      `Missing: ${missing.join(', ')}. Install them (Debian/Ubuntu: sudo apt-get install -y ${missing.join(' ')}), ` +
        'or set DATABASE_URL and REDIS_URL to servers of your own.',
    );
  }
  log(`installing ${missing.join(', ')} with apt-get (one time)…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const update = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  if (update.status !== 0) throw new StepError('install packages', 'apt-get update failed');
  const install = spawnSync('apt-get', ['install', '-y', '-qq', ...missing], { stdio: 'inherit', env });
  if (install.status !== 0)
    throw new StepError('install packages', `apt-get install ${missing.join(' ')} failed`);
}

export async function isPortFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
  });
}

function asPostgres(bin: string, args: string[], opts: { logFile?: string } = {}) {
  const command = isRoot ? 'runuser' : bin;
  const fullArgs = isRoot ? ['-u', 'postgres', '--', bin, ...args] : args;
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
  stop(): void;
}

function postmasterPid(dataDir: string): number | null {
  const pidFile = path.join(dataDir, 'postmaster.pid');
  if (!fs.existsSync(pidFile)) return null;
  const pid = Number(fs.readFileSync(pidFile, 'utf8').split('\n')[0]);
  if (!pid) return null;
  try {
    process.kill(pid, 0);
    return pid;
  } catch {
    return null;
  }
}

/** Starts (initialising when new) a PostgreSQL cluster in dataDir on 127.0.0.1:port. */
export async function startPostgres(
  dataDir: string,
  port: number,
  database: string,
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
  if (!postmasterPid(dataDir)) {
    if (!(await isPortFree(port))) {
      throw new StepError(
        'start PostgreSQL',
        `port ${port} on 127.0.0.1 is taken; set CP_PG_PORT to another port`,
      );
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
    stop() {
      const pid = postmasterPid(dataDir);
      if (!pid) return;
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
  stop(): void;
}

/** Starts redis-server on 127.0.0.1:port with its files in dir. */
export async function startRedis(
  dir: string,
  port: number,
  opts: { persist: boolean },
): Promise<RedisHandle> {
  const bin = which('redis-server');
  if (!bin) throw new StepError('start Redis', 'redis-server not found');
  fs.mkdirSync(dir, { recursive: true });
  const pidFile = path.join(dir, 'redis.pid');
  const logFile = path.join(dir, 'redis.log');
  const running = readPid(pidFile);
  if (!running) {
    if (!(await isPortFree(port))) {
      throw new StepError(
        'start Redis',
        `port ${port} on 127.0.0.1 is taken; set CP_REDIS_PORT to another port`,
      );
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
    const r = spawnSync(bin, args, { encoding: 'utf8' });
    if (r.status !== 0)
      throw new StepError('start Redis', `redis-server failed: ${r.stderr || r.stdout}`, logFile);
    await waitFor(() => readPid(pidFile) !== null && !isPortFreeSync(port), 10_000, 'start Redis', logFile);
  }
  return {
    url: `redis://127.0.0.1:${port}`,
    port,
    stop() {
      const pid = readPid(pidFile);
      if (!pid) return;
      try {
        process.kill(pid, 'SIGTERM');
      } catch {
        /* gone */
      }
      const until = Date.now() + 5000;
      while (Date.now() < until && readPid(pidFile)) spawnSync('sleep', ['0.1']);
    },
  };
}

function readPid(pidFile: string): number | null {
  if (!fs.existsSync(pidFile)) return null;
  const pid = Number(fs.readFileSync(pidFile, 'utf8').trim());
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
