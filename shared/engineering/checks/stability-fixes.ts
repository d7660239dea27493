// The fixes offered when the stability ratio falls short of the site minimum: extra counterweight,
// a longer counterweight arm, or the largest radius at which the ratio holds.
import { boomCgAt, edgeBalance, planModel, type PlanModel } from '../crane-model';
import { f, term, type Ctx } from '../context';
import { formatFormula, formatQuantity } from '../format';
import { DEG } from '../units';
import type { Fix } from '../types';

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

export function pushFix(ctx: Ctx, fixes: Fix[], fx: Omit<Fix, 'text'>) {
  fixes.push({ ...fx, text: `${fx.message} (${formatFormula(fx.formula, ctx.system)})` });
}

export function stabilityFixes(
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
