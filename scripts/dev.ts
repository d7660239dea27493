// npm run dev: the same PostgreSQL, Redis, migrations and seed as the start command, then
// the Vite dev server (hot reload, proxying /api), and the API and worker in watch mode.
import path from 'node:path';
import { startProcess, stopAll, type Managed } from './lib/processes';
import { prepareStack, startMailCatcherIfNeeded } from './lib/stack';

const root = process.cwd();
const dataDir = path.resolve(process.env.DATA_DIR ?? '.data');
let stopServices: () => void = () => undefined;
let children: Managed[] = [];
let stopping = false;

function say(message: string) {
  process.stdout.write(`[dev] ${message}\n`);
}

async function shutdown(code: number) {
  if (stopping) return;
  stopping = true;
  await stopAll(children);
  stopServices();
  process.exit(code);
}

async function main() {
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  const stack = await prepareStack({ dataDir, root, say, onStarted: (stop) => (stopServices = stop) });
  const env = { ...stack.env, NODE_ENV: 'development', PORT: process.env.PORT ?? '3000' };
  const tsx = path.join(root, 'node_modules/tsx/dist/cli.mjs');
  const catcher = startMailCatcherIfNeeded(env, say);
  children = [
    ...(catcher ? [catcher] : []),
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
