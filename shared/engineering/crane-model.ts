// The crane as masses in plan and a support polygon, for the moment balance and the support
// reactions. Coordinates: origin at the centre of rotation on the ground; x toward the rear of the
// carrier/carbody, y to its side. The rotating upper's masses lie on the boom line at signed
// distance s (positive toward the load). The boom's direction is the slew angle measured from
// "over the rear" (x axis). Tipping edges are the support lines: outrigger float centrelines, or
// the crawler track centrelines (sides, conservative) and track ends (tumbler centres).
import type { Ctx } from './context';
import { DEG, si, siOr } from './units';

export interface Edge {
  label: string;
  /** outward normal */
  nx: number;
  ny: number;
  /** points with n·p > d are beyond the edge */
  d: number;
}

export interface PlanModel {
  kind: 'outriggers' | 'crawler';
  labels: string[];
  /** weights (N) and positions s (m) along the boom line; index 0 is the gross load, 1 the boom */
  w: number[];
  s: number[];
  carrierW: number;
  carrierX: number;
  edges: Edge[];
  /**
   * wind: sum of force × height about the ground (N·m). The wind may blow from any direction: the
   * moment balance adds it in full about every tipping line, reactions take the least favourable way.
   */
  windMoment: number;
  /** support corners (outriggers) x, y */
  supports: { label: string; x: number; y: number }[];
  /** outrigger box or crawler centre x, half-length a (along x), half-width b (along y) */
  x0: number;
  a: number;
  b: number;
  /** index of the counterweight in w/s, -1 if none */
  cwIndex: number;
}

/** Boom CG position along the boom line for a radius (boom angle follows from the radius). */
export function boomCgAt(ctx: Ctx, radius: number): number {
  const g = ctx.geometry;
  const L = g.boomLength ?? 0;
  const c = siOr(ctx.input.crane.boom?.cgFromFoot, L / 2);
  if (L <= 0) return g.pivotOffset;
  let cos = (radius - g.pivotOffset) / L;
  if (cos > 1) cos = 1;
  if (cos < -1) cos = -1;
  return g.pivotOffset + c * cos;
}

export function planModel(ctx: Ctx, radius: number): PlanModel | null {
  const c = ctx.input.crane;
  if (c.type === 'gantry_a_frame') return null;
  const box = c.type === 'mobile_outriggers' ? c.outriggers : undefined;
  const tr = c.type === 'mobile_crawler' ? c.tracks : undefined;
  if (!box && !tr) return null;
  if (!c.counterweight && !c.upperWorks && !c.carrier) return null;
  const labels = ['gross load', 'boom'];
  const w = [ctx.gross, siOr(c.boom?.weight, 0)];
  const s = [radius, boomCgAt(ctx, radius)];
  if (c.upperWorks) {
    labels.push('upper works');
    w.push(si(c.upperWorks.weight)!);
    s.push(-si(c.upperWorks.cgBehindRotation)!);
  }
  let cwIndex = -1;
  if (c.counterweight) {
    cwIndex = w.length;
    labels.push('counterweight');
    w.push(si(c.counterweight.weight)!);
    s.push(-si(c.counterweight.cgBehindRotation)!);
  }
  const carrierW = siOr(c.carrier?.weight, 0);
  const carrierX = siOr(c.carrier?.cgRearOfRotation, 0);
  let x0: number, a: number, b: number;
  if (box) {
    x0 = siOr(box.boxCentreRearOfRotation, 0);
    a = si(box.longitudinalSpread)! / 2;
    b = si(box.transverseSpread)! / 2;
  } else {
    x0 = siOr(tr!.centreRearOfRotation, 0);
    a = si(tr!.length)! / 2;
    b = si(tr!.gauge)! / 2;
  }
  const side = box ? 'outriggers' : 'track';
  const edges: Edge[] = [
    { label: `rear ${box ? 'outrigger line' : 'track ends'}`, nx: 1, ny: 0, d: x0 + a },
    { label: `front ${box ? 'outrigger line' : 'track ends'}`, nx: -1, ny: 0, d: a - x0 },
    { label: `left-side ${side}${box ? ' line' : ' centreline'}`, nx: 0, ny: 1, d: b },
    { label: `right-side ${side}${box ? ' line' : ' centreline'}`, nx: 0, ny: -1, d: b },
  ];
  const wind = ctx.wind;
  const windMoment = wind ? wind.loadForce * wind.loadHeight + wind.boomForce * wind.boomHeight : 0;
  const supports = box
    ? [
        { label: 'right front', x: x0 - a, y: -b },
        { label: 'left front', x: x0 - a, y: b },
        { label: 'left rear', x: x0 + a, y: b },
        { label: 'right rear', x: x0 + a, y: -b },
      ]
    : [];
  return {
    kind: box ? 'outriggers' : 'crawler',
    labels,
    w,
    s,
    carrierW,
    carrierX,
    edges,
    windMoment,
    supports,
    x0,
    a,
    b,
    cwIndex,
  };
}

export interface EdgeBalance {
  edge: number;
  overturning: number;
  resisting: number;
  ratio: number;
}

/** Moment balance about one edge for a slew angle: overturning and resisting moments. */
export function edgeBalance(m: PlanModel, slewDeg: number, e: number, withWind = true): EdgeBalance {
  const ux = Math.cos(slewDeg * DEG);
  const uy = Math.sin(slewDeg * DEG);
  const E = m.edges[e];
  const nu = E.nx * ux + E.ny * uy;
  // the least favourable wind for this line blows square to it, whatever the boom's direction
  let ovt = withWind ? m.windMoment : 0;
  let res = 0;
  for (let i = 0; i < m.w.length; i++) {
    const arm = m.s[i] * nu - E.d; // n·p − d with p = s·u
    if (arm > 0) ovt += m.w[i] * arm;
    else res -= m.w[i] * arm;
  }
  const ca = E.nx * m.carrierX - E.d;
  if (ca > 0) ovt += m.carrierW * ca;
  else res -= m.carrierW * ca;
  return { edge: e, overturning: ovt, resisting: res, ratio: ovt > 0 ? res / ovt : Infinity };
}

/** The governing (lowest-ratio) edge for a slew angle. */
export function governing(m: PlanModel, slewDeg: number): EdgeBalance {
  let best = edgeBalance(m, slewDeg, 0);
  for (let e = 1; e < m.edges.length; e++) {
    const b = edgeBalance(m, slewDeg, e);
    // ties (within rounding of unit conversions) keep the first, so either unit system picks the same edge
    if (b.ratio < best.ratio * (1 - 1e-9)) best = b;
  }
  return best;
}

/** Slew angles examined when none is entered: every 5°, which includes over the rear, side and front. */
export const SLEW_SWEEP: readonly number[] = Array.from({ length: 72 }, (_, i) => i * 5);

/** The slew angle entered, or the least favourable one of the sweep (and the corner directions). */
export function worstSlew(
  ctx: Ctx,
  m: PlanModel,
): { slewDeg: number; balance: EdgeBalance; entered: boolean } {
  const entered = ctx.input.crane.slewAngle;
  if (entered) return { slewDeg: entered.value, balance: governing(m, entered.value), entered: true };
  let slew = 0;
  let best = governing(m, 0);
  const corner = Math.atan2(m.b, m.a) / DEG;
  const extra = [corner, 180 - corner, 180 + corner, 360 - corner];
  for (let i = 1; i < SLEW_SWEEP.length + extra.length; i++) {
    const t = i < SLEW_SWEEP.length ? SLEW_SWEEP[i] : extra[i - SLEW_SWEEP.length];
    const b = governing(m, t);
    if (b.ratio < best.ratio * (1 - 1e-9)) {
      best = b;
      slew = t;
    }
  }
  return { slewDeg: slew, balance: best, entered: false };
}

/**
 * Total vertical load and its plan position, the wind moment added as an eccentricity blowing along
 * the plan direction `wind` (a unit vector; by default along the boom line).
 */
export function resultant(
  m: PlanModel,
  slewDeg: number,
  wind?: readonly [number, number],
): { V: number; ex: number; ey: number } {
  const ux = Math.cos(slewDeg * DEG);
  const uy = Math.sin(slewDeg * DEG);
  let V = m.carrierW;
  let mx = m.carrierW * m.carrierX;
  let my = 0;
  for (let i = 0; i < m.w.length; i++) {
    V += m.w[i];
    mx += m.w[i] * m.s[i] * ux;
    my += m.w[i] * m.s[i] * uy;
  }
  mx += m.windMoment * (wind ? wind[0] : ux);
  my += m.windMoment * (wind ? wind[1] : uy);
  return { V, ex: V > 0 ? mx / V : 0, ey: V > 0 ? my / V : 0 };
}

/**
 * Wind directions worth trying for the reactions and pressures at one slew, from the calm
 * eccentricity (ex, ey about the centre of a rigid rectangle of half-sizes a, b): square to
 * (1/a, 1/b) toward the corner the weights load most — in the four-support regime that corner's
 * reaction grows fastest with wind and stays the largest — and straight out along the eccentricity,
 * the way lift-off and tipping are reached first.
 */
export function windDirections(a: number, b: number, ex: number, ey: number): [number, number][] {
  const sx = ex >= 0 ? 1 : -1;
  const sy = ey >= 0 ? 1 : -1;
  const h = Math.hypot(1 / a, 1 / b);
  const out: [number, number][] = [];
  if (h > 0 && Number.isFinite(h)) out.push([sx / a / h, sy / b / h]);
  const e = Math.hypot(ex, ey);
  if (e > 0 && Number.isFinite(e)) out.push([ex / e, ey / e]);
  if (out.length === 0) out.push([1, 0]);
  return out;
}
