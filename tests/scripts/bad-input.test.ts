// Faults a person meets when starting the desk, each answered with one sentence naming the
// cause and the fix, no stack trace, nothing started. Run as the unprivileged user
// "nobody", because root may write anywhere and installs missing packages itself.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { which } from '../../scripts/lib/services';
import { deskEnv, freePorts, launch } from './desk';

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'counterpoise-bad-'));
fs.chmodSync(tmp, 0o755);
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

const runuser = which('runuser') ?? '/usr/sbin/runuser';
const asNobody = (env: NodeJS.ProcessEnv) =>
  launch(env, {
    ready: false,
    command: [
      runuser,
      '-u',
      'nobody',
      '--',
      // By its full path: runuser looks it up in the restricted PATH otherwise.
      which('env') ?? '/usr/bin/env',
      ...Object.entries(env).map(([k, v]) => `${k}=${v}`),
      process.execPath,
      '--import',
      'tsx',
      'scripts/start.ts',
    ],
  });

/** Only the variables the command needs, so nothing of the caller's leaks into it. */
function minimalEnv(dataDir: string, ports: Awaited<ReturnType<typeof freePorts>>, pathDirs: string) {
  const env = deskEnv(dataDir, ports, { PATH: pathDirs, HOME: tmp });
  return Object.fromEntries(
    Object.entries(env).filter(([k]) => /^(PATH|HOME|DATA_DIR|PORT|CP_|SKIP_CLIENT_BUILD|LOG_LEVEL)/.test(k)),
  );
}

describe.runIf(process.getuid?.() === 0)('starting with a fault', () => {
  it('when the data folder is not writable, then one sentence names the folder, the user and the fix', async () => {
    const readOnly = path.join(tmp, 'read-only');
    fs.mkdirSync(readOnly, { mode: 0o755 });
    const desk = await asNobody(
      minimalEnv(path.join(readOnly, 'data'), await freePorts(), process.env.PATH!),
    );
    expect(await desk.exited).toBe(1);
    const lines = desk.output().trim().split('\n');
    expect(lines).toEqual([
      `[counterpoise] step "check the data folder" failed: the data folder ${path.join(readOnly, 'data')} is not writable by user nobody (EACCES); give that user write access to it or point DATA_DIR at a folder it can write.`,
    ]);
  }, 60_000);

  it('when a Debian package is missing and the user is not root, then one sentence names the packages and how to install them', async () => {
    // A PATH holding only node: redis-server, qpdf, pdftoppm (poppler-utils, the stamp's page
    // render) and apt-get are not found.
    const bin = path.join(tmp, 'bin');
    fs.mkdirSync(bin);
    fs.symlinkSync(process.execPath, path.join(bin, 'node'));
    const writable = path.join(tmp, 'writable');
    fs.mkdirSync(writable, { mode: 0o777 });
    fs.chmodSync(writable, 0o777);
    const desk = await asNobody(minimalEnv(path.join(writable, 'data'), await freePorts(), bin));
    expect(await desk.exited).toBe(1);
    const lines = desk.output().trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(
      /^\[counterpoise\] step "install packages" failed: missing Debian packages redis-server, qpdf, poppler-utils: install them with your system's package manager \(Debian names: redis-server qpdf poppler-utils\), then start again\.$/,
    );
    expect(fs.existsSync(path.join(writable, 'data', 'pg'))).toBe(false);
  }, 60_000);
});
