// The submission editor's fields for a lift with several cranes (2 to 4). The crane entered in the
// steps above is crane 1 (the lead); each other crane repeats the single-crane fields of the
// catalogue (configuration, reeving, ground, block and rigging) under `multiCrane.others.N.`, plus
// its pick point and, where statics cannot fix it, its stated share. Kept apart from lift-steps so
// the single-crane catalogue stays as it is.
import { labelOfPath, STEPS, type FieldDef, type FieldGroup } from './lift-fields';

export const MAX_OTHER_CRANES = 3;

const q = (path: string, label: string, kind: Extract<FieldDef, { kind: 'quantity' }>['q'], hint?: string) =>
  ({ kind: 'quantity', path, label, q: kind, hint }) as const satisfies FieldDef;

/** Fields of the lift as a whole and of crane 1. */
export const MULTI_CRANE_GROUPS: FieldGroup[] = [
  {
    title: 'Load centre of gravity (plan)',
    note: 'Pick points and the centre of gravity share one plan frame of your choosing, e.g. the load’s own axes. Two cranes, or three picks not in a line, get their shares from statics; with four cranes (or three in a line) state each share.',
    fields: [
      q('multiCrane.loadCg.x', 'Centre of gravity x', 'length'),
      q('multiCrane.loadCg.y', 'Centre of gravity y', 'length'),
      {
        kind: 'number',
        path: 'multiCrane.cgOffsetFraction',
        label: 'CG uncertainty (fraction of pick spacing)',
        hint: 'Default 0.05: the shares are also shown with the CG moved by 5% of the pick spacing.',
      },
    ],
  },
  {
    title: 'Crane 1 (the crane entered above)',
    fields: [
      { kind: 'text', path: 'multiCrane.lead.name', label: 'Name' },
      q('multiCrane.lead.pickPoint.x', 'Pick point x', 'length'),
      q('multiCrane.lead.pickPoint.y', 'Pick point y', 'length'),
      q('multiCrane.lead.statedShare', 'Stated share', 'weight'),
      q('multiCrane.lead.chartCapacity', 'Chart capacity stated in the plan', 'weight'),
    ],
  },
];

function prefixField(def: FieldDef, prefix: string): FieldDef {
  return { ...def, path: `${prefix}${def.path}` } as FieldDef;
}

/** The single-crane groups a crane of several repeats, from the catalogue (paths relative to the crane). */
function perCraneGroups(): FieldGroup[] {
  const out: FieldGroup[] = [];
  for (const step of STEPS) {
    if (!['crane', 'chart', 'load', 'reeving', 'ground'].includes(step.id)) continue;
    for (const group of step.groups) {
      // the load is one for all cranes
      const fields = group.fields.filter((f) => !f.path.startsWith('load.'));
      if (fields.length > 0) out.push({ ...group, fields });
    }
  }
  return out;
}

const PER_CRANE = perCraneGroups();

/** The groups of crane `index + 2` (multiCrane.others[index]); `when` reads that crane's values. */
export function otherCraneGroups(index: number): FieldGroup[] {
  const prefix = `multiCrane.others.${index}.`;
  const own = (values: Record<string, unknown>) =>
    ((values.multiCrane as { others?: Record<string, unknown>[] } | undefined)?.others?.[index] ??
      {}) as Record<string, unknown>;
  return [
    {
      title: 'Pick point and share',
      fields: [
        { kind: 'text', path: `${prefix}name`, label: 'Name' },
        q(`${prefix}pickPoint.x`, 'Pick point x', 'length'),
        q(`${prefix}pickPoint.y`, 'Pick point y', 'length'),
        q(`${prefix}statedShare`, 'Stated share', 'weight'),
      ],
    },
    ...PER_CRANE.map((group) => ({
      ...group,
      fields: group.fields.map((f) => prefixField(f, prefix)),
      when: group.when ? (values: Record<string, unknown>) => group.when!(own(values)) : undefined,
    })),
  ];
}

/** Every path of the several-cranes catalogue for crane 2 (for the schema test and labels). */
export function multiCraneCatalogue(): FieldDef[] {
  return [...MULTI_CRANE_GROUPS, ...otherCraneGroups(0)].flatMap((g) => g.fields);
}

/** 'multiCrane.others.1.crane.boomLength' → 'Crane 3: Boom length'; null for other paths. */
export function labelOfMultiCranePath(path: string): string | null {
  const clean = path.replace(/^inputs\./, '').replace(/\.value$|\.unit$/, '');
  if (!clean.startsWith('multiCrane')) return null;
  const other = /^multiCrane\.others\.(\d+)(?:\.(.*))?$/.exec(clean);
  if (other) {
    const n = Number(other[1]) + 2;
    const rest = other[2];
    if (!rest) return `Crane ${n}`;
    if (rest.startsWith('chart.rows')) {
      const row = /chart\.rows\.(\d+)/.exec(rest)?.[1];
      return row === undefined ? `Crane ${n}: chart rows` : `Crane ${n}: chart row ${Number(row) + 1}`;
    }
    const generic = rest.replace(/\.\d+(?=\.|$)/g, '[]');
    for (const def of otherCraneGroups(0).flatMap((g) => g.fields)) {
      const rel = def.path.replace(/^multiCrane\.others\.0\./, '');
      if (rel === rest || rel === generic) return `Crane ${n}: ${def.label}`;
      if (def.kind === 'list')
        for (const column of def.columns)
          if (`${rel}[].${column.path}` === generic) return `Crane ${n}: ${def.label}, ${column.label}`;
    }
    return `Crane ${n}: ${rest}`;
  }
  for (const def of MULTI_CRANE_GROUPS.flatMap((g) => g.fields)) if (def.path === clean) return def.label;
  if (clean === 'multiCrane.others') return 'Other cranes';
  return 'Several cranes';
}

/** Every field label by path, the several-cranes fields included. */
export function labelOfAnyPath(path: string): string {
  return labelOfMultiCranePath(path) ?? labelOfPath(path);
}
