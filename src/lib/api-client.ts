// The one way the client talks to the API: same-origin fetch with the session cookie,
// JSON in and out, and every failure turned into an ApiError carrying the server's
// error code, message and field errors ({error:{code,message,fields}}).
import type { z } from 'zod';
import { ErrorBody } from '@shared/schemas/common';

export type FieldError = { path: string; message: string };

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldError[];

  constructor(status: number, code: string, message: string, fields: FieldError[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/**
 * Sent with every state-changing request: the server refuses a signed-in change without it
 * (a form or a no-cors fetch from another site cannot set a custom header).
 */
export const CSRF_HEADER = { 'X-CSRF-Guard': '1' } as const;

type Query = Record<string, string | number | undefined | null>;

type RequestOptions = {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  query?: Query;
  signal?: AbortSignal;
};

/** Builds `?a=1&b=2` in the order given, leaving out empty values, so query keys and URLs match. */
export function toQueryString(query: Query | undefined): string {
  if (!query) return '';
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    params.append(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'Your session has ended. Sign in again.',
  403: 'Your role does not allow this.',
  404: 'Not found. It may have been removed, or it belongs to another organisation.',
  429: 'Too many attempts in a short time. Wait a minute, then try again.',
  503: 'The desk is temporarily unavailable. Try again in a minute.',
};

async function toApiError(response: Response): Promise<ApiError> {
  let payload: unknown = undefined;
  try {
    payload = await response.json();
  } catch {
    // Not JSON (a proxy page, an empty body): fall back to a plain message below.
  }
  const parsed = ErrorBody.safeParse(payload);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(response.status, code, message, fields ?? []);
  }
  return new ApiError(
    response.status,
    `http_${response.status}`,
    FALLBACK_MESSAGES[response.status] ??
      `The server answered ${response.status}. Try again; if it persists, tell the desk administrator.`,
  );
}

export async function request<T>(
  path: string,
  options: RequestOptions = {},
  schema?: z.ZodType<T>,
): Promise<T> {
  const { method = 'GET', body, query, signal } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') Object.assign(headers, CSRF_HEADER);

  let response: Response;
  try {
    response = await fetch(`${path}${toQueryString(query)}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'include',
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(
      0,
      'network_error',
      'Could not reach the Counterpoise server. Check your connection and try again.',
    );
  }

  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;

  const data: unknown = await response.json();
  if (!schema) return data as T;
  const result = schema.safeParse(data);
  if (!result.success) {
    throw new ApiError(
      response.status,
      'unexpected_response',
      `The server's answer to ${path} did not have the expected shape. Reload the page; if it persists, tell the desk administrator.`,
    );
  }
  return result.data;
}

export const api = {
  get: <T>(path: string, schema?: z.ZodType<T>, options: Omit<RequestOptions, 'method' | 'body'> = {}) =>
    request(path, { ...options, method: 'GET' }, schema),
  post: <T>(path: string, body?: unknown, schema?: z.ZodType<T>) =>
    request(path, { method: 'POST', body }, schema),
  put: <T>(path: string, body?: unknown, schema?: z.ZodType<T>) =>
    request(path, { method: 'PUT', body }, schema),
  delete: <T = void>(path: string) => request<T>(path, { method: 'DELETE' }),
};

/** Turns an upload's error answer (JSON or not) into an ApiError, as `request` does. */
export function apiErrorFrom(status: number, text: string): ApiError {
  let payload: unknown = undefined;
  try {
    payload = JSON.parse(text);
  } catch {
    // Not JSON: fall back to a plain message below.
  }
  const parsed = ErrorBody.safeParse(payload);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(status, code, message, fields ?? []);
  }
  return new ApiError(
    status,
    status === 0 ? 'network_error' : `http_${status}`,
    status === 0
      ? 'Could not reach the Counterpoise server. Check your connection and try again.'
      : (FALLBACK_MESSAGES[status] ??
          `The server answered ${status}. Try again; if it persists, tell the desk administrator.`),
  );
}
