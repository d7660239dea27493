// The wind cases of the ground-bearing check: for each slew the wind is tried from the directions
// that load each corner most, along each edge's normal and straight out along the eccentricity; the
// largest reaction or pressure governs. Where the result is not linear in the wind's direction (the
// triangular block under a crawler track shortens as the eccentricity grows; three outriggers once
// one lifts off) the least favourable direction lies between those: worstWind() searches the whole
// circle for it.
import { DEG } from '../units';

export const NO_WIND = [0, 0] as const;

/** The calm resultant moved by a wind moment M blowing along the plan direction dir. */
export function withWind(
  r: { V: number; ex: number; ey: number },
  M: number,
  dir: readonly [number, number],
) {
  return r.V > 0 ? { V: r.V, ex: r.ex + (M * dir[0]) / r.V, ey: r.ey + (M * dir[1]) / r.V } : r;
}

const SWEEP_STEP = 45;
const GOLDEN = (Math.sqrt(5) - 1) / 2;

/**
 * The case of the least favourable wind direction: the seed directions and every 45° are tried,
 * then a golden-section search within 45° either side of the worst of them (24 steps: under a
 * thousandth of a degree). `peak` gives the case for a unit plan direction; its `p` is maximised.
 */
export function worstWind<T extends { p: number }>(
  peak: (dir: readonly [number, number]) => T,
  seeds: readonly (readonly [number, number])[],
): T {
  const at = (deg: number) => peak([Math.cos(deg * DEG), Math.sin(deg * DEG)]);
  let best = peak(seeds[0] ?? [1, 0]);
  let bestDeg = seeds[0] ? Math.atan2(seeds[0][1], seeds[0][0]) / DEG : 0;
  const consider = (c: T, deg: number) => {
    if (c.p > best.p * (1 + 1e-12)) {
      best = c;
      bestDeg = deg;
    }
  };
  for (const s of seeds.slice(1)) consider(peak(s), Math.atan2(s[1], s[0]) / DEG);
  for (let deg = 0; deg < 360; deg += SWEEP_STEP) consider(at(deg), deg);
  if (!Number.isFinite(best.p)) return best;
  let lo = bestDeg - SWEEP_STEP;
  let hi = bestDeg + SWEEP_STEP;
  let x1 = hi - GOLDEN * (hi - lo);
  let x2 = lo + GOLDEN * (hi - lo);
  let c1 = at(x1);
  let c2 = at(x2);
  for (let i = 0; i < 24; i++) {
    if (c1.p >= c2.p) {
      hi = x2;
      x2 = x1;
      c2 = c1;
      x1 = hi - GOLDEN * (hi - lo);
      c1 = at(x1);
    } else {
      lo = x1;
      x1 = x2;
      c1 = c2;
      x2 = lo + GOLDEN * (hi - lo);
      c2 = at(x2);
    }
  }
  consider(c1, x1);
  consider(c2, x2);
  return best;
}
