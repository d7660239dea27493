// Defect 6, as a property: for any input the schema accepts — every quantity anywhere between zero
// and its upper bound (QUANTITY_MAX_SI), in any unit — every number in the result is finite, and no
// check or item whose value is missing or non-finite reports pass.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkLift } from '@shared/engineering/evaluate';
import { TO_SI, WEIGHT_UNITS, LENGTH_UNITS } from '@shared/engineering/units';
import { QUANTITY_MAX_SI } from '@shared/schemas/lift-input';
import type { LiftResult } from '@shared/engineering/types';
import { badNumbers, outriggerLift, q } from './support';

/** A magnitude from 0 to the bound, log-spread, with the bound itself and zero included. */
const magnitude = (maxSI: number) =>
  fc.oneof(
    fc.constant(0),
    fc.constant(maxSI),
    fc.double({ min: -12, max: 0, noNaN: true }).map((e) => maxSI * 10 ** e),
  );

function passesWithoutValue(r: LiftResult): string[] {
  const out: string[] = [];
  for (const c of r.checks) {
    if (c.status === 'pass' && (c.value === null || !Number.isFinite(c.value))) {
      // a check passes only through its items; its headline may be informational
      if (!c.items.some((i) => i.status === 'pass' && i.value !== null)) out.push(c.id);
    }
    for (const i of c.items)
      if (i.status === 'pass' && (i.value === null || !Number.isFinite(i.value))) out.push(i.id);
  }
  return out;
}

describe('finite results for every accepted input', () => {
  it('when any quantity takes any value up to its bound, then every result number is finite and nothing passes without a value', () => {
    const W = QUANTITY_MAX_SI.weight;
    const L = QUANTITY_MAX_SI.length;
    fc.assert(
      fc.property(
        fc.record({
          load: magnitude(W),
          cw: magnitude(W),
          carrier: magnitude(W),
          arm: magnitude(L),
          radius: magnitude(L),
          boom: magnitude(L).map((x) => Math.max(x, 1e-3)),
          spread: magnitude(L).map((x) => Math.max(x, 1e-3)),
          mat: magnitude(L).map((x) => Math.max(x, 1e-3)),
          wind: magnitude(QUANTITY_MAX_SI.speed),
          area: magnitude(QUANTITY_MAX_SI.area),
          cap: magnitude(W),
          crawler: fc.boolean(),
          slew: fc.option(fc.double({ min: 0, max: 360, noNaN: true }), { nil: undefined }),
          wu: fc.constantFrom(...WEIGHT_UNITS),
          lu: fc.constantFrom(...LENGTH_UNITS),
        }),
        (v) => {
          const w = (si: number) => q(si / TO_SI[v.wu], v.wu);
          const len = (si: number) => q(si / TO_SI[v.lu], v.lu);
          const lift = outriggerLift();
          lift.load = { weight: w(v.load), windArea: q(v.area, 'm2') };
          lift.crane.boomLength = len(v.boom);
          lift.crane.radius = len(Math.min(v.radius, v.boom));
          lift.crane.counterweight = { weight: w(v.cw), cgBehindRotation: len(v.arm) };
          lift.crane.carrier = { weight: w(v.carrier), cgRearOfRotation: len(0) };
          if (v.slew === undefined) delete lift.crane.slewAngle;
          else lift.crane.slewAngle = q(v.slew, 'deg');
          if (v.crawler) {
            lift.crane.type = 'mobile_crawler';
            delete lift.crane.outriggers;
            lift.crane.tracks = { length: len(v.spread), shoeWidth: len(v.mat), gauge: len(v.spread) };
          } else
            lift.crane.outriggers = { longitudinalSpread: len(v.spread), transverseSpread: len(v.spread) };
          lift.chart.rows = [
            { radius: len(0), boomLength: len(v.boom), capacity: w(v.cap) },
            { radius: len(L), boomLength: len(v.boom), capacity: w(v.cap / 2) },
          ];
          lift.ground = { mat: { length: len(v.mat), width: len(v.mat) }, allowableBearing: q(200, 'kPa') };
          lift.environment = { windSpeed: q(v.wind, 'm/s'), boomWindArea: q(v.area, 'm2') };
          lift.reeving = { partsOfLine: 4, sheavesPassed: 5, bearing: 'plain', hoistLinePull: w(v.cap) };
          lift.personnel = { platformWeight: w(v.load / 10) };
          const out = checkLift(lift);
          fc.pre(out.ok);
          if (!out.ok) return;
          expect(badNumbers(out.result)).toEqual([]);
          expect(passesWithoutValue(out.result)).toEqual([]);
        },
      ),
      { numRuns: 400 },
    );
  });

  it('when the rigging (slings, a 3- or 4-leg bridle, a beam and its drops) takes any value up to its bounds, then every number is finite and nothing passes without a value', () => {
    const W = QUANTITY_MAX_SI.weight;
    const L = QUANTITY_MAX_SI.length;
    const signed = magnitude(L).chain((x) => fc.constantFrom(x, -x));
    const pick = fc.record({ x: signed, y: signed });
    fc.assert(
      fc.property(
        fc.record({
          load: magnitude(W),
          rating: magnitude(W).map((x) => Math.max(x, 1)),
          beamWeight: magnitude(W),
          beamRating: magnitude(W).map((x) => Math.max(x, 1)),
          hook: magnitude(L).map((x) => Math.max(x, 1e-3)),
          legs: fc.array(pick, { minLength: 3, maxLength: 4 }),
          drops: fc.array(pick, { minLength: 2, maxLength: 2 }),
          angle: fc.double({ min: 0.001, max: 90, noNaN: true }),
          choke: fc.double({ min: 0, max: 180, noNaN: true }),
          hitch: fc.constantFrom('vertical', 'choker', 'basket'),
          equalised: fc.boolean(),
          beam: fc.boolean(),
        }),
        (v) => {
          const t = (si: number) => q(si / TO_SI.t, 't');
          const m = (si: number) => q(si, 'm');
          const lift = outriggerLift();
          lift.load = { weight: t(v.load) };
          const bridle = {
            material: 'wire' as const,
            hitch: v.hitch,
            chokeAngle: q(v.choke, 'deg'),
            ratedLoadVertical: t(v.rating),
            hookHeight: m(v.hook),
            equalised: v.equalised,
            legs: v.legs.map((p) => ({ pickPoint: { x: m(p.x), y: m(p.y) } })),
          };
          const drops = {
            material: 'chain' as const,
            hitch: v.hitch,
            ratedLoadVertical: t(v.rating),
            legs: v.drops.map((p) => ({ angle: q(v.angle, 'deg'), pickPoint: { x: m(p.x), y: m(p.y) } })),
          };
          const twoLegs = {
            ...bridle,
            legs: [{ angle: q(v.angle, 'deg') }, { angle: q(90 - v.angle / 2, 'deg') }],
          };
          lift.rigging = v.beam
            ? {
                slings: twoLegs,
                beam: {
                  kind: 'lifting',
                  weight: t(v.beamWeight),
                  ratedLoad: t(v.beamRating),
                  slingsBelow: drops,
                },
                hardware: [{ wll: t(v.rating), carries: 'leg' }],
              }
            : { slings: bridle, hardware: [{ wll: t(v.rating) }] };
          const out = checkLift(lift);
          fc.pre(out.ok);
          if (!out.ok) return;
          expect(badNumbers(out.result)).toEqual([]);
          expect(passesWithoutValue(out.result)).toEqual([]);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('when a lift of 2 to 4 cranes takes any load, centre of gravity, pick points and stated shares up to their bounds, then every number is finite and nothing passes without a value', () => {
    const W = QUANTITY_MAX_SI.weight;
    const L = QUANTITY_MAX_SI.length;
    const signed = magnitude(L).chain((x) => fc.constantFrom(x, -x));
    const pick = fc.record({ x: signed, y: signed });
    fc.assert(
      fc.property(
        fc.record({
          load: magnitude(W),
          cg: pick,
          picks: fc.array(pick, { minLength: 2, maxLength: 4 }),
          shares: fc.array(magnitude(W), { minLength: 4, maxLength: 4 }),
          stated: fc.boolean(),
          fraction: fc.double({ min: 0, max: 0.5, noNaN: true }),
        }),
        (v) => {
          const t = (si: number) => q(si / TO_SI.t, 't');
          const at = (p: { x: number; y: number }) => ({ x: q(p.x, 'm'), y: q(p.y, 'm') });
          const lift = outriggerLift();
          lift.load = { weight: t(v.load) };
          const base = outriggerLift();
          lift.multiCrane = {
            loadCg: at(v.cg),
            cgOffsetFraction: v.fraction,
            lead: { pickPoint: at(v.picks[0]), ...(v.stated ? { statedShare: t(v.shares[0]) } : {}) },
            others: v.picks.slice(1).map((p, i) => ({
              crane: base.crane,
              chart: base.chart,
              hookBlock: { weight: q(0.3, 't') },
              pickPoint: at(p),
              ...(v.stated ? { statedShare: t(v.shares[i + 1]) } : {}),
            })),
          };
          const out = checkLift(lift);
          fc.pre(out.ok);
          if (!out.ok) return;
          expect(badNumbers(out.result)).toEqual([]);
          expect(passesWithoutValue(out.result)).toEqual([]);
          for (const c of out.result.cranes ?? [])
            expect(passesWithoutValue({ ...out.result, checks: c.checks })).toEqual([]);
        },
      ),
      { numRuns: 200 },
    );
  });
});
