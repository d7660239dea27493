// Defect 9: wind is taken from the least favourable direction for stability, reactions and bearing,
// including a side wind on the load and the boom. Wind force F = q·A·Cf with q = ½ρv² (read, ρ =
// 1.225 kg/m³). Hand-worked: 10 m/s → q = 61.25 Pa; load 10 m² × Cf 1.2 → F = 735 N at the tip
// height; boom 8 m² × 1.2 → 588 N at half the tip height.
import { describe, expect, it } from 'vitest';
import { tippingBalance } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { crawlerLift, findItem, G, outriggerLift, q, run } from './support';

function windy(slew: number) {
  const l = outriggerLift();
  l.crane.slewAngle = q(slew, 'deg');
  l.crane.pivotHeight = q(2, 'm');
  l.load = { weight: q(10, 't'), windArea: q(10, 'm2'), dragCoefficient: 1.2 };
  l.environment = { windSpeed: q(10, 'm/s'), boomWindArea: q(8, 'm2'), boomDragCoefficient: 1.2 };
  return l;
}

describe('wind direction', () => {
  it('when the boom is over the rear, then a side wind still overturns about the side lines', () => {
    const l = windy(0);
    const tip = 2 + Math.sqrt(400 - 100);
    const windMoment = 735 * tip + 588 * ((tip + 2) / 2);
    const b = tippingBalance(LiftInput.parse(l), 0)!;
    const side = b.find((e) => e.edge.startsWith('left-side'))!;
    // nothing of the crane lies beyond the left-side line with the boom over the rear: wind alone
    expect(side.overturning).toBeCloseTo(windMoment, 6);
  });
  it('when wind blows, then the largest outrigger reaction is at least the one with wind along the boom', () => {
    const withWind = run(windy(90)).figures.maxSupportReaction!;
    const calm = structuredClone(windy(90));
    calm.environment = { windSpeed: q(0, 'm/s') };
    const still = run(calm).figures.maxSupportReaction!;
    // side wind across a 6 m × 6 m box adds M·√(1/(4a)² + 1/(4b)²) to the governing corner
    const tip = 2 + Math.sqrt(300);
    const M = 735 * tip + 588 * ((tip + 2) / 2);
    expect(withWind).toBeCloseTo(still + M * Math.hypot(1 / 12, 1 / 12), 3);
  });

  it('when wind blows on a crawler, then the peak track pressure is the largest over every wind direction', () => {
    // The crawler of the moment-balance tests (boom 24 m at 12 m over the track ends, V = 120 t,
    // e₀ = 142.5 ÷ 120 = 1.1875 m along the tracks, tracks 6 m × 1 m, gauge 4.4 m) in 10 m/s:
    // q = 61.25 Pa; load 10 m² × Cf 1.2 → 735 N at the tip, 24 sin 60° = 20.785 m; boom 8 m² × 1.2
    // → 588 N at half that height: M = 735 × 20.785 + 588 × 10.392 = 21,387 N·m. A wind from plan
    // direction θ moves the resultant by M/V (cos θ, sin θ): e = e₀ + M cos θ / V, the heavier
    // track carries V (b + M sin θ / V) ÷ 2b, b = 2.2 m, and (e > L/6) p = 2 V_t ÷ (3 w (L/2 − e)).
    // Over the circle the largest is 219.26 kPa near θ = 39°; the wind along the boom gives
    // 218.61 kPa and towards the corner of the track rectangle 219.16 kPa.
    const l = crawlerLift();
    l.load = { weight: q(20, 't'), windArea: q(10, 'm2'), dragCoefficient: 1.2 };
    l.environment = { windSpeed: q(10, 'm/s'), boomWindArea: q(8, 'm2'), boomDragCoefficient: 1.2 };
    const V = 120e3 * G;
    const tip = 24 * Math.sin(Math.PI / 3);
    const M = 735 * tip + 588 * (tip / 2);
    const p = (deg: number) => {
      const e = 142.5 / 120 + (M * Math.cos((deg * Math.PI) / 180)) / V;
      const Vt = (V * (2.2 + (M * Math.sin((deg * Math.PI) / 180)) / V)) / 4.4;
      return (2 * Vt) / (3 * 1 * (3 - e));
    };
    let best = 0;
    for (let d = 0; d < 360; d += 0.01) best = Math.max(best, p(d));
    const it = findItem(run(l), 'ground-bearing.pressure');
    expect(it.value!).toBeCloseTo(best, 3);
    expect(best / 1000).toBeCloseTo(219.256, 3);
    expect(it.value!).toBeGreaterThan(p(0) + 600);
  });
});
