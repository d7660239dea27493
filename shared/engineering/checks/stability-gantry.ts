// Check 4 for a gantry/A-frame with two inclined legs: the moment balance about the leg feet, the
// backstay ballast resisting; backstay tension and leg compression from the equilibrium of the apex.
// The ground-bearing check takes its leg and anchor loads from the same statics.
import { fallsShort } from '../compare';
import { f, item, statusMax, statusMin, term, type Ctx } from '../context';
import { gantryFrame } from './geometry';
import { pushFix } from './stability-fixes';
import { formatQuantity } from '../format';
import { SOURCES } from '../sources';
import { DEG, si } from '../units';
import type { CheckItem, Source, Fix, LiftFigures } from '../types';

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

/**
 * The stability items of a gantry/A-frame (ratio about the leg feet, backstay tension, leg
 * compression) and the fixes for a short ratio; null when the legs, backstay or ballast are missing.
 */
export function gantryStabilityItems(
  ctx: Ctx,
  fixes: Fix[],
  figures: LiftFigures,
  src: Source,
): CheckItem[] | null {
  const { policy } = ctx;
  const minR = policy.minStabilityRatio;
  const items: CheckItem[] = [];
  const gs = gantryStatics(ctx);
  if (!gs) return null;
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
  // A member's force against its rating when one is entered; statics only otherwise.
  const rated = (
    id: string,
    label: string,
    value: number,
    limit: number | undefined,
    formula: ReturnType<typeof f>,
    against: string,
    none: string,
  ) =>
    item(ctx, {
      id,
      label,
      status: limit !== undefined ? statusMax(value, limit, policy) : 'pass',
      value,
      limit: limit ?? null,
      limitType: limit !== undefined ? 'max' : null,
      unit: 'force',
      formula,
      source: limit !== undefined ? SOURCES.input : SOURCES.statics,
      message: limit !== undefined ? against : none,
    });
  items.push(
    rated(
      'stability.backstay',
      'Backstay tension',
      gs.backstayTension,
      si(g.backstayRatedLoad),
      f`apex equilibrium, backstay at ${term(gs.backstayAngleDeg, 'angle')}: T = ${term(gs.backstayTension, 'force')}`,
      'Backstay tension against its rated load.',
      'No backstay rating entered.',
    ),
    rated(
      'stability.leg-compression',
      'Leg compression (each)',
      gs.legCompression,
      si(g.legRatedCompression),
      f`frame compression ${term(gs.frameCompression, 'force')} ÷ 2 legs ÷ cos(leg splay) = ${term(gs.legCompression, 'force')}`,
      'Leg compression against its rating.',
      'No leg rating entered.',
    ),
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
  return items;
}
