// The lift input's rigging in the field catalogue (the "Load and rigging" step of lift-fields.ts):
// the hook block and what hangs below it, the slings, a spreader or lifting beam with its drops,
// and the hardware. Every other crane of a several-crane lift repeats these groups
// (multi-crane-steps.ts), so each crane's own rigging and beam are entered the same way.
import { HITCHES, SLING_MATERIALS } from '@shared/schemas/lift-input';
import { q, type FieldDef, type FieldGroup } from './field-types';

const MATERIALS = SLING_MATERIALS.map(
  (m) => [m, m === 'wire' ? 'Wire rope' : m === 'chain' ? 'Chain' : 'Synthetic'] as const,
);
const HITCH_OPTIONS = HITCHES.map((h) => [h, h[0].toUpperCase() + h.slice(1)] as const);
const BEAM_KINDS = [
  ['spreader', 'Spreader beam'],
  ['lifting', 'Lifting beam'],
] as const;

/** A leg of the slings or a drop below the beam: its angle, or length and reach, or pick point. */
const LEG_COLUMNS: FieldDef[] = [
  q('angle', 'Angle from horizontal', 'angle'),
  q('length', 'Length', 'length'),
  q('horizontalDistance', 'Horizontal distance', 'length'),
  q('pickPoint.x', 'Pick point x', 'length'),
  q('pickPoint.y', 'Pick point y', 'length'),
];

const beamKind = (values: Record<string, unknown>) =>
  (values.rigging as { beam?: { kind?: string } } | undefined)?.beam?.kind ?? '';

export const RIGGING_GROUPS: FieldGroup[] = [
  {
    title: 'Below and at the hook',
    fields: [
      q('hookBlock.weight', 'Hook block weight', 'weight'),
      q('hookBlock.height', 'Hook block height', 'length'),
      q('loadLineAllowance', 'Load line allowance', 'weight'),
      q('rigging.height', 'Rigging height (hook to load)', 'length'),
      {
        kind: 'list',
        path: 'rigging.items',
        label: 'Other rigging items carried with the load',
        addLabel: 'Add a rigging item',
        hint: 'A spreader or lifting beam has its own group below, with its rated load and drops.',
        columns: [{ kind: 'text', path: 'name', label: 'Item' }, q('weight', 'Weight', 'weight')],
      },
      {
        kind: 'list',
        path: 'chartDeductions',
        label: 'Chart deductions (jib stowed, auxiliary head…)',
        addLabel: 'Add a deduction',
        columns: [{ kind: 'text', path: 'name', label: 'Deduction' }, q('weight', 'Weight', 'weight')],
      },
    ],
  },
  {
    title: 'Slings',
    note: 'The slings from the hook to the load, or to the beam when the load hangs from one.',
    fields: [
      { kind: 'text', path: 'rigging.slings.name', label: 'Sling set' },
      {
        kind: 'select',
        path: 'rigging.slings.material',
        label: 'Material',
        options: MATERIALS,
      },
      {
        kind: 'select',
        path: 'rigging.slings.hitch',
        label: 'Hitch',
        options: HITCH_OPTIONS,
      },
      q('rigging.slings.ratedLoadVertical', 'Rated load per leg (vertical)', 'weight'),
      q('rigging.slings.chokeAngle', 'Angle of choke (choker hitch)', 'angle'),
      q('rigging.slings.weight', 'Sling weight', 'weight'),
      q('rigging.slings.hookHeight', 'Hook height above the picks (3 or 4 legs)', 'length'),
      {
        kind: 'checkbox',
        path: 'rigging.slings.equalised',
        label: 'Four legs with an equalising arrangement (else rated on two legs)',
      },
      {
        kind: 'list',
        path: 'rigging.slings.legs',
        label: 'Legs (1 to 4)',
        addLabel: 'Add a leg',
        hint: 'One or two legs: each leg’s angle, or its length and horizontal distance from the hook. Three or four legs, listed round the load: each pick point in plan from the centre of gravity.',
        columns: LEG_COLUMNS,
      },
    ],
  },
  {
    title: 'Spreader or lifting beam',
    note: 'Only when the load hangs from a beam. The beam and its drops count in the load on the hook; the slings above carry the beam and everything under it. Choose the kind to enter the drops below it.',
    fields: [
      { kind: 'select', path: 'rigging.beam.kind', label: 'Beam kind', options: BEAM_KINDS },
      { kind: 'text', path: 'rigging.beam.name', label: 'Beam (make, identification)' },
      q('rigging.beam.weight', 'Beam weight', 'weight'),
      q('rigging.beam.ratedLoad', 'Beam rated load', 'weight', 'As marked on the beam.'),
    ],
  },
  {
    title: 'Drops below the beam',
    note: 'The slings from the beam to the load, 1 or 2 drops. With two drops give each its pick point from the centre of gravity: the centre of gravity between them shares the load.',
    when: (v) => beamKind(v) !== '',
    fields: [
      { kind: 'text', path: 'rigging.beam.slingsBelow.name', label: 'Drop set' },
      {
        kind: 'select',
        path: 'rigging.beam.slingsBelow.material',
        label: 'Drop material',
        options: MATERIALS,
      },
      { kind: 'select', path: 'rigging.beam.slingsBelow.hitch', label: 'Drop hitch', options: HITCH_OPTIONS },
      q('rigging.beam.slingsBelow.ratedLoadVertical', 'Rated load per drop (vertical)', 'weight'),
      q('rigging.beam.slingsBelow.chokeAngle', 'Angle of choke of the drops (choker hitch)', 'angle'),
      q('rigging.beam.slingsBelow.weight', 'Weight of the drops', 'weight'),
      {
        kind: 'list',
        path: 'rigging.beam.slingsBelow.legs',
        label: 'Drops (1 or 2)',
        addLabel: 'Add a drop',
        hint: 'Each drop: its angle, or its length and horizontal distance from the beam’s pick point; with neither it hangs vertically.',
        columns: LEG_COLUMNS,
      },
    ],
  },
  {
    title: 'Hardware',
    fields: [
      {
        kind: 'list',
        path: 'rigging.hardware',
        label: 'Shackles, links, hooks',
        addLabel: 'Add hardware',
        columns: [
          { kind: 'text', path: 'name', label: 'Item' },
          q('wll', 'Working load limit', 'weight'),
          q('weight', 'Weight', 'weight'),
          {
            kind: 'select',
            path: 'carries',
            label: 'Carries',
            options: [
              ['total', 'The whole load'],
              ['leg', 'One leg'],
            ],
          },
        ],
      },
    ],
  },
];
