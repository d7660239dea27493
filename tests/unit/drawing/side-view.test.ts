// The side-view scene is drawn from the engine's own figures, so the picture and the stability
// check agree: the radius, boom tip height and tipping line are the result's numbers.
import { describe, expect, it } from 'vitest';
import { sideViewScene, sideViewUnavailableReason } from '@shared/drawing/side-view';
import { exampleResult } from '../stamp-fixtures';

describe('side view scene', () => {
  for (const name of ['pass-outriggers', 'pass-crawler', 'fail-stability']) {
    it(`when ${name} is drawn, then radius, tip height and arms are the engine's`, () => {
      const { inputs, result } = exampleResult(name);
      const scene = sideViewScene(inputs, result);
      expect(scene).not.toBeNull();
      const f = result.figures;
      expect(scene!.radius).toBe(f.radius);
      expect(scene!.angle).toBe(f.boomAngleDeg);
      expect(scene!.fulcrum).toBe(f.tipping!.distanceAlongBoom);
      expect(scene!.tipY).toBeCloseTo(f.tipHeight!, 6);
      expect(scene!.loadArm).toBeCloseTo(f.radius! - f.tipping!.distanceAlongBoom, 9);
      // The boom reaches the radius it was checked at (tip over the hook).
      expect(scene!.tipX).toBeCloseTo(f.radius!, 6);
      expect(scene!.xMin).toBeLessThan(-scene!.fulcrum);
      expect(scene!.xMax).toBeGreaterThan(scene!.radius);
      expect(scene!.yMax).toBeGreaterThan(scene!.tipY);
      expect(sideViewUnavailableReason(inputs, result)).toBeNull();
    });
  }

  it('when the crane is a gantry, then no scene is drawn and the reason says so', () => {
    const { inputs, result } = exampleResult('pass-gantry-a-frame');
    expect(sideViewUnavailableReason(inputs, result)).toMatch(/gantry or A-frame/);
  });
});
