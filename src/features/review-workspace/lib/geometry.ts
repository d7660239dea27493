// Markup geometry between the screen and the page. Markups are stored in PDF user space
// (points, origin at the bottom-left of the page's view box, y upwards); the screen works
// in viewport pixels (origin top-left, y down, scaled by the zoom and turned by the page's
// rotation). pdf.js's viewport does the conversion both ways, so a markup drawn at any zoom
// is stored the same and lands where the stamped return draws it.

/** The two conversions of a pdf.js PageViewport that markups need. */
export interface PointConverter {
  convertToPdfPoint(x: number, y: number): number[];
  convertToViewportPoint(x: number, y: number): number[];
}

export type ViewPoint = { x: number; y: number };
export type BoxGeometry = { x: number; y: number; width: number; height: number };
export type ArrowGeometry = { x1: number; y1: number; x2: number; y2: number };
export type PointGeometry = { x: number; y: number };

/** Hundredths of a point: finer than any pen, and the same number at every zoom. */
function round(value: number): number {
  return Math.round(value * 100) / 100 + 0;
}

export function toPdfPoint(viewport: PointConverter, p: ViewPoint): PointGeometry {
  const [x, y] = viewport.convertToPdfPoint(p.x, p.y);
  return { x: round(x), y: round(y) };
}

export function toViewPoint(viewport: PointConverter, x: number, y: number): ViewPoint {
  const [vx, vy] = viewport.convertToViewportPoint(x, y);
  return { x: vx, y: vy };
}

/** A box dragged between two screen points, as (x, y) lower-left plus width and height. */
export function boxFromDrag(viewport: PointConverter, a: ViewPoint, b: ViewPoint): BoxGeometry {
  const p = toPdfPoint(viewport, a);
  const q = toPdfPoint(viewport, b);
  return {
    x: Math.min(p.x, q.x),
    y: Math.min(p.y, q.y),
    width: Math.max(1, round(Math.abs(q.x - p.x))),
    height: Math.max(1, round(Math.abs(q.y - p.y))),
  };
}

/** An arrow dragged from its tail (a) to its head (b). */
export function arrowFromDrag(viewport: PointConverter, a: ViewPoint, b: ViewPoint): ArrowGeometry {
  const p = toPdfPoint(viewport, a);
  const q = toPdfPoint(viewport, b);
  return { x1: p.x, y1: p.y, x2: q.x, y2: q.y };
}

/** A stored box as a screen rectangle (left, top, width, height); rotation swaps sides. */
export function boxToView(viewport: PointConverter, g: Partial<BoxGeometry>) {
  const x = g.x ?? 0;
  const y = g.y ?? 0;
  const a = toViewPoint(viewport, x, y);
  const b = toViewPoint(viewport, x + (g.width ?? 1), y + (g.height ?? 1));
  return {
    left: Math.min(a.x, b.x),
    top: Math.min(a.y, b.y),
    width: Math.abs(b.x - a.x),
    height: Math.abs(b.y - a.y),
  };
}

/** The screen scale of one PDF point (the zoom): pdf.js viewports report it as `scale`. */
export function pointScale(viewport: PointConverter): number {
  const a = toViewPoint(viewport, 0, 0);
  const b = toViewPoint(viewport, 1, 0);
  return Math.hypot(b.x - a.x, b.y - a.y);
}

/** Drags shorter than this (screen pixels) are clicks, not shapes. */
export const MIN_DRAG_PX = 4;

export function dragLength(a: ViewPoint, b: ViewPoint): number {
  return Math.hypot(b.x - a.x, b.y - a.y);
}

export { cloudPath } from '@shared/drawing/cloud-path';

/** Where a stored markup sits on screen, for scrolling it into view. */
export function markupAnchor(viewport: PointConverter, kind: string, g: Record<string, number>): ViewPoint {
  if (kind === 'arrow') return toViewPoint(viewport, g.x2 ?? 0, g.y2 ?? 0);
  if (kind === 'text' || kind === 'pin') return toViewPoint(viewport, g.x ?? 0, g.y ?? 0);
  const box = boxToView(viewport, g);
  return { x: box.left, y: box.top };
}
