// The pictures of a chart grid as plain data, drawn by a thin SVG renderer in the client:
// capacity against radius (one line per boom length) and the working range (boom-tip height
// against radius for each boom length). Pure; lengths in the chart's own length unit.
// Tip height: a straight boom of length L hinged at the pivot (offset ahead of the centre of
// rotation, height above ground) reaches the radius R at a height pivotHeight + √(L² − (R − offset)²)
// (geometry; the engine's crane-model.ts uses the same pivot convention).
import { TO_SI } from '../engineering/units';
import type { ChartGrid } from './chart-grid';

export interface PlotLine {
  boomLength: number;
  points: { x: number; y: number }[];
}

export function capacityLines(g: ChartGrid): PlotLine[] {
  return g.boomLengths.map((b, j) => ({
    boomLength: b,
    points: g.radii
      .map((r, i) => ({ x: r, y: g.capacities[i][j] }))
      .filter((p): p is { x: number; y: number } => p.y !== null),
  }));
}

/** pivotOffset and pivotHeight in SI (m); the result in the chart's length unit. */
export function workingRange(g: ChartGrid, pivotOffsetSI = 0, pivotHeightSI = 0): PlotLine[] {
  const lu = TO_SI[g.units.boomLength];
  const ru = TO_SI[g.units.radius];
  return g.boomLengths.map((b, j) => {
    const L = b * lu;
    const points = g.radii
      .filter((_, i) => g.capacities[i][j] !== null)
      .map((r) => {
        const reach = r * ru - pivotOffsetSI;
        const h2 = L * L - reach * reach;
        return h2 >= 0 ? { x: r, y: (pivotHeightSI + Math.sqrt(h2)) / ru } : null;
      })
      .filter((p): p is { x: number; y: number } => p !== null);
    return { boomLength: b, points };
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
