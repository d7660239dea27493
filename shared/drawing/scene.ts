// The primitives of a figure drawn both on screen (SVG) and in the stamped return (pdf-lib), in
// the figure's own units (pixels on screen, points on paper) with y down from its top-left
// corner. Colours are roles: each renderer maps a role to its own colour (the paper prints in
// greyscale, the screen keeps its accents), so the two only paint what shared/drawing computes.

export type Point = readonly [number, number];

export interface Stroke<R extends string> {
  role: R;
  width: number;
  dash?: readonly number[];
  cap?: 'round';
}

export type TextAnchor = 'start' | 'middle' | 'end';

export type Shape<R extends string> =
  | { kind: 'line'; from: Point; to: Point; stroke: Stroke<R> }
  | { kind: 'polyline'; points: readonly Point[]; stroke: Stroke<R> }
  | { kind: 'polygon'; points: readonly Point[]; fill?: R; stroke?: Stroke<R> }
  | { kind: 'circle'; centre: Point; r: number; fill?: R; stroke?: Stroke<R> }
  | {
      kind: 'text';
      /** The start, middle or end of the baseline, as `anchor` says. */
      at: Point;
      text: string;
      size: number;
      bold?: boolean;
      anchor: TextAnchor;
      role: R;
      /** A white halo behind the letters, so no line runs through them. */
      halo?: boolean;
      /** Degrees, clockwise on the y-down figure (-90 reads bottom to top). */
      rotate?: number;
    }
  | {
      kind: 'dimension';
      from: Point;
      to: Point;
      stroke: Stroke<R>;
      /** The arrowheads at `from` and `to`, filled with the stroke's role. */
      heads: readonly [readonly Point[], readonly Point[]];
    };

export interface Scene<R extends string> {
  width: number;
  height: number;
  /** In painting order: later shapes cover earlier ones. */
  shapes: Shape<R>[];
}

/** How a renderer measures and breaks its text, for layouts that keep labels clear of lines. */
export interface TextMetrics {
  width(text: string, size: number, bold: boolean): number;
  wrap(text: string, size: number, bold: boolean, maxWidth: number): string[];
}

/** The corners of a box, clockwise on the y-down figure. */
export function box(x: number, y: number, w: number, h: number): Point[] {
  return [
    [x, y],
    [x + w, y],
    [x + w, y + h],
    [x, y + h],
  ];
}

/**
 * 45° hatching clipped to a box: `falling` lines run down to the right (x − y constant), `rising`
 * lines up to the right (x + y constant). The lines pass through `through` and every `step` along
 * x from it, so a hatch can keep its phase to the figure's origin like an SVG pattern does.
 */
export function hatch(
  x: number,
  y: number,
  w: number,
  h: number,
  lean: 'falling' | 'rising',
  step: number,
  through: Point = [0, 0],
): [Point, Point][] {
  const s = lean === 'falling' ? 1 : -1;
  // A line is x − s·y = c; over the box c runs between these two corners' values.
  const cs = [x - s * y, x + w - s * y, x - s * (y + h), x + w - s * (y + h)];
  const lo = Math.min(...cs);
  const hi = Math.max(...cs);
  const c0 = through[0] - s * through[1];
  const out: [Point, Point][] = [];
  for (let k = Math.ceil((lo - c0) / step); c0 + k * step <= hi; k++) {
    const c = c0 + k * step;
    // Points (c + s·t, t) for t in the box's y range and x range.
    const t0 = Math.max(y, s > 0 ? x - c : c - x - w);
    const t1 = Math.min(y + h, s > 0 ? x + w - c : c - x);
    if (t1 - t0 > 1e-9) out.push([[c + s * t0, t0] as Point, [c + s * t1, t1] as Point]);
  }
  return out;
}

/**
 * The two outward arrowheads of a dimension line: each tip `overshoot` past its end, `length`
 * long and `half` wide on either side of the line.
 */
export function arrowHeads(
  from: Point,
  to: Point,
  head: { length: number; half: number; overshoot?: number },
): [Point[], Point[]] {
  const len = Math.hypot(to[0] - from[0], to[1] - from[1]) || 1;
  const ux = (to[0] - from[0]) / len;
  const uy = (to[1] - from[1]) / len;
  const one = (end: Point, dx: number, dy: number): Point[] => {
    const tip: Point = [end[0] + dx * (head.overshoot ?? 0), end[1] + dy * (head.overshoot ?? 0)];
    const bx = tip[0] - dx * head.length;
    const by = tip[1] - dy * head.length;
    return [tip, [bx - dy * head.half, by + dx * head.half], [bx + dy * head.half, by - dx * head.half]];
  };
  return [one(from, -ux, -uy), one(to, ux, uy)];
}
