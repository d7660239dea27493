// Check 4, backward stability: the unloaded crane at the shortest radius of the plan, against the
// backward tipping criteria and the site's minimum stability ratio; a gantry or A-frame unloaded
// must still lean on its backstay (common practice, no source).
import { exceeds, fallsShort } from '../compare';
import { governing, planModel, SLEW_SWEEP } from '../crane-model';
import { columns, same as sameRow } from '../chart';
import { f, item, statusMax, statusMin, term, type Ctx } from '../context';
import { supportReactions } from './support-reactions';
import { gantryStatics } from './stability-gantry';
import { SOURCES } from '../sources';
import { DEG, siOr } from '../units';
import type { CheckItem } from '../types';

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
  if (c.type === 'gantry_a_frame') return gantryBackward(ctx);
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

/**
 * A gantry or A-frame unloaded (hook block only, no load to catch the wind): its backstay can only
 * pull, so the frame (half its weight and the block at the apex) must still lean on it. The
 * backstay tension from the apex equilibrium, T = W' · tan β · backstay length ÷ anchor distance,
 * is zero for legs standing vertical: nothing then holds the frame from falling backward.
 */
function gantryBackward(ctx: Ctx): CheckItem[] {
  const block = siOr(ctx.input.hookBlock?.weight, 0);
  const gs = gantryStatics({ ...ctx, wind: null }, block);
  if (!gs) return [];
  const T = gs.backstayTension;
  const leans = exceeds(T, 0);
  return [
    item(ctx, {
      id: 'stability.backward',
      label: 'Backward stability (unloaded): the frame still leans on its backstay',
      status: leans ? 'pass' : 'fail',
      value: T,
      limit: 0,
      limitType: 'min',
      unit: 'force',
      formula: f`unloaded, hook block ${term(block, 'weight')} at the apex ${term(gs.outreach, 'length')} ahead of the leg feet: backstay tension ${term(T, 'force')}, more than 0`,
      source: SOURCES.gantryBackward,
      message: leans
        ? 'Unloaded, the frame still leans forward on its backstay.'
        : 'Unloaded, the apex is not ahead of the leg feet: nothing holds the frame from falling backward (a backstay cannot push). Incline the legs toward the load or guy the frame forward.',
    }),
  ];
}
