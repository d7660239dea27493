// Where file bytes live. The embedded default is a folder under the data directory;
// another backend (an object store) implements the same calls.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
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
  /** Store the file at `file`, moving it when it can (large files never pass through memory). */
  putFile(key: string, file: string): Promise<void>;
  /** Write the stored bytes to the local file `dest`. */
  getFile(key: string, dest: string): Promise<void>;
}

export class LocalFolderStorage implements Storage {
  constructor(private readonly root: string) {}

  private resolve(key: string): string {
    if (!/^[a-z0-9][a-z0-9/_.-]*$/i.test(key) || key.includes('..'))
      throw new Error(`bad storage key ${key}`);
    return path.join(this.root, key);
  }

  async put(key: string, bytes: Uint8Array) {
    const file = this.resolve(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    await fs.writeFile(tmp, bytes);
    await fs.rename(tmp, file);
  }

  async putFile(key: string, source: string) {
    const file = this.resolve(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    await fs.rename(source, tmp).catch(() => fs.copyFile(source, tmp));
    await fs.rename(tmp, file);
  }

  async getFile(key: string, dest: string) {
    // A hard link when both are on one file system (stored files are never changed in place).
    await fs.link(this.resolve(key), dest).catch(() => fs.copyFile(this.resolve(key), dest));
  }

  async open(key: string): Promise<StoredObject | null> {
    const file = this.resolve(key);
    const stat = await fs.stat(file).catch((error: NodeJS.ErrnoException) => {
      if (error.code === 'ENOENT') return null;
      throw error;
    });
    if (!stat?.isFile()) return null;
    return {
      size: stat.size,
      // Every stored file has its own key and is never rewritten, so the size holds while it streams.
      stream: (range) => createReadStream(file, { ...range, highWaterMark: 1 << 16 }),
    };
  }

  async delete(key: string) {
    await fs.rm(this.resolve(key), { force: true });
  }
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
