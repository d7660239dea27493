// The governing tipping line the stability check reports for drawings, worked by hand.
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkLift } from '@shared/engineering';

const load = (name: string) =>
  JSON.parse(fs.readFileSync(`shared/engineering/examples/${name}.json`, 'utf8'));

describe('the tipping line in the figures', () => {
  it('when the outrigger example is checked, then the line is the front outrigger line 3.6 m ahead of rotation', () => {
    // Outriggers 7.2 m long, box centred on the centre of rotation: the front float line is
    // 7.2 / 2 = 3.6 m ahead. With the boom over the front (slew 180°) the load arm about it is
    // radius 12 m − 3.6 m = 8.4 m and the counterweight arm 4.2 m + 3.6 m = 7.8 m, the arms the
    // stability formula prints.
    const outcome = checkLift(load('pass-outriggers'));
    if (!outcome.ok) throw new Error('example must parse');
    const t = outcome.result.figures.tipping!;
    expect(t.slewDeg).toBe(180);
    expect(t.distanceAlongBoom).toBeCloseTo(3.6, 9);
    const stability = outcome.result.checks.find((c) => c.id === 'stability')!;
    expect(stability.formulaText).toContain('8.40 m');
    expect(stability.formulaText).toContain('7.80 m');
  });

  it('when the crane is a gantry, then no tipping line is reported for the side view', () => {
    const outcome = checkLift(load('pass-gantry-a-frame'));
    if (!outcome.ok) throw new Error('example must parse');
    expect(outcome.result.figures.tipping ?? null).toBeNull();
  });
});
