// How responses travel: JSON and the client's text assets compressed; the built client served
// with hashed assets cached for a year and index.html revalidated on every load, so a release
// reaches each browser on its next page load while unchanged chunks are never fetched again.
import path from 'node:path';
import compression from 'compression';
import express, { Router, type Request, type Response } from 'express';
import { notFoundHandler } from './error-handler';

/**
 * compression's own filter already leaves out types that are compressed (application/pdf,
 * image/png, fonts in woff/woff2). On top of it: never a partial response (its Content-Range
 * counts the stored bytes, and a gzip stream of a slice is not a slice of anything), never
 * a server-sent event stream (each event must reach the browser when it is written).
 */
export function shouldCompress(req: Request, res: Response): boolean {
  if (res.statusCode === 206 || res.getHeader('Content-Range') !== undefined) return false;
  if (String(res.getHeader('Content-Type') ?? '').startsWith('text/event-stream')) return false;
  return compression.filter(req, res);
}

export function compressResponses() {
  return compression({ filter: shouldCompress });
}

export const IMMUTABLE = 'public, max-age=31536000, immutable';

/**
 * The built client: dist/assets/* carry a content hash in their names (Vite), so they are
 * immutable; a missing one is a 404, never index.html. Everything else in dist/ (the favicon)
 * keeps a short cache, and index.html — the page that names the current hashes — is
 * revalidated every time. Any other path that is not the API gets index.html (client routes).
 */
export function clientFiles(clientDir: string): Router {
  const router = Router();
  const index = path.resolve(clientDir, 'index.html');
  const noCacheForIndex = (res: Response, file: string) => {
    if (path.resolve(file) === index) res.setHeader('Cache-Control', 'no-cache');
  };
  router.use(
    '/assets',
    express.static(path.join(clientDir, 'assets'), { index: false, immutable: true, maxAge: '365d' }),
  );
  router.use('/assets', notFoundHandler);
  router.use(express.static(clientDir, { index: false, maxAge: '1h', setHeaders: noCacheForIndex }));
  router.get(/^\/(?!api\/).*/, (_req, res) => {
    res.sendFile(index, { headers: { 'Cache-Control': 'no-cache' } });
  });
  return router;
}
