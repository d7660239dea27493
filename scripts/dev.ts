// npm run dev: the same lock, PostgreSQL, Redis, migrations and seed as the start command,
// then the Vite dev server (hot reload, proxying /api), and the API and worker in watch
// mode (tsx watch restarts them on change, so they are not supervised).
import path from 'node:path';
import { AlreadyRunning, acquireLock, type DeskLock } from './lib/lock';
import { startProcess, stopAll, type Managed } from './lib/processes';
import { mailCatcherSpec, prepareStack } from './lib/stack';

const root = process.cwd();
const dataDir = path.resolve(process.env.DATA_DIR ?? '.data');
let stopServices: () => void = () => undefined;
let children: Managed[] = [];
let lock: DeskLock | null = null;
let stopping = false;

function say(message: string) {
  process.stdout.write(`[dev] ${message}\n`);
}

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  await stopAll(children);
  stopServices();
  lock?.release();
  process.exit(code);
}

async function main() {
  const port = process.env.PORT ?? '3000';
  try {
    lock = acquireLock(dataDir, `http://127.0.0.1:${port}`);
  } catch (error) {
    if (!(error instanceof AlreadyRunning)) throw error;
    process.stderr.write(`[dev] ${error.message}; stop that desk first or give this one its own DATA_DIR.\n`);
    process.exit(1);
  }
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  const stack = await prepareStack({
    dataDir,
    root,
    say,
    onStarted: (stop) => (stopServices = stop),
    lock,
    run: (spec) => children.push(startProcess(spec.name, spec.command, spec.args, spec.env)),
  });
  const env = { ...stack.env, NODE_ENV: 'development', PORT: port };
  const tsx = path.join(root, 'node_modules/tsx/dist/cli.mjs');
  const catcher = mailCatcherSpec(env, say);
  children = [
    ...children,
    ...(catcher ? [startProcess(catcher.name, catcher.command, catcher.args, catcher.env)] : []),
    startProcess('api', process.execPath, [tsx, 'watch', 'server/index.ts'], { ...env, CP_SERVICE: 'api' }),
    startProcess('worker', process.execPath, [tsx, 'watch', 'worker/index.ts'], {
      ...env,
      CP_SERVICE: 'worker',
    }),
    startProcess('vite', process.execPath, [path.join(root, 'node_modules/vite/bin/vite.js')], env),
  ];
  say('Vite on http://127.0.0.1:5173 (proxying /api to the API on port ' + env.PORT + ')');
}

main().catch(async (error) => {
  const e = error as Error & { step?: string };
  process.stderr.write(`[dev] step "${e.step ?? 'start'}" failed: ${e.message}\n`);
  await shutdown(1);
});
