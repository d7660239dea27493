// The working range of a library chart (hook height against radius for each boom length) and what
// a package puts on the pictures. Geometry hand-worked below; the convention is the engine's
// (checks/geometry.ts): tip height = h0 + √(L² − (R − a)²); hook height = tip height − d, where the
// allowance d = hook block height + the clearance kept under the tip.
import { describe, expect, it } from 'vitest';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import twoCranes from '@shared/engineering/examples/caution-two-cranes.json';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { previewText } from '@shared/library/chart-text';
import { hookHeight, labelSide, lineAt, workingRange } from '@shared/library/chart-plot';
import { craneLiftFigures } from '@shared/library/lift-points';

const bare = { pivotOffset: 0, pivotHeight: 0, allowance: 0 };

describe('hook height of a straight boom hinged at its foot pin', () => {
  it('when L = 10 m, R = 6 m, pivot 1 m ahead and 2 m up, then the tip is at 2 + √(100 − 25) = 10.660 m', () => {
    expect(hookHeight(10, 6, { pivotOffset: 1, pivotHeight: 2, allowance: 0 })).toBeCloseTo(10.660254, 6);
  });

  it('when a 1.4 m block and 1.0 m clearance hang under that tip, then the hook is 2.4 m lower: 8.260 m', () => {
    expect(hookHeight(10, 6, { pivotOffset: 1, pivotHeight: 2, allowance: 2.4 })).toBeCloseTo(8.260254, 6);
  });

  it('when L = 30.5 m at R = 12 m, a = 1.2 m, h0 = 2.8 m, d = 2.4 m, then the hook is at 2.8 + √(930.25 − 116.64) − 2.4 = 28.924 m', () => {
    // √813.61 = 28.52385 m
    expect(hookHeight(30.5, 12, { pivotOffset: 1.2, pivotHeight: 2.8, allowance: 2.4 })).toBeCloseTo(
      28.92385,
      5,
    );
  });

  it('when the boom is vertical over the pivot (R = a), then the hook is at h0 + L − d', () => {
    expect(hookHeight(20, 1.5, { pivotOffset: 1.5, pivotHeight: 3, allowance: 1 })).toBeCloseTo(22, 9);
  });

  it('when the radius lies beyond the boom (R − a > L), then there is no hook height', () => {
    expect(hookHeight(10, 12, { pivotOffset: 1, pivotHeight: 2, allowance: 0 })).toBeNull();
    // exactly at full reach the boom lies flat: the tip is at pivot height
    expect(hookHeight(10, 11, { pivotOffset: 1, pivotHeight: 2, allowance: 0 })).toBeCloseTo(2, 9);
  });
});

describe('the working range of a chart grid', () => {
  const g = previewText('radius (m) / boom (m) / capacity (t),10,20\n6,10,8\n12,,5\n18,,3').grid!;

  it('when drawn, then each boom length spans its rated radii, rated radii marked and the arc sampled between', () => {
    const [ten, twenty] = workingRange(g, { pivotOffset: 1, pivotHeight: 2, allowance: 0 }, 4);
    // boom 10 m is rated at 6 m only: one point, 2 + √75
    expect(ten.points).toEqual([{ x: 6, y: expect.closeTo(2 + Math.sqrt(75), 9), rated: true }]);
    // boom 20 m from 6 to 18 m in 4 steps: 6, 9, 12, 15, 18 m; 6, 12 and 18 are rated
    expect(twenty.points.map((p) => [p.x, !!p.rated])).toEqual([
      [6, true],
      [9, false],
      [12, true],
      [15, false],
      [18, true],
    ]);
    // R = 12 m: 2 + √(400 − 121) = 2 + √279 = 18.703 m; R = 18 m: 2 + √(400 − 289) = 12.536 m
    expect(twenty.points[2].y).toBeCloseTo(2 + Math.sqrt(279), 9);
    expect(twenty.points[4].y).toBeCloseTo(2 + Math.sqrt(111), 9);
    // the hook falls as the boom lowers
    const ys = twenty.points.map((p) => p.y);
    expect([...ys].sort((a, b) => b - a)).toEqual(ys);
  });

  it('when the allowance is larger than the tip is high, then those radii are left out, not drawn underground', () => {
    // boom 20 m at R = 18 m: tip at 0 + √(400 − 324) = 8.72 m; with a 9 m allowance the hook would be below ground
    const [, twenty] = workingRange(g, { ...bare, allowance: 9 }, 0);
    expect(twenty.points.map((p) => p.x)).toEqual([6, 12]);
  });

  it('when the chart is in feet, then geometry works in SI and the heights come back in feet', () => {
    const ft = previewText('radius (ft) / boom (ft) / capacity (kip),100\n40,30').grid!;
    // L = 100 ft, R = 40 ft, a = 4 ft, h0 = 8.5 ft: 8.5 + √(10 000 − 1 296) = 8.5 + 93.295 = 101.795 ft
    const [line] = workingRange(ft, { pivotOffset: 4 * 0.3048, pivotHeight: 8.5 * 0.3048, allowance: 0 });
    expect(line.points[0].x).toBe(40);
    expect(line.points[0].y).toBeCloseTo(101.79523, 4);
  });
});

describe('a package on the chart', () => {
  it('when the single-crane lift has a required lift height, then the hook it needs is lift + load + rigging height', () => {
    const input = LiftInput.parse(passOutriggers);
    const result = evaluateLift(input);
    const f = craneLiftFigures(passOutriggers, result, 0);
    expect(f.radius).toBe(result.figures.radius);
    expect(f.grossLoad).toBe(result.figures.grossLoad);
    expect(f.blockHeight).toBeCloseTo(1.4, 9);
    expect(f.clearance).toBe(result.policy.minBlockClearanceM);
    // 6 m lift height + 1.8 m load height + 2.5 m rigging height = 10.3 m
    expect(f.neededHookHeight).toBeCloseTo(10.3, 9);
    expect(f.cranesInLift).toBe(1);
  });

  it('when the hook needed is set against the working range, then the margin is the engine’s block clearance less the minimum', () => {
    const input = LiftInput.parse(passOutriggers);
    const result = evaluateLift(input);
    const f = craneLiftFigures(passOutriggers, result, 0);
    const allowance = f.blockHeight! + f.clearance!;
    const hook = hookHeight(30.5, f.radius!, { pivotOffset: 1.2, pivotHeight: 2.8, allowance })!;
    const clearance = result.checks
      .flatMap((c) => c.items)
      .find((i) => i.id === 'geometry.block-clearance')!.value!;
    expect(hook - f.neededHookHeight!).toBeCloseTo(clearance - f.clearance!, 9);
  });

  it('when crane 2 of a two-crane lift is asked for, then its own share, radius, block and rigging are used', () => {
    const raw = structuredClone(twoCranes) as typeof twoCranes;
    const other = raw.multiCrane.others[0] as Record<string, unknown> & {
      hookBlock: { height: { value: number } };
      rigging: { height: { value: number }; slings?: unknown };
    };
    other.hookBlock.height.value = 1.1;
    other.rigging.height.value = 3;
    delete other.rigging.slings;
    const result = evaluateLift(LiftInput.parse(raw));
    const f = craneLiftFigures(raw, result, 1);
    expect(f.radius).toBe(result.cranes![1].figures!.radius);
    expect(f.grossLoad).toBe(result.cranes![1].grossLoad);
    expect(f.grossLoad).not.toBe(result.cranes![0].grossLoad);
    expect(f.blockHeight).toBeCloseTo(1.1, 9);
    // 6 m lift height + 1.4 m load height + 3.0 m of crane 2's rigging
    expect(f.neededHookHeight).toBeCloseTo(10.4, 9);
    expect(f.cranesInLift).toBe(2);
    // a slot the lift does not have gives nothing to draw
    expect(craneLiftFigures(raw, result, 3)).toMatchObject({
      radius: null,
      grossLoad: null,
      blockHeight: null,
    });
  });

  it('when the package has not been checked or its draft does not parse, then only what is known is given', () => {
    const unchecked = craneLiftFigures(passOutriggers, null, 0);
    expect(unchecked).toMatchObject({ radius: null, grossLoad: null, clearance: null });
    expect(unchecked.neededHookHeight).toBeCloseTo(10.3, 9);
    const result = evaluateLift(LiftInput.parse(passOutriggers));
    const draft = craneLiftFigures({ crane: { type: 'mobile_outriggers' } }, result, 0);
    expect(draft.radius).toBe(result.figures.radius);
    expect(draft).toMatchObject({ blockHeight: null, neededHookHeight: null });
  });
});

describe('where a mark on a plot is labelled', () => {
  const line = (pts: [number, number][]) => ({
    boomLength: 30,
    points: pts.map(([x, y]) => ({ x, y, rated: true })),
  });
  const high = line([
    [8, 28],
    [12, 18],
  ]);
  const low = line([
    [8, 10],
    [12, 6],
  ]);
  it('when asked between two points, then the line is read straight between them: 28 − 10 × 2/4 = 23 at x = 10', () => {
    expect(lineAt(high, 10)).toBe(23);
    expect(lineAt(high, 12)).toBe(18);
    expect(lineAt(high, 14)).toBeNull();
  });
  it('when every line passes above the mark, then the label goes below it; otherwise above', () => {
    expect(labelSide([high], 10, 12)).toBe('below');
    expect(labelSide([high, low], 10, 12)).toBe('above');
    expect(labelSide([low], 10, 12)).toBe('above');
    // no line reaches that far: above, where a lift beyond the chart is drawn
    expect(labelSide([high], 20, 2)).toBe('above');
  });
});
