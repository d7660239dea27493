// Structured logs with pino: one JSON line per event, the request id on request logs.
import { pino } from 'pino';
import { logSettings } from '../config';

const settings = logSettings();

export const logger = pino({
  level: settings.level,
  base: { service: settings.service },
  redact: ['req.headers.cookie', 'req.headers.authorization', 'password', 'passwordHash'],
});
