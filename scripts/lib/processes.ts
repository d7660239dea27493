// Child processes of the start and dev commands: started with their logs in files, in
// their own process group (so Ctrl-C reaches the launcher only, which then stops them in
// order), and stopped with SIGTERM and a time limit.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';

export interface Managed {
  name: string;
  child: ChildProcess;
  logFile?: string;
}

export function startProcess(
  name: string,
  command: string,
  args: string[],
  env: NodeJS.ProcessEnv,
  logFile?: string,
): Managed {
  const out = logFile ? fs.openSync(logFile, 'a') : 'inherit';
  // spawns: node (every caller passes process.execPath: the API, the worker, the mail catcher, Vite)
  const child = spawn(command, args, {
    env,
    stdio: ['ignore', out, out],
    detached: true,
  });
  // The child has its own copy; keeping ours open would leak one per restart.
  if (typeof out === 'number') fs.closeSync(out);
  return { name, child, logFile };
}

/** SIGTERM, then SIGKILL when the process has not exited within ms. */
export function stopChild(child: ChildProcess, ms: number): Promise<void> {
  return new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      resolve();
    }, ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}

export async function stopAll(children: Managed[], ms = 10_000) {
  await Promise.all(children.map(({ child }) => stopChild(child, ms)));
}

export async function waitForHealth(url: string, ms: number, stillRunning: () => boolean): Promise<void> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (!stillRunning()) throw new Error('a process exited before the API answered');
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      /* not yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no healthy answer from ${url} within ${Math.round(ms / 1000)} s`);
}
