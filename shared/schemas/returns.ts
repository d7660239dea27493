// Stamped returns of a package, as GET/POST /api/packages/:id/returns answer them.
import { z } from 'zod';
import { UnitSystem } from './common';

export const StampedReturn = z.object({
  id: z.uuid(),
  revisionId: z.uuid(),
  state: z.enum(['pending', 'ready', 'failed']),
  progress: z.number().int(),
  error: z.string().nullable(),
  sha256: z.string().nullable(),
  pages: z.number().int().nullable(),
  verificationCode: z.string(),
  /** The unit system of the whole document, fixed when it was issued. */
  unitSystem: UnitSystem,
  createdAt: z.string(),
  readyAt: z.string().nullable(),
});
export type StampedReturn = z.infer<typeof StampedReturn>;

export const ReturnList = z.object({ items: z.array(StampedReturn) });
export type ReturnList = z.infer<typeof ReturnList>;
