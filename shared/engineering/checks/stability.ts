// Check 4 — stability as a moment balance about the tipping line (PRODUCT.md §4).
// Overturning moment = Σ weight × lever arm beyond the tipping line (gross load, boom, wind force ×
// height); resisting moment = Σ weight × lever arm inside it (upper works, carrier/carbody,
// counterweight). Ratio = resisting ÷ overturning against the site minimum (default 1.5, common
// practice, no source). For information, the chart capacity is compared with the tipping load from
// the same balance: ASME B30.5 §5-1.1.1 / SAE J765 rate at most 85% of tipping on outriggers, 75% on
// crawlers. Gantry/A-frame with two inclined legs: balance about the leg feet, the backstay ballast
// resisting; backstay tension and leg compression from the equilibrium of the apex.
// A failed ratio gets fixes: extra counterweight, counterweight arm, or the largest radius.
import { exceeds, fallsShort } from '../compare';
import {
  boomCgAt,
  edgeBalance,
  governing,
  planModel,
  SLEW_SWEEP,
  worstSlew,
  type PlanModel,
} from '../crane-model';
import { columns, same as sameRow } from '../chart';
import { check, f, item, statusMax, statusMin, term, type Ctx } from '../context';
import { gantryFrame } from './geometry';
import { supportReactions } from './support-reactions';
import { formatFormula, formatQuantity } from '../format';
import { SOURCES } from '../sources';
import { DEG, si, siOr } from '../units';
import type { CheckItem, CheckResult, Fix, FormulaPart, LiftFigures } from '../types';

export interface GantryStatics {
  outreach: number;
  apexHeight: number;
  overturning: number;
  resisting: number;
  ratio: number;
  backstayTension: number;
  frameCompression: number;
  legCompression: number;
  backstayAngleDeg: number;
}

/**
 * Gantry/A-frame statics. Side view: the frame (two legs) is pinned at its feet and inclined
 * forward; the load hangs from the apex; a backstay runs from the apex to ballast on the ground
 * behind the feet. Half the frame weight is lumped at the apex, half at the feet.
 */
export function gantryStatics(ctx: Ctx, gross = ctx.gross): GantryStatics | null {
  const g = ctx.input.crane.gantry;
  if (!g) return null;
  const fr = gantryFrame(ctx.input);
  const Wf = si(g.frameWeight)!;
  const d = si(g.backstayAnchorDistance)!;
  const Wb = si(g.ballastWeight)!;
  const xA = fr.outreach;
  const yA = fr.apexHeight;
  const F = ctx.wind ? ctx.wind.loadForce : 0;
  const overturning = gross * xA + Wf * (xA / 2) + F * yA;
  const resisting = Wb * d;
  // Apex equilibrium: C·e_f + T·e_t + (F, −W') = 0, with W' = gross + Wf/2.
  const ef = [Math.sin(fr.inclination), Math.cos(fr.inclination)];
  const tx = -d - xA;
  const ty = -yA;
  const tl = Math.hypot(tx, ty);
  const et = [tx / tl, ty / tl];
  const Wp = gross + Wf / 2;
  const det = ef[0] * et[1] - et[0] * ef[1];
  // Solve [ef et][C T]^T = [-F, Wp]
  const C = (-F * et[1] - et[0] * Wp) / det;
  const T = (ef[0] * Wp - ef[1] * -F) / det;
  const cosBeta = fr.leg > 0 ? fr.frameHeight / fr.leg : 1;
  return {
    outreach: xA,
    apexHeight: yA,
    overturning,
    resisting,
    ratio: overturning > 0 ? resisting / overturning : Infinity,
    backstayTension: T,
    frameCompression: C,
    legCompression: C / 2 / cosBeta,
    backstayAngleDeg: Math.atan2(yA, d + xA) / DEG,
  };
}

function ratioAtRadius(ctx: Ctx, slew: number, radius: number): number {
  const m = planModel(ctx, radius);
  if (!m) return Infinity;
  let r = Infinity;
  for (let e = 0; e < m.edges.length; e++) {
    const b = edgeBalance(m, slew, e);
    if (b.ratio < r) r = b.ratio;
  }
  return r;
}

function momentFormula(m: PlanModel, slew: number, e: number): { ovt: FormulaPart[]; res: FormulaPart[] } {
  const ux = Math.cos(slew * DEG);
  const uy = Math.sin(slew * DEG);
  const E = m.edges[e];
  const nu = E.nx * ux + E.ny * uy;
  const ovt: FormulaPart[] = [];
  const res: FormulaPart[] = [];
  const add = (label: string, w: number, arm: number) => {
    if (w === 0) return;
    const target = arm > 0 ? ovt : res;
    if (target.length) target.push(' + ');
    target.push(...f`${label} ${term(w, 'weight')} × ${term(Math.abs(arm), 'length')}`);
  };
  for (let i = 0; i < m.w.length; i++) add(m.labels[i], m.w[i], m.s[i] * nu - E.d);
  add('carrier', m.carrierW, E.nx * m.carrierX - E.d);
  if (m.windMoment > 0) {
    if (ovt.length) ovt.push(' + ');
    ovt.push(...f`wind square to the line ${term(m.windMoment, 'moment')}`);
  }
  return { ovt, res };
}

export function stabilityCheck(ctx: Ctx, fixes: Fix[], figures: LiftFigures): CheckResult {
  const { policy, geometry } = ctx;
  const minR = policy.minStabilityRatio;
  const src = SOURCES.policy(`minimum stability ratio ${minR} (default 1.5: common practice, no source)`);
  const items: CheckItem[] = [];
  if (ctx.input.crane.type === 'gantry_a_frame') {
    const gs = gantryStatics(ctx);
    if (!gs)
      return check('stability', 'Stability', [na(ctx, 'Enter the gantry legs, backstay and ballast.')]);
    figures.overturningMoment = gs.overturning;
    figures.resistingMoment = gs.resisting;
    figures.stabilityRatio = gs.ratio;
    const g = ctx.input.crane.gantry!;
    const Wf = si(g.frameWeight)!;
    items.push(
      item(ctx, {
        id: 'stability.ratio',
        label: 'Stability ratio about the leg feet',
        status: statusMin(gs.ratio, minR, policy),
        value: gs.ratio,
        limit: minR,
        limitType: 'min',
        unit: 'ratio',
        formula: f`resisting = ballast ${term(si(g.ballastWeight)!, 'weight')} × ${term(
          si(g.backstayAnchorDistance)!,
          'length',
        )} = ${term(gs.resisting, 'moment')}; overturning = gross ${term(ctx.gross, 'weight')} × ${term(
          gs.outreach,
          'length',
        )} + frame ${term(Wf, 'weight')} × ${term(gs.outreach / 2, 'length')}${
          ctx.wind && ctx.wind.loadForce > 0 ? ' + wind ' : ''
        }${ctx.wind && ctx.wind.loadForce > 0 ? term(ctx.wind.loadForce * gs.apexHeight, 'moment') : ''} = ${term(
          gs.overturning,
          'moment',
        )}; ratio = ${term(gs.ratio, 'ratio')}`,
        source: src,
        message: 'Moment balance about the feet of the legs; the ballast at the backstay anchor resists.',
      }),
    );
    const tieLimit = si(g.backstayRatedLoad);
    items.push(
      item(ctx, {
        id: 'stability.backstay',
        label: 'Backstay tension',
        status: tieLimit !== undefined ? statusMax(gs.backstayTension, tieLimit, policy) : 'pass',
        value: gs.backstayTension,
        limit: tieLimit ?? null,
        limitType: tieLimit !== undefined ? 'max' : null,
        unit: 'force',
        formula: f`apex equilibrium, backstay at ${term(gs.backstayAngleDeg, 'angle')}: T = ${term(gs.backstayTension, 'force')}`,
        source: tieLimit !== undefined ? SOURCES.input : SOURCES.statics,
        message:
          tieLimit !== undefined ? 'Backstay tension against its rated load.' : 'No backstay rating entered.',
      }),
    );
    const legLimit = si(g.legRatedCompression);
    items.push(
      item(ctx, {
        id: 'stability.leg-compression',
        label: 'Leg compression (each)',
        status: legLimit !== undefined ? statusMax(gs.legCompression, legLimit, policy) : 'pass',
        value: gs.legCompression,
        limit: legLimit ?? null,
        limitType: legLimit !== undefined ? 'max' : null,
        unit: 'force',
        formula: f`frame compression ${term(gs.frameCompression, 'force')} ÷ 2 legs ÷ cos(leg splay) = ${term(
          gs.legCompression,
          'force',
        )}`,
        source: legLimit !== undefined ? SOURCES.input : SOURCES.statics,
        message: legLimit !== undefined ? 'Leg compression against its rating.' : 'No leg rating entered.',
      }),
    );
    if (fallsShort(gs.ratio, minR) && g.ballastWeight) {
      const d = si(g.backstayAnchorDistance)!;
      const extra = (minR * gs.overturning - gs.resisting) / d;
      pushFix(ctx, fixes, {
        checkId: 'stability',
        kind: 'extra_counterweight',
        value: extra,
        unit: 'weight',
        formula: f`(${term(minR, 'ratio')} × ${term(gs.overturning, 'moment')} − ${term(gs.resisting, 'moment')}) ÷ ${term(d, 'length')}`,
        message: `Add ${formatQuantity(extra, 'weight', ctx.system)} of ballast at the backstay anchor.`,
      });
      const Wb = si(g.ballastWeight)!;
      if (Wb > 0) {
        const arm = (minR * gs.overturning) / Wb;
        pushFix(ctx, fixes, {
          checkId: 'stability',
          kind: 'counterweight_arm',
          value: arm,
          unit: 'length',
          formula: f`${term(minR, 'ratio')} × ${term(gs.overturning, 'moment')} ÷ ${term(Wb, 'weight')}`,
          message: `Or move the ballast anchor to ${formatQuantity(arm, 'length', ctx.system)} behind the leg feet.`,
        });
      }
    }
    return check('stability', 'Stability', items, 'stability.ratio');
  }

  if (geometry.radius === null) return check('stability', 'Stability', [na(ctx, 'No radius entered.')]);
  const m = planModel(ctx, geometry.radius);
  if (!m)
    return check('stability', 'Stability', [
      na(
        ctx,
        'Enter the crane weights and centres of gravity (upper works, carrier/carbody, counterweight) and the outrigger spread or track geometry.',
      ),
    ]);
  const { slewDeg, balance, entered } = worstSlew(ctx, m);
  const E = m.edges[balance.edge];
  const fm = momentFormula(m, slewDeg, balance.edge);
  figures.overturningMoment = balance.overturning;
  figures.resistingMoment = balance.resisting;
  figures.stabilityRatio = Number.isFinite(balance.ratio) ? balance.ratio : null;
  const along = E.nx * Math.cos(slewDeg * DEG) + E.ny * Math.sin(slewDeg * DEG);
  figures.tipping = along > 1e-9 ? { slewDeg, edge: E.label, distanceAlongBoom: E.d / along } : null;
  if (!Number.isFinite(balance.ratio)) {
    // Nothing lies beyond any tipping line (and no wind): there is no ratio to hold against the minimum.
    items.push(
      item(ctx, {
        id: 'stability.ratio',
        label: 'Stability ratio',
        status: 'not_applicable',
        value: null,
        unit: 'ratio',
        formula: [`about the ${E.label}: overturning moment `, term(balance.overturning, 'moment')],
        source: SOURCES.statics,
        message:
          'No overturning moment about any tipping line: every weight entered lies inside the supports.',
      }),
    );
    items.push(...backwardStability(ctx));
    return check('stability', 'Stability', items, 'stability.ratio');
  }
  const status = statusMin(balance.ratio, minR, policy);
  items.push(
    item(ctx, {
      id: 'stability.ratio',
      label: 'Stability ratio',
      status,
      value: balance.ratio,
      limit: minR,
      limitType: 'min',
      unit: 'ratio',
      formula: [
        `about the ${E.label}, slew ${slewDeg.toFixed(0)}°${entered ? '' : ' (least favourable)'}: resisting = `,
        ...fm.res,
        ' = ',
        term(balance.resisting, 'moment'),
        '; overturning = ',
        ...fm.ovt,
        ' = ',
        term(balance.overturning, 'moment'),
        '; ratio = ',
        term(balance.ratio, 'ratio'),
      ],
      source: src,
      message:
        status === 'fail'
          ? fallsShort(balance.ratio, 1)
            ? 'The crane would tip: the overturning moment exceeds the resisting moment.'
            : `Resisting ÷ overturning is below the site minimum of ${minR}.`
          : `Moment balance about the ${E.label}.`,
    }),
  );
  items.push(
    item(ctx, {
      id: 'stability.overturning',
      label: 'Overturning moment',
      status: 'pass',
      value: balance.overturning,
      unit: 'moment',
      formula: [...fm.ovt, ' = ', term(balance.overturning, 'moment')],
      source: SOURCES.statics,
      message: 'Weights beyond the tipping line × their lever arms, plus wind.',
    }),
    item(ctx, {
      id: 'stability.resisting',
      label: 'Resisting moment',
      status: 'pass',
      value: balance.resisting,
      unit: 'moment',
      formula: [...fm.res, ' = ', term(balance.resisting, 'moment')],
      source: SOURCES.statics,
      message: 'Weights inside the tipping line × their lever arms.',
    }),
  );
  // Tipping load on the governing edge, without wind (as the SAE J765 test is run).
  const ux = Math.cos(slewDeg * DEG);
  const uy = Math.sin(slewDeg * DEG);
  const nu = E.nx * ux + E.ny * uy;
  const loadArm = m.s[0] * nu - E.d;
  if (loadArm > 0) {
    const noLoad = { ...m, w: [0, ...m.w.slice(1)] };
    const b0 = edgeBalance(noLoad, slewDeg, balance.edge, false);
    const tipping = (b0.resisting - b0.overturning) / loadArm;
    const pctLimit = m.kind === 'outriggers' ? 85 : 75;
    const rated = ctx.chart.capacity;
    if (tipping > 0 && rated !== null) {
      const pct = (rated / tipping) * 100;
      items.push(
        item(ctx, {
          id: 'stability.rated-vs-tipping',
          label: 'Chart capacity as a share of the computed tipping load',
          status: pct > pctLimit ? 'caution' : 'pass',
          value: pct,
          limit: pctLimit,
          limitType: 'max',
          unit: 'percent',
          formula: f`tipping load = (resisting ${term(b0.resisting, 'moment')} − overturning without load ${term(
            b0.overturning,
            'moment',
          )}) ÷ load arm ${term(loadArm, 'length')} = ${term(tipping, 'weight')}; chart ${term(rated, 'weight')} = ${term(
            pct,
            'percent',
          )} of tipping`,
          source: SOURCES.asmeTipping,
          message:
            pct > pctLimit
              ? `For information: the chart rates more than ${pctLimit}% of the tipping load computed from the weights entered; check the crane weights and arms entered.`
              : `For information: the chart rates ${pct.toFixed(0)}% of the tipping load computed from the weights entered (at most ${pctLimit}%).`,
        }),
      );
    }
  }
  if (status === 'fail')
    stabilityFixes(ctx, fixes, m, slewDeg, balance.edge, balance.overturning, balance.resisting);
  items.push(...backwardStability(ctx));
  return check('stability', 'Stability', items, 'stability.ratio');
}

function pushFix(ctx: Ctx, fixes: Fix[], fx: Omit<Fix, 'text'>) {
  fixes.push({ ...fx, text: `${fx.message} (${formatFormula(fx.formula, ctx.system)})` });
}

function stabilityFixes(
  ctx: Ctx,
  fixes: Fix[],
  m: PlanModel,
  slew: number,
  e: number,
  ovt: number,
  res: number,
) {
  const minR = ctx.policy.minStabilityRatio;
  const E = m.edges[e];
  const ux = Math.cos(slew * DEG);
  const uy = Math.sin(slew * DEG);
  const nu = E.nx * ux + E.ny * uy;
  if (m.cwIndex >= 0) {
    const Wc = m.w[m.cwIndex];
    const arm = E.d - m.s[m.cwIndex] * nu; // lever arm inside the edge
    if (arm > 0) {
      const extra = (minR * ovt - res) / arm;
      pushFix(ctx, fixes, {
        checkId: 'stability',
        kind: 'extra_counterweight',
        value: extra,
        unit: 'weight',
        formula: f`(${term(minR, 'ratio')} × overturning ${term(ovt, 'moment')} − resisting ${term(
          res,
          'moment',
        )}) ÷ counterweight arm ${term(arm, 'length')} = ${term(extra, 'weight')}`,
        message: `Add ${formatQuantity(extra, 'weight', ctx.system)} of counterweight at the same position (if the manufacturer allows it).`,
      });
    }
    if (Wc > 0 && nu > 0) {
      const need = (minR * ovt - (res - Wc * Math.max(arm, 0))) / Wc;
      const behind = (need - E.d) / nu;
      pushFix(ctx, fixes, {
        checkId: 'stability',
        kind: 'counterweight_arm',
        value: behind,
        unit: 'length',
        formula: f`arm about the tipping line = (${term(minR, 'ratio')} × ${term(ovt, 'moment')} − other resisting ${term(
          res - Wc * Math.max(arm, 0),
          'moment',
        )}) ÷ ${term(Wc, 'weight')} = ${term(need, 'length')}`,
        message: `Or place the counterweight's centre of gravity ${formatQuantity(behind, 'length', ctx.system)} behind the centre of rotation.`,
      });
    }
  }
  // Largest radius restoring the ratio, by bisection (the ratio falls as the radius grows).
  const g = ctx.geometry;
  let lo = Math.max(0, g.pivotOffset);
  let hi = g.radius!;
  if (ratioAtRadius(ctx, slew, lo) >= minR) {
    for (let i = 0; i < 40; i++) {
      const mid = (lo + hi) / 2;
      if (ratioAtRadius(ctx, slew, mid) >= minR) lo = mid;
      else hi = mid;
    }
    pushFix(ctx, fixes, {
      checkId: 'stability',
      kind: 'max_radius',
      value: lo,
      unit: 'length',
      formula: f`bisection on the moment balance: ratio ≥ ${term(minR, 'ratio')} up to radius ${term(lo, 'length')} (boom CG at ${term(
        boomCgAt(ctx, lo),
        'length',
      )})`,
      message: `Or reduce the radius to ${formatQuantity(lo, 'length', ctx.system)} or less.`,
    });
  }
}

function na(ctx: Ctx, message: string): CheckItem {
  return item(ctx, {
    id: 'stability.ratio',
    label: 'Stability ratio',
    status: 'not_applicable',
    value: null,
    unit: 'ratio',
    source: SOURCES.input,
    message,
  });
}

/** Supports on each edge of the outrigger box, in planModel's order (rear, front, left, right). */
const EDGE_SUPPORTS: readonly (readonly [number, number])[] = [
  [2, 3],
  [0, 1],
  [1, 2],
  [0, 3],
];

/**
 * Backward stability: the crane unloaded (hook block only), the boom at the shortest radius of the
 * plan (the shortest radius the chart lists for the boom used, or the plan's radius if shorter), in
 * every direction, with the boom's wind blowing backward. Criteria (ASME B30.5 §5-1.1.2, from
 * memory; the same test read in ASME B30.4-2020 §4-1.3.4): crawlers — the crane's centre of gravity
 * no further from the axis of rotation than 70% of the distance to the backward tipping fulcrum;
 * outriggers or wheels — the supports on the boom side carry at least 15% of the crane's weight.
 * The moment balance about the backward tipping line is held against the site minimum as well.
 */
export function backwardStability(ctx: Ctx): CheckItem[] {
  const c = ctx.input.crane;
  if (c.type === 'gantry_a_frame')
    return [
      item(ctx, {
        id: 'stability.backward',
        label: 'Backward stability (unloaded)',
        status: 'not_applicable',
        value: null,
        unit: 'percent',
        source: SOURCES.statics,
        message:
          'A frame held by a backstay to ballast on the ground has no backward tipping case: the backstay cannot push.',
      }),
    ];
  const rPlan = ctx.geometry.radius;
  if (rPlan === null) return [];
  const used = ctx.chart.boomLengthUsed ?? ctx.geometry.boomLength;
  const col = used === null ? undefined : columns(ctx.rows).find((k) => sameRow(k.boomLength, used));
  const rMin = Math.max(ctx.geometry.pivotOffset, Math.min(rPlan, col?.rows[0]?.radius ?? rPlan));
  const block = siOr(ctx.input.hookBlock?.weight, 0);
  const w = ctx.wind;
  const uctx: Ctx = {
    ...ctx,
    gross: block,
    belowHook: 0,
    wind: w ? { ...w, loadForce: 0 } : null,
  };
  const m = planModel(uctx, rMin);
  if (!m) return [];
  const corner = Math.atan2(m.b, m.a) / DEG;
  const slews = [...SLEW_SWEEP, corner, 180 - corner, 180 + corner, 360 - corner];
  let V = m.carrierW;
  for (const wi of m.w) V += wi;
  const crawler = m.kind === 'crawler';
  let worst = { value: crawler ? -Infinity : Infinity, slew: 0, cg: 0, reach: 0 };
  let worstRatio = { ratio: Infinity, slew: 0, edge: 0, ovt: 0, res: 0 };
  for (const t of slews) {
    const ux = Math.cos(t * DEG);
    const uy = Math.sin(t * DEG);
    let mx = m.carrierW * m.carrierX;
    let my = 0;
    for (let i = 0; i < m.w.length; i++) {
      mx += m.w[i] * m.s[i] * ux;
      my += m.w[i] * m.s[i] * uy;
    }
    // the boom's wind pushes backward, the least favourable way for this case
    mx -= m.windMoment * ux;
    my -= m.windMoment * uy;
    const ex = V > 0 ? mx / V : 0;
    const ey = V > 0 ? my / V : 0;
    if (crawler) {
      const behind = -(ex * ux + ey * uy);
      let reach = Infinity;
      for (const E of m.edges) {
        const k = -(E.nx * ux + E.ny * uy);
        if (k > 1e-12) reach = Math.min(reach, E.d / k);
      }
      const pct = (behind / reach) * 100;
      if (pct > worst.value + 1e-12) worst = { value: pct, slew: t, cg: behind, reach };
    } else {
      let e = 0;
      for (let i = 1; i < 4; i++)
        if (m.edges[i].nx * ux + m.edges[i].ny * uy > m.edges[e].nx * ux + m.edges[e].ny * uy + 1e-12) e = i;
      const R = supportReactions(V, ex - m.x0, ey, m.a, m.b);
      const [i, j] = EDGE_SUPPORTS[e];
      const pct = R ? ((R[i] + R[j]) / V) * 100 : 0;
      if (pct < worst.value - 1e-12) worst = { value: pct, slew: t, cg: -(ex * ux + ey * uy), reach: e };
    }
  }
  // The unloaded balance is least favourable with the boom over an end, a side or a corner, or
  // where the criterion above was worst: those slews are enough for the ratio.
  for (const t of [0, 90, 180, 270, corner, 180 - corner, 180 + corner, 360 - corner, worst.slew]) {
    const g = governing(m, t);
    if (g.ratio < worstRatio.ratio)
      worstRatio = { ratio: g.ratio, slew: t, edge: g.edge, ovt: g.overturning, res: g.resisting };
  }
  const items: CheckItem[] = [];
  const pol = ctx.policy;
  if (V > 0) {
    if (crawler) {
      const lim = pol.backwardCrawlerCgPct;
      items.push(
        item(ctx, {
          id: 'stability.backward',
          label: 'Backward stability (unloaded): centre of gravity against the backward fulcrum',
          status: statusMax(worst.value, lim, pol),
          value: worst.value,
          limit: lim,
          limitType: 'max',
          unit: 'percent',
          formula: f`unloaded, hook block ${term(block, 'weight')} at radius ${term(rMin, 'length')}, slew ${worst.slew.toFixed(0)}° (least favourable): crane CG ${term(
            worst.cg,
            'length',
          )} behind the axis ÷ backward fulcrum ${term(worst.reach, 'length')} = ${term(worst.value, 'percent')}`,
          source: SOURCES.policy(
            `backward stability, crawlers ${lim}% (default: ${SOURCES.asmeBackward.text})`,
          ),
          message: exceeds(worst.value, lim)
            ? 'The unloaded crane could tip backward: its centre of gravity is too close to the backward tipping fulcrum.'
            : 'Unloaded crane at the shortest radius: centre of gravity against the backward tipping fulcrum.',
        }),
      );
    } else {
      const lim = pol.backwardBoomSideSupportPct;
      items.push(
        item(ctx, {
          id: 'stability.backward',
          label: 'Backward stability (unloaded): share of weight on the boom-side supports',
          status: statusMin(worst.value, lim, pol),
          value: worst.value,
          limit: lim,
          limitType: 'min',
          unit: 'percent',
          formula: f`unloaded, hook block ${term(block, 'weight')} at radius ${term(rMin, 'length')}, slew ${worst.slew.toFixed(0)}° (least favourable): crane weight ${term(
            V,
            'weight',
          )}, CG ${term(worst.cg, 'length')} behind the axis; boom-side supports carry ${term(worst.value, 'percent')}`,
          source: SOURCES.policy(
            `backward stability, outriggers ${lim}% (default: ${SOURCES.asmeBackward.text})`,
          ),
          message: fallsShort(worst.value, lim)
            ? 'The unloaded crane could tip backward: too little of its weight stays on the boom-side supports.'
            : 'Unloaded crane at the shortest radius: weight left on the boom-side supports.',
        }),
      );
    }
  }
  if (Number.isFinite(worstRatio.ratio)) {
    const minR = pol.minStabilityRatio;
    const E = m.edges[worstRatio.edge];
    items.push(
      item(ctx, {
        id: 'stability.backward-ratio',
        label: 'Unloaded crane: stability ratio',
        status: statusMin(worstRatio.ratio, minR, pol),
        value: worstRatio.ratio,
        limit: minR,
        limitType: 'min',
        unit: 'ratio',
        formula: f`unloaded about the ${E.label}, slew ${worstRatio.slew.toFixed(0)}°: resisting ${term(worstRatio.res, 'moment')} ÷ overturning ${term(
          worstRatio.ovt,
          'moment',
        )} = ${term(worstRatio.ratio, 'ratio')}`,
        source: SOURCES.policy(`minimum stability ratio ${minR} (default 1.5: common practice, no source)`),
        message: 'Moment balance of the unloaded crane about its least favourable tipping line.',
      }),
    );
  }
  return items;
}
