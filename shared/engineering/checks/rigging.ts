// Check 6 — rigging (PRODUCT.md §6): sling leg tension from the leg angles and the load's centre of
// gravity, sling capacity by hitch, hardware working load limits.
// Two legs meeting at the hook above the centre of gravity (statics of the hook):
//   T_A = W·cos θ_B / sin(θ_A + θ_B),  T_B = W·cos θ_A / sin(θ_A + θ_B)   (θ from horizontal)
// which for equal legs is W / (2 sin θ): the angle factor 1/sin θ (rigging handbooks, ASME B30.9
// practice). A leg given by length and horizontal distance from the hook has cos θ = distance/length.
// Minimum leg angle: site policy (default 30°, rigging handbooks). Hitch capacity: vertical 1×,
// choker 0.75× wire rope (rigging handbooks), 0.80× synthetic and chain (from memory), basket 2×
// with vertical legs (rigging handbooks); the angle is already in the tension. A choker with a
// stated angle of choke below 120° is rated lower again by the ASME B30.9 choke-angle table (read in
// sling makers' reproductions of it). Each leg's vertical share at its pick point is reported
// (T · sin θ; the shares add up to the weight below the hook's rigging). Three- and four-leg
// bridles with the centre of gravity off centre: bridle.ts.
import { atLeast, exceeds, fallsShort } from '../compare';
import type { LiftInput } from '../../schemas/lift-input';
import { check, f, item, statusMax, term, type Ctx } from '../context';
import { SOURCES } from '../sources';
import { DEG, si } from '../units';
import type { CheckItem, CheckResult, FormulaPart, LiftFigures, Source } from '../types';
import { bridleLegs } from './bridle';
import { solveShares } from '../multi-crane';

type SlingSetT = NonNullable<NonNullable<LiftInput['rigging']>['slings']>;

export const angleFactor = (deg: number): number => 1 / Math.sin(deg * DEG);

/** Tensions in two legs at angles θA, θB (degrees from horizontal) meeting at the hook over the CG. */
export function twoLegTensions(W: number, thetaA: number, thetaB: number): [number, number] {
  const a = thetaA * DEG;
  const b = thetaB * DEG;
  const s = Math.sin(a + b);
  return [(W * Math.cos(b)) / s, (W * Math.cos(a)) / s];
}

type Leg = NonNullable<LiftInput['rigging']>['slings'] extends infer S
  ? S extends { legs: (infer L)[] }
    ? L
    : never
  : never;

export function legAngleDeg(leg: Leg): number {
  if (leg.angle) return leg.angle.value;
  const len = si(leg.length)!;
  const hd = si(leg.horizontalDistance)!;
  const c = Math.min(1, hd / len);
  return Math.acos(c) / DEG;
}

export function hitchFactor(
  hitch: 'vertical' | 'choker' | 'basket',
  material: 'wire' | 'synthetic' | 'chain',
): { factor: number; source: Source } {
  if (hitch === 'vertical') return { factor: 1, source: SOURCES.slingAngle };
  if (hitch === 'basket') return { factor: 2, source: SOURCES.basket };
  if (material === 'wire') return { factor: 0.75, source: SOURCES.chokerWire };
  return { factor: 0.8, source: material === 'synthetic' ? SOURCES.chokerSynthetic : SOURCES.chokerChain };
}

/** ASME B30.9 choke-angle table: share of the choker rating kept at an angle of choke (degrees). */
export function chokeAngleFactor(deg: number): number {
  if (exceeds(deg, 120)) return 1;
  if (atLeast(deg, 90)) return 0.87;
  if (atLeast(deg, 60)) return 0.74;
  if (atLeast(deg, 30)) return 0.62;
  return 0.49;
}

export function riggingCheck(ctx: Ctx, figures: LiftFigures): CheckResult {
  const r = ctx.input.rigging;
  const { policy } = ctx;
  const items: CheckItem[] = [];
  let maxLeg = 0;
  let W0 = si(ctx.input.load.weight)!;
  if (r?.items) for (const it of r.items) W0 += si(it.weight)!;
  const beam = r?.beam;
  /** Every leg of one set of slings carrying W; `below`: the drops under a beam. */
  const slingSet = (sl: SlingSetT, W: number, below: boolean) => {
    const idp = below ? 'rigging.below.' : 'rigging.';
    let angles =
      sl.legs.length >= 3 ? [] : sl.legs.map((l) => (below && !l.angle && !l.length ? 90 : legAngleDeg(l)));
    let tensions: number[];
    let formulaBase;
    let verticals: { V: number[]; formula: (i: number) => FormulaPart[]; source: Source } | null = null;
    let bridleFail: string | null = null;
    if (below && sl.legs.length === 2) {
      // drops from the beam: the centre of gravity between the two pick points shares the load
      const picks = sl.legs.map((l) => [si(l.pickPoint!.x)!, si(l.pickPoint!.y)!] as const);
      const V = solveShares(W, picks, [0, 0]);
      if (!V || V.some((v) => v < -1e-9 * W)) {
        bridleFail = 'the centre of gravity is not between the two drops';
        tensions = [];
      } else {
        const Vp = V.map((v) => Math.max(0, v));
        tensions = Vp.map((v, i) => v / Math.sin(angles[i] * DEG));
        verticals = {
          V: Vp,
          formula: (i) =>
            f`two drops: V = W ${term(W, 'weight')} × distance of the other drop from the centre of gravity ÷ drop spacing = ${term(Vp[i], 'weight')}`,
          source: SOURCES.beamDrops,
        };
      }
      formulaBase = (i: number) =>
        f`T = V ${term(verticals?.V[i] ?? 0, 'weight')} ÷ sin(${term(angles[i], 'angle')}) = ${term(tensions[i], 'weight')}`;
    } else if (sl.legs.length >= 3) {
      const h = si(sl.hookHeight!)!;
      const picks = sl.legs.map((l) => [si(l.pickPoint!.x)!, si(l.pickPoint!.y)!] as const);
      const b = bridleLegs(W, picks, h, sl.equalised === true);
      angles = b.angleDeg;
      tensions = b.tension;
      bridleFail = b.reason;
      const L = picks.map(([x, y]) => Math.sqrt(x * x + y * y + h * h));
      const how =
        b.method === 'three'
          ? 'three legs: ΣV = W and the moments about the centre of gravity balance'
          : b.method === 'equalised'
            ? 'four legs with an equalising arrangement: balanced shares as even as statics allows'
            : 'four legs rated on two: the larger share of the leg when its diagonal pair carries the load alone';
      verticals = {
        V: b.vertical,
        formula: (i) => f`${how}: V = ${term(b.vertical[i] ?? 0, 'weight')} of W ${term(W, 'weight')}`,
        source:
          b.method === 'three'
            ? SOURCES.bridleStatics
            : b.method === 'equalised'
              ? SOURCES.bridleEqualised
              : SOURCES.bridleTwoLegs,
      };
      formulaBase = (i: number) =>
        f`T = V ${term(b.vertical[i], 'weight')} × leg length ${term(L[i], 'length')} ÷ hook height ${term(h, 'length')} = ${term(tensions[i], 'weight')}`;
    } else if (angles.length === 2) {
      tensions = twoLegTensions(W, angles[0], angles[1]);
      formulaBase = (i: number) =>
        f`T = W ${term(W, 'weight')} × cos(${term(angles[1 - i], 'angle')}) ÷ sin(${term(angles[0], 'angle')} + ${term(
          angles[1],
          'angle',
        )}) = ${term(tensions[i], 'weight')}`;
    } else {
      tensions = [W * angleFactor(angles[0])];
      formulaBase = () =>
        f`T = W ${term(W, 'weight')} × angle factor 1/sin(${term(angles[0], 'angle')}) = ${term(W, 'weight')} × ${term(
          angleFactor(angles[0]),
          'ratio',
        )} = ${term(tensions[0], 'weight')}`;
    }
    const base = hitchFactor(sl.hitch, sl.material);
    const choke = sl.hitch === 'choker' && sl.chokeAngle ? sl.chokeAngle.value : null;
    const cf = choke === null ? 1 : chokeAngleFactor(choke);
    const hf =
      cf === 1
        ? base
        : {
            factor: base.factor * cf,
            source: {
              kind: base.source.kind,
              text: `${base.source.text}; ${SOURCES.chokeAngle.text}`,
            } as Source,
          };
    if (bridleFail !== null) {
      tensions = [];
      items.push(
        item(ctx, {
          id: `${idp}bridle`,
          label: `${sl.legs.length}-leg bridle shares`,
          status: 'fail',
          value: null,
          unit: 'weight',
          source: SOURCES.bridleStatics,
          message: `No leg loads: ${bridleFail}.`,
        }),
      );
    }
    const wll = si(sl.ratedLoadVertical)!;
    const cap = wll * hf.factor;
    for (let i = 0; i < tensions.length; i++) {
      const T = tensions[i];
      if (T > maxLeg) maxLeg = T;
      const own = sl.legs[i].name ?? (below ? `drop ${i + 1}` : `leg ${i + 1}`);
      const legName = below ? `below the beam, ${own}` : own;
      items.push(
        item(ctx, {
          id: `${idp}leg-${i + 1}`,
          label: `Sling ${legName} tension`,
          status: statusMax(T, cap, policy),
          value: T,
          limit: cap,
          limitType: 'max',
          unit: 'weight',
          formula: [
            ...formulaBase(i),
            ' against ',
            sl.hitch,
            ' capacity ',
            term(wll, 'weight'),
            cf === 1
              ? ` × ${hf.factor} = `
              : ` × ${base.factor} × choke-angle factor ${cf} (angle of choke ${Math.round(choke! * 10) / 10}°) = `,
            term(cap, 'weight'),
          ],
          source: hf.source,
          message: exceeds(T, cap)
            ? `Sling ${legName} is overloaded in a ${sl.hitch} hitch.`
            : `Sling ${legName} tension against its ${sl.hitch} hitch capacity.`,
        }),
      );
      const ang = angles[i];
      const V = verticals ? verticals.V[i] : T * Math.sin(ang * DEG);
      items.push(
        item(ctx, {
          id: `${idp}vertical-${i + 1}`,
          label: `Vertical share at the pick point of ${own}${below ? ' (below the beam)' : ''}`,
          status: 'pass',
          value: V,
          limit: null,
          limitType: null,
          unit: 'weight',
          formula: verticals
            ? verticals.formula(i)
            : f`V = T ${term(T, 'weight')} × sin(${term(ang, 'angle')}) = ${term(V, 'weight')}`,
          source: verticals ? verticals.source : SOURCES.verticalShare,
          message: `The pick point of ${legName} carries this much of the weight vertically.`,
        }),
      );
      items.push(
        item(ctx, {
          id: `${idp}angle-${i + 1}`,
          label: `Sling ${legName} angle from horizontal`,
          status: fallsShort(ang, policy.minSlingAngleDeg) ? 'fail' : 'pass',
          value: ang,
          limit: policy.minSlingAngleDeg,
          limitType: 'min',
          unit: 'angle',
          formula: f`angle ${term(ang, 'angle')}, angle factor 1/sin θ = ${term(angleFactor(ang), 'ratio')}; minimum ${term(
            policy.minSlingAngleDeg,
            'angle',
          )}`,
          source: SOURCES.policy(
            `minimum sling angle ${policy.minSlingAngleDeg}° (default: ${SOURCES.slingMinAngle.text})`,
          ),
          message: fallsShort(ang, policy.minSlingAngleDeg)
            ? 'Sling leg flatter than the minimum angle.'
            : 'Sling leg angle.',
        }),
      );
    }
  };
  if (beam) {
    const below = si(beam.slingsBelow?.weight) ?? 0;
    if (beam.slingsBelow) slingSet(beam.slingsBelow, W0, true);
    const hanging = W0 + below;
    const rated = si(beam.ratedLoad)!;
    const name = beam.name ?? (beam.kind === 'spreader' ? 'Spreader beam' : 'Lifting beam');
    items.push(
      item(ctx, {
        id: 'rigging.beam',
        label: `${name} rated load`,
        status: statusMax(hanging, rated, policy),
        value: hanging,
        limit: rated,
        limitType: 'max',
        unit: 'weight',
        formula: f`load and rigging items ${term(W0, 'weight')} + drops ${term(below, 'weight')} = ${term(hanging, 'weight')} against the beam's rated load ${term(rated, 'weight')}`,
        source: { kind: 'input', text: 'rated load as marked on the beam (entered)' },
        message: exceeds(hanging, rated)
          ? `${name} carries more than its rated load.`
          : `${name} against its rated load.`,
      }),
    );
    // the slings above carry the beam and everything under it
    if (r?.slings) slingSet(r.slings, hanging + si(beam.weight)!, false);
  } else if (r?.slings) slingSet(r.slings, W0, false);
  if (r?.hardware) {
    r.hardware.forEach((h, i) => {
      const wll = si(h.wll)!;
      const leg = h.carries === 'leg';
      const load = leg ? maxLeg : ctx.belowHook;
      const name = h.name ?? `hardware ${i + 1}`;
      items.push(
        item(ctx, {
          id: `rigging.hardware-${i + 1}`,
          label: `${name} working load limit`,
          status: statusMax(load, wll, policy),
          value: load,
          limit: wll,
          limitType: 'max',
          unit: 'weight',
          formula: f`${leg ? 'largest leg tension' : 'load below the hook'} ${term(load, 'weight')} against WLL ${term(wll, 'weight')}`,
          source: { kind: 'input', text: 'working load limit as marked on the hardware (entered)' },
          message: exceeds(load, wll)
            ? `${name} is loaded beyond its working load limit.`
            : `${name} against its working load limit.`,
        }),
      );
    });
  }
  figures.maxSlingTension = maxLeg > 0 ? maxLeg : null;
  if (items.length === 0)
    items.push(
      item(ctx, {
        id: 'rigging.leg-1',
        label: 'Rigging',
        status: 'not_applicable',
        value: null,
        unit: 'weight',
        source: SOURCES.input,
        message: 'Enter the slings (legs, hitch, rated load) or hardware to check the rigging.',
      }),
    );
  return check('rigging', 'Rigging', items);
}
