// Where the stamp block goes on page 1 of a revision's plan: the engineer's placement (the
// lower-left corner of the block's outline in the page's display frame, points, y up, as the
// page is shown) and where the block will land in the return — where placed, a corner the desk
// found empty, or a cover sheet before the plan when page 1 has no room.
import { z } from 'zod';

const coordinate = (name: 'x' | 'y', edge: string) =>
  z
    .number({ error: `${name} must be a number of points from the ${edge} edge of page 1` })
    .min(0, `${name} must be 0 or more: points from the ${edge} edge of page 1`)
    .max(14_400, `${name} must be at most 14400 pt (the largest page a PDF allows)`);

/** PUT /api/packages/:id/stamp-placement */
export const StampPlacementBody = z.object({ x: coordinate('x', 'left'), y: coordinate('y', 'bottom') });
export type StampPlacementBody = z.infer<typeof StampPlacementBody>;

const Rect = z.object({ x: z.number(), y: z.number(), width: z.number(), height: z.number() });

export const StampLanding = z.discriminatedUnion('on', [
  z.object({
    on: z.literal('page'),
    how: z.enum(['placed', 'top-right', 'top-left', 'bottom-right', 'bottom-left']),
    rect: Rect,
  }),
  z.object({ on: z.literal('cover'), why: z.string() }),
]);
export type StampLanding = z.infer<typeof StampLanding>;

/** GET, PUT and DELETE /api/packages/:id/stamp-placement */
export const StampPlacementView = z.object({
  revision: z.number().int(),
  /** The plan: the document whose page 1 carries the stamp. */
  fileId: z.uuid(),
  /** Null: the desk chooses (the emptiest corner, else a cover sheet). */
  placement: z.object({ x: z.number(), y: z.number() }).nullable(),
  /** Page 1 of the plan as displayed, in points. */
  page: z.object({ width: z.number(), height: z.number() }),
  stamp: z.object({ width: z.number(), height: z.number() }),
  lands: StampLanding,
});
export type StampPlacementView = z.infer<typeof StampPlacementView>;
