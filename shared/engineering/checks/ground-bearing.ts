// Check 5 — support reactions and ground bearing (PRODUCT.md §5).
// Outriggers: rigid base on four supports of equal stiffness (statics, common practice):
//   R_i = V/4 ± M_L/(2·L) ± M_T/(2·B), with V the total weight, M_L = V·e_x and M_T = V·e_y its
//   moments about the box centre, L and B the longitudinal and transverse spreads. When one R_i goes
//   negative that support lifts off; the load is then shared by the other three (statically
//   determinate) and the result is flagged. When the resultant lies outside the box no compressive
//   reactions balance the crane: "no support solution", fail, and no force is reported.
// Wind: for each slew the wind is tried from several directions (ground-bearing-wind.ts); the
//   largest reaction or pressure governs. Crawler tracks as eccentric footings, on mats or not:
//   ground-bearing-tracks.ts. Pressure under the mats against the allowable bearing (as entered,
//   else IBC Table 1806.2 for the soil class): ground-bearing-pressure.ts.
import { exceeds } from '../compare';
import { planModel, resultant, SLEW_SWEEP, windDirections, type PlanModel } from '../crane-model';
import { check, f, item, term, type Ctx } from '../context';
import { pressureItem } from './ground-bearing-pressure';
import { NO_WIND, withWind, worstWind } from './ground-bearing-wind';
import { gantryStatics } from './stability-gantry';
import { fourSupportReactions, supportReactions } from './support-reactions';
import { crawler } from './ground-bearing-tracks';
import { SOURCES } from '../sources';
import { si } from '../units';
import type { CheckItem, CheckResult, Fix, LiftFigures } from '../types';

type Dir = readonly [number, number];

/** The widest angle (radians) between neighbouring plan directions (one or two here). */
function widestGap(dirs: readonly Dir[]): number {
  if (dirs.length < 2) return 2 * Math.PI;
  let gap = 0;
  const angles = dirs.map(([x, y]) => Math.atan2(y, x)).sort((x, y) => x - y);
  for (let i = 0; i < angles.length; i++) {
    const next = i + 1 < angles.length ? angles[i + 1] : angles[0] + 2 * Math.PI;
    gap = Math.max(gap, next - angles[i]);
  }
  return gap;
}

function outriggers(ctx: Ctx, m: PlanModel, figures: LiftFigures, items: CheckItem[], fixes?: Fix[]) {
  const entered = ctx.input.crane.slewAngle;
  const slews = entered ? [entered.value] : SLEW_SWEEP;
  let worst = { max: -Infinity, R: [0, 0, 0, 0], slew: 0, liftOff: -1, V: 0, ex: 0, ey: 0 };
  let tips: { slew: number; edge: string; ex: number; ey: number; V: number } | null = null;
  type Case = {
    p: number;
    R: number[] | null;
    liftOff: number;
    /** the smallest of the four-support reactions (negative once a support lifts off) */
    low: number;
    V: number;
    ex: number;
    ey: number;
  };
  const at = (r: { V: number; ex: number; ey: number }): Case => {
    const ex = r.ex - m.x0;
    const R = supportReactions(r.V, ex, r.ey, m.a, m.b);
    if (!R) return { p: Infinity, R: null, liftOff: -1, low: -Infinity, V: r.V, ex, ey: r.ey };
    const four = fourSupportReactions(r.V, ex, r.ey, m.a, m.b);
    let liftOff = -1;
    for (let i = 0; i < 4; i++) if (four[i] < 0 && (liftOff < 0 || four[i] < four[liftOff])) liftOff = i;
    const low = Math.min(four[0], four[1], four[2], four[3]);
    return { p: Math.max(R[0], R[1], R[2], R[3]), R, liftOff, low, V: r.V, ex, ey: r.ey };
  };
  const M = m.windMoment;
  const lipschitz = Math.hypot(1 / m.a, 1 / m.b) / 2;
  const refine: { t: number; calm: ReturnType<typeof resultant>; dirs: Dir[]; seed: number }[] = [];
  for (const t of slews) {
    const calm = resultant(m, t, NO_WIND);
    // the corner and the eccentricity directions load a corner most while all four supports bear
    // (the reactions are linear in the wind there)
    const dirs: Dir[] = M > 0 ? windDirections(m.a, m.b, calm.ex - m.x0, calm.ey) : [];
    const cases: Case[] = [];
    if (M > 0) for (const d of dirs) cases.push(at(withWind(calm, M, d)));
    else cases.push(at(calm));
    // a wind square to the line the resultant is nearest takes it furthest past that line: it
    // alone decides whether any wind tips the crane
    let tipped: Case | undefined;
    for (const k of cases) if (k.R === null) tipped = tipped ?? k;
    if (!tipped && M > 0 && calm.V > 0) {
      let n = m.edges[0];
      let past = -Infinity;
      for (const E of m.edges) {
        const o = E.nx * calm.ex + E.ny * calm.ey - E.d;
        if (o > past) {
          past = o;
          n = E;
        }
      }
      // only a resultant within M/V of a line can be blown past it
      if (past + M / calm.V > -1e-9 * n.d) {
        const r = withWind(calm, M, [n.nx, n.ny]);
        if (exceeds(n.nx * r.ex + n.ny * r.ey, n.d)) {
          const k = at(r);
          if (k.R === null) tipped = k;
        }
      }
    }
    if (tipped) {
      // no compressive reactions balance the crane: it tips about the line the resultant is beyond
      if (!tips) {
        const r = { ex: tipped.ex + m.x0, ey: tipped.ey };
        let e = 0;
        let beyond = -Infinity;
        m.edges.forEach((E, k) => {
          const over = E.nx * r.ex + E.ny * r.ey - E.d;
          if (over > beyond) {
            beyond = over;
            e = k;
          }
        });
        tips = { slew: t, edge: m.edges[e].label, ex: tipped.ex, ey: tipped.ey, V: tipped.V };
      }
      continue;
    }
    let c = cases[0];
    for (const k of cases) if (k.p > c.p * (1 + 1e-9)) c = k;
    if (c.p > worst.max * (1 + 1e-9))
      worst = { max: c.p, R: c.R!, slew: t, liftOff: c.liftOff, V: c.V, ex: c.ex, ey: c.ey };
    if (M > 0) {
      // While all four supports bear, a reaction changes by V·√(1/a² + 1/b²)/4 per metre the
      // resultant moves, and every wind's resultant lies within 2M/V of a seed's: when no support
      // can reach lift-off the reactions stay linear in the wind and the corner direction is the worst.
      let low = Infinity;
      for (const k of cases) low = Math.min(low, k.low);
      if (low - lipschitz * M < 0) refine.push({ t, calm, dirs, seed: c.p });
    }
  }
  // Once a support can lift off, the three-support reactions are no longer linear in the wind: the
  // wind's direction is searched over the whole circle for each slew whose bound could still beat
  // the worst found. Three supports: a reaction moves twice as fast as on four, so no wind takes
  // the largest more than lipschitz · M past the calm one, nor (lipschitz · M per radian of the
  // wind's direction) more than half the widest gap between the seed directions (π at most) past
  // the seeds' largest.
  const open = tips ? [] : refine.filter((k) => k.seed + lipschitz * M * Math.PI > worst.max * (1 + 1e-9));
  open.sort((x, y) => (y.seed > x.seed ? 1 : y.seed < x.seed ? -1 : 0));
  for (const k of open) {
    const bound = Math.min(at(k.calm).p + lipschitz * M, k.seed + (lipschitz * M * widestGap(k.dirs)) / 2);
    if (bound > worst.max * (1 + 1e-9)) {
      const c = worstWind((d) => at(withWind(k.calm, M, d)), k.dirs);
      if (c.R && c.p > worst.max * (1 + 1e-9))
        worst = { max: c.p, R: c.R, slew: k.t, liftOff: c.liftOff, V: c.V, ex: c.ex, ey: c.ey };
    }
  }
  if (tips) {
    figures.supportReactions = [];
    figures.maxSupportReaction = null;
    items.push(
      item(ctx, {
        id: 'ground-bearing.reactions',
        label: 'Outrigger reactions',
        status: 'fail',
        value: null,
        unit: 'weight',
        formula: f`slew ${tips.slew.toFixed(0)}°: resultant ${term(tips.V, 'weight')} at eₓ ${term(tips.ex, 'length')}, e_y ${term(
          tips.ey,
          'length',
        )} from the box centre, outside the box of half-length ${term(m.a, 'length')} and half-width ${term(m.b, 'length')}`,
        source: SOURCES.rigidBase,
        message: `No support solution: the crane tips about the ${tips.edge}. No set of compressive outrigger reactions balances it.`,
      }),
    );
    return;
  }
  figures.supportReactions = m.supports.map((s, i) => ({
    label: s.label,
    x: s.x,
    y: s.y,
    reaction: worst.R[i],
  }));
  figures.maxSupportReaction = worst.max;
  const L = 2 * m.a;
  const B = 2 * m.b;
  items.push(
    item(ctx, {
      id: 'ground-bearing.reactions',
      label: 'Largest outrigger reaction',
      status: worst.liftOff >= 0 ? 'caution' : 'pass',
      value: worst.max,
      unit: 'weight',
      formula: f`slew ${worst.slew.toFixed(0)}°${entered ? '' : ' (largest reaction)'}: R = V/4 ± V·eₓ/(2L) ± V·e_y/(2B), V ${term(
        worst.V,
        'weight',
      )}, eₓ ${term(worst.ex, 'length')}, e_y ${term(worst.ey, 'length')}, L ${term(L, 'length')}, B ${term(B, 'length')} → ${
        m.supports[0].label
      } ${term(worst.R[0], 'weight')}, ${m.supports[1].label} ${term(worst.R[1], 'weight')}, ${m.supports[2].label} ${term(
        worst.R[2],
        'weight',
      )}, ${m.supports[3].label} ${term(worst.R[3], 'weight')}`,
      source: SOURCES.rigidBase,
      message:
        worst.liftOff >= 0
          ? `The ${m.supports[worst.liftOff].label} outrigger lifts off in the four-support model; reactions shown are shared by the other three. Confirm with the manufacturer's outrigger load figures.`
          : 'Reactions from the rigid-base model on four supports.',
    }),
  );
  const mat = ctx.input.ground?.mat;
  if (mat) {
    const area = si(mat.length)! * si(mat.width)! * (mat.perSupport ?? 1);
    pressureItem(ctx, worst.max / area, area, worst.max, 'largest reaction', items, figures, fixes);
  }
}

export function groundBearingCheck(ctx: Ctx, figures: LiftFigures, fixes?: Fix[]): CheckResult {
  const items: CheckItem[] = [];
  if (ctx.input.crane.type === 'gantry_a_frame') {
    const gs = gantryStatics(ctx);
    const mat = ctx.input.ground?.mat;
    if (!gs || !mat) return na(ctx, 'Enter the mat size under each gantry foot.');
    const Wf = si(ctx.input.crane.gantry!.frameWeight)!;
    const foot =
      (gs.frameCompression *
        Math.cos(
          Math.asin(Math.min(1, gs.outreach / Math.max(1e-9, Math.hypot(gs.outreach, gs.apexHeight)))),
        ) +
        Wf / 2) /
      2;
    const area = si(mat.length)! * si(mat.width)! * (mat.perSupport ?? 1);
    items.push(
      item(ctx, {
        id: 'ground-bearing.reactions',
        label: 'Reaction at each leg foot',
        status: 'pass',
        value: foot,
        unit: 'weight',
        formula: f`(frame compression ${term(gs.frameCompression, 'force')} × cos(inclination) + half frame weight ${term(Wf / 2, 'weight')}) ÷ 2 feet = ${term(foot, 'weight')}`,
        source: SOURCES.statics,
        message: 'Vertical reaction at each foot of the legs.',
      }),
    );
    figures.maxSupportReaction = foot;
    pressureItem(ctx, foot / area, area, foot, 'foot reaction', items, figures, fixes);
    return check('ground-bearing', 'Support reactions and ground bearing', items);
  }
  if (ctx.geometry.radius === null) return na(ctx, 'No radius entered.');
  const m = planModel(ctx, ctx.geometry.radius);
  if (!m) return na(ctx, 'Enter the crane weights and the outrigger spread or track geometry.');
  if (m.kind === 'outriggers') outriggers(ctx, m, figures, items, fixes);
  else crawler(ctx, m, items, figures, fixes);
  if (items.length === 1 && m.kind === 'outriggers')
    items.push(pressureNotChecked(ctx, 'Enter the mat size to check the pressure under the outriggers.'));
  return check('ground-bearing', 'Support reactions and ground bearing', items, 'ground-bearing.pressure');
}

/** The pressure could not be checked: the reason names what to enter. */
function pressureNotChecked(ctx: Ctx, message: string) {
  return item(ctx, {
    id: 'ground-bearing.pressure',
    label: 'Ground bearing pressure',
    status: 'not_applicable',
    value: null,
    unit: 'pressure',
    source: SOURCES.input,
    message,
  });
}

function na(ctx: Ctx, message: string): CheckResult {
  return check('ground-bearing', 'Support reactions and ground bearing', [pressureNotChecked(ctx, message)]);
}
