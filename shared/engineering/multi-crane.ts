// Several cranes on one load (2 to 4). Shares from statics, hoist lines plumb (load-sharing statics,
// read in engineering articles, REFERENCES.md):
// - two cranes: the centre of gravity projected on the line between the picks,
//   share A = W · d_B / (d_A + d_B);
// - three picks not in a line: ΣV = W and the moments about both plan axes, a 3 × 3 system;
// - four picks (or three in a line): statics leaves the shares open; the planner states them and
//   they are checked against force and moment balance within 1% (common practice, no source), and
//   refused (fail) when they do not balance.
// W is the load's weight; each crane then carries its share plus its own rigging and hook block.
// Every crane gets every single-crane check for that, and its gross load must stay below its chart
// capacity by the multi-crane margin (Queensland Mobile Crane Code of Practice 2006 §14.3.2, read:
// 20% two cranes, 33% three, 50% four or more; site policy). Sensitivity: the centre of gravity
// moved by a fraction of the pick spacing (default 5%, common practice, no source).
import type { LiftInput } from '../schemas/lift-input';
import { exceeds } from './compare';
import { si, type Quantity } from './units';

export const SHARE_BALANCE_TOLERANCE = 0.01;
export const DEFAULT_CG_OFFSET_FRACTION = 0.05;

export type Point = readonly [number, number];

export interface SharePlan {
  /** load weight shared (N) */
  W: number;
  method: 'two' | 'three' | 'stated' | 'none';
  /** share of the load per crane (N), lead first; null when it cannot be found */
  shares: number[] | null;
  picks: (Point | null)[];
  cg: Point;
  spacing: number;
  /** shares with the centre of gravity moved by offset in each direction tried */
  sensitivity: { offset: number; min: number[]; max: number[] } | null;
  /** stated shares: residual force (N) and moment (N·m) against the load */
  balance: { force: number; moment: number | null; ok: boolean } | null;
  /** why the shares could not be found */
  reason: string | null;
}

const pt = (p: { x: Quantity; y: Quantity } | undefined): Point | null => {
  const x = si(p?.x);
  const y = si(p?.y);
  return x === undefined || y === undefined ? null : [x, y];
};

export function solveShares(W: number, picks: Point[], g: Point): number[] | null {
  if (picks.length === 2) {
    const [a, b] = picks;
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const L2 = dx * dx + dy * dy;
    if (!(L2 > 0)) return null;
    const t = ((g[0] - a[0]) * dx + (g[1] - a[1]) * dy) / L2;
    return [W * (1 - t), W * t];
  }
  if (picks.length === 3) {
    // [1 1 1; x1 x2 x3; y1 y2 y3] s = [W; W gx; W gy], relative to the centre of gravity
    const p = picks.map((q) => [q[0] - g[0], q[1] - g[1]]);
    const det = (p[1][0] - p[0][0]) * (p[2][1] - p[0][1]) - (p[2][0] - p[0][0]) * (p[1][1] - p[0][1]);
    const s = spacingOf(picks);
    if (!(Math.abs(det) > 1e-6 * s * s)) return null;
    // barycentric coordinates of the centre of gravity (the origin here) in the pick triangle
    const area = (u: number[], v: number[], w: number[]) =>
      (v[0] - u[0]) * (w[1] - u[1]) - (w[0] - u[0]) * (v[1] - u[1]);
    const o = [0, 0];
    return [
      (W * area(o, p[1], p[2])) / det,
      (W * area(p[0], o, p[2])) / det,
      (W * area(p[0], p[1], o)) / det,
    ];
  }
  return null;
}

function spacingOf(picks: Point[]): number {
  let s = 0;
  for (let i = 0; i < picks.length; i++)
    for (let j = i + 1; j < picks.length; j++)
      s = Math.max(s, Math.hypot(picks[i][0] - picks[j][0], picks[i][1] - picks[j][1]));
  return s;
}

export function sharePlan(input: LiftInput): SharePlan {
  const mc = input.multiCrane!;
  const W = si(input.load.weight)!;
  const picks = [pt(mc.lead.pickPoint), ...mc.others.map((o) => pt(o.pickPoint))];
  const cg = pt(mc.loadCg) ?? ([0, 0] as Point);
  const stated = [si(mc.lead.statedShare), ...mc.others.map((o) => si(o.statedShare))];
  const n = picks.length;
  const all = picks.every((p) => p !== null) ? (picks as Point[]) : null;
  const spacing = all ? spacingOf(all) : 0;
  const base = { W, picks, cg, spacing, sensitivity: null, balance: null, reason: null };
  if (all && (n === 2 || n === 3)) {
    const shares = solveShares(W, all, cg);
    if (shares) {
      const f = mc.cgOffsetFraction ?? DEFAULT_CG_OFFSET_FRACTION;
      const offset = f * spacing;
      const dirs: Point[] =
        n === 2
          ? (() => {
              const ux = (all[1][0] - all[0][0]) / spacing;
              const uy = (all[1][1] - all[0][1]) / spacing;
              return [
                [ux, uy],
                [-ux, -uy],
              ];
            })()
          : [
              [1, 0],
              [-1, 0],
              [0, 1],
              [0, -1],
            ];
      const min = [...shares];
      const max = [...shares];
      for (const d of dirs) {
        const moved = solveShares(W, all, [cg[0] + d[0] * offset, cg[1] + d[1] * offset])!;
        moved.forEach((v, i) => {
          min[i] = Math.min(min[i], v);
          max[i] = Math.max(max[i], v);
        });
      }
      return { ...base, method: n === 2 ? 'two' : 'three', shares, sensitivity: { offset, min, max } };
    }
  }
  if (stated.every((s) => s !== undefined)) {
    const shares = stated as number[];
    let force = -W;
    for (const s of shares) force += s;
    let moment: number | null = null;
    if (all) {
      let mx = 0;
      let my = 0;
      shares.forEach((s, i) => {
        mx += s * (all[i][0] - cg[0]);
        my += s * (all[i][1] - cg[1]);
      });
      moment = Math.hypot(mx, my);
    }
    const ok =
      !exceeds(Math.abs(force), SHARE_BALANCE_TOLERANCE * W) &&
      (moment === null || !exceeds(moment, SHARE_BALANCE_TOLERANCE * W * spacing));
    return { ...base, method: 'stated', shares, balance: { force, moment, ok } };
  }
  return {
    ...base,
    method: 'none',
    shares: null,
    reason:
      n >= 4 || (all && n === 3)
        ? 'With four cranes, or three pick points in a line, statics does not fix the shares: state each crane’s share from the lift plan.'
        : 'Enter each crane’s pick point (and the load’s centre of gravity) or each crane’s share.',
  };
}
