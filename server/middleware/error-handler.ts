// One error handler: AppError and zod errors become the JSON error shape; a database or
// Redis that does not answer is an outage (503, one code each, so clients and load
// balancers can tell it from a bug); anything else is logged with its stack and answered
// with a plain 500. Clients never see a stack trace.
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { readableError } from '@shared/catalogue/readable-issue';
import { AppError, fromZod } from '../lib/app-error';
import { logger } from '../lib/logger';

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No route ${req.method} ${req.path}.`));
};

/** SQLSTATE classes and codes that mean the database is away, not that the query is wrong. */
const DB_DOWN_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'EPIPE',
  '57P01',
  '57P02',
  '57P03',
  '53300',
]);
const DB_DOWN_TEXT =
  /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error|the database system is (starting up|shutting down)|terminating connection due to administrator command/i;
const REDIS_DOWN_TEXT =
  /Stream isn't writeable|Connection is closed|MaxRetriesPerRequest|no answer from Redis/i;

/** The AppError for an error that means PostgreSQL or Redis is away, or null. */
export function outageOf(err: unknown): AppError | null {
  const e = err as {
    code?: string;
    message?: string;
    name?: string;
    driverError?: { code?: string; message?: string };
  };
  if (!e || typeof e !== 'object') return null;
  const message = `${e.message ?? ''} ${e.driverError?.message ?? ''}`;
  if (e.name === 'MaxRetriesPerRequestError' || REDIS_DOWN_TEXT.test(message)) {
    return new AppError(
      503,
      'queue_unavailable',
      'The job queue (Redis) is not answering. Try again in a minute; nothing stored was lost.',
    );
  }
  const code = e.driverError?.code ?? e.code ?? '';
  if (DB_DOWN_CODES.has(code) || code.startsWith('08') || DB_DOWN_TEXT.test(message)) {
    return new AppError(
      503,
      'database_unavailable',
      'The database is not answering. Try again in a minute; nothing stored was lost.',
    );
  }
  return null;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let error: AppError;
  const outage = outageOf(err);
  if (err instanceof AppError) {
    error = err;
    if (err.status === 503) {
      (req.log ?? logger).warn(
        { err: { message: (err as { reason?: string }).reason ?? err.message } },
        err.code,
      );
      res.setHeader('Retry-After', '10');
    }
  } else if (outage) {
    (req.log ?? logger).warn({ err: { message: err?.message, code: err?.code } }, outage.code);
    error = outage;
    res.setHeader('Retry-After', '10');
  } else if (err instanceof ZodError) error = fromZod(err);
  else if (err?.type === 'entity.parse.failed') {
    error = new AppError(400, 'invalid_json', `The request body is not valid JSON: ${err.message}`);
  } else if (err?.type === 'entity.too.large') {
    error = new AppError(
      413,
      'too_large',
      `The request body is larger than the limit of ${err.limit} bytes.`,
    );
  } else if (
    err instanceof Error &&
    /^(Unexpected end of form|Multipart: Boundary not found|Malformed part header|Unexpected end of multipart data)/.test(
      err.message,
    )
  ) {
    error = new AppError(400, 'bad_upload', `The upload is not a complete multipart body: ${err.message}.`, [
      { path: 'file', message: 'the multipart body must end with its closing boundary' },
    ]);
  } else if (err?.code === 'LIMIT_FILE_SIZE') {
    error = new AppError(413, 'file_too_large', err.message, [
      { path: err.field ?? 'file', message: err.message },
    ]);
  } else {
    (req.log ?? logger).error({ err }, 'unhandled error');
    error = new AppError(500, 'internal', 'Something went wrong on our side. The error has been logged.');
  }
  res
    .status(error.status)
    .json({ error: { code: error.code, ...readableError(error.message, error.fields) } });
};
