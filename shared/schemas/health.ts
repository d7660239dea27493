// GET /api/health: whether the database and the job queue answer (503 with the same body when either
// is down; `error` names the outage with the code the error handler uses).
import { z } from 'zod';

/** `error` is the fixed words "not answering": the driver's own text is logged, not shown. */
const Probe = z.object({ ok: z.boolean(), error: z.literal('not answering').optional() });

export const HealthResponse = z.object({
  status: z.enum(['ok', 'degraded']),
  database: Probe,
  queue: Probe,
  error: z
    .object({ code: z.enum(['database_unavailable', 'queue_unavailable']), message: z.string() })
    .optional(),
});
export type HealthResponse = z.infer<typeof HealthResponse>;
