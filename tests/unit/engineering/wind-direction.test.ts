// Defect 9: wind is taken from the least favourable direction for stability, reactions and bearing,
// including a side wind on the load and the boom. Wind force F = q·A·Cf with q = ½ρv² (read, ρ =
// 1.225 kg/m³). Hand-worked: 10 m/s → q = 61.25 Pa; load 10 m² × Cf 1.2 → F = 735 N at the tip
// height; boom 8 m² × 1.2 → 588 N at half the tip height.
import { describe, expect, it } from 'vitest';
import { tippingBalance } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { outriggerLift, q, run } from './support';

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
});
