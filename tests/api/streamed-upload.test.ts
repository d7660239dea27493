// Uploads stream with bounded memory and time, measured in a real API process
// (server/index.ts): a ~150 MB scan and a compression bomb each grow its resident memory by
// less than 64 MB (peak, from /proc: VmHWM after clear_refs, against VmRSS before); the bomb
// is refused in words naming the file, with no object and no row, while /api/health keeps
// answering within a second; an upload cut off half-way leaves no object, no row and no
// working copy. The PDFs are written to disk by the test and sent from disk.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeWorld } from '../support/factories';
import { TEST_PASSWORD, startTestApp, type TestApp } from '../support/app';
import { writeBombPdf, writeNoisePdf } from '../support/big-pdfs';
import { makePdf } from '../support/pdfs';
import { storedObjects } from '../support/s3';
import { until } from '../support/until';
import { freePort } from '../../scripts/lib/services';

const MB = 1024 * 1024;
let t: TestApp;
let api: ChildProcess;
let dir: string;
let base: string;
let port: number;
let big: string;
let bomb: string;

beforeAll(async () => {
  t = await startTestApp();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cp-stream-'));
  big = path.join(dir, 'scanned-lift-plan.pdf');
  bomb = path.join(dir, 'crane-plan-packed.pdf');
  await writeNoisePdf(big, 150 * 1000 * 1000);
  // About 1 MB on disk, 1 GiB unpacked.
  await writeBombPdf(bomb, 1024 * MB);
  // What an API process that ended mid-upload would leave behind.
  fs.mkdirSync(path.join(dir, 'data', 'work', 'uploads'), { recursive: true });
  fs.writeFileSync(path.join(dir, 'data', 'work', 'uploads', 'left-by-a-crash.upload'), 'partial');
  const logFile = path.join(dir, 'api.log');
  port = await freePort();
  base = `http://127.0.0.1:${port}`;
  const out = fs.openSync(logFile, 'a');
  // spawns: node
  api = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'warn',
      HOST: '127.0.0.1',
      PORT: String(port),
      APP_URL: base,
      DATA_DIR: path.join(dir, 'data'),
      REDIS_PREFIX: t.ctx.config.REDIS_PREFIX,
      UPLOAD_MAX_BYTES: String(200 * MB),
      CP_SERVICE: 'api',
    },
    stdio: ['ignore', out, out],
  });
  await until(async () => (await fetch(`${base}/api/health`)).status === 200, 60_000, 'API listening');
}, 120_000);

afterAll(async () => {
  if (api && api.exitCode === null) {
    const exited = new Promise((r) => api.once('exit', r));
    api.kill('SIGTERM');
    await exited;
  }
  await t?.close();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

function procStatus(pid: number, field: 'VmRSS' | 'VmHWM'): number {
  const line = fs
    .readFileSync(`/proc/${pid}/status`, 'utf8')
    .split('\n')
    .find((l) => l.startsWith(`${field}:`));
  return Number(/(\d+)/.exec(line ?? '')?.[1] ?? NaN) * 1024;
}

/** Runs `fn` and gives the API process's peak resident memory above what it held before. */
async function rssGrowth<T>(fn: () => Promise<T>): Promise<{ result: T; growth: number; before: number }> {
  const pid = api.pid!;
  // Resets the peak (VmHWM) to the current resident size (proc(5), clear_refs "5").
  fs.writeFileSync(`/proc/${pid}/clear_refs`, '5');
  const before = procStatus(pid, 'VmRSS');
  let sampled = before;
  const timer = setInterval(() => {
    sampled = Math.max(sampled, procStatus(pid, 'VmRSS'));
  }, 25);
  try {
    const result = await fn();
    const peak = Math.max(procStatus(pid, 'VmHWM'), sampled);
    return { result, growth: peak - before, before };
  } finally {
    clearInterval(timer);
  }
}

/** Runs `fn` while /api/health is asked every 100 ms; each answer's time (Infinity when not 200). */
async function probingHealth<T>(fn: () => Promise<T>): Promise<{ result: T; health: number[] }> {
  let answering = true;
  const health: number[] = [];
  const probe = (async () => {
    while (answering) {
      const started = Date.now();
      const res = await fetch(`${base}/api/health`);
      health.push(res.status === 200 ? Date.now() - started : Infinity);
      await new Promise((r) => setTimeout(r, 100));
    }
  })();
  try {
    return { result: await fn(), health };
  } finally {
    answering = false;
    await probe;
  }
}

async function signIn(email: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: base },
    body: JSON.stringify({ email, password: TEST_PASSWORD }),
  });
  expect(res.status).toBe(200);
  return /cp_session=([^;]+)/.exec(res.headers.get('set-cookie') ?? '')?.[1] ?? '';
}

async function newDraft() {
  const w = await makeWorld(t.ctx.dataSource);
  const token = await signIn(w.plannerA.email);
  const headers = { Cookie: `cp_session=${token}`, 'X-CSRF-Guard': '1', Origin: base };
  const created = await fetch(`${base}/api/packages`, {
    method: 'POST',
    headers: { ...headers, 'Content-Type': 'application/json' },
    body: JSON.stringify({ title: 'Streamed plans', siteId: w.site.id, plannedLiftDate: '2027-03-14' }),
  });
  expect(created.status).toBe(201);
  const body = (await created.json()) as { package: { id: string }; current: { id: string } };
  return { headers, packageId: body.package.id, revisionId: body.current.id };
}

type Answer = {
  status: number;
  body: { error?: { code: string; message: string } } & Record<string, unknown>;
};

/**
 * POSTs `file` as the multipart field "file" (kind lift_plan), streamed from disk. With
 * `cutAfter`, the request is destroyed once that many file bytes are sent (a client that
 * goes away half-way) and the answer is null.
 */
function sendFile(
  d: { headers: Record<string, string>; packageId: string },
  file: string,
  opts: { cutAfter?: number } = {},
): Promise<Answer | null> {
  const boundary = `----cp${Date.now()}`;
  const name = path.basename(file);
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\nlift_plan\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: application/pdf\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const size = fs.statSync(file).size;
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}/api/packages/${d.packageId}/files`, {
      method: 'POST',
      headers: {
        ...d.headers,
        'Content-Type': `multipart/form-data; boundary=${boundary}`,
        'Content-Length': String(head.length + size + tail.length),
      },
    });
    req.on('response', (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (text += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text ? JSON.parse(text) : {} }));
    });
    req.on('error', (error) => (opts.cutAfter ? resolve(null) : reject(error)));
    req.write(head);
    const stream = fs.createReadStream(file, { highWaterMark: 1 << 20 });
    let sent = 0;
    stream.on('data', (chunk) => {
      sent += chunk.length;
      if (!req.write(chunk)) {
        stream.pause();
        req.once('drain', () => stream.resume());
      }
      if (opts.cutAfter && sent >= opts.cutAfter) {
        stream.destroy();
        req.destroy();
        setTimeout(() => resolve(null), 200);
      }
    });
    stream.on('end', () => req.end(tail));
  });
}

const rowsOf = (revisionId: string) =>
  t.ctx.dataSource.query(`SELECT id, sha256 FROM uploaded_files WHERE revision_id = $1`, [revisionId]);
const workFiles = () => {
  const work = path.join(dir, 'data', 'work', 'uploads');
  return fs.existsSync(work) ? fs.readdirSync(work) : [];
};

describe('uploads stream with bounded memory', () => {
  it('when the API starts, then working copies left by an earlier process are removed', () => {
    expect(workFiles()).toEqual([]);
  });

  it('when a ~150 MB scan is uploaded, then it is stored whole with its sha-256, health answers meanwhile and the API grows by less than 64 MB', async () => {
    // One small upload first, so the growth measured is the upload's, not the first use of the code.
    const warm = path.join(dir, 'warm-up.pdf');
    fs.writeFileSync(warm, await makePdf(1));
    expect((await sendFile(await newDraft(), warm))?.status).toBe(201);
    const d = await newDraft();
    const {
      result: { result, growth, before },
      health,
    } = await probingHealth(() => rssGrowth(() => sendFile(d, big)));
    process.stdout.write(
      `150 MB upload: API resident memory ${Math.round(before / MB)} MB before, grew by ${(growth / MB).toFixed(1)} MB at its peak; /api/health answered ${health.length} times meanwhile, slowest ${Math.max(...health)} ms\n`,
    );
    expect(Math.max(...health)).toBeLessThan(1000);
    expect(result?.status).toBe(201);
    expect(result?.body).toMatchObject({
      originalName: 'scanned-lift-plan.pdf',
      pages: 1,
      sizeBytes: fs.statSync(big).size,
    });
    const [row] = await rowsOf(d.revisionId);
    expect(row.sha256).toBe(result?.body.sha256);
    const object = await t.ctx.storage.open(`revisions/${d.revisionId}/${row.id}.pdf`);
    expect(object?.size).toBe(fs.statSync(big).size);
    expect(workFiles()).toEqual([]);
    expect(growth).toBeLessThan(64 * MB);
  }, 180_000);

  it('when three ~150 MB scans are uploaded at once, then each is stored and the API grows by less than 3 × 64 MB', async () => {
    const drafts = await Promise.all([newDraft(), newDraft(), newDraft()]);
    const { result, growth } = await rssGrowth(() => Promise.all(drafts.map((d) => sendFile(d, big))));
    process.stdout.write(
      `three 150 MB uploads at once: API grew by ${(growth / MB).toFixed(1)} MB at its peak\n`,
    );
    expect(result.map((r) => r?.status)).toEqual([201, 201, 201]);
    expect(workFiles()).toEqual([]);
    expect(growth).toBeLessThan(3 * 64 * MB);
  }, 300_000);

  it('when a compression bomb is uploaded, then 422 names the file, nothing is stored, health answers meanwhile and the API grows by less than 64 MB', async () => {
    const d = await newDraft();
    const {
      result: { result, growth },
      health,
    } = await probingHealth(() => rssGrowth(() => sendFile(d, bomb)));
    process.stdout.write(
      `compression bomb (${(fs.statSync(bomb).size / MB).toFixed(1)} MB, 1 GiB unpacked): API grew by ${(growth / MB).toFixed(1)} MB; /api/health answered ${health.length} times meanwhile, slowest ${Math.max(...health)} ms\n`,
    );
    expect(result?.status).toBe(422);
    expect(result?.body.error?.code).toBe('decompression_limit');
    expect(result?.body.error?.message).toBe(
      'The file “crane-plan-packed.pdf” unpacks to more than 256 MB (on page 1), the desk’s limit for a file of its size: it looks like a compression bomb, not a drawing. Save or print it as a new PDF and upload that copy.',
    );
    expect(await rowsOf(d.revisionId)).toEqual([]);
    expect(await storedObjects(t.ctx.config, `revisions/${d.revisionId}/`)).toEqual([]);
    expect(workFiles()).toEqual([]);
    expect(health.length).toBeGreaterThan(0);
    expect(Math.max(...health)).toBeLessThan(1000);
    expect(growth).toBeLessThan(64 * MB);
  }, 120_000);

  it('when an upload is cut off half-way, then no object, no row and no working copy are left', async () => {
    const d = await newDraft();
    expect(await sendFile(d, big, { cutAfter: 40 * MB })).toBeNull();
    await until(
      async () =>
        (await storedObjects(t.ctx.config, `revisions/${d.revisionId}/`)).length === 0 &&
        workFiles().length === 0,
      15_000,
      'the cut-off upload cleaned up',
    );
    expect(await rowsOf(d.revisionId)).toEqual([]);
    // The API goes on answering uploads.
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
  }, 60_000);
});
