// Converter of stored lift inputs to the current schema version. Version 1 described several cranes
// as `tandem`: per crane a pick-point distance from the centre of gravity or a share, the chart
// capacity and its own hook weight, with the crane at the top of the input taken as the first of
// them. Version 2 gives each crane its own configuration (`multiCrane`). The converter is pure and
// runs every time an input is evaluated, so stored inputs (drafts and submitted revisions, which
// the database freezes) keep loading and evaluating without rewriting a row.
//   v1 tandem.cranes[0]      → multiCrane.lead (the crane entered at the top; its stated chart
//                              capacity kept: the lower of it and the chart rows governs)
//   v1 tandem.cranes[1…]     → multiCrane.others (chart capacity and own hook block only)
//   two pick-point distances → pick points on a line through the centre of gravity at the origin
//   stated shares            → statedShare
import type { LiftInput } from '../schemas/lift-input';
import { si } from './units';

type Multi = NonNullable<LiftInput['multiCrane']>;
const m = (value: number) => ({ value, unit: 'm' as const });

export function upgradeLiftInput(input: LiftInput): LiftInput {
  if (!input.tandem) return input.schemaVersion === 2 ? input : { ...input, schemaVersion: 2 };
  const cranes = input.tandem.cranes;
  const d = cranes.map((c) => si(c.pickPointDistance));
  const onLine = cranes.length === 2 && d[0] !== undefined && d[1] !== undefined;
  const pick = (i: number) => (onLine ? { x: m(i === 0 ? -d[0]! : d[1]!), y: m(0) } : undefined);
  const multiCrane: Multi = {
    loadCg: { x: m(0), y: m(0) },
    lead: {
      name: cranes[0].name,
      chartCapacity: cranes[0].chartCapacity,
      pickPoint: pick(0),
      statedShare: cranes[0].share,
    },
    others: cranes.slice(1).map((c, k) => ({
      name: c.name,
      chartCapacity: c.chartCapacity,
      hookBlock: c.ownHookWeight ? { weight: c.ownHookWeight } : undefined,
      pickPoint: pick(k + 1),
      statedShare: c.share,
    })),
  };
  const { tandem: _v1, ...rest } = input;
  void _v1;
  return { ...rest, schemaVersion: 2, multiCrane };
}
