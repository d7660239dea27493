// The desk's list of hand-offs addressed to the signed-in person (each a mail the desk wrote
// them: a package to review, a decision to issue, findings answered…), and the live stream.
import { z } from 'zod';

export const HandOff = z.object({
  id: z.uuid(),
  /** What was handed over, in words (the mail's subject). */
  text: z.string(),
  /** What kind of hand-off, in words. */
  kind: z.string(),
  packageId: z.uuid().nullable(),
  at: z.string(),
  read: z.boolean(),
});
export type HandOff = z.infer<typeof HandOff>;

export const HandOffList = z.object({
  /** Unread hand-offs, counted up to 100 (shown as "99+" beyond). */
  unread: z.number().int(),
  items: z.array(HandOff),
});
export type HandOffList = z.infer<typeof HandOffList>;

export const MarkHandOffsRead = z
  .object({
    ids: z
      .array(z.uuid({ message: 'each id must be a hand-off id' }))
      .max(200, { message: 'at most 200 hand-offs at once' })
      .optional(),
    all: z.literal(true).optional(),
  })
  .refine((b) => (b.ids?.length ?? 0) > 0 || b.all === true, {
    message: 'name the hand-offs to mark read (ids), or all of them (all: true)',
    path: ['ids'],
  });
export type MarkHandOffsRead = z.infer<typeof MarkHandOffsRead>;

export const HandOffsUnread = z.object({ unread: z.number().int() });
