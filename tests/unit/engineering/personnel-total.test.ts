// Defect 8: the personnel check compares everything on the hook with the personnel share of the chart
// (OSHA 29 CFR 1926.1431, read: platform, rigging and occupants ≤ 50% of rated capacity; ASME B30.5,
// read: block, hook and rigging count as part of the load), as the capacity check does.
import { describe, expect, it } from 'vitest';
import { findItem, G, outriggerLift, q, run } from './support';

describe('personnel platform load', () => {
  it('when a hook block, load-line allowance and chart deductions are listed, then they count in the total', () => {
    const l = outriggerLift();
    l.personnel = {
      platformWeight: q(900, 'kg'),
      riggingWeight: q(60, 'kg'),
      occupants: 2,
      occupantWeight: q(100, 'kg'),
      toolsWeight: q(40, 'kg'),
    };
    l.hookBlock = { weight: q(500, 'kg') };
    l.loadLineAllowance = q(50, 'kg');
    l.chartDeductions = [{ name: 'jib stowed', weight: q(300, 'kg') }];
    const it = findItem(run(l), 'personnel.load');
    // 900 + 60 + 2 × 100 + 40 + 500 + 50 + 300 = 2050 kg, against 50% of 24 t = 12 t
    expect(it.value!).toBeCloseTo(2050 * G, 6);
    expect(it.limit!).toBeCloseTo(12000 * G, 6);
  });
});
