// The one way a stored file leaves the API: opened through the storage interface (size
// first, no bytes read), answered whole (200) or as one byte range (206, 416) from a
// stream, so a 100 MB package never sits in memory and a PDF viewer can fetch pages by range.
import type { Request, Response } from 'express';
import parseRange from 'range-parser';
import { pipeline } from 'node:stream';
import { AppError } from './app-error';
import { logger } from './logger';
import type { ByteRange, Storage } from './storage';

export interface StoredDownload {
  key: string;
  contentType: string;
  /** The Content-Disposition header exactly as the route words it. */
  disposition: string;
  /** The stored sha-256 (hex): sent as X-Content-SHA256 and as the strong ETag. */
  sha256: string | null;
  /** What a missing object is called in the 404 ("file", "stamped return"). */
  what: string;
}

type Decision = { status: 200 } | { status: 206; range: ByteRange } | { status: 416 };

/**
 * What a Range header asks of an object of `size` bytes. One range only: a header that asks
 * for several, names another unit, or does not parse is ignored (RFC 9110 §14.2 lets a server
 * answer such a request with the whole representation).
 */
export function decideRange(size: number, header: string | undefined): Decision {
  if (!header) return { status: 200 };
  const ranges = parseRange(size, header, { combine: true });
  if (ranges === -1) return { status: 416 };
  if (ranges === -2 || ranges.type !== 'bytes' || ranges.length !== 1) return { status: 200 };
  const [range] = ranges;
  return { status: 206, range: { start: range.start, end: range.end } };
}

export async function sendStored(req: Request, res: Response, storage: Storage, d: StoredDownload) {
  const object = await storage.open(d.key);
  if (!object) throw AppError.notFound(d.what);
  const etag = d.sha256 ? `"${d.sha256}"` : undefined;

  res.setHeader('Accept-Ranges', 'bytes');
  res.setHeader('X-Content-SHA256', d.sha256 ?? '');
  if (etag) res.setHeader('ETag', etag);
  // If-Range names the copy the client already holds part of; for any other copy, send it whole.
  const ifRange = req.get('If-Range');
  const decision = decideRange(
    object.size,
    ifRange !== undefined && ifRange !== etag ? undefined : req.get('Range'),
  );
  if (decision.status === 416) {
    res.setHeader('Content-Range', `bytes */${object.size}`);
    throw new AppError(
      416,
      'range_not_satisfiable',
      `The requested range is outside the file, which is ${object.size} bytes long.`,
    );
  }
  res.setHeader('Content-Type', d.contentType);
  res.setHeader('Content-Disposition', d.disposition);
  if (etag && req.fresh) {
    res.status(304).end();
    return;
  }
  const range = decision.status === 206 ? decision.range : undefined;
  if (range) {
    res.status(206);
    res.setHeader('Content-Range', `bytes ${range.start}-${range.end}/${object.size}`);
  }
  res.setHeader('Content-Length', String(range ? range.end - range.start + 1 : object.size));
  if (req.method === 'HEAD' || object.size === 0) {
    res.end();
    return;
  }
  // A client that goes away mid-file closes the response; the stream is then closed too.
  pipeline(object.stream(range), res, (error) => {
    if (error && error.code !== 'ERR_STREAM_PREMATURE_CLOSE')
      (req.log ?? logger).warn({ err: { message: error.message }, key: d.key }, 'stored file stream failed');
  });
}
