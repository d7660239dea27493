// Ground: "what would fix it" for failed bearing, and the crawler track's contact length and
// minimum pressure. Rigid mats: pressure = reaction ÷ mat area (statics, common practice). Eccentric
// footing (statics): e ≤ L/6 trapezoidal p = V/(bL)(1 ± 6e/L); e > L/6 triangular over 3(L/2 − e).
import { describe, expect, it } from 'vitest';
import { trackPeakPressure } from '@shared/engineering/checks/ground-bearing-tracks';
import { findItem, outriggerLift, q, run } from './support';

describe('ground bearing', () => {
  it('when the pressure under the mats is over the allowable, then the fix gives the mat area that brings it within', () => {
    const l = outriggerLift();
    l.ground = { mat: { length: q(1, 'm'), width: q(1, 'm') }, allowableBearing: q(100, 'kPa') };
    const r = run(l);
    const R = r.figures.maxSupportReaction!;
    expect(findItem(r, 'ground-bearing.pressure').status).toBe('fail');
    const fx = r.fixes.find((x) => x.kind === 'mat_area')!;
    expect(fx.value).toBeCloseTo(R / 100_000, 9);
    expect(fx.text).toMatch(new RegExp(`${Math.ceil(R / 100_000)} mats of 1.00 m × 1.00 m`));
  });
  it('when the fix’s number of mats is laid under each support, then the pressure is within the allowable; one mat fewer is not', () => {
    const l = outriggerLift();
    l.ground = { mat: { length: q(1, 'm'), width: q(1, 'm') }, allowableBearing: q(100, 'kPa') };
    const r = run(l);
    // largest reaction R over 100 kPa needs R ÷ 100 kPa of mat: ⌈R ÷ 100 kPa ÷ 1 m²⌉ mats of 1 m × 1 m
    const n = Math.ceil(r.figures.maxSupportReaction! / 100_000);
    const laid = (k: number) =>
      findItem(
        run({ ...l, ground: { ...l.ground, mat: { ...l.ground!.mat!, perSupport: k } } }),
        'ground-bearing.pressure',
      );
    expect(laid(n).status).not.toBe('fail');
    expect(laid(n).value!).toBeLessThanOrEqual(100_000);
    expect(laid(n - 1).status).toBe('fail');
  });
  it('when a track load is eccentric, then the contact length and the minimum pressure follow the footing formulas', () => {
    // V 400 kN, L 6 m, b 1 m: e 0.5 m (≤ L/6): p from 400/6·(1 − 0.5) = 33.3 to 100 kPa·m… in Pa
    const a = trackPeakPressure(400e3, 0.5, 6, 1);
    expect(a.pMin).toBeCloseTo((400e3 / 6) * (1 - 0.5), 6);
    expect(a.p).toBeCloseTo((400e3 / 6) * 1.5, 6);
    expect(a.contact).toBe(6);
    // e 2 m (> L/6): triangular over 3 (3 − 2) = 3 m, peak 2V / (3 b (L/2 − e)) = 266.7 kPa
    const b = trackPeakPressure(400e3, 2, 6, 1);
    expect(b.contact).toBeCloseTo(3, 12);
    expect(b.pMin).toBe(0);
    expect(b.p).toBeCloseTo((2 * 400e3) / 3, 6);
  });
});
