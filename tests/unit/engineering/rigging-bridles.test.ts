// Three- and four-leg bridles with the centre of gravity off centre, worked by hand from the statics
// of the hook: T = V · L / h with L = √(x² + y² + h²), vertical shares V from ΣV = W and the
// moments about the centre of gravity. Four legs without an equalising arrangement are rated as if
// two legs carry the load (ASME B30.9, from memory): each diagonal pair carries the whole weight.
import { describe, expect, it } from 'vitest';
import { LiftInput, type LiftInputRaw } from '@shared/schemas/lift-input';
import { evaluateLift } from '@shared/engineering/evaluate';
import { G, outriggerLift, q } from './support';

const pick = (x: number, y: number) => ({ pickPoint: { x: q(x, 'm'), y: q(y, 'm') } });
function bridle(weightT: number, legs: object[], hookHeight: number, extra: object = {}): LiftInputRaw {
  return {
    ...outriggerLift(),
    load: { weight: q(weightT, 't') },
    rigging: {
      slings: {
        material: 'wire',
        hitch: 'vertical',
        ratedLoadVertical: q(200, 't'),
        hookHeight: q(hookHeight, 'm'),
        legs,
        ...extra,
      },
    },
  } as LiftInputRaw;
}
const items = (raw: LiftInputRaw) =>
  evaluateLift(LiftInput.parse(raw)).checks.find((c) => c.id === 'rigging')!.items;
const t = (raw: LiftInputRaw, id: string) => items(raw).find((i) => i.id === id)!.value! / G / 1000;

describe('three- and four-leg bridles', () => {
  it('when three legs carry 24 t with the centre of gravity off centre, then the shares and tensions are the hand statics', () => {
    // Picks in the load's frame A(−2, 0), B(2, 0), C(0, 3), centre of gravity (0.5, 1); from the
    // centre of gravity A(−2.5, −1), B(1.5, −1), C(−0.5, 2); hook 3 m above the picks.
    // ΣM about x: 3 V_C = 24 × 1 → V_C = 8 t; V_A + V_B = 16, 2 (V_B − V_A) = 24 × 0.5 → V_B = 11, V_A = 5.
    // L_A = √(6.25 + 1 + 9) = 4.0311, T_A = 5 × 4.0311 / 3 = 6.7185 t; L_B = √(2.25 + 1 + 9) = 3.5,
    // T_B = 11 × 3.5 / 3 = 12.833 t; L_C = √(0.25 + 4 + 9) = 3.64005, T_C = 8 × 3.64005 / 3 = 9.7068 t.
    const raw = bridle(24, [pick(-2.5, -1), pick(1.5, -1), pick(-0.5, 2)], 3);
    expect([1, 2, 3].map((i) => t(raw, `rigging.vertical-${i}`))).toEqual([
      expect.closeTo(5, 9),
      expect.closeTo(11, 9),
      expect.closeTo(8, 9),
    ]);
    expect(t(raw, 'rigging.leg-1')).toBeCloseTo(6.7185, 4);
    expect(t(raw, 'rigging.leg-2')).toBeCloseTo(12.8333, 4);
    expect(t(raw, 'rigging.leg-3')).toBeCloseTo(9.7068, 4);
    // leg B's angle from horizontal: atan(3 / √3.25) = atan(1.6641) = 58.997°
    expect(items(raw).find((i) => i.id === 'rigging.angle-2')!.value).toBeCloseTo(58.997, 3);
  });

  // Rectangle of picks (±2, ±1.5) about its centre, legs listed round the load; the centre of
  // gravity 0.4 m and 0.3 m off the centre; from the centre of gravity the picks are
  // 1 (−2.4, −1.8), 2 (1.6, −1.8), 3 (1.6, 1.2), 4 (−2.4, 1.2); hook 2 m above; load 100 t.
  const rect = [pick(-2.4, -1.8), pick(1.6, -1.8), pick(1.6, 1.2), pick(-2.4, 1.2)];

  it('when four legs have no equalising arrangement, then each diagonal pair is taken to carry the whole load', () => {
    // Diagonal 1–3 (−2, −1.5)→(2, 1.5): the centre of gravity is on it at t = 0.6 → V1 = 40, V3 = 60 t.
    // Diagonal 2–4 (2, −1.5)→(−2, 1.5): t = ((0.4 − 2)(−4) + (0.3 + 1.5)(3)) / 25 = 0.472 → V2 = 52.8,
    // V4 = 47.2 t. T1 = 40 × √13 / 2 = 72.111, T2 = 52.8 × √9.8 / 2 = 82.645, T3 = 60 × √8 / 2 =
    // 84.853, T4 = 47.2 × √11.2 / 2 = 78.981 t.
    const raw = bridle(100, rect, 2);
    expect(t(raw, 'rigging.vertical-1')).toBeCloseTo(40, 9);
    expect(t(raw, 'rigging.vertical-2')).toBeCloseTo(52.8, 9);
    expect(t(raw, 'rigging.leg-1')).toBeCloseTo(72.111, 3);
    expect(t(raw, 'rigging.leg-2')).toBeCloseTo(82.645, 3);
    expect(t(raw, 'rigging.leg-3')).toBeCloseTo(84.853, 3);
    expect(t(raw, 'rigging.leg-4')).toBeCloseTo(78.981, 3);
    const v = items(raw).find((i) => i.id === 'rigging.vertical-1')!;
    expect(v.source.kind).toBe('from_memory');
    expect(v.source.text).toContain('ASME B30.9');
  });

  it('when the four legs are equalised, then they share as evenly as balance allows (W/4 + a·x + b·y)', () => {
    // In the centre frame V = 25 + a X + b Y; ΣV X = 100 × 0.4 → 16 a = 40, a = 2.5; ΣV Y = 100 × 0.3
    // → 9 b = 30, b = 3.333. V1 = 25 − 5 − 5 = 15, V2 = 25 + 5 − 5 = 25, V3 = 35, V4 = 25 t.
    // T1 = 15 × √13 / 2 = 27.042 t, T3 = 35 × √8 / 2 = 49.497 t.
    const raw = bridle(100, rect, 2, { equalised: true });
    expect([1, 2, 3, 4].map((i) => t(raw, `rigging.vertical-${i}`))).toEqual([
      expect.closeTo(15, 9),
      expect.closeTo(25, 9),
      expect.closeTo(35, 9),
      expect.closeTo(25, 9),
    ]);
    expect(t(raw, 'rigging.leg-1')).toBeCloseTo(27.042, 3);
    expect(t(raw, 'rigging.leg-3')).toBeCloseTo(49.497, 3);
  });

  it('when the centre of gravity lies outside three picks, then the bridle fails with the reason and no negative tension', () => {
    const raw = bridle(10, [pick(1, 0), pick(3, 0), pick(2, 2)], 3);
    const its = items(raw);
    const b = its.find((i) => i.id === 'rigging.bridle')!;
    expect(b.status).toBe('fail');
    expect(b.message).toContain('outside the pick points');
    expect(its.some((i) => i.id.startsWith('rigging.leg-'))).toBe(false);
  });

  it('when a 3-leg bridle has no hook height or a leg no pick point, then the input is refused naming the field', () => {
    const noHeight = bridle(10, [pick(-1, 0), pick(1, 0), pick(0, 1)], 3);
    delete (noHeight.rigging!.slings as { hookHeight?: unknown }).hookHeight;
    const r1 = LiftInput.safeParse(noHeight);
    expect(r1.success).toBe(false);
    expect(JSON.stringify(r1.error!.issues)).toContain('rigging.slings.hookHeight');
    const r2 = LiftInput.safeParse(bridle(10, [pick(-1, 0), pick(1, 0), { angle: q(60, 'deg') }], 3));
    expect(r2.success).toBe(false);
    expect(JSON.stringify(r2.error!.issues)).toContain('rigging.slings.legs[].pickPoint');
    const r3 = LiftInput.safeParse(bridle(10, [...rect, pick(0, 0)], 3));
    expect(JSON.stringify(r3.error!.issues)).toContain('1 to 4 legs');
  });
});

describe('one- and two-leg slings', () => {
  it('when a two-leg sling gives only pick points, then the input is refused: its angles are needed', () => {
    const raw = bridle(10, [pick(-1, 0), pick(1, 0)], 3);
    const r = LiftInput.safeParse(raw);
    expect(r.success).toBe(false);
    expect(JSON.stringify(r.error!.issues)).toContain('with 1 or 2 legs give each leg its angle');
  });
});
