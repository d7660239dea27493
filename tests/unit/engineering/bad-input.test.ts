// Bad input: every problem is a zod issue naming the field and its limit (or, for a radius outside
// the chart, a clear failed status), never an exception or a NaN in the results.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkLift } from '@shared/engineering/evaluate';
import { badNumbers, checkOf, findItem, outriggerLift, q, run } from './support';

function issues(raw: unknown) {
  const out = checkLift(raw);
  if (out.ok) throw new Error('expected invalid input');
  return out.issues;
}

describe('bad input', () => {
  it('when the load weight is negative, then the issue names load.weight and the limit 0', () => {
    const lift = outriggerLift();
    lift.load.weight = q(-1, 't');
    const is = issues(lift);
    expect(is).toHaveLength(1);
    expect(is[0].path).toBe('load.weight.value');
    expect(is[0].message).toMatch(/load\.weight must be 0 or more/);
  });

  it('when the boom angle is 95°, then the issue says it must be between 0 and 90 degrees', () => {
    const lift = outriggerLift();
    lift.crane.boomAngle = q(95, 'deg');
    const is = issues(lift);
    expect(is[0].path).toBe('crane.boomAngle.value');
    expect(is[0].message).toBe('crane.boomAngle (from horizontal) must be between 0 and 90 degrees');
  });

  it('when a sling angle is negative, then the issue names the sling leg angle and 0..90', () => {
    const lift = outriggerLift();
    lift.rigging = {
      slings: {
        material: 'wire',
        hitch: 'vertical',
        ratedLoadVertical: q(5, 't'),
        legs: [{ angle: q(-5, 'deg') }],
      },
    };
    const is = issues(lift);
    expect(is[0].path).toBe('rigging.slings.legs.0.angle.value');
    expect(is[0].message).toMatch(/legs\[\]\.angle.*between 0 and 90 degrees/);
  });

  it.each([NaN, Infinity, -Infinity])(
    'when a weight is %s, then the issue says it must be a finite number',
    (v) => {
      const lift = outriggerLift();
      lift.crane.counterweight!.weight = q(v, 't');
      const is = issues(lift);
      expect(is[0].path).toBe('crane.counterweight.weight.value');
      expect(is[0].message).toBe('crane.counterweight.weight must be a finite number');
    },
  );

  it('when a unit is unknown, then the issue names the field and lists the units it accepts', () => {
    const lift = outriggerLift() as unknown as { crane: { boomLength: { unit: string } } };
    lift.crane.boomLength.unit = 'furlong';
    const is = issues(lift);
    expect(is[0].path).toBe('crane.boomLength.unit');
    expect(is[0].message).toBe('crane.boomLength: unit must be one of m, mm, ft, in');
  });

  it('when the chart has no rows or is missing, then the issue names chart.rows / chart', () => {
    const lift = outriggerLift();
    lift.chart.rows = [];
    expect(issues(lift)[0]).toEqual({
      path: 'chart.rows',
      message: 'chart.rows must list at least 1 row of the load chart',
    });
    const { chart: _c, ...noChart } = outriggerLift();
    expect(issues(noChart)[0].path).toBe('chart');
    expect(issues(noChart)[0].message).toMatch(/chart is required/);
  });

  it('when neither boom angle nor radius is given, then the issue says one is required', () => {
    const lift = outriggerLift();
    delete lift.crane.radius;
    expect(issues(lift)[0].message).toMatch(/crane\.boomAngle or crane\.radius is required/);
  });

  it('when the policy is out of range, then the issue is prefixed with policy.', () => {
    const out = checkLift(outriggerLift(), { minStabilityRatio: 0.5 });
    expect(out.ok).toBe(false);
    if (!out.ok)
      expect(out.issues[0]).toEqual({
        path: 'policy.minStabilityRatio',
        message: 'minStabilityRatio must be between 1 and 5',
      });
  });

  it('when the input is not an object at all, then there are issues and no exception', () => {
    for (const raw of [null, 42, 'lift', [], {}]) expect(checkLift(raw).ok).toBe(false);
  });

  it('when the radius is beyond the last chart row, then capacity fails "outside chart" without NaN', () => {
    const lift = outriggerLift();
    lift.crane.radius = q(15, 'm');
    const r = run(lift);
    const c = checkOf(r, 'capacity');
    expect(c.status).toBe('fail');
    expect(c.message).toMatch(/outside chart/);
    expect(c.value).toBeNull();
    expect(badNumbers(r)).toEqual([]);
  });

  it('when the boom is longer than any listed, then capacity fails "outside chart"', () => {
    const lift = outriggerLift();
    lift.crane.boomLength = q(25, 'm');
    expect(findItem(run(lift), 'capacity.use').message).toMatch(/boom length longer than the longest listed/);
  });

  it('when the radius cannot be reached by the boom, then geometry fails and nothing is NaN', () => {
    const lift = outriggerLift();
    lift.crane.radius = q(40, 'm');
    const r = run(lift);
    expect(findItem(r, 'geometry.radius').status).toBe('fail');
    expect(badNumbers(r)).toEqual([]);
  });

  it('when random numbers are thrown at every weight and length, then evaluation never throws nor yields NaN', () => {
    fc.assert(
      fc.property(
        fc.record({
          load: fc.double({ min: 0, max: 1e6, noNaN: true }),
          cw: fc.double({ min: 0, max: 1e6, noNaN: true }),
          arm: fc.double({ min: -20, max: 20, noNaN: true }),
          radius: fc.double({ min: 0, max: 60, noNaN: true }),
          slew: fc.double({ min: 0, max: 360, noNaN: true }),
          mat: fc.double({ min: 0.01, max: 5, noNaN: true }),
          wind: fc.double({ min: 0, max: 60, noNaN: true }),
          legDeg: fc.double({ min: 0, max: 90, noNaN: true }),
          block: fc.double({ min: 0, max: 1e4, noNaN: true }),
        }),
        (v) => {
          const lift = outriggerLift();
          lift.load = { weight: q(v.load, 'kg'), windArea: q(v.mat, 'm2') };
          lift.crane.counterweight = { weight: q(v.cw, 'kg'), cgBehindRotation: q(v.arm, 'm') };
          lift.crane.radius = q(v.radius, 'm');
          lift.crane.slewAngle = q(v.slew, 'deg');
          lift.hookBlock = { weight: q(v.block, 'kg') };
          lift.ground = {
            mat: { length: q(v.mat, 'm'), width: q(v.mat, 'm') },
            allowableBearing: q(200, 'kPa'),
          };
          lift.environment = {
            windSpeed: q(v.wind, 'm/s'),
            powerLines: [{ voltage: q(v.wind * 30 + 0.1, 'kV'), distance: q(v.radius, 'm') }],
          };
          lift.rigging = {
            slings: {
              material: 'synthetic',
              hitch: 'choker',
              ratedLoadVertical: q(1, 't'),
              legs: [{ angle: q(v.legDeg, 'deg') }, { angle: q(90 - v.legDeg / 2, 'deg') }],
            },
          };
          lift.reeving = { partsOfLine: 3, sheavesPassed: 3, bearing: 'plain' };
          const out = checkLift(lift);
          expect(out.ok).toBe(true);
          if (out.ok) expect(badNumbers(out.result)).toEqual([]);
        },
      ),
      { numRuns: 300 },
    );
  });
});
