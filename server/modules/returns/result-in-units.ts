// The check result in the unit system of the document. The engine keeps its values in SI, but
// the words it writes (messages, fixes, the reasons a lift is critical, discrepancies) carry
// quantities in the system it ran in, which is metric for the check run. For a document in the
// other system the same engine runs again on the same inputs and policy, and its words are used
// when its values are the stored ones exactly (same engine version, same figures and statuses);
// otherwise the stored result is printed as it is.
import { evaluateLift } from '@shared/engineering/evaluate';
import { readStoredResult } from '@shared/engineering/stored-result';
import type { LiftResult } from '@shared/engineering/types';
import type { UnitSystem } from '@shared/schemas/common';
import { LiftInput } from '@shared/schemas/lift-input';

function valuesOf(r: LiftResult) {
  return JSON.stringify([
    r.overallStatus,
    r.checks.map((c) => [
      c.id,
      c.status,
      c.value,
      c.limit,
      c.items.map((i) => [i.id, i.status, i.value, i.limit]),
    ]),
    r.discrepancies.map((d) => [d.status, d.stated, d.computed]),
    r.critical.isCritical,
    r.critical.triggers.map((t) => t.id),
  ]);
}

export function resultInUnits(
  revision: { inputs: Record<string, unknown>; results: unknown },
  system: UnitSystem,
): LiftResult | null {
  const stored = readStoredResult(revision.results);
  if (!stored || stored.units === system) return stored;
  const parsed = LiftInput.safeParse(revision.inputs);
  if (!parsed.success) return stored;
  const again = evaluateLift(parsed.data, stored.policy, { units: system });
  if (again.engineVersion !== stored.engineVersion || valuesOf(again) !== valuesOf(stored)) return stored;
  return again;
}
