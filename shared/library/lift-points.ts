// What a package puts on a library chart's pictures, for one crane slot (0 the crane entered at
// the top, 1 to 3 the other cranes of a lift with several cranes): the check's recomputed radius
// and gross load (the capacity plot's lift point), and for the working range the hook height the
// lift needs with the allowance between boom tip and hook. Pure: reads the stored inputs and the
// stored result, never runs the engine.
import type { LiftResult, LiftFigures } from '../engineering/types';
import { LiftInput } from '../schemas/lift-input';
import { upgradeLiftInput } from '../engineering/upgrade';
import { riggingHeight } from '../engineering/checks/geometry';
import { si, siOr } from '../engineering/units';

export interface CraneLiftFigures {
  slot: number;
  /** how many cranes the lift has (1 for a single crane), so a label can say "crane 2" */
  cranesInLift: number;
  /** the check's radius (m) and this crane's gross load (N); null before a check has run */
  radius: number | null;
  grossLoad: number | null;
  /** this crane's hook block height (m), tip sheave to hook, as entered; null when not entered */
  blockHeight: number | null;
  /** the site policy's minimum clearance kept between block and tip (m), from the stored result */
  clearance: number | null;
  /**
   * The hook height the lift needs (m): required lift height + load height + rigging height (the
   * terms of the engine's block-clearance check). Null without a required lift height.
   */
  neededHookHeight: number | null;
}

function figuresOf(result: LiftResult, slot: number): { radius: number | null; grossLoad: number | null } {
  if (result.cranes) {
    const c = result.cranes[slot];
    if (!c) return { radius: null, grossLoad: null };
    const f: LiftFigures | null = c.figures;
    return { radius: f?.radius ?? null, grossLoad: c.grossLoad ?? f?.grossLoad ?? null };
  }
  if (slot !== 0) return { radius: null, grossLoad: null };
  return { radius: result.figures.radius, grossLoad: result.figures.grossLoad };
}

export function craneLiftFigures(inputs: unknown, result: LiftResult | null, slot: number): CraneLiftFigures {
  const fig = result ? figuresOf(result, slot) : { radius: null, grossLoad: null };
  const out: CraneLiftFigures = {
    slot,
    cranesInLift: result?.cranes?.length ?? 1,
    ...fig,
    blockHeight: null,
    clearance: result ? result.policy.minBlockClearanceM : null,
    neededHookHeight: null,
  };
  const parsed = LiftInput.safeParse(inputs);
  if (!parsed.success) return out;
  const input = upgradeLiftInput(parsed.data);
  if (input.multiCrane) out.cranesInLift = input.multiCrane.others.length + 1;
  const other = slot > 0 ? input.multiCrane?.others[slot - 1] : undefined;
  if (slot > 0 && !other) return out;
  const own = other ? { ...input, rigging: other.rigging, hookBlock: other.hookBlock } : input;
  out.blockHeight = si(own.hookBlock?.height) ?? null;
  const lift = si(input.requiredLiftHeight);
  if (lift !== undefined) out.neededHookHeight = lift + siOr(input.load.height, 0) + riggingHeight(own);
  return out;
}
