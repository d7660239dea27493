// Defect 7: when no set of compressive reactions balances the crane, there is no support solution:
// the result says so with fail and the tipping line, and never reports a negative force.
// Hand-worked with the outrigger lift of support.ts (6 m × 6 m box, boom over the left side):
// 60 t at 10 m radius: resultant e_y = Σw·s / V = (60.5·10 + 4·5 − 20·1 − 15·4) / 129.5 = 4.208 m > b = 3 m.
import { describe, expect, it } from 'vitest';
import { supportReactions } from '@shared/engineering/checks/support-reactions';
import { checkOf, findItem, G, outriggerLift, q, run } from './support';

describe('support reactions of a crane that tips', () => {
  it('when the resultant falls outside the outrigger box, then no support solution, fail, no negative force', () => {
    const l = outriggerLift();
    l.load = { weight: q(60, 't') };
    const r = run(l);
    const it = findItem(r, 'ground-bearing.reactions');
    expect(it.status).toBe('fail');
    expect(it.message).toMatch(/no support solution: the crane tips about the left-side outriggers line/i);
    for (const s of r.figures.supportReactions) expect(s.reaction).toBeGreaterThanOrEqual(0);
    expect(r.figures.maxSupportReaction).toBeNull();
    expect(checkOf(r, 'ground-bearing').status).toBe('fail');
    const ey = (60.5 * 10 + 4 * 5 - 20 * 1 - 15 * 4) / 129.5;
    expect(ey).toBeGreaterThan(3);
  });
  it('when one outrigger lifts off but three balance the crane, then reactions stay compressive with a caution', () => {
    // boom toward the left rear corner: e = (28.5·10 + 4·5 − 20 − 60) / 97.5 = 2.31 m, beyond the
    // four-support kern (e/√2 · (1/a + 1/b) = 1.09 > 1) but inside the box: the right front lifts off
    const l = outriggerLift();
    l.crane.slewAngle = q(45, 'deg');
    l.load = { weight: q(28, 't') };
    const r = run(l);
    const it = findItem(r, 'ground-bearing.reactions');
    expect(it.status).toBe('caution');
    expect(it.message).toMatch(/right front outrigger lifts off/);
    for (const s of r.figures.supportReactions) expect(s.reaction).toBeGreaterThanOrEqual(-1e-6);
  });
  it('when only a wind square to the side line takes the resultant past it, then there is still no support solution', () => {
    // Boom at slew 60°, 41.3 t on the hook at 10 m (with the 0.5 t block): V = 41.8 + 69 = 110.8 t,
    // Σw·s = 41.8 × 10 + 4 × 5 − 20 × 1 − 15 × 4 = 358 t·m → e = 3.2310 m along the boom, 2.7982 m
    // square to the left-side line (3 m out). Wind 20 m/s on 47 m² × Cf 1.2 at the 17.32 m tip:
    // F = 245 Pa × 56.4 m² = 13.82 kN, M = 239.3 kN·m = 24.40 t·m → M/V = 0.2203 m. Blowing along the
    // boom it leaves the resultant 2.9889 m from the centre square to the line (inside); towards
    // the box corner 2.9539 m (inside); square to the line 2.7982 + 0.2203 = 3.0184 m (past it).
    const l = outriggerLift();
    l.crane.slewAngle = q(60, 'deg');
    l.load = { weight: q(41.3, 't'), windArea: q(47, 'm2'), dragCoefficient: 1.2 };
    l.environment = { windSpeed: q(20, 'm/s') };
    const r = run(l);
    const it = findItem(r, 'ground-bearing.reactions');
    expect(it.status).toBe('fail');
    expect(it.message).toMatch(/no support solution: the crane tips about the left-side outriggers line/i);
    expect(r.figures.maxSupportReaction).toBeNull();
    // calm, the same crane stands on its outriggers
    const calm = structuredClone(l);
    calm.environment = { windSpeed: q(0, 'm/s') };
    expect(findItem(run(calm), 'ground-bearing.reactions').status).not.toBe('fail');
  });
  it('when one outrigger lifts off in the wind, then the largest reaction is the largest over every wind direction', () => {
    // the lift-off case above (V = 97.5 t, e = 225 ÷ 97.5 = 2.3077 m towards the corner at 45°) in a
    // 15 m/s wind on 20 m² × Cf 1.2 at the 17.32 m tip: M = 137.8 Pa × 24 m² × 17.32 m, moving the
    // resultant M/V in the wind's direction; the three-support reactions of each, every 0.05°
    const l = outriggerLift();
    l.crane.slewAngle = q(45, 'deg');
    l.load = { weight: q(28, 't'), windArea: q(20, 'm2'), dragCoefficient: 1.2 };
    l.environment = { windSpeed: q(15, 'm/s') };
    const V = 97.5 * 1000 * G;
    const e = 225 / 97.5;
    const M = 0.5 * 1.225 * 15 ** 2 * 24 * 20 * Math.sin(Math.PI / 3);
    let best = 0;
    for (let d = 0; d < 360; d += 0.05) {
      const w = (d * Math.PI) / 180;
      const ex = e * Math.SQRT1_2 + (M / V) * Math.cos(w);
      const ey = e * Math.SQRT1_2 + (M / V) * Math.sin(w);
      const R = supportReactions(V, ex, ey, 3, 3);
      if (R) best = Math.max(best, ...R);
    }
    const r = run(l);
    expect(findItem(r, 'ground-bearing.reactions').status).toBe('caution');
    expect(r.figures.maxSupportReaction!).toBeGreaterThanOrEqual(best * (1 - 1e-6));
    expect(r.figures.maxSupportReaction!).toBeLessThanOrEqual(best * (1 + 1e-6));
  });
});
