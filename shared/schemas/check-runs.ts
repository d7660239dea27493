// The check run of a package's current revision as its page shows it: where the job is
// (waiting for the queue, queued, running, finished) and whether this person may run a
// check that could not run again.
import { z } from 'zod';
import { CHECK_RUN_STATES } from './packages';

export const CHECK_HAND_OFF = ['none', 'waiting_for_queue', 'queued', 'running', 'finished'] as const;

export const CheckRunStatus = z.object({
  revisionId: z.uuid(),
  revisionNumber: z.number().int(),
  status: z.enum(CHECK_RUN_STATES),
  progress: z.number().int(),
  /** Why the run stopped (invalid lift data, or the last attempt's failure). */
  error: z.string().nullable(),
  /** waiting_for_queue: stored, but the job queue has not taken it yet (it is unreachable). */
  handOff: z.enum(CHECK_HAND_OFF),
  /** Attempts that failed so far; the worker retries with a growing pause. */
  failedAttempts: z.number().int(),
  /** The check could not run and this person may run it again (contractor or reviewer). */
  canRetry: z.boolean(),
});
export type CheckRunStatus = z.infer<typeof CheckRunStatus>;
