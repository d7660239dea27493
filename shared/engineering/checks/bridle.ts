// Three- and four-leg bridles meeting at one hook above the load's centre of gravity, pick points
// given in plan from the centre of gravity and the hook's height h above them. A leg from pick
// point (x, y) to the hook has length L = √(x² + y² + h²); its vertical share V sets its tension
// T = V · L / h (statics of the hook; the horizontal components then balance when ΣV·x = ΣV·y = 0).
// - 3 legs not in a line: ΣV = W, ΣV·x = 0, ΣV·y = 0 fix the shares (the same 3 × 3 statics as
//   three cranes, multi-crane.ts).
// - 4 legs: statics leaves the shares open. Without an equalising arrangement the bridle is rated
//   as if two legs carry the load (ASME B30.9, from memory: "rated on two legs"): each diagonal pair
//   (legs 1–3 and 2–4, legs listed in order round the load) is taken to carry the whole weight,
//   shared as two picks share it (the centre of gravity projected on the diagonal), and each leg is
//   checked for the larger of what it carries. With an equalising arrangement stated, the legs
//   share as evenly as force and moment balance allow: V = Aᵀ(AAᵀ)⁻¹[W, 0, 0] with A = [1; x; y]
//   (the least-squares balanced shares; common practice, no source).
import { solveShares, type Point } from '../multi-crane';

export interface BridleLegs {
  /** vertical share of each leg (N) */
  vertical: number[];
  /** tension of each leg (N) */
  tension: number[];
  /** angle of each leg from horizontal (degrees) */
  angleDeg: number[];
  method: 'three' | 'two-legs-carry' | 'equalised';
  /** why the shares could not be found (legs in a line, a leg that would have to push) */
  reason: string | null;
}

function equalisedShares(W: number, p: Point[]): number[] | null {
  // M = A Aᵀ, a symmetric 3 × 3 of sums; solve M λ = [W, 0, 0] by Cramer's rule.
  let n = 0,
    sx = 0,
    sy = 0,
    sxx = 0,
    syy = 0,
    sxy = 0;
  for (const [x, y] of p) {
    n += 1;
    sx += x;
    sy += y;
    sxx += x * x;
    syy += y * y;
    sxy += x * y;
  }
  const M = [
    [n, sx, sy],
    [sx, sxx, sxy],
    [sy, sxy, syy],
  ];
  const det3 = (m: number[][]) =>
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
    m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
    m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const d = det3(M);
  const scale = Math.max(sxx, syy, 1e-12);
  if (!(Math.abs(d) > 1e-9 * n * scale * scale)) return null;
  const col = (k: number) => M.map((row, i) => row.map((v, j) => (j === k ? (i === 0 ? W : 0) : v)));
  const lam = [det3(col(0)) / d, det3(col(1)) / d, det3(col(2)) / d];
  return p.map(([x, y]) => lam[0] + lam[1] * x + lam[2] * y);
}

/** Leg shares and tensions of a 3- or 4-leg bridle; picks in plan from the centre of gravity (m). */
export function bridleLegs(W: number, picks: Point[], h: number, equalised: boolean): BridleLegs {
  const L = picks.map(([x, y]) => Math.sqrt(x * x + y * y + h * h));
  const angleDeg = picks.map(([x, y]) => (Math.atan2(h, Math.hypot(x, y)) * 180) / Math.PI);
  const done = (vertical: number[] | null, method: BridleLegs['method'], why: string): BridleLegs => {
    if (!vertical || vertical.some((v) => !Number.isFinite(v)))
      return { vertical: [], tension: [], angleDeg, method, reason: why };
    if (vertical.some((v) => v < -1e-9 * W))
      return {
        vertical: [],
        tension: [],
        angleDeg,
        method,
        reason: 'the centre of gravity lies outside the pick points: a leg would have to push',
      };
    const v = vertical.map((x) => Math.max(0, x));
    return { vertical: v, tension: v.map((x, i) => (x * L[i]) / h), angleDeg, method, reason: null };
  };
  const origin: Point = [0, 0];
  if (picks.length === 3)
    return done(
      solveShares(W, picks, origin),
      'three',
      'the three pick points lie in a line: statics cannot share the load',
    );
  if (equalised)
    return done(
      equalisedShares(W, picks),
      'equalised',
      'the four pick points lie in a line: statics cannot share the load',
    );
  // two legs carry: each diagonal pair takes the whole weight; each leg keeps the larger share
  const v = [0, 0, 0, 0];
  for (const [a, b] of [
    [0, 2],
    [1, 3],
  ] as const) {
    const s = solveShares(W, [picks[a], picks[b]], origin);
    if (!s) return done(null, 'two-legs-carry', `legs ${a + 1} and ${b + 1} share one pick point`);
    v[a] = Math.max(v[a], s[0]);
    v[b] = Math.max(v[b], s[1]);
  }
  return done(v, 'two-legs-carry', '');
}
