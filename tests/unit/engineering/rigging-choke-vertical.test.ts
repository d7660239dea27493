// Choker hitch with a stated angle of choke, and each leg's vertical share at its pick point.
// Choke-angle factors: ASME B30.9 table as reproduced in sling makers' instructions (read): over
// 120° 1.00, 90–120° 0.87, 60–89° 0.74, 30–59° 0.62, 0–29° 0.49 of the choker rating. Choker rating
// for wire rope 0.75 × vertical (rigging handbooks, read). Shares worked by hand below.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { chokeAngleFactor } from '@shared/engineering/checks/rigging';
import { G, outriggerLift, q } from './support';

function withSlings(slings: Record<string, unknown>): LiftInputRaw {
  return { ...outriggerLift(), load: { weight: q(10, 't') }, rigging: { slings } } as LiftInputRaw;
}
const rigging = (raw: LiftInputRaw) =>
  evaluateLift(LiftInput.parse(raw)).checks.find((c) => c.id === 'rigging')!;
const byId = (raw: LiftInputRaw, id: string) => rigging(raw).items.find((i) => i.id === id)!;

describe('choke angle and vertical shares', () => {
  it('when the angle of choke falls in each band of the ASME B30.9 table, then the factor is the table’s', () => {
    expect([180, 121, 120, 100, 90, 89, 60, 59, 30, 29, 0].map(chokeAngleFactor)).toEqual([
      1, 1, 0.87, 0.87, 0.87, 0.74, 0.74, 0.62, 0.62, 0.49, 0.49,
    ]);
  });

  it('when a wire choker is choked at 100°, then each leg is rated 8.5 t × 0.75 × 0.87 and a 5.5 t leg fails', () => {
    const slings = {
      material: 'wire',
      hitch: 'choker',
      ratedLoadVertical: q(8.5, 't'),
      chokeAngle: q(100, 'deg'),
      legs: [{ angle: q(60, 'deg') }, { angle: q(60, 'deg') }],
    };
    const leg = byId(withSlings(slings), 'rigging.leg-1');
    // by hand: T = 10 t / (2 sin 60°) = 5.7735 t; capacity 8.5 × 0.75 × 0.87 = 5.54625 t
    expect(leg.value! / G / 1000).toBeCloseTo(10 / (2 * Math.sin(Math.PI / 3)), 6);
    expect(leg.limit! / G / 1000).toBeCloseTo(5.54625, 9);
    expect(leg.status).toBe('fail');
    expect(leg.source.text).toContain('choke-angle');
    // the same sling with no angle of choke stated keeps the 0.75 rating and passes
    const { chokeAngle: _c, ...plain } = slings;
    void _c;
    const free = byId(withSlings(plain), 'rigging.leg-1');
    expect(free.limit! / G / 1000).toBeCloseTo(6.375, 9);
    expect(free.status).not.toBe('fail');
  });

  it('when two legs are at 60° and 45° over the CG, then their vertical shares add up to the weight', () => {
    const raw = withSlings({
      material: 'wire',
      hitch: 'vertical',
      ratedLoadVertical: q(20, 't'),
      legs: [{ angle: q(60, 'deg') }, { angle: q(45, 'deg') }],
    });
    // by hand: T_A = W cos45/sin105 = 10 × 0.70711/0.96593 = 7.3205 t, V_A = T_A sin60 = 6.3397 t;
    //          T_B = W cos60/sin105 = 5.1764 t, V_B = T_B sin45 = 3.6603 t; V_A + V_B = 10 t
    const vA = byId(raw, 'rigging.vertical-1').value! / G / 1000;
    const vB = byId(raw, 'rigging.vertical-2').value! / G / 1000;
    expect(vA).toBeCloseTo(6.3397, 4);
    expect(vB).toBeCloseTo(3.6603, 4);
    expect(vA + vB).toBeCloseTo(10, 9);
  });

  it('when the angle of choke is over 180°, then the input names the field and its limit', () => {
    const raw = withSlings({
      material: 'wire',
      hitch: 'choker',
      ratedLoadVertical: q(8.5, 't'),
      chokeAngle: q(200, 'deg'),
      legs: [{ angle: q(60, 'deg') }],
    });
    const parsed = LiftInput.safeParse(raw);
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues[0].message).toMatch(/rigging\.slings\.chokeAngle.*180/);
  });
});
