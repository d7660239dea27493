// Defect 3, as a property: every verdict is the same whichever unit each input was typed in, and a
// value exactly at a limit is at the limit (caution, never fail) in every unit. Each scenario is
// typed once; fast-check then re-types every quantity, each in any unit of its kind.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkLift } from '@shared/engineering/evaluate';
import {
  AREA_UNITS,
  LENGTH_UNITS,
  MOMENT_UNITS,
  PRESSURE_UNITS,
  SPEED_UNITS,
  TO_SI,
  VOLTAGE_UNITS,
  WEIGHT_UNITS,
  type AnyUnit,
} from '@shared/engineering/units';
import type { LiftInputRaw } from '@shared/schemas/lift-input';
import type { SitePolicyInput } from '@shared/schemas/site-policy';
import type { LiftResult } from '@shared/engineering/types';
import { example, exampleNames, findItem, outriggerLift, q } from './support';

const KINDS: readonly (readonly string[])[] = [
  LENGTH_UNITS,
  WEIGHT_UNITS,
  PRESSURE_UNITS,
  SPEED_UNITS,
  AREA_UNITS,
  VOLTAGE_UNITS,
  MOMENT_UNITS,
];

/** Re-type every { value, unit } in the input, choosing each new unit from `picks` in turn. */
function retype(v: unknown, picks: number[], at = { i: 0 }): unknown {
  if (Array.isArray(v)) return v.map((x) => retype(x, picks, at));
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    if (typeof o.value === 'number' && typeof o.unit === 'string') {
      const kind = KINDS.find((k) => k.includes(o.unit as string));
      if (!kind) return o;
      const u = kind[picks[at.i++ % picks.length] % kind.length] as AnyUnit;
      return { value: (o.value * TO_SI[o.unit as AnyUnit]) / TO_SI[u], unit: u };
    }
    return Object.fromEntries(Object.entries(o).map(([k, x]) => [k, retype(x, picks, at)]));
  }
  return v;
}

function evaluate(raw: unknown, policy?: SitePolicyInput): LiftResult {
  const out = checkLift(raw, policy);
  if (!out.ok) throw new Error(out.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  return out.result;
}

const verdicts = (r: LiftResult) => [
  r.overallStatus,
  ...r.checks.flatMap((c) => [`${c.id}=${c.status}`, ...c.items.map((i) => `${i.id}=${i.status}`)]),
  ...r.discrepancies.map((d) => `${d.figure}=${d.status}`),
];

interface Scenario {
  name: string;
  input: LiftInputRaw;
  policy?: SitePolicyInput;
  /** the item that sits exactly at its limit */
  atLimit?: string;
}

/** A lift with one value set exactly at its limit from a first evaluation. */
function atLimitScenarios(): Scenario[] {
  const out: Scenario[] = [];
  for (const [kV, ft] of [
    [50, 10],
    [200, 15],
    [600, 35],
  ]) {
    const l = outriggerLift();
    l.environment = { powerLines: [{ voltage: q(kV, 'kV'), distance: q(ft, 'ft') }] };
    out.push({ name: `power line ${kV} kV at ${ft} ft`, input: l, atLimit: 'power-line.clearance-1' });
  }
  const wind = outriggerLift();
  wind.environment = { windSpeed: q(20, 'mph') };
  out.push({ name: 'wind at 20 mph', input: wind, atLimit: 'wind.speed' });
  const cap = outriggerLift();
  cap.load = { weight: q(24 * 0.85 - 0.5, 't') };
  out.push({ name: 'chart use at 85%', input: cap, atLimit: 'capacity.use' });
  const base = outriggerLift();
  base.ground = { mat: { length: q(1.2, 'm'), width: q(1.2, 'm') }, allowableBearing: q(1, 'kPa') };
  base.reeving = { partsOfLine: 4, sheavesPassed: 5, bearing: 'plain', hoistLinePull: q(1, 't') };
  base.rigging = {
    slings: {
      material: 'wire',
      hitch: 'vertical',
      ratedLoadVertical: q(1, 't'),
      legs: [{ angle: q(55, 'deg') }, { angle: q(65, 'deg') }],
    },
  };
  base.requiredLiftHeight = q(5, 'm');
  const first = evaluate(base);
  const p = findItem(first, 'ground-bearing.pressure').value!;
  const pull = findItem(first, 'reeving.line-pull').value!;
  const T = Math.max(findItem(first, 'rigging.leg-1').value!, findItem(first, 'rigging.leg-2').value!);
  const ratio = findItem(first, 'stability.ratio').value!;
  const clearance = findItem(first, 'geometry.block-clearance').value!;
  const backward = findItem(first, 'stability.backward').value!;
  const set = (f: (l: LiftInputRaw) => void) => {
    const l = structuredClone(base);
    f(l);
    return l;
  };
  out.push(
    {
      name: 'bearing at allowable',
      input: set((l) => (l.ground!.allowableBearing = q(p, 'Pa'))),
      atLimit: 'ground-bearing.pressure',
    },
    {
      name: 'line pull at hoist rating',
      input: set((l) => (l.reeving!.hoistLinePull = q(pull, 'N'))),
      atLimit: 'reeving.line-pull',
    },
    {
      name: 'sling at its rating',
      input: set((l) => (l.rigging!.slings!.ratedLoadVertical = q(T, 'N'))),
      atLimit: T === findItem(first, 'rigging.leg-1').value ? 'rigging.leg-1' : 'rigging.leg-2',
    },
    {
      name: 'stability ratio at the minimum',
      input: base,
      policy: { minStabilityRatio: ratio },
      atLimit: 'stability.ratio',
    },
    {
      name: 'block clearance at the minimum',
      input: base,
      policy: { minBlockClearanceM: clearance },
      atLimit: 'geometry.block-clearance',
    },
    {
      name: 'boom-side share at the minimum',
      input: base,
      policy: { backwardBoomSideSupportPct: backward },
      atLimit: 'stability.backward',
    },
  );
  return out;
}

describe('unit invariance of every verdict', () => {
  const scenarios: Scenario[] = [
    ...exampleNames().map((n) => ({ name: n, input: example(n) })),
    ...atLimitScenarios(),
  ];
  it('when the at-limit scenarios are typed in SI, then each limit item is at its limit (caution)', () => {
    for (const s of scenarios)
      if (s.atLimit)
        expect([s.name, findItem(evaluate(s.input, s.policy), s.atLimit).status]).toEqual([
          s.name,
          'caution',
        ]);
  });
  it.each(scenarios.map((s) => [s.name, s] as const))(
    'when %s is re-typed in any mix of units, then every verdict is unchanged',
    (_name, s) => {
      const expected = verdicts(evaluate(s.input, s.policy));
      fc.assert(
        fc.property(fc.array(fc.nat({ max: 6 }), { minLength: 1, maxLength: 40 }), (picks) => {
          const r = evaluate(retype(s.input, picks), s.policy);
          expect(verdicts(r)).toEqual(expected);
          if (s.atLimit) expect(findItem(r, s.atLimit).status).toBe('caution');
        }),
        { numRuns: 40 },
      );
    },
  );
});
