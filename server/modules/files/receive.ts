// Receives one uploaded file as it arrives, without holding it in memory: each chunk goes to
// the object store (a multipart upload of small parts, under the key the route chose before
// the body was read) and to a working copy on disk (which the PDF check reads in another
// process), while its sha-256 and size are counted. A body over the size limit, a client that
// goes away half-way or an object store that stops answering aborts the multipart upload and
// deletes the working copy: nothing is left behind. A multer storage engine, so multer keeps
// parsing the form (fields, limits, a body without its closing boundary).
import { createHash, randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { once } from 'node:events';
import { PassThrough, type Readable } from 'node:stream';
import { finished } from 'node:stream/promises';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer, { type StorageEngine } from 'multer';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../lib/storage';

export interface ReceivedUpload {
  /** Where the object store holds it (removed again if the upload is refused). */
  storageKey: string;
  /** The working copy on disk, for the check; the caller deletes it (`discardWorkFile`). */
  workFile: string;
  size: number;
  sha256: string;
  originalName: string;
}

const targets = new WeakMap<Request, string>();
const received = new WeakMap<Request, ReceivedUpload>();

/** Name the storage key the next upload of this request goes to (before its body is read). */
export function receiveInto(req: Request, storageKey: string) {
  targets.set(req, storageKey);
}

/** The file this request's body carried, stored and on disk; null when it had none. */
export function receivedUpload(req: Request): ReceivedUpload | null {
  return received.get(req) ?? null;
}

/** Remove what a refused upload left: its object and its working copy. */
export async function discardUpload(storage: Storage, upload: ReceivedUpload) {
  await storage.delete(upload.storageKey).catch(() => undefined);
  await discardWorkFile(upload);
}

export async function discardWorkFile(upload: Pick<ReceivedUpload, 'workFile'>) {
  await rm(upload.workFile, { force: true });
}

type MulterFile = Express.Multer.File & { stream: Readable };

class StreamedStorage implements StorageEngine {
  constructor(
    private readonly storage: Storage,
    private readonly workDir: string,
    private readonly maxBytes: number,
  ) {}

  _handleFile(req: Request, file: Express.Multer.File, cb: (error?: unknown, info?: object) => void) {
    const key = targets.get(req);
    if (!key) {
      cb(new Error('the upload route did not name a storage key'));
      return;
    }
    this.receive(key, file as MulterFile).then(
      (upload) => {
        received.set(req, upload);
        cb(null, { path: upload.workFile, size: upload.size });
      },
      (error: unknown) => cb(error),
    );
  }

  _removeFile(req: Request, _file: Express.Multer.File, cb: (error: Error | null) => void) {
    const upload = received.get(req);
    received.delete(req);
    if (!upload) return cb(null);
    discardUpload(this.storage, upload).then(
      () => cb(null),
      () => cb(null),
    );
  }

  private async receive(storageKey: string, file: MulterFile): Promise<ReceivedUpload> {
    await mkdir(this.workDir, { recursive: true });
    const workFile = path.join(this.workDir, `${randomUUID()}.upload`);
    const hash = createHash('sha256');
    let size = 0;
    const toStore = new PassThrough({ highWaterMark: 1 << 20 });
    const put = this.storage.putStream(storageKey, toStore);
    // Rejects when the store fails; never settles otherwise (so it can race every wait).
    const storeFailed = put.done.then(() => new Promise<never>(() => undefined));
    storeFailed.catch(() => undefined);
    const disk = createWriteStream(workFile);
    try {
      for await (const chunk of file.stream as AsyncIterable<Buffer>) {
        size += chunk.length;
        if (size > this.maxBytes) throw new multer.MulterError('LIMIT_FILE_SIZE', file.fieldname);
        hash.update(chunk);
        const waits: Promise<unknown>[] = [];
        if (!disk.write(chunk)) waits.push(once(disk, 'drain'));
        if (!toStore.write(chunk)) waits.push(once(toStore, 'drain'));
        if (waits.length) await Promise.race([Promise.all(waits), storeFailed]);
      }
      toStore.end();
      disk.end();
      await Promise.all([finished(disk), put.done]);
    } catch (error) {
      toStore.destroy();
      disk.destroy();
      await put.abort();
      await rm(workFile, { force: true });
      throw error;
    }
    return {
      storageKey,
      workFile,
      size,
      sha256: hash.digest('hex'),
      originalName: Buffer.from(file.originalname, 'latin1').toString('utf8'),
    };
  }
}

/**
 * The multipart middleware of an upload route: one file in the field "file", streamed as
 * above, within `maxBytes`; multer's refusals in words (413 over the limit, 400 otherwise).
 */
export function streamedUpload(opts: {
  storage: Storage;
  workDir: string;
  maxBytes: number;
  /** What the file is called in the 413 ("file", "manufacturer's document"). */
  what: string;
  fields: number;
}): RequestHandler {
  const upload = multer({
    storage: new StreamedStorage(opts.storage, opts.workDir, opts.maxBytes),
    // So that a name with folders reaches checkFileName and is refused.
    preservePath: true,
    limits: { fileSize: opts.maxBytes, files: 1, fields: opts.fields },
  }).single('file');
  return (req: Request, res: Response, next: NextFunction) =>
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          const mb = Math.round((opts.maxBytes / 1024 / 1024) * 10) / 10;
          return next(
            new AppError(413, 'file_too_large', `The ${opts.what} is larger than the limit of ${mb} MB.`, [
              { path: 'file', message: `file must be at most ${mb} MB` },
            ]),
          );
        }
        return next(
          new AppError(400, 'bad_upload', `The upload was refused: ${err.message}.`, [
            { path: err.field ?? 'file', message: err.message },
          ]),
        );
      }
      next(err);
    });
}
