// Defect 3: a value exactly at a limit must not fail by rounding, and the verdict at a limit must
// not depend on the unit the contractor typed. Limits read in OSHA 29 CFR 1926.1408 Table A
// (500–750 kV: 35 ft) and the default 20 mph wind limit (common practice, no source).
import { describe, expect, it } from 'vitest';
import { atLeast, atMost, REL_TOL } from '@shared/engineering/compare';
import { statusMin } from '@shared/engineering/context';
import { DEFAULT_POLICY } from '@shared/schemas/site-policy';
import { findItem, outriggerLift, q, run } from './support';

describe('comparison at a limit (one helper, SI, stated relative tolerance)', () => {
  it('when a ratio of exactly 1.5 is computed as 1.4999999999999998, then it reaches the 1.5 minimum', () => {
    expect(0.1 * 3 * 5).toBe(1.5000000000000002);
    expect(1.4999999999999998).toBeLessThan(1.5);
    expect(atLeast(1.4999999999999998, 1.5)).toBe(true);
    expect(statusMin(1.4999999999999998, 1.5, DEFAULT_POLICY)).toBe('caution');
  });
  it('when a value is past its limit by more than the stated tolerance, then it breaks the limit', () => {
    expect(REL_TOL).toBe(1e-9);
    expect(atMost(1 + 1e-8, 1)).toBe(false);
    expect(atLeast(1 - 1e-8, 1)).toBe(false);
    expect(atMost(Number.NaN, 1)).toBe(false);
    expect(atLeast(Number.POSITIVE_INFINITY, 1)).toBe(true);
  });
  it('when a 600 kV line is exactly 35 ft away, typed in ft or as 10.668 m, then both verdicts are the same', () => {
    const at = (distance: { value: number; unit: string }) => {
      const l = outriggerLift();
      l.environment = { powerLines: [{ voltage: q(600, 'kV'), distance: distance as never }] };
      return findItem(run(l), 'power-line.clearance-1').status;
    };
    expect(at(q(35, 'ft'))).toBe('caution');
    expect(at(q(10.668, 'm'))).toBe('caution');
    expect(at(q(420, 'in'))).toBe('caution');
  });
  it('when the wind is exactly 20 mph, typed as 20 mph or 32.18688 km/h, then both are at the limit, not over', () => {
    const at = (speed: { value: number; unit: string }) => {
      const l = outriggerLift();
      l.environment = { windSpeed: speed as never };
      return findItem(run(l), 'wind.speed').status;
    };
    expect(at(q(20, 'mph'))).toBe('caution');
    expect(at(q(32.18688, 'km/h'))).toBe('caution');
    expect(at(q(8.9408, 'm/s'))).toBe('caution');
  });
});
