// A spreader or lifting beam: its weight and its drops hang from the hook (gross load), the drops
// share the load by the centre of gravity between their pick points, the beam is checked against
// its rated load, and the slings above carry the beam and everything under it. Worked by hand.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { example, G, outriggerLift, q } from './support';

const above = {
  material: 'wire',
  hitch: 'vertical',
  ratedLoadVertical: q(10, 't'),
  legs: [{ angle: q(60, 'deg') }, { angle: q(60, 'deg') }],
};
const drops = {
  material: 'wire',
  hitch: 'vertical',
  ratedLoadVertical: q(5, 't'),
  weight: q(0.1, 't'),
  legs: [{ pickPoint: { x: q(-2, 'm'), y: q(0, 'm') } }, { pickPoint: { x: q(3, 'm'), y: q(0, 'm') } }],
};
function withBeam(beam: object | null): LiftInputRaw {
  return {
    ...outriggerLift(),
    load: { weight: q(10, 't') },
    rigging: { slings: above, ...(beam ? { beam } : {}) },
  } as LiftInputRaw;
}
const beam = { kind: 'spreader', weight: q(0.8, 't'), ratedLoad: q(12, 't'), slingsBelow: drops };
const result = (raw: LiftInputRaw) => evaluateLift(LiftInput.parse(raw));
const item = (raw: LiftInputRaw, id: string) =>
  result(raw)
    .checks.find((c) => c.id === 'rigging')!
    .items.find((i) => i.id === id)!;
const tonnes = (n: number) => n / G / 1000;

describe('spreader and lifting beams', () => {
  it('when a 10 t load hangs from a 0.8 t spreader on two drops, then each sling set is checked for what it carries', () => {
    const raw = withBeam(beam);
    // drops at 2 m and 3 m either side of the centre of gravity, 5 m apart, vertical:
    // V1 = 10 × 3/5 = 6 t, V2 = 10 × 2/5 = 4 t; the 6 t drop is over its 5 t rating
    expect(tonnes(item(raw, 'rigging.below.leg-1').value!)).toBeCloseTo(6, 9);
    expect(tonnes(item(raw, 'rigging.below.leg-2').value!)).toBeCloseTo(4, 9);
    expect(item(raw, 'rigging.below.leg-1').status).toBe('fail');
    // the beam carries the load and its drops: 10 + 0.1 = 10.1 t against 12 t
    expect(tonnes(item(raw, 'rigging.beam').value!)).toBeCloseTo(10.1, 9);
    expect(item(raw, 'rigging.beam').status).not.toBe('fail');
    // the slings above carry 10.1 + 0.8 = 10.9 t on two legs at 60°: T = 10.9 / (2 sin 60°) = 6.2931 t
    expect(tonnes(item(raw, 'rigging.leg-1').value!)).toBeCloseTo(6.2931, 4);
  });

  it('when the beam is added, then the gross load grows by the beam and its drops (0.9 t)', () => {
    const gross = (raw: LiftInputRaw) => result(raw).figures.grossLoad;
    expect(tonnes(gross(withBeam(beam)) - gross(withBeam(null)))).toBeCloseTo(0.9, 9);
  });

  it('when the load outweighs the beam’s rating, then the beam fails', () => {
    const raw = withBeam({ ...beam, ratedLoad: q(10, 't') });
    expect(item(raw, 'rigging.beam').status).toBe('fail');
  });

  it('when two drops have no pick points, then the input is refused naming the field', () => {
    const r = LiftInput.safeParse(
      withBeam({
        ...beam,
        slingsBelow: { ...drops, legs: [{ angle: q(90, 'deg') }, { angle: q(90, 'deg') }] },
      }),
    );
    expect(r.success).toBe(false);
    expect(JSON.stringify(r.error!.issues)).toContain('rigging.beam.slingsBelow.legs[].pickPoint');
  });

  it('when a drop gives its length but neither its horizontal distance nor its angle, then the input is refused naming the field', () => {
    const legs = [{ length: q(3, 'm'), pickPoint: drops.legs[0].pickPoint }, drops.legs[1]];
    const r = LiftInput.safeParse(withBeam({ ...beam, slingsBelow: { ...drops, legs } }));
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join('.'))).toContain(
      'rigging.beam.slingsBelow.legs.0.horizontalDistance',
    );
  });

  it('when a drop is given by length 5 m and horizontal distance 3 m, then its angle is acos(3/5) = 53.13° and T = V ÷ 0.8', () => {
    const legs = [{ ...drops.legs[0], length: q(5, 'm'), horizontalDistance: q(3, 'm') }, drops.legs[1]];
    const raw = withBeam({ ...beam, slingsBelow: { ...drops, legs } });
    expect(item(raw, 'rigging.below.angle-1').value).toBeCloseTo((Math.acos(0.6) * 180) / Math.PI, 9);
    // V1 = 6 t as before; sin θ = 4/5, so T1 = 6 ÷ 0.8 = 7.5 t
    expect(tonnes(item(raw, 'rigging.below.leg-1').value!)).toBeCloseTo(7.5, 9);
  });

  it('when the spreader-beam example is checked, then its drops share 9.5 t by the lever rule: 5.067 t and 4.433 t', () => {
    // drops 1.4 m and 1.6 m either side of the centre of gravity, 3.0 m apart, vertical:
    // V_north = 9.5 × 1.6 / 3.0 = 5.0667 t, V_south = 9.5 × 1.4 / 3.0 = 4.4333 t; the beam carries
    // 9.5 + 0.04 = 9.54 t; the slings above 9.54 + 0.4 = 9.94 t on two legs at 60°: 5.738 t each
    const raw = example('pass-spreader-beam.json');
    expect(tonnes(item(raw, 'rigging.below.leg-1').value!)).toBeCloseTo(9.5 * (1.6 / 3), 9);
    expect(tonnes(item(raw, 'rigging.below.leg-2').value!)).toBeCloseTo(9.5 * (1.4 / 3), 9);
    expect(item(raw, 'rigging.below.vertical-1').label).toBe(
      'Vertical share at the pick point of north drop (below the beam)',
    );
    expect(tonnes(item(raw, 'rigging.beam').value!)).toBeCloseTo(9.54, 9);
    expect(tonnes(item(raw, 'rigging.leg-1').value!)).toBeCloseTo(9.94 / (2 * Math.sin(Math.PI / 3)), 9);
  });
});
