// Supervision for the start command's processes: a process that exits unexpectedly (a
// crash, kill -9) is started again after a growing pause, and only repeated crashes (5
// within 2 minutes) give up, naming the process and its log. Stopping goes in the order
// given, each process with a time limit, so the API stops taking work before the worker
// finishes its jobs.
import type { ChildProcess } from 'node:child_process';
import { startProcess, stopChild } from './processes';

export interface ProcessSpec {
  name: string;
  command: string;
  args: string[];
  env: NodeJS.ProcessEnv;
  logFile?: string;
}

export interface SupervisorOptions {
  say: (message: string) => void;
  /** Called once when a process crashed too often; the caller stops the desk. */
  onGiveUp: (spec: ProcessSpec, crashes: number) => void;
  /** Called whenever a pid changes (start, restart), e.g. to record it in the lock file. */
  onPids?: (pids: Record<string, number>) => void;
  maxCrashes?: number;
  windowMs?: number;
  firstDelayMs?: number;
  maxDelayMs?: number;
}

interface Entry {
  spec: ProcessSpec;
  child: ChildProcess | null;
  crashes: number[];
  restartTimer: NodeJS.Timeout | null;
}

export function describeExit(code: number | null, signal: NodeJS.Signals | null) {
  return signal ? `killed by ${signal}` : `exit code ${code}`;
}

export class Supervisor {
  private readonly entries = new Map<string, Entry>();
  private stopping = false;
  gaveUp = false;
  readonly maxCrashes: number;
  readonly windowMs: number;

  constructor(private readonly opts: SupervisorOptions) {
    this.maxCrashes = opts.maxCrashes ?? 5;
    this.windowMs = opts.windowMs ?? 120_000;
  }

  start(spec: ProcessSpec) {
    const entry: Entry = { spec, child: null, crashes: [], restartTimer: null };
    this.entries.set(spec.name, entry);
    this.launch(entry);
  }

  pids(): Record<string, number> {
    const out: Record<string, number> = {};
    for (const [name, e] of this.entries)
      if (e.child?.pid && e.child.exitCode === null) out[name] = e.child.pid;
    return out;
  }

  private launch(entry: Entry) {
    const { spec } = entry;
    const { child } = startProcess(spec.name, spec.command, spec.args, spec.env, spec.logFile);
    entry.child = child;
    entry.restartTimer = null;
    // A spawn failure (missing binary) arrives as 'error' and then 'exit'; count it once, at exit.
    child.once('error', (err) => this.opts.say(`${spec.name} could not start: ${err.message}`));
    child.once('exit', (code, signal) => this.exited(entry, child, code, signal));
    this.opts.onPids?.(this.pids());
  }

  private exited(entry: Entry, child: ChildProcess, code: number | null, signal: NodeJS.Signals | null) {
    if (entry.child !== child || this.stopping) return;
    const { spec } = entry;
    const now = Date.now();
    entry.crashes = [...entry.crashes.filter((t) => now - t < this.windowMs), now];
    const n = entry.crashes.length;
    const log = spec.logFile ? ` See ${spec.logFile}.` : '';
    if (n >= this.maxCrashes) {
      this.opts.say(
        `${spec.name} stopped unexpectedly ${n} times within ${Math.round(this.windowMs / 60_000)} minutes (last: ${describeExit(code, signal)}); stopping the desk.${log}`,
      );
      if (!this.gaveUp) {
        this.gaveUp = true;
        this.opts.onGiveUp(spec, n);
      }
      return;
    }
    const first = this.opts.firstDelayMs ?? 500;
    const delay = Math.min(first * 2 ** (n - 1), this.opts.maxDelayMs ?? 15_000);
    this.opts.say(
      `${spec.name} stopped unexpectedly (${describeExit(code, signal)}); restarting it in ${(delay / 1000).toFixed(1)} s (${n} of ${this.maxCrashes} allowed within ${Math.round(this.windowMs / 60_000)} minutes).${log}`,
    );
    entry.restartTimer = setTimeout(() => {
      if (!this.stopping) {
        this.launch(entry);
        this.opts.say(`${spec.name} restarted (pid ${entry.child?.pid})`);
      }
    }, delay);
  }

  /** Stops the processes one after another in the order given (others afterwards). */
  async stopAll(order: string[], ms = 15_000) {
    this.stopping = true;
    for (const e of this.entries.values()) if (e.restartTimer) clearTimeout(e.restartTimer);
    const names = [
      ...order.filter((n) => this.entries.has(n)),
      ...[...this.entries.keys()].filter((n) => !order.includes(n)),
    ];
    for (const name of names) {
      const child = this.entries.get(name)?.child;
      if (child) await stopChild(child, ms);
    }
  }
}
