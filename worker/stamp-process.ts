// Stamping beside other queues runs in a child process of the worker. Building a stamped
// return keeps its process's event loop busy for seconds at a time (pdf-lib drawing the overlay
// and the calculation sheet, the fonts, hashing the file: 6.5 s in one stretch for the first
// ~95 MB return of a process, 0.5–1.5 s stretches after that), and a check run in the same
// process waits all that time. So a worker whose WORKER_QUEUES include `stamp` and anything
// else forks itself with WORKER_QUEUES=stamp: the child takes the stamp queue (and relays its
// intents), the parent everything else. The child's log lines go to the parent's log with
// service "worker-stamp". The child closes when the parent does (SIGTERM) or goes away (its
// IPC channel closes, e.g. after kill -9); when the child dies on its own, the parent closes
// with an error so that the start command's supervisor starts both again, with its crash count.
import { fork, type ChildProcess } from 'node:child_process';
import { childWorkerEnv } from '../server/config';
import { logger } from '../server/lib/logger';

export interface StampProcess {
  child: ChildProcess;
  /** SIGTERM, then the child's own close limit; SIGKILL when it is still there after limitMs. */
  stop(limitMs: number): Promise<void>;
}

export function startStampProcess(entry: string, onCrash: () => void): StampProcess {
  // spawns: node (this worker's own entry, with the same Node.js flags: tsx's loader)
  const child = fork(entry, [], {
    env: childWorkerEnv(['stamp'], 'worker-stamp'),
    execArgv: process.execArgv,
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  let stopping = false;
  child.once('exit', (code, signal) => {
    if (stopping) return;
    logger.error({ code, signal, pid: child.pid }, 'the stamping process stopped on its own');
    onCrash();
  });
  logger.info({ pid: child.pid }, 'stamping runs in a process of its own');
  return {
    child,
    stop(limitMs) {
      stopping = true;
      if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
      return new Promise<void>((resolve) => {
        const timer = setTimeout(() => {
          child.kill('SIGKILL');
          resolve();
        }, limitMs);
        timer.unref();
        child.once('exit', () => {
          clearTimeout(timer);
          resolve();
        });
        child.kill('SIGTERM');
      });
    },
  };
}

/** In the child: close when the parent's IPC channel goes (the parent exited or was killed). */
export function closeWithParent(close: () => void) {
  if (process.send) process.once('disconnect', close);
}
