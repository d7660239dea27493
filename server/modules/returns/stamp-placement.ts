// Where the stamp block goes: on page 1 of the plan where the engineer placed it, else in the
// emptiest corner (the first of the corner positions, shared/drawing/stamp-outline.ts, with no
// ink under it, page-ink.ts), else on a cover sheet before the plan. The block never covers the
// plan's content, the engineer's markups on page 1 or the footer: a placed block that would (the
// decision's override lines made it taller than the outline the engineer placed) falls back to
// a corner, and no free corner means the cover sheet.
import type { StampInput } from './stamp-input';
import {
  cornerCandidates,
  FOOTER_ROOM,
  overlaps,
  STAMP_SIZE,
  type PageSize,
  type Rect,
  type StampCorner,
} from '@shared/drawing/stamp-outline';
import { inkUnder, type PageInk } from '../../lib/pdf-tools/page-ink';
import { markupToDisplay, type PageFrame } from './page-frame-pdf';

/** Points kept clear round the block: nothing of the plan may touch its border. */
export const STAMP_CLEARANCE = 4;

export type StampSpot =
  { on: 'page'; rect: Rect; how: 'placed' | StampCorner } | { on: 'cover'; why: string };

type MarkupOnPage = Pick<StampInput['markups'][number], 'kind' | 'geometry' | 'text'>;

const n = (g: Record<string, number>, k: string, d = 0) =>
  typeof g[k] === 'number' && Number.isFinite(g[k]) ? g[k] : d;

/**
 * A generous rectangle round what a markup draws in the display frame, its label included
 * (labels sit above a shape or beside a pin, up to three lines of 180 pt).
 */
export function markupFootprint(frame: PageFrame, m: MarkupOnPage): Rect {
  const g = m.geometry;
  const pts: Array<[number, number]> = [];
  let pad = 4;
  let labelAbove = m.text ? 32 : 18;
  switch (m.kind) {
    case 'arrow':
      pts.push(
        markupToDisplay(frame, n(g, 'x1'), n(g, 'y1')),
        markupToDisplay(frame, n(g, 'x2'), n(g, 'y2')),
      );
      pad = 14;
      break;
    case 'pin':
    case 'text': {
      const [x, y] = markupToDisplay(frame, n(g, 'x'), n(g, 'y'));
      const size = n(g, 'fontSize', 11);
      // A text box wraps within 220 pt; a pin's label runs 180 pt to its right.
      const lines = m.kind === 'text' ? Math.ceil(((m.text ?? '').length * size * 0.55) / 220) + 1 : 3;
      pts.push([x - 10, y + size + 14], [x + 232, y - lines * size * 1.2 - 10]);
      labelAbove = 0;
      break;
    }
    default: {
      const x = n(g, 'x');
      const y = n(g, 'y');
      pts.push(
        markupToDisplay(frame, x, y),
        markupToDisplay(frame, x + n(g, 'width', 1), y + n(g, 'height', 1)),
      );
    }
  }
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const x0 = Math.min(...xs) - pad;
  const y0 = Math.min(...ys) - pad;
  const top = Math.max(...ys) + pad + labelAbove;
  return { x: x0, y: y0, width: Math.max(...xs) + pad + (labelAbove ? 180 : 0) - x0, height: top - y0 };
}

/** Room the footer may take at the bottom right, for placements checked before the page count is known. */
export const FOOTER_ALLOWANCE = 214;

/**
 * What the desk itself draws on page 1 and the stamp must leave visible: the markups (with their
 * labels) and the footer, whose left edge is at most `footerLeft`.
 */
export function deskReserved(frame: PageFrame, marks: MarkupOnPage[], footerLeft = Infinity): Rect[] {
  const left = Math.min(footerLeft, frame.width - FOOTER_ALLOWANCE) - 4;
  return [
    ...marks.map((m) => markupFootprint(frame, m)),
    { x: left, y: 0, width: frame.width - left, height: FOOTER_ROOM - 3 },
  ];
}

export interface SpotQuestion {
  /** Page 1's ink, or null when it could not be rendered (then only the cover sheet is safe). */
  ink: PageInk | null;
  page: PageSize;
  /** The block's size on this page (override lines and scale included). */
  size: PageSize;
  /** The engineer's placement: the lower-left corner of the STAMP_SIZE outline. */
  placed: { x: number; y: number } | null;
  /** What the desk itself draws on page 1: markups and the footer. */
  reserved: Rect[];
}

/** Whether the block may sit at `rect`: on the page, over no ink and none of the desk's own drawing. */
export function spotIsFree(q: Pick<SpotQuestion, 'ink' | 'page' | 'reserved'>, rect: Rect): boolean {
  if (!q.ink) return false;
  const onPage =
    rect.x >= -0.01 &&
    rect.y >= -0.01 &&
    rect.x + rect.width <= q.page.width + 0.01 &&
    rect.y + rect.height <= q.page.height + 0.01;
  return onPage && inkUnder(q.ink, rect, STAMP_CLEARANCE) === 0 && !q.reserved.some((r) => overlaps(r, rect));
}

export function chooseStampSpot(q: SpotQuestion): StampSpot {
  if (!q.ink) return { on: 'cover', why: 'page 1 could not be read to find a free corner' };
  if (q.placed) {
    // The outline's top edge stays where the engineer put it; a taller block grows downwards.
    const top = q.placed.y + STAMP_SIZE.height;
    const rect = {
      x: Math.min(Math.max(0, q.placed.x), Math.max(0, q.page.width - q.size.width)),
      y: Math.max(0, Math.min(top, q.page.height) - q.size.height),
      ...q.size,
    };
    if (spotIsFree(q, rect)) return { on: 'page', rect, how: 'placed' };
  }
  for (const c of cornerCandidates(q.page, q.size)) {
    if (spotIsFree(q, c.rect)) return { on: 'page', rect: c.rect, how: c.corner };
  }
  return { on: 'cover', why: 'page 1 had no free corner' };
}
