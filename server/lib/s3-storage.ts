// The Storage calls over the S3 API: a HEAD for an object's size, a GET with a Range header
// for a ranged stream, PutObject for bytes already in memory and a streamed (multipart when
// large) upload for a file on disk or a body still arriving. No call reads a whole object
// into memory. An S3 server that does not answer (refused, reset, timed out, 5xx) is told
// apart as StorageUnavailable (503 `storage_unavailable`), never as a database outage.
import { createReadStream, createWriteStream } from 'node:fs';
import { PassThrough, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { S3Settings } from '../config';
import { AppError } from './app-error';
import {
  checkStorageKey,
  type ByteRange,
  type Storage,
  type StoredObject,
  type StreamedPut,
} from './storage';

function status(error: unknown): number | undefined {
  return (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
}

function isMissing(error: unknown): boolean {
  const name = (error as Error).name;
  return status(error) === 404 || name === 'NotFound' || name === 'NoSuchKey';
}

const DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE']);
const DOWN_NAMES = new Set([
  'TimeoutError',
  'RequestTimeout',
  'ServiceUnavailable',
  'SlowDown',
  'InternalError',
]);

/** The object store is away (not: the request was wrong). */
class StorageUnavailable extends AppError {
  constructor(readonly reason: string) {
    super(
      503,
      'storage_unavailable',
      'The file store (S3) is not answering. Try again in a minute; nothing stored was lost.',
    );
    this.name = 'StorageUnavailable';
  }
}

/** `error` as StorageUnavailable when it means the S3 server did not answer; else itself. */
function asStorageOutage(error: unknown): unknown {
  if (error instanceof AppError) return error;
  const e = error as { code?: string; name?: string; message?: string; cause?: { code?: string } };
  const code = e?.code ?? e?.cause?.code ?? '';
  const http = status(error) ?? 0;
  if (
    DOWN_CODES.has(code) ||
    DOWN_NAMES.has(e?.name ?? '') ||
    http >= 500 ||
    /ECONNREFUSED|socket hang up/.test(e?.message ?? '')
  )
    return new StorageUnavailable(`${e?.name ?? 'Error'}: ${e?.message ?? code}`);
  return error;
}

async function guarded<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    throw asStorageOutage(error);
  }
}

export function createS3Client(s: S3Settings): S3Client {
  return new S3Client({
    endpoint: s.S3_ENDPOINT,
    region: s.S3_REGION,
    forcePathStyle: s.S3_FORCE_PATH_STYLE,
    credentials:
      s.S3_ACCESS_KEY_ID && s.S3_SECRET_ACCESS_KEY
        ? { accessKeyId: s.S3_ACCESS_KEY_ID, secretAccessKey: s.S3_SECRET_ACCESS_KEY }
        : undefined,
    // Checksums only where S3 requires them: a streamed body then goes as plain bytes, which
    // every S3 server (the local fake too) reads; each stored file's sha-256 is kept in the database.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
}

export class S3Storage implements Storage {
  constructor(
    private readonly client: S3Client,
    private readonly bucket: string,
  ) {}

  /** Creates the bucket when it is missing (a bucket this account already has is fine). */
  async ensureBucket() {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
      return;
    } catch (error) {
      if (!isMissing(error)) throw error;
    }
    try {
      await this.client.send(new CreateBucketCommand({ Bucket: this.bucket }));
    } catch (error) {
      // Another process (the API beside the worker) may have created it in between.
      const name = (error as Error).name;
      if (name !== 'BucketAlreadyOwnedByYou' && name !== 'BucketAlreadyExists') throw error;
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
    }
  }

  async put(key: string, bytes: Uint8Array) {
    const Key = checkStorageKey(key);
    await guarded(() =>
      this.client.send(
        new PutObjectCommand({ Bucket: this.bucket, Key, Body: bytes, ContentLength: bytes.byteLength }),
      ),
    );
  }

  putStream(key: string, body: Readable): StreamedPut {
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.bucket, Key: checkStorageKey(key), Body: body },
      // Parts of 5 MiB (S3's smallest), one in flight while the next one fills: an upload
      // being received holds about 10 MiB here, whatever its size. Two in flight measured
      // 38–52 MB of peak growth for a 150 MB upload against 31–33 MB, for about a second less.
      partSize: 5 * 1024 * 1024,
      queueSize: 1,
      // A failed part aborts the multipart upload: no parts are left behind on the server.
      leavePartsOnError: false,
    });
    let aborted = false;
    const done = guarded(() => upload.done()).then(() => undefined);
    return {
      done,
      abort: async () => {
        if (aborted) return;
        aborted = true;
        await upload.abort().catch(() => undefined);
        await done.catch(() => undefined);
        // A small body goes as one PutObject that may have landed before the abort.
        await this.delete(key).catch(() => undefined);
      },
    };
  }

  async putFile(key: string, file: string) {
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.bucket, Key: checkStorageKey(key), Body: createReadStream(file) },
      // Parts of 8 MiB, two at a time: a large return holds at most about 16 MiB here.
      partSize: 8 * 1024 * 1024,
      queueSize: 2,
    });
    await guarded(() => upload.done());
  }

  async getFile(key: string, dest: string) {
    const Key = checkStorageKey(key);
    const res = await guarded(() => this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key })));
    await pipeline(res.Body as Readable, createWriteStream(dest));
  }

  async open(key: string): Promise<StoredObject | null> {
    const Key = checkStorageKey(key);
    let size: number;
    try {
      const head = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key }));
      size = head.ContentLength ?? 0;
    } catch (error) {
      if (isMissing(error)) return null;
      throw asStorageOutage(error);
    }
    return {
      size,
      // Every stored object has its own key and is never rewritten, so the size holds while it streams.
      stream: (range?: ByteRange) => this.stream(Key, range),
    };
  }

  /** A stream at once; the GET is sent behind it, and its failure arrives as the stream's error. */
  private stream(Key: string, range?: ByteRange): Readable {
    const out = new PassThrough({ highWaterMark: 1 << 16 });
    const abort = new AbortController();
    // Never more than the range: a server that answers a one-byte range whole (the local fake
    // does for bytes=0-0) must not run past the Content-Length the response already sent.
    const length = range ? range.end - range.start + 1 : Infinity;
    out.once('close', () => abort.abort());
    this.client
      .send(
        new GetObjectCommand({
          Bucket: this.bucket,
          Key,
          Range: range ? `bytes=${range.start}-${range.end}` : undefined,
        }),
        { abortSignal: abort.signal },
      )
      .then((res) => pipeline(res.Body as Readable, (source) => atMost(source, length), out))
      .catch((error: Error) => out.destroy(error));
    return out;
  }

  async delete(key: string) {
    const Key = checkStorageKey(key);
    await guarded(() => this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key })));
  }
}

async function* atMost(source: AsyncIterable<Buffer>, length: number) {
  let left = length;
  for await (const chunk of source) {
    if (chunk.length >= left) {
      yield chunk.subarray(0, left);
      return;
    }
    left -= chunk.length;
    yield chunk;
  }
}

export function createS3Storage(s: S3Settings): S3Storage {
  return new S3Storage(createS3Client(s), s.S3_BUCKET);
}
