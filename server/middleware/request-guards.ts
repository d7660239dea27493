// Guards every API request passes before its route: the cross-site request guard, the
// content types a route takes, and the shape limits of a JSON body (depth, keys, text).
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { unsafeTextReason } from '@shared/schemas/safe-text';
import { AppError } from '../lib/app-error';
import { SESSION_COOKIE } from '../modules/auth/passport';

/** The header the client sets on every state-changing request (src/lib/api-client.ts). */
export const CSRF_HEADER = 'x-csrf-guard';
export const JSON_MAX_DEPTH = 32;
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/**
 * Routes that take a file upload (method and path); every other route with a body takes JSON
 * only, including the library's other routes.
 */
const MULTIPART_ROUTES: ReadonlyArray<{ method: string; path: RegExp }> = [
  { method: 'POST', path: /^\/api\/packages\/[^/]+\/files\/?$/ },
  { method: 'POST', path: /^\/api\/library\/chart-import\/file\/?$/ },
  { method: 'POST', path: /^\/api\/library\/versions\/[^/]+\/document\/?$/ },
];
const FORBIDDEN_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/**
 * A state-changing request must come from the desk's own pages: a browser on another
 * origin (even of the same site) is refused by its Fetch-Metadata or Origin header, and a
 * request carrying the session cookie must also carry the custom header, which a form or a
 * no-cors fetch from another page cannot set.
 */
export function csrfGuard(appOrigin: string | null): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const site = req.get('sec-fetch-site');
    if (site && site !== 'same-origin' && site !== 'none') {
      return next(crossSite(`the browser says it was sent from a ${site} page`));
    }
    const origin = req.get('origin');
    if (origin !== undefined) {
      const own = `${req.protocol}://${req.get('host') ?? ''}`;
      if (origin !== own && origin !== appOrigin) {
        return next(crossSite(`it comes from ${origin.slice(0, 100)}, not from this desk`));
      }
    }
    if (req.cookies?.[SESSION_COOKIE] && req.get(CSRF_HEADER) !== '1') {
      return next(
        new AppError(
          403,
          'csrf_header_missing',
          `A signed-in change needs the header X-CSRF-Guard: 1 (the desk's pages send it).`,
        ),
      );
    }
    next();
  };
}

function crossSite(why: string) {
  return new AppError(403, 'cross_site_request', `This request was refused because ${why}.`);
}

function hasBody(req: Request) {
  const length = req.get('content-length');
  return (length !== undefined && length !== '0') || req.get('transfer-encoding') !== undefined;
}

/** 415 for a body whose type the route does not take (JSON routes JSON, uploads multipart). */
export const contentTypeGuard: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method) || !hasBody(req)) return next();
  const path = req.originalUrl.split('?')[0];
  const multipart = MULTIPART_ROUTES.some((r) => r.method === req.method && r.path.test(path));
  const wanted = multipart ? 'multipart/form-data' : 'application/json';
  if (!req.is(wanted)) {
    const sent = req.get('content-type') ?? 'no content type';
    return next(
      new AppError(415, 'unsupported_media_type', `This route takes ${wanted}; the request sent ${sent}.`, [
        { path: 'content-type', message: `content-type must be ${wanted}` },
      ]),
    );
  }
  next();
};

/**
 * Depth of a JSON text without parsing it (brackets outside strings), so a 10,000-level
 * body is refused before JSON.parse or any validator recurses into it.
 */
export function jsonDepth(text: string, stopAt: number): number {
  let depth = 0;
  let max = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 92) i++;
      else if (c === 34) inString = false;
    } else if (c === 34) inString = true;
    else if (c === 123 || c === 91) {
      depth++;
      if (depth > max) max = depth;
      if (max > stopAt) return max;
    } else if (c === 125 || c === 93) depth--;
  }
  return max;
}

/** express.json's verify hook: the depth limit, before the text is parsed. */
export function verifyJsonDepth(_req: unknown, _res: unknown, buf: Buffer) {
  if (jsonDepth(buf.toString('utf8'), JSON_MAX_DEPTH) > JSON_MAX_DEPTH) {
    throw new AppError(
      400,
      'too_deep',
      `The request body is nested deeper than the limit of ${JSON_MAX_DEPTH} levels.`,
      [{ path: '(root)', message: `nesting must be at most ${JSON_MAX_DEPTH} levels` }],
    );
  }
}

/** The first problem of a parsed value (unsafe text or a prototype key), with its path. */
export function inputProblem(value: unknown, path: string[] = []): { path: string; message: string } | null {
  if (typeof value === 'string') {
    const reason = unsafeTextReason(value);
    return reason
      ? { path: path.join('.') || '(root)', message: `${path.join('.') || 'text'} ${reason}` }
      : null;
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const p = inputProblem(value[i], [...path, String(i)]);
      if (p) return p;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const key of Object.keys(value)) {
      const at = [...path, key];
      if (FORBIDDEN_KEYS.has(key)) {
        return { path: at.join('.'), message: `the key "${key}" is not accepted` };
      }
      const keyReason = unsafeTextReason(key);
      if (keyReason) return { path: at.join('.'), message: `a key ${keyReason}` };
      const p = inputProblem((value as Record<string, unknown>)[key], at);
      if (p) return p;
    }
  }
  return null;
}

/** 400 naming the field for NUL characters, lone surrogates or prototype keys anywhere in a request. */
export const inputTextGuard: RequestHandler = (req, _res, next) => {
  for (const [part, value] of [
    ['params', req.params],
    ['query', req.query],
    ['body', req.body],
  ] as const) {
    const problem = inputProblem(value, part === 'body' ? [] : [part]);
    if (problem) {
      return next(new AppError(400, 'invalid_input', `${problem.path}: ${problem.message}`, [problem]));
    }
  }
  let url = req.originalUrl;
  try {
    url = decodeURIComponent(url);
  } catch {
    return next(
      AppError.badRequest('The address is not valid percent-encoding.', [
        { path: 'url', message: 'url is not valid' },
      ]),
    );
  }
  const reason = unsafeTextReason(url);
  if (reason) return next(AppError.badRequest(`url ${reason}`, [{ path: 'url', message: `url ${reason}` }]));
  next();
};
