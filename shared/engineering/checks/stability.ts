// Check 4 — stability as a moment balance about the tipping line (PRODUCT.md §4).
// Overturning moment = Σ weight × lever arm beyond the tipping line (gross load, boom, wind force ×
// height); resisting moment = Σ weight × lever arm inside it (upper works, carrier/carbody,
// counterweight). Ratio = resisting ÷ overturning against the site minimum (default 1.5, common
// practice, no source). For information, the chart capacity is compared with the tipping load from
// the same balance: ASME B30.5 §5-1.1.1 / SAE J765 rate at most 85% of tipping on outriggers, 75% on
// crawlers. Gantry/A-frame with two inclined legs: balance about the leg feet, the backstay ballast
// resisting; backstay tension and leg compression from the equilibrium of the apex.
// A failed ratio gets fixes: extra counterweight, counterweight arm, or the largest radius
// (stability-fixes.ts). The gantry balance is in stability-gantry.ts, the unloaded crane's backward
// case in stability-backward.ts.
import { fallsShort } from '../compare';
import { edgeBalance, planModel, worstSlew, type PlanModel } from '../crane-model';
import { check, f, item, statusMin, term, type Ctx } from '../context';
import { backwardStability } from './stability-backward';
import { stabilityFixes } from './stability-fixes';
import { gantryStabilityItems } from './stability-gantry';
import { SOURCES } from '../sources';
import { DEG } from '../units';
import type { CheckItem, CheckResult, Fix, FormulaPart, LiftFigures } from '../types';

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
    const gantry = gantryStabilityItems(ctx, fixes, figures, src);
    if (!gantry)
      return check('stability', 'Stability', [na(ctx, 'Enter the gantry legs, backstay and ballast.')]);
    return check('stability', 'Stability', [...gantry, ...backwardStability(ctx)], 'stability.ratio');
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
