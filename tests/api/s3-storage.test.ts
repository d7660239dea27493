// The S3 storage against the test command's local fake S3 server: every call of the Storage
// interface, ranges streamed from the object store, and a missing key answered as null.
import { randomBytes, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connect, StartupError } from '@server/bootstrap';
import { loadConfig, s3Settings } from '@server/config';
import { freePort } from '../../scripts/lib/services';
import { PassThrough } from 'node:stream';
import { createS3Client, createS3Storage, S3Storage } from '@server/lib/s3-storage';
import { until } from '../support/until';
import { sha256, sha256OfFile } from '@server/lib/storage';

let storage: S3Storage;
let work: string;

beforeAll(async () => {
  storage = createS3Storage(s3Settings());
  await storage.ensureBucket();
  work = fs.mkdtempSync(path.join(os.tmpdir(), 's3-storage-test-'));
});

afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

const key = (name: string) => `tests/${randomUUID()}/${name}`;

async function bytesOf(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of stream) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
}

describe('S3 storage on the local fake S3 server', () => {
  it('when bytes are put, then open answers their size and streams them back whole', async () => {
    const k = key('plain.txt');
    await storage.put(k, Buffer.from('0123456789'));
    const object = await storage.open(k);
    expect(object?.size).toBe(10);
    expect(await text(object!.stream())).toBe('0123456789');
  });

  it('when a range is asked for, then only those bytes come back (both ends inclusive)', async () => {
    const k = key('ranged.bin');
    const bytes = randomBytes(300_000);
    await storage.put(k, bytes);
    const object = (await storage.open(k))!;
    expect(await bytesOf(object.stream({ start: 0, end: 0 }))).toEqual(bytes.subarray(0, 1));
    expect(await bytesOf(object.stream({ start: 1024, end: 2047 }))).toEqual(bytes.subarray(1024, 2048));
    expect(await bytesOf(object.stream({ start: 299_990, end: 299_999 }))).toEqual(bytes.subarray(299_990));
  });

  it('when a key was never stored, then open answers null', async () => {
    expect(await storage.open(key('never.pdf'))).toBeNull();
  });

  it('when an object is deleted, then open answers null and a second delete is harmless', async () => {
    const k = key('gone.txt');
    await storage.put(k, Buffer.from('bye'));
    await storage.delete(k);
    expect(await storage.open(k)).toBeNull();
    await expect(storage.delete(k)).resolves.toBeUndefined();
  });

  it('when a large file is put from disk and fetched to disk, then the bytes arrive unchanged', async () => {
    // Over one 8 MiB part, so the upload goes in parts.
    const source = path.join(work, 'large.bin');
    const bytes = randomBytes(9 * 1024 * 1024 + 123);
    fs.writeFileSync(source, bytes);
    const k = key('large.bin');
    await storage.putFile(k, source);
    expect((await storage.open(k))?.size).toBe(bytes.length);
    const dest = path.join(work, 'fetched.bin');
    await storage.getFile(k, dest);
    expect(await sha256OfFile(dest)).toBe(sha256(bytes));
  });

  it('when a body is streamed in as it arrives, then the object holds every byte, in parts', async () => {
    const k = key('streamed.bin');
    const body = new PassThrough();
    const put = storage.putStream(k, body);
    const chunks = Array.from({ length: 11 }, () => randomBytes(1024 * 1024));
    for (const c of chunks) if (!body.write(c)) await new Promise((r) => body.once('drain', r));
    body.end();
    await put.done;
    const dest = path.join(work, 'streamed.bin');
    await storage.getFile(k, dest);
    expect(await sha256OfFile(dest)).toBe(sha256(Buffer.concat(chunks)));
  });

  it('when a streamed put is aborted after its first parts, then the multipart upload is aborted and no object is left', async () => {
    const client = createS3Client(s3Settings());
    const commands: string[] = [];
    client.middlewareStack.add(
      (next, context) => async (args) => {
        commands.push(context.commandName ?? '');
        return next(args);
      },
      { step: 'initialize', name: 'recordCommands' },
    );
    const recorded = new S3Storage(client, s3Settings().S3_BUCKET);
    const k = key('cut-off.bin');
    const body = new PassThrough();
    const put = recorded.putStream(k, body);
    put.done.catch(() => undefined);
    body.write(randomBytes(12 * 1024 * 1024));
    await until(async () => commands.includes('UploadPartCommand'), 10_000, 'a part sent');
    body.destroy();
    await put.abort();
    await until(async () => commands.includes('AbortMultipartUploadCommand'), 10_000, 'the upload aborted');
    expect(commands).not.toContain('CompleteMultipartUploadCommand');
    expect(await recorded.open(k)).toBeNull();
    client.destroy();
  });

  it('when a key is not of the form the code makes, then it is refused before any request', async () => {
    await expect(storage.put('../escape', Buffer.from('x'))).rejects.toThrow(/bad storage key/);
    await expect(storage.open('/absolute')).rejects.toThrow(/bad storage key/);
    await expect(storage.open('a b')).rejects.toThrow(/bad storage key/);
  });

  it('when a stream is closed early, then it ends without an error escaping', async () => {
    const k = key('early.bin');
    await storage.put(k, randomBytes(2 * 1024 * 1024));
    const stream = (await storage.open(k))!.stream();
    await new Promise<void>((resolve) => stream.once('data', () => resolve()));
    stream.destroy();
    await new Promise((r) => setTimeout(r, 200));
    expect(stream.destroyed).toBe(true);
  });

  it('when the bucket already exists, then ensureBucket succeeds again', async () => {
    await expect(storage.ensureBucket()).resolves.toBeUndefined();
  });
});

describe('the start of the API and the worker', () => {
  it('when the S3 endpoint does not answer, then connecting fails with one line naming the bucket and the endpoint', async () => {
    const endpoint = `http://127.0.0.1:${await freePort()}`;
    const error = await connect({ ...loadConfig(), S3_ENDPOINT: endpoint }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(StartupError);
    expect((error as StartupError).message).toMatch(
      new RegExp(`^reach the S3 bucket failed: ${s3Settings().S3_BUCKET} at ${endpoint}: .+`),
    );
  });

  it('when the bucket does not exist yet, then connecting creates it', async () => {
    const bucket = `fresh-${randomUUID().slice(0, 8)}`;
    const ctx = await connect({ ...loadConfig(), S3_BUCKET: bucket });
    try {
      const k = key('first.txt');
      await ctx.storage.put(k, Buffer.from('first'));
      expect((await ctx.storage.open(k))?.size).toBe(5);
    } finally {
      await (ctx as { close?: () => Promise<void> }).close?.();
    }
  });
});
