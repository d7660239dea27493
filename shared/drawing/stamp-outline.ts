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

/** How far in from its corner the block may slide, as a share of the page's shorter side, and the step. */
export const CORNER_REACH = 0.3;
export const CORNER_STEP = 6;

/**
 * The positions the desk tries, best first: the block in each corner at STAMP_EDGE from the
 * edges, a little closer to them (12, 8 pt), or slid in from that corner in CORNER_STEP steps,
 * up to CORNER_REACH of the shorter side — so a drawing's border frame or title block does not
 * push it off the page when there is room just inside. The nearest to its corner comes first;
 * at equal distance top right (where a reader looks for a stamp), then top left, bottom right,
 * bottom left. Bottom positions stay above the footer's room.
 */
export function cornerCandidates(page: PageSize, size: PageSize): Array<{ corner: StampCorner; rect: Rect }> {
  const out: Array<{ corner: StampCorner; rect: Rect; inset: number; order: number }> = [];
  const corners: StampCorner[] = ['top-right', 'top-left', 'bottom-right', 'bottom-left'];
  const reach = CORNER_REACH * Math.min(page.width, page.height);
  const steps = Math.floor(reach / CORNER_STEP);
  // Offsets from the STAMP_EDGE position: out towards the edges (12 and 8 pt from them), then in.
  const offsets = [
    12 - STAMP_EDGE,
    8 - STAMP_EDGE,
    ...Array.from({ length: steps + 1 }, (_, k) => k * CORNER_STEP),
  ];
  corners.forEach((corner, order) => {
    const right = corner.endsWith('right');
    const top = corner.startsWith('top');
    for (const dx of offsets) {
      for (const dy of offsets) {
        const x = right ? page.width - STAMP_EDGE - size.width - dx : STAMP_EDGE + dx;
        const y = top ? page.height - STAMP_EDGE - size.height - dy : Math.max(STAMP_EDGE + dy, FOOTER_ROOM);
        if (x < 0 || y < 0 || x + size.width > page.width || y + size.height > page.height) continue;
        out.push({
          corner,
          rect: { x, y, width: size.width, height: size.height },
          inset: Math.abs(dx) + Math.abs(dy),
          order,
        });
      }
    }
  });
  out.sort((p, q) => p.inset - q.inset || p.order - q.order);
  return out.map(({ corner, rect }) => ({ corner, rect }));
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
