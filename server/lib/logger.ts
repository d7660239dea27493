// Structured logs with pino: one JSON line per event, the request id on request logs.
import { pino } from 'pino';

export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
  base: { service: process.env.CP_SERVICE ?? 'api' },
  redact: ['req.headers.cookie', 'req.headers.authorization', 'password', 'passwordHash'],
});
