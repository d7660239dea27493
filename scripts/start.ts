// The start command: builds the client, brings up PostgreSQL and Redis (embedded under
// .data/ unless DATABASE_URL / REDIS_URL are set), migrates, seeds the demo once, then
// runs the API and the worker until Ctrl-C or SIGTERM, which stops everything it started.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/seed/demo-accounts';
import { startProcess, stopAll, waitForHealth, type Managed } from './lib/processes';
import { prepareStack, startMailCatcherIfNeeded } from './lib/stack';

const root = process.cwd();
const dataDir = path.resolve(process.env.DATA_DIR ?? '.data');
const logDir = path.join(dataDir, 'logs');
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';

function say(message: string) {
  process.stdout.write(`[counterpoise] ${message}\n`);
}

let stopServices: () => void = () => undefined;
let children: Managed[] = [];
let stopping = false;

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  say('stopping…');
  await stopAll(children);
  stopServices();
  say('stopped');
  process.exit(code);
}

async function main() {
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  fs.mkdirSync(logDir, { recursive: true });

  if (process.env.SKIP_CLIENT_BUILD !== '1') {
    say('building the client…');
    const r = spawnSync(
      process.execPath,
      [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'],
      {
        stdio: ['ignore', 'inherit', 'inherit'],
      },
    );
    if (r.status !== 0)
      throw Object.assign(new Error('vite build failed (see the output above)'), {
        step: 'build the client',
      });
  }

  const stack = await prepareStack({ dataDir, root, say, onStarted: (stop) => (stopServices = stop) });
  const env: NodeJS.ProcessEnv = {
    ...stack.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    PORT: String(port),
    HOST: host,
  };
  const tsx = ['--import', 'tsx'];
  children = [];
  const catcher = startMailCatcherIfNeeded(env, say, path.join(logDir, 'mail.log'));
  if (catcher) children.push(catcher);
  children.push(
    startProcess(
      'api',
      process.execPath,
      [...tsx, 'server/index.ts'],
      { ...env, CP_SERVICE: 'api' },
      path.join(logDir, 'api.log'),
    ),
    startProcess(
      'worker',
      process.execPath,
      [...tsx, 'worker/index.ts'],
      { ...env, CP_SERVICE: 'worker' },
      path.join(logDir, 'worker.log'),
    ),
  );
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
  try {
    await waitForHealth(`${address}/api/health`, 60_000, () =>
      children.every((c) => c.child.exitCode === null),
    );
  } catch (error) {
    throw Object.assign(error as Error, { step: 'start the API', logFile: path.join(logDir, 'api.log') });
  }
  say(`ready: ${address}`);
  say(`logs: ${path.relative(root, logDir)}/api.log and worker.log`);
  say(`demo accounts (password "${DEMO_PASSWORD}"):`);
  for (const a of DEMO_ACCOUNTS)
    say(`  ${a.role.padEnd(10)} ${a.email.padEnd(40)} ${a.name}, ${a.organisation}`);
  say(`Ctrl-C stops the API, the worker${stack.embedded ? ', PostgreSQL and Redis' : ''}.`);
}

main().catch(async (error) => {
  const e = error as Error & { step?: string; logFile?: string };
  const log = e.logFile ? ` See ${path.relative(root, e.logFile)}.` : '';
  process.stderr.write(`[counterpoise] step "${e.step ?? 'start'}" failed: ${e.message}.${log}\n`);
  await shutdown(1);
});
