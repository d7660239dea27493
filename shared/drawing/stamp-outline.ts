// Where the stamp block may sit on page 1 of the return, as plain rectangles in the page's
// display frame (points, origin at the lower-left of the visible page as displayed, y up): the
// block's size, the four corner positions the desk tries when the engineer has not placed it,
// and the test whether a placed block lies on the page. The stamp builder
// (server/modules/returns/stamp-placement.ts) and the workspace's placement outline both read it.

/** The stamp block's size before any override lines make it taller (draw-stamp-block.ts). */
export const STAMP_SIZE = { width: 230, height: 150 } as const;
/** Distance from the page's edges the desk keeps when it places the block in a corner. */
export const STAMP_EDGE = 18;
/** Room kept free at the bottom of every page for the footer ("REF rev N — page n of m"). */
export const FOOTER_ROOM = 24;

export type StampCorner = 'top-right' | 'top-left' | 'bottom-right' | 'bottom-left';

export const CORNER_WORDS: Record<StampCorner, string> = {
  'top-right': 'top right corner',
  'top-left': 'top left corner',
  'bottom-right': 'bottom right corner',
  'bottom-left': 'bottom left corner',
};

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PageSize {
  width: number;
  height: number;
}

/**
 * The corner positions in the order they are tried: top right first (where a reader looks
 * for a stamp), then top left, bottom right, bottom left; each first at STAMP_EDGE from the
 * edges, then closer in (12, 8 pt) so a block that just misses the plan's content still fits.
 * Bottom positions stay above the footer's room.
 */
export function cornerCandidates(page: PageSize, size: PageSize): Array<{ corner: StampCorner; rect: Rect }> {
  const out: Array<{ corner: StampCorner; rect: Rect }> = [];
  const corners: StampCorner[] = ['top-right', 'top-left', 'bottom-right', 'bottom-left'];
  for (const corner of corners) {
    for (const edge of [STAMP_EDGE, 12, 8]) {
      const right = corner.endsWith('right');
      const top = corner.startsWith('top');
      const x = right ? page.width - edge - size.width : edge;
      const y = top ? page.height - edge - size.height : Math.max(edge, FOOTER_ROOM);
      if (x < 0 || y < 0 || x + size.width > page.width || y + size.height > page.height) continue;
      out.push({ corner, rect: { x, y, width: size.width, height: size.height } });
    }
  }
  return out;
}

/** Whether two rectangles overlap (touching edges do not). */
export function overlaps(a: Rect, b: Rect): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * Null when a block of `size` with its lower-left corner at (x, y) lies on the page, else the
 * field that does not and its limits, in words for the API's answer.
 */
export function placementOutside(
  at: { x: number; y: number },
  page: PageSize,
  size: PageSize = STAMP_SIZE,
): { path: 'x' | 'y'; message: string } | null {
  const maxX = Math.max(0, page.width - size.width);
  const maxY = Math.max(0, page.height - size.height);
  const pt = (n: number) => `${Math.round(n * 10) / 10} pt`;
  if (at.x < 0 || at.x > maxX + 0.01)
    return {
      path: 'x',
      message: `x must be between 0 and ${pt(maxX)}: page 1 is ${pt(page.width)} wide and the stamp ${pt(size.width)}`,
    };
  if (at.y < 0 || at.y > maxY + 0.01)
    return {
      path: 'y',
      message: `y must be between 0 and ${pt(maxY)}: page 1 is ${pt(page.height)} high and the stamp ${pt(size.height)}`,
    };
  return null;
}
