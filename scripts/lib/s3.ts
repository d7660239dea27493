// The local fake S3 server's process, as the start command supervises it and as the test
// command runs it for the length of a run (server/s3-fake.ts, objects under DATA_DIR/s3).
import { spawn } from 'node:child_process';
import type { ProcessSpec } from './supervisor';

export function fakeS3Spec(dataDir: string, port: number, logFile?: string): ProcessSpec {
  return {
    name: 's3-fake',
    command: process.execPath,
    args: ['--import', 'tsx', 'server/s3-fake.ts'],
    env: { ...process.env, DATA_DIR: dataDir, CP_SERVICE: 's3-fake', CP_S3_PORT: String(port) },
    logFile,
  };
}

/** Waits until something answers HTTP on url (the fake answers every request, even a bare GET). */
export async function waitForFakeS3(url: string, ms = 30_000, stillRunning: () => boolean = () => true) {
  const until = Date.now() + ms;
  for (;;) {
    if (!stillRunning()) throw new Error(`the fake S3 server exited before it answered on ${url}`);
    try {
      await fetch(url, { signal: AbortSignal.timeout(1000) });
      return;
    } catch {
      if (Date.now() > until)
        throw new Error(`the fake S3 server did not answer on ${url} within ${Math.round(ms / 1000)} s`);
      await new Promise((r) => setTimeout(r, 200));
    }
  }
}

export interface FakeS3Handle {
  url: string;
  port: number;
  stop(): void;
}

/** A fake S3 server for the tests: its objects in dataDir/s3, its output on the console. */
export async function startThrowawayS3(dataDir: string, port: number): Promise<FakeS3Handle> {
  const spec = fakeS3Spec(dataDir, port);
  // spawns: node (server/s3-fake.ts)
  const child = spawn(spec.command, spec.args, { env: spec.env, stdio: ['ignore', 'inherit', 'inherit'] });
  const url = `http://127.0.0.1:${port}`;
  const stop = () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
  };
  try {
    await waitForFakeS3(url, 30_000, () => child.exitCode === null);
  } catch (error) {
    stop();
    throw error;
  }
  return { url, port, stop };
}
