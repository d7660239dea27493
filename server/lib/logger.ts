// Structured logs with pino: one JSON line per event, the request id on request logs.
// Secrets never reach a log line: cookies, set-cookie and authorisation of requests and
// responses, passwords, the invitation token in an invitation's address, and the values
// (user-entered text) of a failed SQL query's parameters.
import { pino } from 'pino';
import { logSettings } from '../config';

const settings = logSettings();

export const REDACTED = '[redacted]';

export const REDACT_PATHS = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-csrf-guard"]',
  'res.headers["set-cookie"]',
  'res.headers.cookie',
  'res.headers.authorization',
  'password',
  'passwordHash',
  'currentPassword',
  'newPassword',
  'token',
  'err.parameters',
  'err.detail',
  'err.driverError.parameters',
  'err.driverError.detail',
  'err.body',
];

/** An address with invitation tokens (and any token= query value) replaced. */
export function redactUrl(url: string | undefined): string | undefined {
  if (!url) return url;
  return url
    .replace(/(\/invites\/)[^/?#]+/gi, `$1${REDACTED}`)
    .replace(/([?&](?:token|invite|code)=)[^&#]*/gi, `$1${REDACTED}`);
}

export const logger = pino({
  level: settings.level,
  base: { service: settings.service },
  redact: { paths: REDACT_PATHS, censor: REDACTED },
});
