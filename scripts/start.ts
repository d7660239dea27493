// The start command: builds the client, brings up PostgreSQL and Redis (embedded under
// .data/ unless DATABASE_URL / REDIS_URL are set), migrates, seeds the demo once, then
// runs the API and the worker until Ctrl-C or SIGTERM, which stops everything it started.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { runMigrations } from './lib/migrate';
import { startProcess, stopAll, waitForHealth, type Managed } from './lib/processes';
import { localSecret } from './lib/secret';
import { ensurePackages, startPostgres, startRedis, StepError, type PostgresHandle, type RedisHandle } from './lib/services';

const root = process.cwd();
const dataDir = path.resolve(process.env.DATA_DIR ?? '.data');
const logDir = path.join(dataDir, 'logs');
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';

function say(message: string) {
  process.stdout.write(`[counterpoise] ${message}\n`);
}

let postgres: PostgresHandle | null = null;
let redis: RedisHandle | null = null;
let children: Managed[] = [];
let stopping = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  say('stopping…');
  await stopAll(children);
  redis?.stop();
  postgres?.stop();
  say('stopped');
  process.exit(code);
}

async function step<T>(name: string, fn: () => Promise<T> | T): Promise<T> {
  try {
    return await fn();
  } catch (error) {
    const e = error as Error & { logFile?: string; step?: string };
    const log = e.logFile ? ` See ${path.relative(root, e.logFile)}.` : '';
    process.stderr.write(`[counterpoise] step "${e.step ?? name}" failed: ${e.message}.${log}\n`);
    await shutdown(1);
    throw error;
  }
}

async function main() {
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  fs.mkdirSync(logDir, { recursive: true });

  if (process.env.SKIP_CLIENT_BUILD !== '1') {
    await step('build the client', () => {
      say('building the client…');
      const r = spawnSync(process.execPath, [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], {
        stdio: ['ignore', 'inherit', 'inherit'],
      });
      if (r.status !== 0) throw new Error('vite build failed (see the output above)');
    });
  }

  let databaseUrl = process.env.DATABASE_URL;
  let redisUrl = process.env.REDIS_URL;
  if (!databaseUrl || !redisUrl) {
    await step('install packages', () => ensurePackages({ postgres: !databaseUrl, redis: !redisUrl }));
  }
  if (!databaseUrl) {
    postgres = await step('start PostgreSQL', () =>
      startPostgres(path.join(dataDir, 'pg'), Number(process.env.CP_PG_PORT ?? 54329), 'counterpoise'),
    );
    databaseUrl = postgres.url;
    say(`PostgreSQL on 127.0.0.1:${postgres.port} (data in ${path.relative(root, postgres.dataDir)})`);
  }
  if (!redisUrl) {
    redis = await step('start Redis', () =>
      startRedis(path.join(dataDir, 'redis'), Number(process.env.CP_REDIS_PORT ?? 56379), { persist: true }),
    );
    redisUrl = redis.url;
    say(`Redis on 127.0.0.1:${redis.port}`);
  }

  const applied = await step('run migrations', () => runMigrations(databaseUrl!));
  say(applied.length ? `applied migrations: ${applied.join(', ')}` : 'database schema is up to date');

  const { seedDemoOnce } = await import('../server/db/seed/seed');
  const seeded = await step('seed the demo scenario', () => seedDemoOnce(databaseUrl!, path.join(dataDir, 'files')));
  say(seeded ? 'demo scenario seeded' : 'demo data already present, reused');

  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    DATABASE_URL: databaseUrl,
    REDIS_URL: redisUrl,
    JWT_SECRET: process.env.JWT_SECRET ?? localSecret(dataDir),
    DATA_DIR: dataDir,
    PORT: String(port),
    HOST: host,
  };
  const tsx = ['--import', 'tsx'];
  children = [
    startProcess('api', process.execPath, [...tsx, 'server/index.ts'], { ...env, CP_SERVICE: 'api' }, path.join(logDir, 'api.log')),
    startProcess('worker', process.execPath, [...tsx, 'worker/index.ts'], { ...env, CP_SERVICE: 'worker' }, path.join(logDir, 'worker.log')),
  ];
  for (const c of children) {
    c.child.once('exit', (code, signal) => {
      if (stopping) return;
      process.stderr.write(
        `[counterpoise] ${c.name} exited (${signal ?? code}). See ${path.relative(root, c.logFile ?? '')}.\n`,
      );
      void shutdown(1);
    });
  }
  const address = `http://${host}:${port}`;
  await step('start the API', () =>
    waitForHealth(`${address}/api/health`, 60_000, () => children.every((c) => c.child.exitCode === null)),
  );
  say(`ready: ${address}`);
  say(`logs: ${path.relative(root, logDir)}/api.log, worker.log`);
  say(`demo accounts (password "${DEMO_PASSWORD}"):`);
  for (const a of DEMO_ACCOUNTS) say(`  ${a.role.padEnd(10)} ${a.email.padEnd(40)} ${a.name}, ${a.organisation}`);
  say('Ctrl-C stops the API, the worker' + (postgres || redis ? ', PostgreSQL and Redis' : '') + '.');
}

main().catch(async (error) => {
  if (!stopping) {
    process.stderr.write(`[counterpoise] ${(error as Error).message}\n`);
    await shutdown(1);
  }
});

export { StepError };
