// The fleet library's payloads: a contractor's cranes, their configurations, each configuration's
// versions (immutable: an edit is a new version) with the load chart as a grid, the manufacturer's
// document reference, the owner desk's verifications, and a package's use of a version.
import { z } from 'zod';
import { CRANE_TYPES, Gantry } from './lift-input';
import { LENGTH_UNITS, TO_SI, WEIGHT_UNITS } from '../engineering/units';
import { checkGrid } from '../library/chart-reader';
import { limitFigure } from '../vocabulary/units';

const text = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .max(max, { error: `${label} must be at most ${max} characters` });
const required = (label: string, max: number) => text(label, max).min(1, { error: `${label} is required` });

function q<const U extends readonly [string, ...string[]]>(
  units: U,
  label: string,
  opts: { min?: number; gt?: boolean; maxSI: number },
) {
  return z
    .object(
      {
        value: z.number({ error: `${label} must be a number` }).refine((v) => Number.isFinite(v), {
          error: `${label} must be a finite number`,
        }),
        unit: z.enum(units, { error: `${label}: unit must be one of ${units.join(', ')}` }),
      },
      { error: `${label} must be { value, unit }` },
    )
    .superRefine((x, ctx) => {
      if (opts.min !== undefined && (opts.gt ? x.value <= opts.min : x.value < opts.min))
        ctx.addIssue({
          code: 'custom',
          path: ['value'],
          message: `${label} must be ${opts.gt ? 'greater than' : 'at least'} ${opts.min}`,
        });
      const si = Math.abs(x.value * TO_SI[x.unit as keyof typeof TO_SI]);
      if (si > opts.maxSI)
        ctx.addIssue({
          code: 'custom',
          path: ['value'],
          message: `${label} must be ${limitFigure(opts.maxSI / TO_SI[x.unit as keyof typeof TO_SI])} ${x.unit} or less`,
        });
    });
}
const MAX_L = 300;
const MAX_W = 25_000 * TO_SI.t;
const len = (label: string) => q(LENGTH_UNITS, label, { min: 0, maxSI: MAX_L });
const posLen = (label: string) => q(LENGTH_UNITS, label, { min: 0, gt: true, maxSI: MAX_L });
const signedLen = (label: string) => q(LENGTH_UNITS, label, { maxSI: MAX_L });
const wt = (label: string) => q(WEIGHT_UNITS, label, { min: 0, maxSI: MAX_W });

export const CraneType = z.enum(CRANE_TYPES, { error: `type must be one of ${CRANE_TYPES.join(', ')}` });
export const CRANE_TYPE_LABELS: Record<(typeof CRANE_TYPES)[number], string> = {
  mobile_outriggers: 'On outriggers',
  mobile_crawler: 'On crawlers',
  gantry_a_frame: 'Gantry or A-frame',
};

export const OutriggerSpread = z.object({
  name: required('supports.outriggerSpreads[].name', 60),
  longitudinalSpread: posLen('supports.outriggerSpreads[].longitudinalSpread'),
  transverseSpread: posLen('supports.outriggerSpreads[].transverseSpread'),
  boxCentreRearOfRotation: signedLen('supports.outriggerSpreads[].boxCentreRearOfRotation').optional(),
});

/** What does not change between configurations: masses, centres of gravity, support geometry. */
export const CraneFixedData = z.object({
  carrier: z
    .object({ weight: wt('carrier.weight'), cgRearOfRotation: signedLen('carrier.cgRearOfRotation') })
    .optional(),
  upperWorks: z
    .object({ weight: wt('upperWorks.weight'), cgBehindRotation: signedLen('upperWorks.cgBehindRotation') })
    .optional(),
  boom: z.object({ weight: wt('boom.weight'), cgFromFoot: len('boom.cgFromFoot').optional() }).optional(),
  pivotOffset: signedLen('pivotOffset').optional(),
  pivotHeight: len('pivotHeight').optional(),
  outriggerSpreads: z
    .array(OutriggerSpread)
    .max(8, { error: 'supports.outriggerSpreads must list at most 8 spread settings' })
    .optional(),
  tracks: z
    .object({
      length: posLen('tracks.length'),
      shoeWidth: posLen('tracks.shoeWidth'),
      gauge: posLen('tracks.gauge'),
      centreRearOfRotation: signedLen('tracks.centreRearOfRotation').optional(),
    })
    .optional(),
  gantry: Gantry.optional(),
});
export type CraneFixedData = z.infer<typeof CraneFixedData>;

export const CraneBody = z.object({
  fleetNumber: required('fleetNumber', 40),
  make: required('make', 100),
  model: required('model', 100),
  type: CraneType,
  fixed: CraneFixedData.default({}),
});
export type CraneBody = z.infer<typeof CraneBody>;
export const CranePatch = CraneBody.partial();

export const WORKING_AREAS = ['full_circle', 'over_rear', 'over_side', 'over_front'] as const;
export const WORKING_AREA_LABELS: Record<(typeof WORKING_AREAS)[number], string> = {
  full_circle: '360°',
  over_rear: 'Over the rear',
  over_side: 'Over the side',
  over_front: 'Over the front',
};

export const ConfigurationDetails = z.object({
  boomLengthMin: posLen('details.boomLengthMin').optional(),
  boomLengthMax: posLen('details.boomLengthMax').optional(),
  jib: text('details.jib', 200).optional(),
  counterweight: z
    .object({
      arrangement: required('details.counterweight.arrangement', 200),
      weight: wt('details.counterweight.weight'),
      cgBehindRotation: signedLen('details.counterweight.cgBehindRotation'),
    })
    .optional(),
  /** The name of one of the crane's outrigger spread settings */
  outriggerSpread: text('details.outriggerSpread', 60).optional(),
  workingArea: z.enum(WORKING_AREAS, {
    error: `details.workingArea must be one of ${WORKING_AREAS.join(', ')}`,
  }),
  hookBlock: z
    .object({ name: text('details.hookBlock.name', 100).optional(), weight: wt('details.hookBlock.weight') })
    .optional(),
});
export type ConfigurationDetails = z.infer<typeof ConfigurationDetails>;

export const ChartNotes = z.object({
  deductions: z
    .array(
      z.object({ name: required('notes.deductions[].name', 100), weight: wt('notes.deductions[].weight') }),
    )
    .max(20, { error: 'notes.deductions must list at most 20 items' })
    .default([]),
  blockIncluded: z.boolean({ error: 'notes.blockIncluded must be true or false' }).default(false),
  interpolationAllowed: z
    .boolean({ error: 'notes.interpolationAllowed must be true or false' })
    .default(false),
  text: text('notes.text', 2000).optional(),
});
export type ChartNotes = z.infer<typeof ChartNotes>;

export const DocumentRef = z.object({
  title: required('document.title', 200),
  edition: text('document.edition', 100).optional(),
  page: text('document.page', 40).optional(),
});

export const ChartUnits = z.object({
  radius: z.enum(LENGTH_UNITS, { error: `chart.units.radius must be one of ${LENGTH_UNITS.join(', ')}` }),
  boomLength: z.enum(LENGTH_UNITS, {
    error: `chart.units.boomLength must be one of ${LENGTH_UNITS.join(', ')}`,
  }),
  capacity: z.enum(WEIGHT_UNITS, { error: `chart.units.capacity must be one of ${WEIGHT_UNITS.join(', ')}` }),
});

/** A chart grid as the client sends it after the preview: checked again by the same reader. */
export const ChartGridBody = z
  .object({
    units: ChartUnits,
    boomLengths: z
      .array(z.number())
      .min(1, { error: 'chart.boomLengths must list at least 1 boom length' })
      .max(100),
    radii: z.array(z.number()).min(1, { error: 'chart.radii must list at least 1 radius' }).max(300),
    capacities: z.array(z.array(z.number().nullable())),
  })
  .superRefine((g, ctx) => {
    if (
      g.capacities.length !== g.radii.length ||
      g.capacities.some((r) => r.length !== g.boomLengths.length)
    ) {
      ctx.addIssue({
        code: 'custom',
        path: ['capacities'],
        message: 'chart.capacities must have one row per radius and one column per boom length',
      });
      return;
    }
    const checked = checkGrid(g);
    for (const e of checked.errors.slice(0, 20))
      ctx.addIssue({ code: 'custom', path: ['capacities'], message: `chart ${e.message}` });
  });

export const VersionBody = z.object({
  details: ConfigurationDetails,
  notes: ChartNotes.default({ deductions: [], blockIncluded: false, interpolationAllowed: false }),
  document: DocumentRef,
  chart: ChartGridBody,
  changeNote: text('changeNote', 500).optional(),
});
export type VersionBody = z.infer<typeof VersionBody>;

export const ConfigurationBody = z.object({
  name: required('name', 200),
  version: VersionBody,
});

export const Person = z.object({ id: z.uuid(), name: z.string() });

export const VerificationView = z.object({
  id: z.uuid(),
  engineer: Person,
  note: z.string(),
  at: z.string(),
});

export const VersionSummary = z.object({
  id: z.uuid(),
  number: z.number().int(),
  createdAt: z.string(),
  createdBy: Person,
  changeNote: z.string().nullable(),
  retiredAt: z.string().nullable(),
  usedBy: z.number().int(),
  /** cells added, removed or changed from the version before */
  cellsChanged: z.number().int().nullable(),
  verified: z.boolean(),
});

export const VersionDetail = VersionSummary.extend({
  configurationId: z.uuid(),
  configurationName: z.string(),
  crane: z.object({
    id: z.uuid(),
    fleetNumber: z.string(),
    make: z.string(),
    model: z.string(),
    type: CraneType,
    fixed: CraneFixedData,
  }),
  details: ConfigurationDetails,
  notes: ChartNotes,
  document: DocumentRef.extend({
    file: z.object({ name: z.string(), sizeBytes: z.number(), pages: z.number().int() }).nullable(),
  }),
  chart: z.object({
    units: ChartUnits,
    boomLengths: z.array(z.number()),
    radii: z.array(z.number()),
    capacities: z.array(z.array(z.number().nullable())),
  }),
  /** The verifications of the reader's own owner desk only */
  verifications: z.array(VerificationView),
});
export type VersionDetail = z.infer<typeof VersionDetail>;

export const ConfigurationSummary = z.object({
  id: z.uuid(),
  name: z.string(),
  retiredAt: z.string().nullable(),
  current: VersionSummary,
  workingArea: z.enum(WORKING_AREAS),
  /** Capacity at the radius asked for in the list's query (chart units), when one was asked */
  capacityAtRadius: z.number().nullable(),
  capacityUnit: z.enum(WEIGHT_UNITS),
});

export const CraneSummary = z.object({
  id: z.uuid(),
  fleetNumber: z.string(),
  make: z.string(),
  model: z.string(),
  type: CraneType,
  retiredAt: z.string().nullable(),
  configurations: z.array(ConfigurationSummary),
});
export type CraneSummary = z.infer<typeof CraneSummary>;
export const CraneList = z.object({ items: z.array(CraneSummary) });

export const CraneDetail = CraneSummary.extend({ fixed: CraneFixedData });
export type CraneDetail = z.infer<typeof CraneDetail>;

export const ConfigurationDetail = z.object({
  id: z.uuid(),
  craneId: z.uuid(),
  name: z.string(),
  retiredAt: z.string().nullable(),
  versions: z.array(VersionSummary),
});
export type ConfigurationDetail = z.infer<typeof ConfigurationDetail>;

export const CraneListQuery = z.object({
  q: text('q', 100).optional(),
  /** With capacity: keep configurations rating at least `capacity` at `radius` */
  radius: z.coerce.number({ error: 'radius must be a number' }).min(0).max(300).optional(),
  radiusUnit: z.enum(LENGTH_UNITS).default('m'),
  capacity: z.coerce.number({ error: 'capacity must be a number' }).min(0).max(25_000_000).optional(),
  capacityUnit: z.enum(WEIGHT_UNITS).default('t'),
  includeRetired: z.enum(['true', 'false']).default('false'),
});

export const VerificationBody = z.object({ note: required('note', 1000) });

export const LibraryUseBody = z.object({
  versionId: z.uuid({ error: 'versionId must be the id of a configuration version' }),
  /** 0 for the lead crane, 1 to 3 for the other cranes of a lift with several cranes */
  slot: z
    .number()
    .int()
    .min(0, { error: 'slot must be 0 to 3' })
    .max(3, { error: 'slot must be 0 to 3' })
    .default(0),
  detached: z.boolean().default(false),
});

/** A crane of a lift with several cranes removed from a draft: its library use goes, later ones move up */
export const CraneRemovedBody = z.object({
  /** 1 to 3: the removed crane's slot; null: the lift went back to one crane (every other crane removed) */
  slot: z
    .number({ error: 'slot must be 1 to 3, or null for back to one crane' })
    .int({ error: 'slot must be 1 to 3, or null for back to one crane' })
    .min(1, { error: 'slot must be 1 to 3: the lead crane (0) is not removed this way' })
    .max(3, { error: 'slot must be 1 to 3, or null for back to one crane' })
    .nullable(),
});

export const ChangedCell = z.object({
  boomLength: z.number(),
  radius: z.number(),
  library: z.number().nullable(),
  package: z.number().nullable(),
});

export const LibraryUse = z.object({
  slot: z.number().int(),
  version: z.object({
    id: z.uuid(),
    number: z.number().int(),
    /** The configuration the version belongs to (its page, for the contractor who keeps it) */
    configurationId: z.uuid(),
    configurationName: z.string(),
    crane: z.string(),
  }),
  detached: z.boolean(),
  /** Cells of the package's chart that differ from the library version (chart units) */
  changedCells: z.array(ChangedCell),
  /** The chart's units, for reading changedCells */
  units: ChartUnits,
  verifications: z.array(VerificationView),
});
export type LibraryUse = z.infer<typeof LibraryUse>;
export const LibraryUseList = z.object({ items: z.array(LibraryUse) });

export const ChartIssue = z.object({
  ref: z.string().nullable(),
  row: z.number().nullable(),
  column: z.number().nullable(),
  message: z.string(),
});
export const ChartPreviewResponse = z.object({
  units: ChartUnits.partial(),
  unitsSource: z.string(),
  orientation: z.enum(['radius_down', 'boom_down']),
  cells: z.array(
    z.array(
      z.object({
        ref: z.string(),
        row: z.number(),
        column: z.number(),
        role: z.enum(['units', 'boomLength', 'radius', 'capacity', 'ignored']),
        raw: z.string(),
        value: z.number().nullable(),
        unit: z.string().nullable(),
        problem: z.enum(['error', 'warning']).nullable(),
        message: z.string().nullable(),
      }),
    ),
  ),
  errors: z.array(ChartIssue),
  warnings: z.array(ChartIssue),
  grid: ChartGridBody.nullable(),
  ratedCells: z.number(),
});
export const ChartTextBody = z.object({
  text: z
    .string({ error: 'text must be the chart pasted as text' })
    .min(1, { error: 'text is empty: paste the chart cells' })
    .max(500_000, { error: 'text must be at most 500,000 characters' }),
});
export const ExportQuery = z.object({
  format: z.enum(['csv', 'xlsx'], { error: 'format must be csv or xlsx' }),
});
