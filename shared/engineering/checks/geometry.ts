// Check 2 — geometry: radius from boom length, boom angle and pivot offset (or the angle from the
// radius), boom-tip height, and the clearance left between hook block and boom tip (PRODUCT.md §2).
// Radius = pivot offset + L·cos(angle); tip height = pivot height + L·sin(angle) (plane geometry).
// Gantry/A-frame: frame height H = √(leg² − (spread/2)²), outreach = H·sin(inclination),
// apex height = H·cos(inclination). Minimum block clearance comes from the site policy.
import { exceeds } from '../compare';
import type { LiftInput } from '../../schemas/lift-input';
import { SOURCES } from '../sources';
import { check, f, item, statusMin, term, type Ctx, type Geometry } from '../context';
import { DEG, si, siOr } from '../units';
import type { CheckItem, CheckResult } from '../types';

export function gantryFrame(input: LiftInput) {
  const g = input.crane.gantry!;
  const leg = si(g.legLength)!;
  const half = siOr(g.legSpread, 0) / 2;
  const frameHeight = Math.sqrt(Math.max(0, leg * leg - half * half));
  const inc = g.legInclination.value * DEG;
  return {
    leg,
    frameHeight,
    inclination: inc,
    outreach: frameHeight * Math.sin(inc),
    apexHeight: frameHeight * Math.cos(inc),
  };
}

export function computeGeometry(
  input: LiftInput,
): Geometry & { radiusFromAngle: number | null; radiusEntered: number | null } {
  const c = input.crane;
  const pivotOffset = siOr(c.pivotOffset, 0);
  const pivotHeight = siOr(c.pivotHeight, 0);
  const radiusEntered = si(c.radius) ?? null;
  // Without the frame or the boom length only the entered radius is known.
  const unknownBoom = {
    radius: radiusEntered,
    boomAngleDeg: null,
    tipHeight: null,
    boomLength: null,
    pivotOffset,
    pivotHeight,
    unreachable: false,
    radiusFromAngle: null,
    radiusEntered,
  };
  if (c.type === 'gantry_a_frame') {
    if (!c.gantry) return unknownBoom;
    const g = gantryFrame(input);
    return {
      radius: Math.max(g.outreach, radiusEntered ?? 0),
      boomAngleDeg: 90 - c.gantry.legInclination.value,
      tipHeight: g.apexHeight,
      boomLength: g.frameHeight,
      pivotOffset: 0,
      pivotHeight: 0,
      unreachable: false,
      radiusFromAngle: g.outreach,
      radiusEntered,
    };
  }
  const L = si(c.boomLength);
  if (L === undefined) return unknownBoom;
  const radiusFromAngle = c.boomAngle ? pivotOffset + L * Math.cos(c.boomAngle.value * DEG) : null;
  let radius: number;
  let angleDeg: number;
  let unreachable = false;
  if (radiusFromAngle !== null && (radiusEntered === null || radiusFromAngle >= radiusEntered)) {
    radius = radiusFromAngle;
    angleDeg = c.boomAngle!.value;
  } else {
    radius = radiusEntered!;
    const cos = (radius - pivotOffset) / L;
    if (cos > 1 || cos < -1) {
      unreachable = true;
      angleDeg = cos > 1 ? 0 : 90;
    } else angleDeg = Math.acos(cos) / DEG;
  }
  return {
    radius,
    boomAngleDeg: angleDeg,
    tipHeight: pivotHeight + L * Math.sin(angleDeg * DEG),
    boomLength: L,
    pivotOffset,
    pivotHeight,
    unreachable,
    radiusFromAngle,
    radiusEntered,
  };
}

/** Vertical height from the hook to the sling attachment points, from the legs or as entered. */
export function riggingHeight(input: LiftInput): number {
  let h = siOr(input.rigging?.height, 0);
  const legs = input.rigging?.slings?.legs;
  if (legs)
    for (const l of legs) {
      const len = si(l.length);
      if (len === undefined) continue;
      const hd = si(l.horizontalDistance);
      const v = l.angle
        ? len * Math.sin(l.angle.value * DEG)
        : Math.sqrt(Math.max(0, len * len - (hd ?? 0) ** 2));
      if (v > h) h = v;
    }
  return h;
}

export function geometryCheck(ctx: Ctx, g: ReturnType<typeof computeGeometry>): CheckResult {
  const { input, policy } = ctx;
  const items: CheckItem[] = [];
  const gantry = input.crane.type === 'gantry_a_frame';
  if (g.radius === null) {
    return check('geometry', 'Geometry', [
      item(ctx, {
        id: 'geometry.radius',
        label: 'Radius',
        status: 'not_applicable',
        value: null,
        unit: 'length',
        source: SOURCES.input,
        message: 'Enter the boom length and angle (or radius), or the gantry legs.',
      }),
    ]);
  }
  if (gantry) {
    const fr = gantryFrame(input);
    items.push(
      item(ctx, {
        id: 'geometry.radius',
        label: 'Outreach from leg feet',
        status: 'pass',
        value: g.radius,
        unit: 'length',
        formula: f`outreach = frame height ${term(fr.frameHeight, 'length')} × sin(inclination ${term(
          input.crane.gantry!.legInclination.value,
          'angle',
        )}) = ${term(fr.outreach, 'length')}`,
        source: SOURCES.statics,
        message: 'Horizontal distance from the leg feet to the hook.',
      }),
    );
  } else if (g.unreachable) {
    items.push(
      item(ctx, {
        id: 'geometry.radius',
        label: 'Radius',
        status: 'fail',
        value: g.radius,
        limit: g.pivotOffset + (g.boomLength ?? 0),
        limitType: 'max',
        unit: 'length',
        formula: f`radius ${term(g.radius, 'length')} > pivot offset ${term(g.pivotOffset, 'length')} + boom length ${term(
          g.boomLength ?? 0,
          'length',
        )}`,
        source: SOURCES.statics,
        message: 'The radius entered cannot be reached with the boom length entered.',
      }),
    );
  } else {
    const L = g.boomLength!;
    const differ =
      g.radiusFromAngle !== null && g.radiusEntered !== null
        ? Math.abs(g.radiusFromAngle - g.radiusEntered) / Math.max(g.radiusEntered, 1e-9)
        : 0;
    const tol = policy.discrepancyTolerancePct / 100;
    items.push(
      item(ctx, {
        id: 'geometry.radius',
        label: 'Radius',
        status: exceeds(differ, tol) ? 'caution' : 'pass',
        value: g.radius,
        unit: 'length',
        formula: f`radius = pivot offset ${term(g.pivotOffset, 'length')} + boom ${term(L, 'length')} × cos(${term(
          g.boomAngleDeg!,
          'angle',
        )}) = ${term(g.radius, 'length')}`,
        source: SOURCES.statics,
        message: exceeds(differ, tol)
          ? `The radius entered (${g.radiusEntered!.toFixed(2)} m) and the radius from the boom angle (${g.radiusFromAngle!.toFixed(
              2,
            )} m) differ; the longer one is used.`
          : 'Horizontal distance from the centre of rotation to the hook.',
      }),
    );
  }
  if (g.tipHeight !== null) {
    items.push(
      item(ctx, {
        id: 'geometry.tip-height',
        label: gantry ? 'Apex height' : 'Boom-tip height',
        status: 'pass',
        value: g.tipHeight,
        unit: 'length',
        formula: gantry
          ? f`apex height = frame height × cos(inclination) = ${term(g.tipHeight, 'length')}`
          : f`tip height = pivot height ${term(g.pivotHeight, 'length')} + boom ${term(g.boomLength!, 'length')} × sin(${term(
              g.boomAngleDeg!,
              'angle',
            )}) = ${term(g.tipHeight, 'length')}`,
        source: SOURCES.statics,
        message: gantry
          ? 'Height of the apex above the leg feet.'
          : 'Height of the boom tip above the ground.',
      }),
    );
    const lift = si(input.requiredLiftHeight);
    if (lift !== undefined) {
      const loadH = siOr(input.load.height, 0);
      const rigH = riggingHeight(input);
      const blockH = siOr(input.hookBlock?.height, 0);
      const clearance = g.tipHeight - (lift + loadH + rigH + blockH);
      items.push(
        item(ctx, {
          id: 'geometry.block-clearance',
          label: 'Block-to-tip clearance',
          status: statusMin(clearance, policy.minBlockClearanceM, policy),
          value: clearance,
          limit: policy.minBlockClearanceM,
          limitType: 'min',
          unit: 'length',
          formula: f`clearance = tip height ${term(g.tipHeight, 'length')} − (lift height ${term(
            lift,
            'length',
          )} + load height ${term(loadH, 'length')} + rigging ${term(rigH, 'length')} + block ${term(
            blockH,
            'length',
          )}) = ${term(clearance, 'length')}`,
          source: SOURCES.policy('minimum block clearance (common practice, no source)'),
          message:
            clearance < 0
              ? 'The load cannot reach the required height with this boom.'
              : 'Headroom left between the hook block and the boom tip at the required lift height.',
        }),
      );
    }
  }
  return check('geometry', 'Geometry', items);
}
