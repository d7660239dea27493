// Defect 7: when no set of compressive reactions balances the crane, there is no support solution:
// the result says so with fail and the tipping line, and never reports a negative force.
// Hand-worked with the outrigger lift of support.ts (6 m × 6 m box, boom over the left side):
// 60 t at 10 m radius: resultant e_y = Σw·s / V = (60.5·10 + 4·5 − 20·1 − 15·4) / 129.5 = 4.208 m > b = 3 m.
import { describe, expect, it } from 'vitest';
import { checkOf, findItem, outriggerLift, q, run } from './support';

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
});
