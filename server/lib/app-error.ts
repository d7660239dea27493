// The one error type of the API and the worker: a code, an HTTP status, a message a
// person can act on, and the fields it concerns.
import type { ZodError } from 'zod';

export interface FieldError {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldError[],
  ) {
    super(message);
  }

  static badRequest(message: string, fields?: FieldError[]) {
    return new AppError(400, 'invalid_input', message, fields);
  }
  static unauthorised(message = 'Sign in to continue.') {
    return new AppError(401, 'unauthenticated', message);
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError(403, 'forbidden', message);
  }
  static notFound(what = 'resource') {
    return new AppError(404, 'not_found', `No such ${what}.`);
  }
  static conflict(message: string) {
    return new AppError(409, 'conflict', message);
  }
}

export function zodFields(error: ZodError, prefix?: string): FieldError[] {
  return error.issues.map((issue) => ({
    path: [prefix, ...issue.path.map(String)].filter(Boolean).join('.') || '(root)',
    message: issue.message,
  }));
}

export function fromZod(error: ZodError, prefix?: string): AppError {
  const fields = zodFields(error, prefix);
  const first = fields[0];
  return new AppError(
    400,
    'invalid_input',
    first ? `${first.path}: ${first.message}` : 'The request is not valid.',
    fields,
  );
}
