// Defect 6: every quantity has a plausible upper bound; a value beyond it is an input error naming
// the field and the limit (bounds are ours: "common practice, no source", chosen well above any
// crane lift on record so that every product in the engine stays finite).
import { describe, expect, it } from 'vitest';
import { checkLift } from '@shared/engineering/evaluate';
import { outriggerLift, q } from './support';

describe('upper bounds on quantities', () => {
  it('when a chart capacity of 1e308 t is entered, then it is refused naming the field and the limit', () => {
    const l = outriggerLift();
    l.chart.rows[0].capacity = q(1e308, 't');
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.issues.map((i) => i.message).join('\n')).toMatch(
      /chart\.rows\[\]\.capacity must be 100,000 t or less/,
    );
  });
  it('when a wind speed of 1e200 m/s is entered, then it is refused naming the limit in the unit typed', () => {
    const l = outriggerLift();
    l.environment = { windSpeed: q(1e200, 'm/s') };
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues[0].message).toMatch(/environment\.windSpeed must be 100 m\/s or less/);
  });
  it('when a limit is typed in another unit, then the message gives the limit in that unit', () => {
    const l = outriggerLift();
    l.load = { weight: q(1e9, 'lb') };
    const out = checkLift(l);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.issues[0].message).toMatch(/load\.weight must be 220,462,262 lb or less/);
  });
});
