// Check 9 — wind (PRODUCT.md §9): force on the load and boom, the moment it adds, and the wind speed
// against the site limit. Dynamic pressure q = ½ρv² with ρ = 1.225 kg/m³ (q = 0.613 v² Pa;
// 0.00256 V² psf), force F = q·A·Cf. The load's force acts at the boom tip (the hoist line carries it
// there) and the boom's at mid-height; their moment is added to the overturning moment.
// Limits: site policy wind limit (default 20 mph, common practice, no source; the manufacturer's chart
// governs when lower); for personnel lifts the lower of that and the personnel limit (default 20 mph,
// OSHA 29 CFR 1926.1431). Default drag coefficient 1.2 when none is entered (common practice, no source).
import { exceeds } from '../compare';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES, sourceText } from '../sources';
import { si } from '../units';
import type { CheckItem, CheckResult } from '../types';

export const AIR_DENSITY = 1.225;
export const DEFAULT_DRAG_COEFFICIENT = 1.2;

/** q = ½ρv² in Pa for v in m/s. */
export const dynamicPressure = (v: number): number => 0.5 * AIR_DENSITY * v * v;

export function computeWind(ctx: Ctx): Ctx['wind'] {
  const env = ctx.input.environment;
  const v = si(env?.windSpeed);
  if (v === undefined) return null;
  const q = dynamicPressure(v);
  const A = si(ctx.input.load.windArea) ?? 0;
  const Cf = ctx.input.load.dragCoefficient ?? DEFAULT_DRAG_COEFFICIENT;
  const Ab = si(env?.boomWindArea) ?? 0;
  const Cb = env?.boomDragCoefficient ?? DEFAULT_DRAG_COEFFICIENT;
  const tip = ctx.geometry.tipHeight ?? 0;
  return {
    loadForce: q * A * Cf,
    boomForce: q * Ab * Cb,
    loadHeight: tip,
    boomHeight: (tip + ctx.geometry.pivotHeight) / 2,
  };
}

export function windCheck(ctx: Ctx): CheckResult {
  const v = si(ctx.input.environment?.windSpeed);
  if (v === undefined || !ctx.wind)
    return check('wind', 'Wind', [
      item(ctx, {
        id: 'wind.speed',
        label: 'Wind speed',
        status: 'not_applicable',
        value: null,
        unit: 'speed',
        source: SOURCES.input,
        message: 'No wind speed entered.',
      }),
    ]);
  const { policy } = ctx;
  const personnel = !!ctx.input.personnel;
  const limit = personnel ? Math.min(policy.windLimitMps, policy.personnelWindLimitMps) : policy.windLimitMps;
  const q = dynamicPressure(v);
  const w = ctx.wind;
  const items: CheckItem[] = [
    item(ctx, {
      id: 'wind.speed',
      label: 'Wind speed',
      status: statusMax(v, limit, policy),
      value: v,
      limit,
      limitType: 'max',
      unit: 'speed',
      formula: f`wind ${term(v, 'speed')} against limit ${term(limit, 'speed')}${personnel ? ' (personnel lift)' : ''}`,
      source:
        personnel && policy.personnelWindLimitMps <= policy.windLimitMps
          ? SOURCES.policy(`personnel wind limit (default: ${SOURCES.oshaPersonnelWind.text})`, {
              metric: `personnel wind limit (default: ${sourceText(SOURCES.oshaPersonnelWind, 'metric')})`,
              imperial: `personnel wind limit (default: ${sourceText(SOURCES.oshaPersonnelWind, 'imperial')})`,
            })
          : SOURCES.policy(
              "wind limit (default 20 mph, common practice, no source; the manufacturer's chart governs when lower)",
              {
                metric:
                  "wind limit (default 8.94 m/s, common practice, no source; the manufacturer's chart governs when lower)",
                imperial:
                  "wind limit (default 20 mph, common practice, no source; the manufacturer's chart governs when lower)",
              },
            ),
      message: exceeds(v, limit)
        ? 'Wind above the limit: do not lift.'
        : 'Wind speed against the site limit.',
    }),
    item(ctx, {
      id: 'wind.force',
      label: 'Wind force on load and boom',
      status: 'pass',
      value: w.loadForce + w.boomForce,
      unit: 'force',
      formula: f`q = ½ × 1.225 × v² = ${term(q, 'pressure')}; load F = q × A × Cf = ${term(w.loadForce, 'force')}; boom F = ${term(
        w.boomForce,
        'force',
      )}`,
      source: SOURCES.windPressure,
      message: 'Wind force from the areas and drag coefficients entered (default Cf 1.2, common practice).',
    }),
    item(ctx, {
      id: 'wind.moment',
      label: 'Added overturning moment from wind',
      status: 'pass',
      value: w.loadForce * w.loadHeight + w.boomForce * w.boomHeight,
      unit: 'moment',
      formula: f`load ${term(w.loadForce, 'force')} × tip height ${term(w.loadHeight, 'length')} + boom ${term(
        w.boomForce,
        'force',
      )} × ${term(w.boomHeight, 'length')} = ${term(w.loadForce * w.loadHeight + w.boomForce * w.boomHeight, 'moment')}`,
      source: SOURCES.statics,
      message: 'Included in the stability moment balance and the support reactions.',
    }),
  ];
  return check('wind', 'Wind', items, 'wind.speed');
}
