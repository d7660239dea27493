// Where file bytes live: an object store spoken to through the S3 API (s3-storage.ts), a
// real one or the local fake S3 server that the start and test commands run.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import type { Readable } from 'node:stream';

/** Byte offsets, both inclusive, as in an HTTP Range. */
export interface ByteRange {
  start: number;
  end: number;
}

/** A stored object opened for reading: its size first, so a caller can answer a Range before any byte is read. */
export interface StoredObject {
  size: number;
  /** The bytes of `range` (the whole object without one) as a stream; nothing is held in memory. */
  stream(range?: ByteRange): Readable;
}

export interface Storage {
  put(key: string, bytes: Uint8Array): Promise<void>;
  /**
   * The object's size and a ranged reader, or null when there is no such object. An object
   * store does the same with a HEAD for the size and a GET with a Range header for the stream.
   */
  open(key: string): Promise<StoredObject | null>;
  delete(key: string): Promise<void>;
  /** Store the file at `file`, streamed from disk (large files never pass through memory); the caller keeps the file. */
  putFile(key: string, file: string): Promise<void>;
  /** Write the stored bytes to the local file `dest`, streamed. */
  getFile(key: string, dest: string): Promise<void>;
  /**
   * Store what `body` yields as it arrives (an upload still being received): a multipart
   * upload of small parts, so memory holds a few parts whatever the file's size. `done`
   * settles when the object is stored; `abort` stops it and leaves no object behind.
   */
  putStream(key: string, body: Readable): StreamedPut;
}

export interface StreamedPut {
  done: Promise<void>;
  abort(): Promise<void>;
}

/**
 * Every key is made by the code from ids it generated (`revisions/<uuid>/<uuid>.pdf`), never
 * from what a person typed; anything else is refused before it reaches the store.
 */
export function checkStorageKey(key: string): string {
  if (!/^[a-z0-9][a-z0-9/_.-]*$/i.test(key) || key.includes('..') || key.length > 512)
    throw new Error(`bad storage key ${key}`);
  return key;
}

export function sha256(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** The sha-256 of a file, streamed from disk. */
export async function sha256OfFile(file: string): Promise<string> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(file, { highWaterMark: 1 << 20 })) hash.update(chunk as Buffer);
  return hash.digest('hex');
}
