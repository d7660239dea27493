// One error handler: AppError and zod errors become the JSON error shape; anything else
// is logged with its stack and answered with a plain 500. Clients never see a stack trace.
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError, fromZod } from '../lib/app-error';
import { logger } from '../lib/logger';

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not_found', `No route ${req.method} ${req.path}.`));
};

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let error: AppError;
  if (err instanceof AppError) error = err;
  else if (err instanceof ZodError) error = fromZod(err);
  else if (err?.type === 'entity.parse.failed') {
    error = new AppError(400, 'invalid_json', `The request body is not valid JSON: ${err.message}`);
  } else if (err?.type === 'entity.too.large') {
    error = new AppError(
      413,
      'too_large',
      `The request body is larger than the limit of ${err.limit} bytes.`,
    );
  } else if (err?.code === 'LIMIT_FILE_SIZE') {
    error = new AppError(413, 'file_too_large', err.message, [
      { path: err.field ?? 'file', message: err.message },
    ]);
  } else {
    (req.log ?? logger).error({ err }, 'unhandled error');
    error = new AppError(500, 'internal', 'Something went wrong on our side. The error has been logged.');
  }
  res.status(error.status).json({
    error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) },
  });
};
