// Property-based tests (fast-check): physical monotonicity and unit-system independence.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { tippingBalance } from '@shared/engineering/evaluate';
import { twoLegTensions } from '@shared/engineering/checks/rigging';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { TO_SI, type AnyUnit } from '@shared/engineering/units';
import { outriggerLift, q, run } from './support';

describe('stability', () => {
  it('when the counterweight moves further behind the centre of rotation, then the ratio about the loaded tipping line never falls', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 8, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 359, noNaN: true }),
        fc.double({ min: 1, max: 50, noNaN: true }),
        fc.double({ min: 3, max: 18, noNaN: true }),
        (arm, extra, slew, load, radius) => {
          const a = outriggerLift();
          a.load = { weight: q(load, 't') };
          a.crane.radius = q(radius, 'm');
          a.crane.counterweight!.cgBehindRotation = q(arm, 'm');
          const b = structuredClone(a);
          b.crane.counterweight!.cgBehindRotation = q(arm + extra, 'm');
          const ba = tippingBalance(LiftInput.parse(a), slew)!;
          const bb = tippingBalance(LiftInput.parse(b), slew)!;
          // the edge the load tips about: the one with the load beyond it (largest overturning)
          let e = 0;
          for (let i = 1; i < ba.length; i++) if (ba[i].overturning > ba[e].overturning) e = i;
          const ux = Math.cos((slew * Math.PI) / 180);
          const uy = Math.sin((slew * Math.PI) / 180);
          const n = [
            [1, 0],
            [-1, 0],
            [0, 1],
            [0, -1],
          ][e];
          // only meaningful when the counterweight moves away from that edge (boom points toward it)
          fc.pre(n[0] * ux + n[1] * uy > 1e-9);
          expect(bb[e].ratio).toBeGreaterThanOrEqual(ba[e].ratio * (1 - 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('rigging', () => {
  it('when a symmetric two-leg sling is flattened, then its tension never falls', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 90, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.double({ min: 0.1, max: 100, noNaN: true }),
        (deg, flatten, t) => {
          const steep = outriggerLift();
          steep.load = { weight: q(t, 't') };
          steep.rigging = {
            slings: {
              material: 'wire',
              hitch: 'vertical',
              ratedLoadVertical: q(10, 't'),
              legs: [{ angle: q(deg, 'deg') }, { angle: q(deg, 'deg') }],
            },
          };
          const flat = structuredClone(steep);
          const lower = Math.max(0.5, deg - flatten);
          flat.rigging!.slings!.legs = [{ angle: q(lower, 'deg') }, { angle: q(lower, 'deg') }];
          expect(run(flat).figures.maxSlingTension!).toBeGreaterThanOrEqual(
            run(steep).figures.maxSlingTension! * (1 - 1e-12),
          );
        },
      ),
      { numRuns: 200 },
    );
  });

  it('when legs given by length are spread further apart (same lengths), then no leg tension falls', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 10, noNaN: true }),
        fc.double({ min: 0, max: 0.9, noNaN: true }),
        fc.double({ min: 0, max: 0.09, noNaN: true }),
        (len, frac, more) => {
          const mk = (f: number): LiftInputRaw => {
            const l = outriggerLift();
            l.rigging = {
              slings: {
                material: 'chain',
                hitch: 'vertical',
                ratedLoadVertical: q(10, 't'),
                legs: [
                  { length: q(len, 'm'), horizontalDistance: q(len * f, 'm') },
                  { length: q(len, 'm'), horizontalDistance: q(len * f, 'm') },
                ],
              },
            };
            return l;
          };
          expect(run(mk(frac + more)).figures.maxSlingTension!).toBeGreaterThanOrEqual(
            run(mk(frac)).figures.maxSlingTension! * (1 - 1e-12),
          );
        },
      ),
      { numRuns: 200 },
    );
  });

  it('when the two leg tensions are resolved, then they hold the load vertically and balance horizontally', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 20, max: 89, noNaN: true }),
        fc.double({ min: 20, max: 89, noNaN: true }),
        (a, b) => {
          const [ta, tb] = twoLegTensions(1000, a, b);
          const r = Math.PI / 180;
          expect(ta * Math.sin(a * r) + tb * Math.sin(b * r)).toBeCloseTo(1000, 6);
          expect(ta * Math.cos(a * r)).toBeCloseTo(tb * Math.cos(b * r), 6);
        },
      ),
    );
  });
});

describe('chart', () => {
  const chartArb = fc
    .array(
      fc.tuple(
        fc.double({ min: 0.5, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 0.3, noNaN: true }),
        fc.boolean(),
      ),
      { minLength: 2, maxLength: 10 },
    )
    .map((steps) => {
      // a chart falling with radius (as load charts do along a boom length)
      let r = 3;
      let c = 80;
      return steps.map(([dr, drop, interp]) => {
        r += dr;
        c *= 1 - drop;
        return {
          radius: q(r, 'm'),
          boomLength: q(20, 'm'),
          capacity: q(c, 't'),
          interpolationAllowed: interp,
        };
      });
    });

  it('when the radius grows, then the chart capacity used by the check never rises', () => {
    fc.assert(
      fc.property(
        chartArb,
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (rows, u1, u2) => {
          const lo = rows[0].radius.value;
          const hi = rows[rows.length - 1].radius.value;
          const [ra, rb] = [lo + (hi - lo) * Math.min(u1, u2), lo + (hi - lo) * Math.max(u1, u2)];
          const mk = (r: number) => {
            const l = outriggerLift();
            l.chart.rows = rows;
            l.crane.radius = q(r, 'm');
            return run(l).figures.chartCapacity!;
          };
          expect(mk(rb)).toBeLessThanOrEqual(mk(ra) * (1 + 1e-12));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('unit systems', () => {
  const IMPERIAL: Partial<Record<AnyUnit, AnyUnit>> = {
    m: 'ft',
    t: 'kip',
    kg: 'lb',
    kPa: 'psf',
    'm/s': 'mph',
    m2: 'ft2',
    kN: 'kip',
    t_m: 'kip_ft',
  };
  function toImperial(v: unknown): unknown {
    if (Array.isArray(v)) return v.map(toImperial);
    if (v && typeof v === 'object') {
      const o = v as Record<string, unknown>;
      if (typeof o.value === 'number' && typeof o.unit === 'string' && IMPERIAL[o.unit as AnyUnit]) {
        const to = IMPERIAL[o.unit as AnyUnit]!;
        return { value: (o.value * TO_SI[o.unit as AnyUnit]) / TO_SI[to], unit: to };
      }
      return Object.fromEntries(Object.entries(o).map(([k, x]) => [k, toImperial(x)]));
    }
    return v;
  }
  function numbers(v: unknown, out: number[] = []): number[] {
    if (typeof v === 'number') out.push(v);
    else if (Array.isArray(v)) v.forEach((x) => numbers(x, out));
    else if (v && typeof v === 'object')
      for (const [k, x] of Object.entries(v)) if (k !== 'formula' && k !== 'policy') numbers(x, out);
    return out;
  }

  it('when the same lift is entered in metric and in imperial units, then every SI result agrees within 1e-9', () => {
    fc.assert(
      fc.property(
        fc.record({
          load: fc.double({ min: 0.1, max: 40, noNaN: true }),
          radius: fc.double({ min: 8, max: 14, noNaN: true }),
          slew: fc.option(fc.double({ min: 0, max: 360, noNaN: true }), { nil: undefined }),
          wind: fc.double({ min: 0, max: 20, noNaN: true }),
          cw: fc.double({ min: 1, max: 40, noNaN: true }),
          leg: fc.double({ min: 2, max: 8, noNaN: true }),
          mat: fc.double({ min: 0.5, max: 3, noNaN: true }),
        }),
        (v) => {
          const m = outriggerLift();
          m.load = { weight: q(v.load, 't'), windArea: q(4, 'm2') };
          m.crane.radius = q(v.radius, 'm');
          m.crane.slewAngle = v.slew === undefined ? undefined : q(v.slew, 'deg');
          m.crane.counterweight!.weight = q(v.cw, 't');
          m.environment = {
            windSpeed: q(v.wind, 'm/s'),
            powerLines: [{ voltage: q(66, 'kV'), distance: q(v.leg, 'm') }],
          };
          m.ground = {
            mat: { length: q(v.mat, 'm'), width: q(v.mat, 'm') },
            allowableBearing: q(250, 'kPa'),
          };
          m.rigging = {
            slings: {
              material: 'wire',
              hitch: 'basket',
              ratedLoadVertical: q(9, 't'),
              legs: [{ length: q(v.leg, 'm'), horizontalDistance: q(1.5, 'm') }, { angle: q(55, 'deg') }],
            },
          };
          m.reeving = { partsOfLine: 4, sheavesPassed: 5, bearing: 'plain', hoistLinePull: q(80, 'kN') };
          m.stated = { grossLoad: q(v.load, 't'), overturningMoment: q(50, 't_m') };
          const imp = toImperial(m) as LiftInputRaw;
          expect(imp.crane.radius!.unit).toBe('ft');
          const a = numbers({
            checks: run(m).checks,
            figures: run(m).figures,
            fixes: run(m).fixes,
            d: run(m).discrepancies,
          });
          const b = numbers({
            checks: run(imp).checks,
            figures: run(imp).figures,
            fixes: run(imp).fixes,
            d: run(imp).discrepancies,
          });
          expect(b.length).toBe(a.length);
          for (let i = 0; i < a.length; i++) {
            const scale = Math.max(Math.abs(a[i]), Math.abs(b[i]), 1e-300);
            expect(Math.abs(a[i] - b[i]) / scale).toBeLessThan(1e-9);
          }
        },
      ),
      { numRuns: 150 },
    );
  });
});
