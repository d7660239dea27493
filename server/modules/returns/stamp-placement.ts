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
import { layoutTextBox } from '@shared/drawing/text-layout';

/** Points kept clear round the block: nothing of the plan may touch its border. */
export const STAMP_CLEARANCE = 4;

export type StampSpot =
  { on: 'page'; rect: Rect; how: 'placed' | StampCorner } | { on: 'cover'; why: string };

type MarkupOnPage = Pick<StampInput['markups'][number], 'kind' | 'geometry' | 'text'>;

/** A measure wider than Lato bold (about 0.55 em a character), so the footprint errs large. */
const wide = (t: string, size: number) => [...t].length * size * 0.62;

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
    case 'text': {
      // Laid out as drawn (shared layout), measured wider than Lato bold is, with room for its tag above.
      const [x, y] = markupToDisplay(frame, n(g, 'x'), n(g, 'y'));
      const width = typeof g.width === 'number' && g.width > 0 ? g.width : undefined;
      const b = layoutTextBox({ x, y, fontSize: n(g, 'fontSize', 11), width }, m.text ?? '', frame, wide);
      const bottom = b.y - (b.lines.length - 1) * b.lineHeight - b.size * 0.3;
      pts.push([b.x, bottom], [b.x + b.width, b.y + b.size + 14]);
      labelAbove = 0;
      break;
    }
    case 'pin': {
      const [x, y] = markupToDisplay(frame, n(g, 'x'), n(g, 'y'));
      // The pin's disc, and its label running up to 180 pt to its right, three lines at most.
      pts.push([x - 10, y + 14], [x + 11 + 180, y - 3 * 8 * 1.2 - 10]);
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
