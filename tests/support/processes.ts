// Real API (server/index.ts) and worker (worker/index.ts) processes for tests: each in a
// process group of its own with its log in a file, stopped as a group (SIGTERM, then SIGKILL)
// whatever state the test ended in.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import { until } from './until';

export interface Spawned {
  name: string;
  child: ChildProcess;
  log: string;
  /** The log's lines so far, parsed (pino JSON; other lines skipped). */
  lines(): Array<Record<string, unknown>>;
}

function start(name: string, entry: string, env: NodeJS.ProcessEnv, log: string): Spawned {
  const out = fs.openSync(log, 'a');
  // spawns: node
  const child = spawn(process.execPath, ['--import', 'tsx', entry], {
    env: { ...process.env, NODE_ENV: 'test', ...env },
    stdio: ['ignore', out, out],
    detached: true,
  });
  fs.closeSync(out);
  return {
    name,
    child,
    log,
    lines: () =>
      fs
        .readFileSync(log, 'utf8')
        .split('\n')
        .flatMap((l) => {
          try {
            return l.startsWith('{') ? [JSON.parse(l) as Record<string, unknown>] : [];
          } catch {
            return [];
          }
        }),
  };
}

function tail(file: string) {
  return fs.existsSync(file) ? fs.readFileSync(file, 'utf8').slice(-3000) : '(no log)';
}

/** An API process on `port`; resolves once /api/health answers 200. */
export async function startApi(name: string, port: number, env: NodeJS.ProcessEnv, log: string) {
  const base = `http://127.0.0.1:${port}`;
  const api = start(
    name,
    'server/index.ts',
    { HOST: '127.0.0.1', PORT: String(port), APP_URL: base, CP_SERVICE: name, ...env },
    log,
  );
  await until(
    async () => (await fetch(`${base}/api/health`)).status === 200,
    60_000,
    `${name} listening`,
  ).catch((e: Error) => {
    throw new Error(`${e.message}; its log: ${tail(log)}`);
  });
  return { ...api, base };
}

/** A worker process; resolves once it logs "worker ready" (the parent's line, not a stamping child's). */
export async function startWorker(name: string, env: NodeJS.ProcessEnv, log: string) {
  const worker = start(name, 'worker/index.ts', { CP_SERVICE: name, LOG_LEVEL: 'info', ...env }, log);
  await until(
    async () =>
      worker.lines().some((l) => l.msg === 'worker ready (queue: concurrency)' && l.service === name),
    60_000,
    `${name} ready`,
  ).catch((e: Error) => {
    throw new Error(`${e.message}; its log: ${tail(log)}`);
  });
  return worker;
}

/** Stops each process's group: SIGTERM, then SIGKILL after `graceMs`. */
export async function stopAll(processes: Spawned[], graceMs = 15_000) {
  await Promise.all(
    processes.map(async ({ child }) => {
      if (child.exitCode !== null || child.signalCode !== null || !child.pid) return;
      const exited = new Promise((r) => child.once('exit', r));
      const signal = (s: NodeJS.Signals) => {
        try {
          process.kill(-child.pid!, s);
        } catch {
          // the group is gone already
        }
      };
      signal('SIGTERM');
      const timer = setTimeout(() => signal('SIGKILL'), graceMs);
      await exited;
      clearTimeout(timer);
      // A grandchild (a stamping child, a PDF check) left in the group.
      signal('SIGKILL');
    }),
  );
}
