// The one field catalogue of the lift input: the submission editor's steps and the fields on
// each, described once so the form, the step list's error marks and the mapping of server field
// errors agree. Lives in shared/ so the server can read it too; the calculation sheet's inputs
// section does not yet print from it (it shares the crane-type and stated-figure words).
import { CRANE_TYPES, ROPE_TYPES, SOIL_CLASSES } from '@shared/schemas/lift-input';
import { CRANE_TYPE_LABELS } from '@shared/vocabulary/crane-types';
import { STATED_FIGURE_LABELS } from '@shared/vocabulary/stated-figures';
import { SOIL_LABELS } from '@shared/vocabulary/soil-classes';
import { q, type Step, type StepId } from './field-types';
import { RIGGING_GROUPS } from './lift-fields-rigging';

export type { FieldDef, FieldGroup, Step, StepId } from './field-types';

const craneType = (values: Record<string, unknown>) =>
  (values.crane as { type?: string } | undefined)?.type ?? '';

export const STEPS: Step[] = [
  {
    id: 'crane',
    title: 'Crane and configuration',
    groups: [
      {
        title: 'Crane',
        fields: [
          {
            kind: 'select',
            path: 'crane.type',
            label: 'Crane type',
            options: CRANE_TYPES.map((t) => [t, CRANE_TYPE_LABELS[t]] as const),
          },
          { kind: 'text', path: 'crane.name', label: 'Crane (make, model, fleet number)' },
        ],
      },
      {
        title: 'Boom and geometry',
        note: 'Give the boom angle or the radius (or both). Radius is measured from the centre of rotation to the hook.',
        when: (v) => craneType(v) !== 'gantry_a_frame',
        fields: [
          q('crane.boomLength', 'Boom length', 'length'),
          q('crane.boomAngle', 'Boom angle from horizontal', 'angle'),
          q('crane.radius', 'Radius', 'length'),
          q('crane.pivotOffset', 'Boom foot pin ahead of rotation', 'length'),
          q('crane.pivotHeight', 'Boom foot pin height', 'length'),
          q(
            'crane.slewAngle',
            'Slew angle (0° over the rear)',
            'angle',
            'Leave empty to check the least favourable direction.',
          ),
        ],
      },
      {
        title: 'Masses of the crane',
        note: 'Distances behind rotation are positive away from the load.',
        when: (v) => craneType(v) !== 'gantry_a_frame',
        fields: [
          q('crane.upperWorks.weight', 'Upper works weight', 'weight'),
          q('crane.upperWorks.cgBehindRotation', 'Upper works CG behind rotation', 'length'),
          q('crane.counterweight.weight', 'Counterweight', 'weight'),
          q('crane.counterweight.cgBehindRotation', 'Counterweight CG behind rotation', 'length'),
          q('crane.carrier.weight', 'Carrier or carbody weight', 'weight'),
          q('crane.carrier.cgRearOfRotation', 'Carrier CG rear of rotation', 'length'),
          q('crane.boom.weight', 'Boom weight', 'weight'),
          q('crane.boom.cgFromFoot', 'Boom CG from foot pin', 'length'),
        ],
      },
      {
        title: 'Outriggers',
        when: (v) => craneType(v) === 'mobile_outriggers',
        fields: [
          q('crane.outriggers.longitudinalSpread', 'Longitudinal spread', 'length'),
          q('crane.outriggers.transverseSpread', 'Transverse spread', 'length'),
          q('crane.outriggers.boxCentreRearOfRotation', 'Outrigger box centre rear of rotation', 'length'),
        ],
      },
      {
        title: 'Tracks',
        when: (v) => craneType(v) === 'mobile_crawler',
        fields: [
          q('crane.tracks.length', 'Track length (tumbler to tumbler)', 'length'),
          q('crane.tracks.shoeWidth', 'Track shoe width', 'length'),
          q('crane.tracks.gauge', 'Track gauge (centre to centre)', 'length'),
          q('crane.tracks.centreRearOfRotation', 'Track centre rear of rotation', 'length'),
        ],
      },
      {
        title: 'Gantry or A-frame',
        when: (v) => craneType(v) === 'gantry_a_frame',
        fields: [
          q('crane.gantry.legLength', 'Leg length', 'length'),
          q('crane.gantry.legInclination', 'Leg inclination from vertical', 'angle'),
          q('crane.gantry.legSpread', 'Leg spread', 'length'),
          q('crane.gantry.frameWeight', 'Frame weight', 'weight'),
          q('crane.gantry.backstayAnchorDistance', 'Backstay anchor distance', 'length'),
          q('crane.gantry.ballastWeight', 'Ballast weight', 'weight'),
          q('crane.gantry.backstayRatedLoad', 'Backstay rated load', 'weight'),
          q('crane.gantry.legRatedCompression', 'Leg rated compression', 'weight'),
        ],
      },
    ],
  },
  {
    id: 'chart',
    title: 'Chart rows',
    groups: [
      {
        title: 'Load chart',
        fields: [
          { kind: 'text', path: 'chart.name', label: 'Chart (configuration, counterweight, support)' },
        ],
      },
    ],
  },
  {
    id: 'load',
    title: 'Load and rigging',
    groups: [
      {
        title: 'Load',
        fields: [
          { kind: 'text', path: 'load.description', label: 'Load description' },
          q('load.weight', 'Load weight', 'weight'),
          q('load.length', 'Length', 'length'),
          q('load.width', 'Width', 'length'),
          q('load.height', 'Height', 'length'),
          q('load.windArea', 'Wind area', 'area'),
          { kind: 'number', path: 'load.dragCoefficient', label: 'Drag coefficient' },
        ],
      },
      ...RIGGING_GROUPS,
    ],
  },
  {
    id: 'reeving',
    title: 'Reeving',
    groups: [
      {
        title: 'Hoist rope',
        fields: [
          { kind: 'number', path: 'reeving.partsOfLine', label: 'Parts of line', integer: true },
          { kind: 'number', path: 'reeving.sheavesPassed', label: 'Sheaves passed', integer: true },
          {
            kind: 'select',
            path: 'reeving.bearing',
            label: 'Sheave bearings',
            options: [
              ['roller', 'Roller'],
              ['plain', 'Plain (bronze bushed)'],
            ],
          },
          {
            kind: 'number',
            path: 'reeving.sheaveEfficiency',
            label: 'Sheave efficiency (replaces the bearing constant)',
            hint: 'From your own data, 0.8 to 1; give its source below.',
          },
          { kind: 'text', path: 'reeving.sheaveEfficiencySource', label: 'Source of the sheave efficiency' },
          q('reeving.hoistLinePull', "Hoist line pull (the hoist's rated single-line pull)", 'weight'),
          q('reeving.ropeRatedLoad', 'Rope rated load', 'weight'),
          q('reeving.ropeBreakingStrength', 'Rope breaking strength', 'weight'),
          {
            kind: 'select',
            path: 'reeving.ropeType',
            label: 'Rope type',
            options: ROPE_TYPES.map(
              (r) => [r, r === 'running' ? 'Running rope' : 'Rotation resistant'] as const,
            ),
          },
        ],
      },
    ],
  },
  {
    id: 'ground',
    title: 'Ground',
    groups: [
      {
        title: 'Mats and ground',
        note: 'Give the allowable bearing pressure from the ground report, or the soil class for a presumptive value.',
        fields: [
          q(
            'ground.mat.length',
            'Mat length',
            'length',
            'Under crawler tracks: the length across the track.',
          ),
          q('ground.mat.width', 'Mat width', 'length'),
          { kind: 'number', path: 'ground.mat.perSupport', label: 'Mats per support', integer: true },
          q('ground.allowableBearing', 'Allowable bearing pressure', 'pressure'),
          {
            kind: 'select',
            path: 'ground.soilClass',
            label: 'Soil class',
            options: SOIL_CLASSES.map((s) => [s, SOIL_LABELS[s]] as const),
          },
        ],
      },
    ],
  },
  {
    id: 'hazards',
    title: 'Hazards and environment',
    groups: [
      {
        title: 'Power lines',
        fields: [
          {
            kind: 'list',
            path: 'environment.powerLines',
            label: 'Power lines near the lift',
            addLabel: 'Add a power line',
            columns: [
              { kind: 'text', path: 'name', label: 'Line' },
              q('voltage', 'Voltage', 'voltage'),
              q('distance', 'Closest approach of any part of crane, load or rigging', 'length'),
            ],
          },
        ],
      },
      {
        title: 'Wind',
        fields: [
          q('environment.windSpeed', 'Design wind speed', 'speed'),
          q('environment.boomWindArea', 'Boom wind area', 'area'),
          { kind: 'number', path: 'environment.boomDragCoefficient', label: 'Boom drag coefficient' },
          q('requiredLiftHeight', 'Required lift height', 'length'),
        ],
      },
      {
        title: 'Personnel platform',
        fields: [
          q('personnel.platformWeight', 'Platform weight', 'weight'),
          q('personnel.riggingWeight', 'Platform rigging weight', 'weight'),
          { kind: 'number', path: 'personnel.occupants', label: 'Occupants', integer: true },
          q('personnel.occupantWeight', 'Weight of each occupant', 'weight'),
          q('personnel.toolsWeight', 'Tools and materials', 'weight'),
          q('personnel.platformRatedLoad', 'Platform rated load', 'weight'),
        ],
      },
      {
        title: 'Site conditions',
        fields: [
          { kind: 'checkbox', path: 'site.overOccupiedArea', label: 'Load passes over an occupied area' },
          { kind: 'checkbox', path: 'site.overOperatingPlant', label: 'Load passes over operating plant' },
          { kind: 'checkbox', path: 'site.loadOutOfOperatorView', label: 'Load out of the operator’s view' },
          { kind: 'checkbox', path: 'site.nonRoutineRigging', label: 'Non-routine rigging' },
          {
            kind: 'checkbox',
            path: 'site.hazardousOrIrreplaceableLoad',
            label: 'Hazardous or irreplaceable load',
          },
          { kind: 'checkbox', path: 'site.declaredCritical', label: 'Declared critical by the lift planner' },
        ],
      },
    ],
  },
  // Fields in shared/catalogue/multi-crane-steps.ts (the editor's MultiCraneEditor).
  { id: 'cranes', title: 'Several cranes', groups: [] },
  {
    id: 'stated',
    title: 'Stated figures',
    groups: [
      {
        title: 'Figures stated in your lift plan',
        note: 'Each figure is compared with the recomputed one; a difference past the site’s tolerance is flagged for the engineer.',
        fields: [
          q('stated.grossLoad', STATED_FIGURE_LABELS.grossLoad, 'weight'),
          q('stated.radius', STATED_FIGURE_LABELS.radius, 'length'),
          q('stated.boomAngle', STATED_FIGURE_LABELS.boomAngle, 'angle'),
          q('stated.chartCapacity', STATED_FIGURE_LABELS.chartCapacity, 'weight'),
          {
            kind: 'number',
            path: 'stated.percentOfChart',
            label: STATED_FIGURE_LABELS.percentOfChart,
            suffix: '%',
          },
          q('stated.overturningMoment', STATED_FIGURE_LABELS.overturningMoment, 'moment'),
          q('stated.resistingMoment', STATED_FIGURE_LABELS.resistingMoment, 'moment'),
          { kind: 'number', path: 'stated.stabilityRatio', label: STATED_FIGURE_LABELS.stabilityRatio },
          q('stated.maxSupportReaction', STATED_FIGURE_LABELS.maxSupportReaction, 'weight'),
          q('stated.groundPressure', STATED_FIGURE_LABELS.groundPressure, 'pressure'),
          q('stated.maxSlingTension', STATED_FIGURE_LABELS.maxSlingTension, 'weight'),
          q('stated.linePull', STATED_FIGURE_LABELS.linePull, 'weight'),
        ],
      },
    ],
  },
  { id: 'documents', title: 'Documents', groups: [] },
  { id: 'review', title: 'Review and submit', groups: [] },
];

const STEP_BY_ROOT: Record<string, StepId> = {
  crane: 'crane',
  chart: 'chart',
  load: 'load',
  rigging: 'load',
  hookBlock: 'load',
  loadLineAllowance: 'load',
  chartDeductions: 'load',
  reeving: 'reeving',
  ground: 'ground',
  environment: 'hazards',
  tandem: 'cranes',
  multiCrane: 'cranes',
  personnel: 'hazards',
  site: 'hazards',
  requiredLiftHeight: 'hazards',
  stated: 'stated',
  files: 'documents',
  title: 'review',
  plannedLiftDate: 'review',
  siteId: 'review',
};

/** The step a field path belongs to: 'inputs.crane.boomLength' and 'crane.boomLength' → crane. */
export function stepOfPath(path: string): StepId {
  const parts = path.split('.');
  const root = parts[0] === 'inputs' ? parts[1] : parts[0];
  return STEP_BY_ROOT[root ?? ''] ?? 'review';
}

/** Every field label by path (list columns as 'list.path[].column'), for naming fields in messages. */
export function labelOfPath(path: string): string {
  const clean = path.replace(/^inputs\./, '').replace(/\.value$|\.unit$/, '');
  const generic = clean.replace(/\.\d+(?=\.|$)/g, '[]');
  for (const step of STEPS) {
    for (const group of step.groups) {
      for (const field of group.fields) {
        if (field.path === clean) return field.label;
        if (field.kind === 'list') {
          for (const column of field.columns) {
            if (`${field.path}[].${column.path}` === generic) {
              const index = /\.(\d+)\./.exec(clean)?.[1];
              return `${field.label}, row ${Number(index ?? 0) + 1}: ${column.label}`;
            }
          }
          if (field.path === generic || field.path === clean) return field.label;
        }
      }
    }
  }
  if (clean.startsWith('chart.rows')) {
    const index = /chart\.rows\.(\d+)/.exec(clean)?.[1];
    return index === undefined ? 'Chart rows' : `Chart row ${Number(index) + 1}`;
  }
  if (clean === 'chart') return 'Load chart';
  return clean;
}
