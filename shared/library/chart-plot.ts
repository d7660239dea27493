// The pictures of a chart grid as plain data, drawn by a thin SVG renderer in the client:
// capacity against radius (one line per boom length) and the working range (hook height against
// radius for each boom length). Pure; lengths in the chart's own length unit.
//
// Working range (plane geometry, the engine's convention in checks/geometry.ts): a straight boom of
// length L hinged at the pivot — `a` ahead of the centre of rotation, `h0` above the ground —
// reaches the radius R with its tip at h0 + √(L² − (R − a)²). The hook hangs below the tip by the
// allowance d = hook block height (tip sheave to hook, as the lift input's hookBlock.height) + the
// clearance kept under the tip (the site policy's minimum block clearance), so
//   hook height = h0 + √(L² − (R − a)²) − d.
// The engine's block-clearance check passes exactly when the hook needed for the lift (required
// lift height + load height + rigging height) is at or below this hook height.
import { TO_SI } from '../engineering/units';
import type { ChartGrid } from './chart-grid';

export interface PlotPoint {
  x: number;
  y: number;
  /** a radius the chart rates (drawn with a marker); sampled points between them are not */
  rated?: boolean;
}

export interface PlotLine {
  boomLength: number;
  points: PlotPoint[];
}

export function capacityLines(g: ChartGrid): PlotLine[] {
  return g.boomLengths.map((b, j) => ({
    boomLength: b,
    points: g.radii
      .map((r, i) => ({ x: r, y: g.capacities[i][j], rated: true }))
      .filter((p): p is { x: number; y: number; rated: true } => p.y !== null),
  }));
}

/** What the working range is drawn from, in SI (m). */
export interface RangeBasis {
  /** boom foot pin ahead of the centre of rotation (a) */
  pivotOffset: number;
  /** boom foot pin above the ground (h0) */
  pivotHeight: number;
  /** from the boom tip down to the hook (d): block height + clearance kept under the tip */
  allowance: number;
}

/**
 * Hook height (m) at radius R (m) for a boom of length L (m): h0 + √(L² − (R − a)²) − d.
 * Null when the boom cannot reach the radius (|R − a| > L).
 */
export function hookHeight(L: number, R: number, b: RangeBasis): number | null {
  const reach = R - b.pivotOffset;
  const h2 = L * L - reach * reach;
  if (!(h2 >= 0)) return null;
  return b.pivotHeight + Math.sqrt(h2) - b.allowance;
}

/**
 * The working range: for each boom length, the hook height across the radii the chart rates it
 * (from its smallest to its largest rated radius, `samples` steps between them so the arc reads as
 * one), in the chart's radius unit on both axes. Radii the boom cannot reach, and hook heights
 * below the ground, are left out.
 */
export function workingRange(g: ChartGrid, b: RangeBasis, samples = 24): PlotLine[] {
  const lu = TO_SI[g.units.boomLength];
  const ru = TO_SI[g.units.radius];
  return g.boomLengths.map((boom, j) => {
    const L = boom * lu;
    const rated = g.radii.filter((_, i) => g.capacities[i][j] !== null);
    const xs = new Map<number, boolean>();
    for (const r of rated) xs.set(r, true);
    if (rated.length > 1 && samples > 0) {
      const lo = Math.min(...rated);
      const hi = Math.max(...rated);
      for (let k = 1; k < samples; k++) {
        const x = lo + ((hi - lo) * k) / samples;
        if (!xs.has(x)) xs.set(x, false);
      }
    }
    const points = [...xs.entries()]
      .sort((p, q) => p[0] - q[0])
      .map(([x, isRated]) => {
        const h = hookHeight(L, x * ru, b);
        return h !== null && h >= 0 ? { x, y: h / ru, ...(isRated ? { rated: true } : {}) } : null;
      })
      .filter((p): p is PlotPoint => p !== null);
    return { boomLength: boom, points };
  });
}

/** Round tick marks from 0 to at least max: 1, 2 or 5 × 10ⁿ apart, about `count` of them. */
export function ticks(max: number, count = 6): number[] {
  if (!(max > 0)) return [0, 1];
  const raw = max / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((k) => k * mag).find((s) => s >= raw)!;
  const out: number[] = [];
  for (let v = 0; v < max + step * 0.999; v += step) out.push(Math.round(v / step) * step);
  return out;
}

/** The height of a line at x (straight between its points), or null where the line does not reach. */
export function lineAt(line: PlotLine, x: number): number | null {
  const pts = [...line.points].sort((a, b) => a.x - b.x);
  for (let i = 0; i < pts.length; i++) {
    if (pts[i].x === x) return pts[i].y;
    if (i > 0 && pts[i - 1].x < x && x < pts[i].x)
      return pts[i - 1].y + ((pts[i].y - pts[i - 1].y) * (x - pts[i - 1].x)) / (pts[i].x - pts[i - 1].x);
  }
  return null;
}

/**
 * Where a mark's label crosses no line: below the mark when every line reaching its x passes above
 * it (a lift inside the chart), above otherwise (a lift over the chart, or lines on both sides).
 */
export function labelSide(lines: PlotLine[], x: number, y: number): 'below' | 'above' {
  const heights = lines.map((l) => lineAt(l, x)).filter((h): h is number => h !== null);
  return heights.length > 0 && heights.every((h) => h > y) ? 'below' : 'above';
}
