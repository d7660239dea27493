// Grid and tick positions for the plots drawn both in the browser (SVG) and in the calculation
// sheet (pdf-lib): round numbers of the display unit, chosen by d3-scale's nice ticks, so the
// two renderers only paint what this computes.
import { scaleLinear } from 'd3-scale';

/** Round tick values covering [lo, hi] (display units), about `count` of them. */
export function niceTicks(lo: number, hi: number, count = 6): number[] {
  if (!(hi > lo)) return [lo];
  return scaleLinear().domain([lo, hi]).ticks(count);
}

/** The distance between neighbouring nice ticks of [lo, hi]. */
export function niceStep(lo: number, hi: number, count = 6): number {
  const t = niceTicks(lo, hi, count);
  return t.length > 1 ? Number((t[1] - t[0]).toPrecision(12)) : 1;
}

/**
 * A square grid for a drawing to scale (the crane side view): vertical lines at nice ticks of the
 * horizontal range, horizontal lines from 0 to `yMax` at the same step. Values in display units.
 */
export function squareGrid(
  xMin: number,
  xMax: number,
  yMax: number,
  count = 8,
): { x: number[]; y: number[]; step: number } {
  const x = niceTicks(xMin, xMax, count);
  const step = niceStep(xMin, xMax, count);
  const y: number[] = [];
  for (let k = 0; k * step <= yMax + step * 1e-9; k++) y.push(Number((k * step).toPrecision(12)));
  return { x, y, step };
}
