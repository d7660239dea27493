// One desk per data folder: the start and dev commands hold DATA_DIR/desk.lock with their
// pid, address and the pids of their processes. A lock whose pid no longer runs one of
// these commands (a crash, a reboot) is stale and taken over.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { StepError } from './services';

export interface LockInfo {
  pid: number;
  url: string;
  startedAt: string;
  /** The launcher's processes (api, worker, mail-catcher) by name. */
  processes: Record<string, number>;
  /** Embedded servers this desk started, so a desk taking over a stale lock may stop them. */
  services: string[];
}

export interface DeskLock {
  file: string;
  /** The stale lock this one replaced, if any. */
  previous: LockInfo | null;
  update(change: Partial<Pick<LockInfo, 'processes' | 'services'>>): void;
  release(): void;
}

export class AlreadyRunning extends Error {}

export function lockFile(dataDir: string) {
  return path.join(dataDir, 'desk.lock');
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Whether pid still runs a launcher (a recycled pid running something else does not count). */
function isLauncher(pid: number): boolean {
  if (!alive(pid)) return false;
  try {
    const argv = fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    return /scripts\/(start|dev)\.ts/.test(argv);
  } catch {
    // Another user's process, or no /proc: assume it is what the lock says.
    return true;
  }
}

export function readLock(dataDir: string): LockInfo | null {
  try {
    return JSON.parse(fs.readFileSync(lockFile(dataDir), 'utf8')) as LockInfo;
  } catch {
    return null;
  }
}

function notWritable(dataDir: string, error: NodeJS.ErrnoException): StepError {
  const user = os.userInfo().username;
  return new StepError(
    'check the data folder',
    `the data folder ${dataDir} is not writable by user ${user} (${error.code}); ` +
      `give that user write access to it or point DATA_DIR at a folder it can write`,
  );
}

/** Takes the data folder's lock, or throws AlreadyRunning naming the desk that holds it. */
export function acquireLock(dataDir: string, url: string): DeskLock {
  try {
    fs.mkdirSync(dataDir, { recursive: true });
    fs.accessSync(dataDir, fs.constants.W_OK);
  } catch (error) {
    throw notWritable(dataDir, error as NodeJS.ErrnoException);
  }
  const file = lockFile(dataDir);
  const info: LockInfo = {
    pid: process.pid,
    url,
    startedAt: new Date().toISOString(),
    processes: {},
    services: [],
  };
  let previous: LockInfo | null = null;
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      // 'wx' fails when the file exists: two desks starting at once cannot both win.
      fs.writeFileSync(file, JSON.stringify(info, null, 2), { flag: 'wx' });
      break;
    } catch (error) {
      const e = error as NodeJS.ErrnoException;
      if (e.code !== 'EEXIST') throw notWritable(dataDir, e);
      const held = readLock(dataDir);
      if (held && held.pid !== process.pid && isLauncher(held.pid)) {
        throw new AlreadyRunning(`already running at ${held.url}, pid ${held.pid}`);
      }
      if (attempt === 1) throw new AlreadyRunning(`another desk is taking ${file} at this moment`);
      previous = held;
      fs.rmSync(file, { force: true });
    }
  }
  const write = () => {
    const tmp = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, JSON.stringify(info, null, 2));
    fs.renameSync(tmp, file);
  };
  return {
    file,
    previous,
    update(change) {
      Object.assign(info, change);
      if (readLock(dataDir)?.pid === process.pid) write();
    },
    release() {
      if (readLock(dataDir)?.pid === process.pid) fs.rmSync(file, { force: true });
    },
  };
}
