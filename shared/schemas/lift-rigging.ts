// Rigging of the lift input: slings (1 to 4 legs; 3- and 4-leg bridles by pick points and hook
// height), hardware, and a spreader or lifting beam with its drops.
import { z } from 'zod';
import { angle, length, name, positiveLength, positiveWeight, signedLength, weight } from './lift-quantities';

export const SLING_MATERIALS = ['wire', 'synthetic', 'chain'] as const;
export const HITCHES = ['vertical', 'choker', 'basket'] as const;

export const PlanPoint = (label: string) =>
  z.object({ x: signedLength(`${label}.x`), y: signedLength(`${label}.y`) });

export const SlingLeg = z
  .object({
    name,
    angle: angle('rigging.slings.legs[].angle (from horizontal)', 0, 90).optional(),
    length: positiveLength('rigging.slings.legs[].length').optional(),
    horizontalDistance: length('rigging.slings.legs[].horizontalDistance').optional(),
    /** 3- and 4-leg bridles: plan position of the leg's pick point from the load's centre of gravity */
    pickPoint: PlanPoint('rigging.slings.legs[].pickPoint').optional(),
  })
  .superRefine((l, ctx) => {
    if (!l.angle && !(l.length && l.horizontalDistance) && !l.pickPoint)
      ctx.addIssue({
        code: 'custom',
        path: ['angle'],
        message:
          'rigging.slings.legs[]: give the leg angle, or its length and horizontal distance from the hook',
      });
  });

const SlingSetBase = z.object({
  name,
  material: z.enum(SLING_MATERIALS, {
    error: `rigging.slings.material must be one of ${SLING_MATERIALS.join(', ')}`,
  }),
  hitch: z.enum(HITCHES, { error: `rigging.slings.hitch must be one of ${HITCHES.join(', ')}` }),
  ratedLoadVertical: positiveWeight('rigging.slings.ratedLoadVertical (per leg)'),
  /** choker hitch: the angle of choke (180° = sling straight through the eye; default over 120°) */
  chokeAngle: angle('rigging.slings.chokeAngle', 0, 180).optional(),
  weight: weight('rigging.slings.weight').optional(),
  /** 3- and 4-leg bridles: height of the hook (where the legs meet) above the pick points */
  hookHeight: positiveLength('rigging.slings.hookHeight').optional(),
  /** 4-leg bridle: an equalising arrangement shares the load over all four legs (else two carry it) */
  equalised: z.boolean({ error: 'rigging.slings.equalised must be true or false' }).optional(),
  legs: z
    .array(SlingLeg)
    .min(1, { error: 'rigging.slings.legs must list 1 to 4 legs' })
    .max(4, { error: 'rigging.slings.legs must list 1 to 4 legs' }),
});

/** Each leg's pick point from the centre of gravity, where the shares depend on it. */
function requirePickPoints(legs: { pickPoint?: unknown }[], ctx: z.RefinementCtx, message: string) {
  legs.forEach((l, i) => {
    if (!l.pickPoint) ctx.addIssue({ code: 'custom', path: ['legs', i, 'pickPoint'], message });
  });
}

export const SlingSet = SlingSetBase.superRefine((s, ctx) => {
  if (s.legs.length < 3) {
    s.legs.forEach((l, i) => {
      if (!l.angle && !(l.length && l.horizontalDistance))
        ctx.addIssue({
          code: 'custom',
          path: ['legs', i, 'angle'],
          message:
            'rigging.slings.legs[]: with 1 or 2 legs give each leg its angle, or its length and horizontal distance from the hook',
        });
    });
    return;
  }
  if (!s.hookHeight)
    ctx.addIssue({
      code: 'custom',
      path: ['hookHeight'],
      message: 'rigging.slings.hookHeight: give the hook height above the pick points for 3 or 4 legs',
    });
  requirePickPoints(
    s.legs,
    ctx,
    'rigging.slings.legs[].pickPoint: give each leg of a 3- or 4-leg bridle its pick point from the centre of gravity',
  );
});

export const Hardware = z.object({
  name,
  wll: positiveWeight('rigging.hardware[].wll'),
  weight: weight('rigging.hardware[].weight').optional(),
  carries: z
    .enum(['total', 'leg'], { error: "rigging.hardware[].carries must be 'total' or 'leg'" })
    .optional(),
});

/** Slings hanging from a spreader or lifting beam to the load: 1 or 2 drops. */
export const BeamDrops = SlingSetBase.omit({ hookHeight: true, equalised: true })
  .extend({
    legs: z
      .array(SlingLeg)
      .min(1, { error: 'rigging.beam.slingsBelow.legs must list 1 or 2 legs' })
      .max(2, { error: 'rigging.beam.slingsBelow.legs must list 1 or 2 legs' }),
  })
  .superRefine((s, ctx) => {
    // a drop's angle comes from its angle, or its length with its horizontal distance; with
    // neither it hangs vertically, but a length alone leaves the angle unknown
    s.legs.forEach((l, i) => {
      if (!l.angle && !l.horizontalDistance && l.length)
        ctx.addIssue({
          code: 'custom',
          path: ['legs', i, 'horizontalDistance'],
          message:
            'rigging.beam.slingsBelow.legs[].horizontalDistance: give the horizontal distance with the drop’s length, or its angle',
        });
    });
    if (s.legs.length === 2)
      requirePickPoints(
        s.legs,
        ctx,
        'rigging.beam.slingsBelow.legs[].pickPoint: give each of two drops its pick point from the centre of gravity',
      );
  });

/** A spreader or lifting beam between the slings above (rigging.slings) and the drops to the load. */
export const Beam = z.object({
  name,
  kind: z.enum(['spreader', 'lifting'], { error: "rigging.beam.kind must be 'spreader' or 'lifting'" }),
  weight: weight('rigging.beam.weight'),
  ratedLoad: positiveWeight('rigging.beam.ratedLoad'),
  slingsBelow: BeamDrops.optional(),
});

export const Rigging = z.object({
  items: z.array(z.object({ name, weight: weight('rigging.items[].weight') })).optional(),
  /** the slings from the hook to the load, or to the beam when there is one */
  slings: SlingSet.optional(),
  beam: Beam.optional(),
  hardware: z.array(Hardware).optional(),
  height: length('rigging.height').optional(),
});
