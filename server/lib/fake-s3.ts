// The local fake S3 server (s3rver from npm): the objects live as files under `dir`, and it
// listens on the loopback address only. The start command runs it as a process of its own
// (server/s3-fake.ts), the test command in its own process for the length of the run.
import fs from 'node:fs';
import S3rver from 's3rver';

/** The keys the fake accepts (it checks every request's signature with them). */
export const FAKE_S3_KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } as const;

export interface FakeS3 {
  url: string;
  port: number;
  close(): Promise<void>;
}

export async function startFakeS3(opts: { dir: string; port: number }): Promise<FakeS3> {
  fs.mkdirSync(opts.dir, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port: opts.port,
    directory: opts.dir,
    silent: true,
    // Buckets are named in the path (S3_FORCE_PATH_STYLE), never in the host name.
    vhostBuckets: false,
  });
  const { port } = await server.run();
  return { url: `http://127.0.0.1:${port}`, port, close: () => server.close() };
}

/** The S3_* settings that point the API, the worker and the seed at a fake on `url`. */
export function fakeS3Env(url: string, bucket: string): Record<string, string> {
  return {
    S3_ENDPOINT: url,
    S3_BUCKET: bucket,
    S3_REGION: 'us-east-1',
    S3_ACCESS_KEY_ID: FAKE_S3_KEYS.accessKeyId,
    S3_SECRET_ACCESS_KEY: FAKE_S3_KEYS.secretAccessKey,
    S3_FORCE_PATH_STYLE: 'true',
  };
}
