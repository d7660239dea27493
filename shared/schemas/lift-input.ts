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
import { same } from '../engineering/chart';
import {
  angle,
  area,
  boundedNumber,
  count,
  length,
  moment,
  name,
  positiveLength,
  positiveWeight,
  pressure,
  quantity,
  signedLength,
  speed,
  weight,
} from './lift-quantities';
import { PRESSURE_UNITS, TO_SI, VOLTAGE_UNITS } from '../engineering/units';
import { PlanPoint, Rigging } from './lift-rigging';

export { QUANTITY_MAX_SI } from './lift-quantities';
export {
  SLING_MATERIALS,
  HITCHES,
  SlingLeg,
  SlingSet,
  Hardware,
  BeamDrops,
  Beam,
  Rigging,
} from './lift-rigging';

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
