// Defect 5: parts of line and the sheaves the rope passes are checked against each other. With N
// parts the rope turns over a sheave between each pair of parts, so at least N − 1 sheaves (statics
// of the reeving); with them the lead-line factor is never below the frictionless 1/N.
// Sheave friction: Wire Rope Users Manual 4th ed. (read): K = 1.09 plain, 1.04 roller.
import { describe, expect, it } from 'vitest';
import { leadLineFactor } from '@shared/engineering/checks/reeving';
import { LiftInput } from '@shared/schemas/lift-input';
import { findItem, G, outriggerLift, run } from './support';

describe('reeving', () => {
  it('when 4 parts of line pass 0 sheaves, then the input is refused naming both fields', () => {
    const l = outriggerLift();
    l.reeving = { partsOfLine: 4, sheavesPassed: 0, bearing: 'plain' };
    const r = LiftInput.safeParse(l);
    expect(r.success).toBe(false);
    if (r.success) return;
    expect(r.error.issues.map((i) => i.message).join('\n')).toMatch(
      /reeving\.sheavesPassed must be at least reeving\.partsOfLine − 1 \(3\)/,
    );
  });
  it('when N − 1 or more sheaves are passed, then the lead-line factor is at least 1/N', () => {
    for (const K of [1.04, 1.09])
      for (let N = 1; N <= 12; N++)
        for (let S = N - 1; S <= N + 4; S++) expect(leadLineFactor(K, N, S)).toBeGreaterThanOrEqual(1 / N);
  });
  it('when a sheave efficiency is entered with its source, then K = 1/efficiency is used and the source shown', () => {
    const l = outriggerLift();
    l.reeving = {
      partsOfLine: 4,
      sheavesPassed: 4,
      bearing: 'roller',
      sheaveEfficiency: 0.98,
      sheaveEfficiencySource: 'sheave maker data sheet (invented)',
    };
    const it = findItem(run(l), 'reeving.line-pull');
    const K = 1 / 0.98;
    const factor = (K ** 4 * (K - 1)) / (K ** 4 - 1);
    expect(it.value!).toBeCloseTo(10.5 * 1000 * G * factor, 6);
    expect(it.source.text).toMatch(/sheave maker data sheet/);
  });
  it('when an efficiency is entered without its source, then the input names the missing source', () => {
    const l = outriggerLift();
    l.reeving = { partsOfLine: 2, sheavesPassed: 2, bearing: 'plain', sheaveEfficiency: 0.95 };
    const r = LiftInput.safeParse(l);
    expect(r.success).toBe(false);
    if (!r.success) expect(r.error.issues[0].message).toMatch(/reeving\.sheaveEfficiencySource is required/);
  });
});
