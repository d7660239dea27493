// The wind cases of the ground-bearing check: for each slew the wind is tried from the directions
// that load each corner most, along the axes and straight out along the eccentricity; the largest
// reaction or pressure governs.
export const NO_WIND = [0, 0] as const;
export const CALM = [undefined];

/** The calm resultant moved by a wind moment M blowing along the plan direction dir. */
export function withWind(
  r: { V: number; ex: number; ey: number },
  M: number,
  dir: readonly [number, number],
) {
  return r.V > 0 ? { V: r.V, ex: r.ex + (M * dir[0]) / r.V, ey: r.ey + (M * dir[1]) / r.V } : r;
}
