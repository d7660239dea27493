// The lift as the contractor enters it: the one schema the submission form, the API, the worker
// and the engine share. Every quantity carries its unit ({ value, unit }); the engine converts to SI.
// Every issue message names the field and the limit it broke.
//
// Conventions (also in the field descriptions):
// - Plan positions of the rotating upper are measured from the centre of rotation along the boom
//   line: `...BehindRotation` is positive away from the load (counterweight side), negative ahead.
// - The carrier/carbody and its supports are fixed to the ground; `slewAngle` is the boom's direction
//   in plan measured from "over the rear" of the carrier (0°) through "over the side" (90°) to
//   "over the front" (180°). With no slew angle the engine takes the least favourable direction.
// - Radius is the horizontal distance from the centre of rotation to the hook (the chart's radius).
// - Boom angle is measured from horizontal; gantry leg inclination from vertical.
import { z } from 'zod';
import {
  ANGLE_UNITS,
  AREA_UNITS,
  LENGTH_UNITS,
  MOMENT_UNITS,
  PRESSURE_UNITS,
  SPEED_UNITS,
  VOLTAGE_UNITS,
  WEIGHT_UNITS,
  TO_SI,
} from '../engineering/units';
import { same } from '../engineering/chart';

const finite = (label: string) =>
  z.number({
    error: (iss) => (iss.input === undefined ? `${label} is required` : `${label} must be a finite number`),
  });

interface Bounds {
  min?: number;
  /** true: value must be strictly greater than min */
  gt?: boolean;
  max?: number;
  /** words for the limit in messages, e.g. "degrees" */
  what?: string;
}

function boundedNumber(label: string, b: Bounds) {
  let n = finite(label);
  const what = b.what ? ` ${b.what}` : '';
  if (b.min !== undefined && b.max !== undefined) {
    const msg = `${label} must be between ${b.min} and ${b.max}${what}`;
    n = (b.gt ? n.gt(b.min, { error: msg }) : n.min(b.min, { error: msg })).max(b.max, { error: msg });
  } else if (b.min !== undefined) {
    n = b.gt
      ? n.gt(b.min, { error: `${label} must be greater than ${b.min}${what}` })
      : n.min(b.min, { error: `${label} must be ${b.min}${what} or more` });
  } else if (b.max !== undefined) {
    n = n.max(b.max, { error: `${label} must be ${b.max}${what} or less` });
  }
  return n;
}

/**
 * Plausible upper bound of each kind of quantity, in SI (ours: common practice, no source). Each is
 * well above any crane lift on record (the heaviest lifts are a few tens of thousands of tonnes, the
 * tallest booms a few hundred metres) and keeps every product the engine forms finite.
 */
export const QUANTITY_MAX_SI = {
  length: 2000,
  weight: 100_000 * 1000 * TO_SI.kg,
  pressure: 100e6,
  speed: 100,
  area: 10_000,
  angle: 360,
  voltage: 2e6,
  moment: 1e12,
} as const;

const KIND_OF_UNITS = new Map<readonly string[], keyof typeof QUANTITY_MAX_SI>([
  [LENGTH_UNITS, 'length'],
  [WEIGHT_UNITS, 'weight'],
  [PRESSURE_UNITS, 'pressure'],
  [SPEED_UNITS, 'speed'],
  [AREA_UNITS, 'area'],
  [ANGLE_UNITS, 'angle'],
  [VOLTAGE_UNITS, 'voltage'],
  [MOMENT_UNITS, 'moment'],
]);

const limitText = (x: number) => x.toLocaleString('en-US', { maximumFractionDigits: x >= 100 ? 0 : 3 });

function quantity<const U extends readonly [string, ...string[]]>(units: U, label: string, b: Bounds = {}) {
  const kind = KIND_OF_UNITS.get(units);
  const maxSI = kind ? QUANTITY_MAX_SI[kind] : Infinity;
  return z
    .object(
      {
        value: boundedNumber(label, b),
        unit: z.enum(units, { error: `${label}: unit must be one of ${units.join(', ')}` }),
      },
      {
        error: (iss) =>
          iss.input === undefined ? `${label} is required` : `${label} must be an object { value, unit }`,
      },
    )
    .superRefine((q, ctx) => {
      const factor = TO_SI[q.unit as keyof typeof TO_SI];
      if (Math.abs(q.value * factor) > maxSI)
        ctx.addIssue({
          code: 'custom',
          path: ['value'],
          message: `${label} must be ${limitText(maxSI / factor)} ${q.unit} or less`,
        });
    });
}

const length = (label: string, b: Bounds = { min: 0 }) => quantity(LENGTH_UNITS, label, b);
const positiveLength = (label: string) => quantity(LENGTH_UNITS, label, { min: 0, gt: true });
const signedLength = (label: string) => quantity(LENGTH_UNITS, label, {});
const weight = (label: string) => quantity(WEIGHT_UNITS, label, { min: 0 });
const positiveWeight = (label: string) => quantity(WEIGHT_UNITS, label, { min: 0, gt: true });
const pressure = (label: string) => quantity(PRESSURE_UNITS, label, { min: 0, gt: true });
const speed = (label: string) => quantity(SPEED_UNITS, label, { min: 0 });
const area = (label: string) => quantity(AREA_UNITS, label, { min: 0 });
const angle = (label: string, min: number, max: number) =>
  quantity(ANGLE_UNITS, label, { min, max, what: 'degrees' });
const moment = (label: string) => quantity(MOMENT_UNITS, label, { min: 0 });
const name = z.string().max(200).optional();
const count = (label: string, min: number, max: number) =>
  boundedNumber(label, { min, max }).int({ error: `${label} must be a whole number` });

export const LengthQ = length('length');
export type LengthQ = z.infer<typeof LengthQ>;
export const WeightQ = weight('weight');
export type WeightQ = z.infer<typeof WeightQ>;

const UpperMass = (label: string) =>
  z.object({
    weight: weight(`${label}.weight`),
    cgBehindRotation: signedLength(`${label}.cgBehindRotation`),
  });

export const CRANE_TYPES = ['mobile_outriggers', 'mobile_crawler', 'gantry_a_frame'] as const;

export const Gantry = z.object({
  legLength: positiveLength('crane.gantry.legLength'),
  legInclination: angle('crane.gantry.legInclination (from vertical)', 0, 75),
  legSpread: length('crane.gantry.legSpread').optional(),
  frameWeight: weight('crane.gantry.frameWeight'),
  backstayAnchorDistance: positiveLength('crane.gantry.backstayAnchorDistance'),
  ballastWeight: weight('crane.gantry.ballastWeight'),
  backstayRatedLoad: positiveWeight('crane.gantry.backstayRatedLoad').optional(),
  legRatedCompression: positiveWeight('crane.gantry.legRatedCompression').optional(),
});

export const Crane = z
  .object({
    type: z.enum(CRANE_TYPES, {
      error: `crane.type must be one of ${CRANE_TYPES.join(', ')}`,
    }),
    name,
    boomLength: positiveLength('crane.boomLength').optional(),
    boomAngle: angle('crane.boomAngle (from horizontal)', 0, 90).optional(),
    radius: length('crane.radius').optional(),
    pivotOffset: signedLength('crane.pivotOffset').optional(),
    pivotHeight: length('crane.pivotHeight').optional(),
    slewAngle: angle('crane.slewAngle', 0, 360).optional(),
    upperWorks: UpperMass('crane.upperWorks').optional(),
    counterweight: UpperMass('crane.counterweight').optional(),
    carrier: z
      .object({
        weight: weight('crane.carrier.weight'),
        cgRearOfRotation: signedLength('crane.carrier.cgRearOfRotation'),
      })
      .optional(),
    boom: z
      .object({
        weight: weight('crane.boom.weight'),
        cgFromFoot: length('crane.boom.cgFromFoot').optional(),
      })
      .optional(),
    outriggers: z
      .object({
        longitudinalSpread: positiveLength('crane.outriggers.longitudinalSpread'),
        transverseSpread: positiveLength('crane.outriggers.transverseSpread'),
        boxCentreRearOfRotation: signedLength('crane.outriggers.boxCentreRearOfRotation').optional(),
      })
      .optional(),
    tracks: z
      .object({
        length: positiveLength('crane.tracks.length'),
        shoeWidth: positiveLength('crane.tracks.shoeWidth'),
        gauge: positiveLength('crane.tracks.gauge'),
        centreRearOfRotation: signedLength('crane.tracks.centreRearOfRotation').optional(),
      })
      .optional(),
    gantry: Gantry.optional(),
  })
  .superRefine((c, ctx) => {
    if (c.type === 'gantry_a_frame') {
      if (!c.gantry)
        ctx.addIssue({
          code: 'custom',
          path: ['gantry'],
          message: 'crane.gantry is required for a gantry or A-frame',
        });
      return;
    }
    if (!c.boomLength)
      ctx.addIssue({
        code: 'custom',
        path: ['boomLength'],
        message: 'crane.boomLength is required for a mobile crane',
      });
    if (!c.boomAngle && !c.radius)
      ctx.addIssue({
        code: 'custom',
        path: ['boomAngle'],
        message: 'crane.boomAngle or crane.radius is required (at least one)',
      });
  });

export const ChartRow = z.object({
  radius: length('chart.rows[].radius'),
  boomLength: positiveLength('chart.rows[].boomLength'),
  capacity: weight('chart.rows[].capacity'),
  interpolationAllowed: z.boolean().optional(),
});

export const Chart = z.object(
  {
    name,
    rows: z
      .array(ChartRow, { error: 'chart.rows must be a list of chart rows' })
      .min(1, { error: 'chart.rows must list at least 1 row of the load chart' })
      .max(2000, { error: 'chart.rows must list at most 2000 rows' })
      .superRefine((rows, ctx) => {
        // Two rows for the same boom length and radius leave the capacity ambiguous: name both.
        const key = rows.map((r) => [
          r.boomLength.value * TO_SI[r.boomLength.unit],
          r.radius.value * TO_SI[r.radius.unit],
        ]);
        for (let i = 0; i < rows.length; i++)
          for (let j = i + 1; j < rows.length; j++)
            if (same(key[i][0], key[j][0]) && same(key[i][1], key[j][1])) {
              ctx.addIssue({
                code: 'custom',
                path: [j],
                message: `chart.rows[${i}] and chart.rows[${j}] list the same boom length and radius: keep one row`,
              });
              return;
            }
      }),
  },
  {
    error: (iss) =>
      iss.input === undefined ? 'chart is required (the load chart rows used)' : 'chart must be an object',
  },
);

export const SLING_MATERIALS = ['wire', 'synthetic', 'chain'] as const;
export const HITCHES = ['vertical', 'choker', 'basket'] as const;

const PlanPoint = (label: string) =>
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
  s.legs.forEach((l, i) => {
    if (!l.pickPoint)
      ctx.addIssue({
        code: 'custom',
        path: ['legs', i, 'pickPoint'],
        message:
          'rigging.slings.legs[].pickPoint: give each leg of a 3- or 4-leg bridle its pick point from the centre of gravity',
      });
  });
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
    if (s.legs.length === 2)
      s.legs.forEach((l, i) => {
        if (!l.pickPoint)
          ctx.addIssue({
            code: 'custom',
            path: ['legs', i, 'pickPoint'],
            message:
              'rigging.beam.slingsBelow.legs[].pickPoint: give each of two drops its pick point from the centre of gravity',
          });
      });
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

export const Load = z.object({
  description: name,
  weight: weight('load.weight'),
  length: length('load.length').optional(),
  width: length('load.width').optional(),
  height: length('load.height').optional(),
  windArea: area('load.windArea').optional(),
  dragCoefficient: boundedNumber('load.dragCoefficient', { min: 0.1, max: 3 }).optional(),
});

export const ROPE_TYPES = ['running', 'rotation_resistant'] as const;
export const Reeving = z
  .object({
    partsOfLine: count('reeving.partsOfLine', 1, 64),
    sheavesPassed: count('reeving.sheavesPassed', 0, 80),
    bearing: z.enum(['plain', 'roller'], { error: "reeving.bearing must be 'plain' or 'roller'" }),
    hoistLinePull: positiveWeight('reeving.hoistLinePull').optional(),
    ropeRatedLoad: positiveWeight('reeving.ropeRatedLoad').optional(),
    ropeBreakingStrength: positiveWeight('reeving.ropeBreakingStrength').optional(),
    ropeType: z
      .enum(ROPE_TYPES, { error: "reeving.ropeType must be 'running' or 'rotation_resistant'" })
      .optional(),
    /** Efficiency of each sheave from the planner's own data (1/K); replaces the bearing constant. */
    sheaveEfficiency: boundedNumber('reeving.sheaveEfficiency', { min: 0.8, max: 1 }).optional(),
    sheaveEfficiencySource: z.string().min(1).max(200).optional(),
  })
  .superRefine((r, ctx) => {
    // With N parts the rope turns over a sheave between each pair of parts: at least N − 1 sheaves.
    if (r.sheavesPassed < r.partsOfLine - 1)
      ctx.addIssue({
        code: 'custom',
        path: ['sheavesPassed'],
        message: `reeving.sheavesPassed must be at least reeving.partsOfLine − 1 (${r.partsOfLine - 1}): ${r.partsOfLine} parts of line pass at least ${r.partsOfLine - 1} sheaves`,
      });
    if (r.sheaveEfficiency !== undefined && !r.sheaveEfficiencySource)
      ctx.addIssue({
        code: 'custom',
        path: ['sheaveEfficiencySource'],
        message:
          'reeving.sheaveEfficiencySource is required with a sheave efficiency (where the figure comes from)',
      });
  });

export const SOIL_CLASSES = [
  'crystalline_bedrock',
  'sedimentary_rock',
  'sandy_gravel',
  'sand_silty_clayey',
  'clay_silt',
  'mud_organic_fill',
] as const;
export type SoilClass = (typeof SOIL_CLASSES)[number];

export const Ground = z.object({
  mat: z
    .object({
      length: positiveLength('ground.mat.length'),
      width: positiveLength('ground.mat.width'),
      perSupport: count('ground.mat.perSupport', 1, 10).optional(),
    })
    .optional(),
  allowableBearing: pressure('ground.allowableBearing').optional(),
  soilClass: z
    .enum(SOIL_CLASSES, { error: `ground.soilClass must be one of ${SOIL_CLASSES.join(', ')}` })
    .optional(),
});

export const PowerLine = z.object({
  name,
  voltage: quantity(VOLTAGE_UNITS, 'environment.powerLines[].voltage', { min: 0, gt: true }),
  distance: length('environment.powerLines[].distance'),
});

export const Environment = z.object({
  windSpeed: speed('environment.windSpeed').optional(),
  boomWindArea: area('environment.boomWindArea').optional(),
  boomDragCoefficient: boundedNumber('environment.boomDragCoefficient', { min: 0.1, max: 3 }).optional(),
  powerLines: z.array(PowerLine).optional(),
});

export const TandemCrane = z.object({
  name,
  pickPointDistance: length('tandem.cranes[].pickPointDistance').optional(),
  share: weight('tandem.cranes[].share').optional(),
  chartCapacity: positiveWeight('tandem.cranes[].chartCapacity'),
  ownHookWeight: weight('tandem.cranes[].ownHookWeight').optional(),
});

export const Tandem = z.object({
  cranes: z
    .array(TandemCrane)
    .min(2, { error: 'tandem.cranes must list at least 2 cranes' })
    .max(8, { error: 'tandem.cranes must list at most 8 cranes' }),
});

export const Personnel = z.object({
  platformWeight: weight('personnel.platformWeight'),
  riggingWeight: weight('personnel.riggingWeight').optional(),
  occupants: count('personnel.occupants', 0, 20).optional(),
  occupantWeight: weight('personnel.occupantWeight (each)').optional(),
  toolsWeight: weight('personnel.toolsWeight').optional(),
  platformRatedLoad: positiveWeight('personnel.platformRatedLoad').optional(),
});

export const SiteConditions = z.object({
  overOccupiedArea: z.boolean().optional(),
  overOperatingPlant: z.boolean().optional(),
  loadOutOfOperatorView: z.boolean().optional(),
  nonRoutineRigging: z.boolean().optional(),
  hazardousOrIrreplaceableLoad: z.boolean().optional(),
  declaredCritical: z.boolean().optional(),
});

/** The figures the contractor states in the plan, each compared with the recomputed one. */
export const Stated = z.object({
  grossLoad: weight('stated.grossLoad').optional(),
  radius: length('stated.radius').optional(),
  boomAngle: angle('stated.boomAngle', 0, 90).optional(),
  chartCapacity: weight('stated.chartCapacity').optional(),
  percentOfChart: boundedNumber('stated.percentOfChart', { min: 0, max: 1000, what: 'percent' }).optional(),
  overturningMoment: moment('stated.overturningMoment').optional(),
  resistingMoment: moment('stated.resistingMoment').optional(),
  stabilityRatio: boundedNumber('stated.stabilityRatio', { min: 0, max: 1000 }).optional(),
  maxSupportReaction: weight('stated.maxSupportReaction').optional(),
  groundPressure: quantity(PRESSURE_UNITS, 'stated.groundPressure', { min: 0 }).optional(),
  maxSlingTension: weight('stated.maxSlingTension').optional(),
  linePull: weight('stated.linePull').optional(),
});

const HookBlock = (label: string) =>
  z.object({ weight: weight(`${label}.weight`), height: length(`${label}.height`).optional() });

/**
 * A crane of a lift with several cranes, other than the one entered at the top of the input (the
 * lead crane). Plan positions (pick points, the load's centre of gravity) share one plan frame of
 * the planner's choosing, e.g. the load's own axes. `chartCapacity` without `crane` and `chart` is
 * the version 1 form (only the multi-crane margin can be checked for such a crane).
 */
export const OtherCrane = z
  .object({
    name,
    crane: Crane.optional(),
    chart: Chart.optional(),
    chartCapacity: positiveWeight('multiCrane.others[].chartCapacity').optional(),
    rigging: Rigging.optional(),
    hookBlock: HookBlock('multiCrane.others[].hookBlock').optional(),
    loadLineAllowance: weight('multiCrane.others[].loadLineAllowance').optional(),
    chartDeductions: z
      .array(z.object({ name, weight: weight('multiCrane.others[].chartDeductions[].weight') }))
      .optional(),
    reeving: Reeving.optional(),
    ground: Ground.optional(),
    pickPoint: PlanPoint('multiCrane.others[].pickPoint').optional(),
    statedShare: weight('multiCrane.others[].statedShare').optional(),
  })
  .superRefine((c, ctx) => {
    if (!c.crane !== !c.chart)
      ctx.addIssue({
        code: 'custom',
        path: [c.crane ? 'chart' : 'crane'],
        message: 'multiCrane.others[]: enter both the crane configuration and its chart rows',
      });
    if (!c.crane && !c.chartCapacity)
      ctx.addIssue({
        code: 'custom',
        path: ['crane'],
        message: 'multiCrane.others[]: enter the crane configuration and chart rows of each crane',
      });
  });

/** Version 2: a lift with 2 to 4 cranes, each with its own configuration, rigging and pick point. */
export const MultiCrane = z.object({
  /** Plan position of the load's centre of gravity (default the origin of the plan frame). */
  loadCg: PlanPoint('multiCrane.loadCg').optional(),
  /** Sensitivity: the centre of gravity moved by this fraction of the pick spacing (default 0.05). */
  cgOffsetFraction: boundedNumber('multiCrane.cgOffsetFraction', { min: 0, max: 0.5 }).optional(),
  lead: z.object({
    name,
    /** capacity the plan states for this crane; the lower of it and the chart governs the margin */
    chartCapacity: positiveWeight('multiCrane.lead.chartCapacity').optional(),
    pickPoint: PlanPoint('multiCrane.lead.pickPoint').optional(),
    statedShare: weight('multiCrane.lead.statedShare').optional(),
  }),
  others: z
    .array(OtherCrane, { error: 'multiCrane.others must list the other cranes' })
    .min(1, { error: 'multiCrane.others must list 1 to 3 cranes (2 to 4 cranes in all)' })
    .max(3, { error: 'multiCrane.others must list 1 to 3 cranes (2 to 4 cranes in all)' }),
});

export const LIFT_INPUT_SCHEMA_VERSION = 2 as const;

export const LiftInput = z
  .object({
    /** 1: several cranes as `tandem` (shares and capacities only); 2: several cranes as `multiCrane`. */
    schemaVersion: z
      .union([z.literal(1), z.literal(2)], { error: 'schemaVersion must be 1 or 2' })
      .optional(),
    title: z.string().max(300).optional(),
    crane: Crane,
    chart: Chart,
    load: Load,
    rigging: Rigging.optional(),
    hookBlock: HookBlock('hookBlock').optional(),
    loadLineAllowance: weight('loadLineAllowance').optional(),
    chartDeductions: z.array(z.object({ name, weight: weight('chartDeductions[].weight') })).optional(),
    reeving: Reeving.optional(),
    ground: Ground.optional(),
    environment: Environment.optional(),
    /** Version 1 form of several cranes, kept so stored inputs load; upgradeLiftInput converts it. */
    tandem: Tandem.optional(),
    multiCrane: MultiCrane.optional(),
    personnel: Personnel.optional(),
    requiredLiftHeight: length('requiredLiftHeight').optional(),
    site: SiteConditions.optional(),
    stated: Stated.optional(),
  })
  .superRefine((l, ctx) => {
    if (l.tandem && l.multiCrane)
      ctx.addIssue({
        code: 'custom',
        path: ['tandem'],
        message: 'tandem and multiCrane both describe several cranes: keep multiCrane',
      });
    else if (l.tandem && l.schemaVersion === 2)
      ctx.addIssue({
        code: 'custom',
        path: ['tandem'],
        message: 'tandem is the version 1 form of several cranes: with schemaVersion 2 enter multiCrane',
      });
  });

export type LiftInput = z.infer<typeof LiftInput>;
export type LiftInputRaw = z.input<typeof LiftInput>;
